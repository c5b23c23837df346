import type { ButtonHTMLAttributes, ReactNode } from 'react';
import { Link, type LinkProps } from 'react-router-dom';
import { cn } from './cn';
import { Spinner } from './spinner';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';
type Size = 'md' | 'sm';

const base =
  'inline-flex items-center justify-center gap-1.5 rounded-control font-medium whitespace-nowrap ' +
  'transition-colors focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent ' +
  'disabled:cursor-not-allowed disabled:opacity-55 aria-disabled:cursor-not-allowed aria-disabled:opacity-55';

const variants: Record<Variant, string> = {
  primary: 'bg-accent text-ink-inverse hover:bg-accent-deep border border-accent-deep/40',
  secondary: 'bg-paper-raised text-ink border border-rule-strong hover:bg-paper-sunken',
  quiet: 'bg-transparent text-accent hover:bg-accent-soft border border-transparent',
  danger:
    'bg-caution-hazard text-ink-inverse hover:bg-caution-hazard-deep border border-caution-hazard-deep/40',
};

const sizes: Record<Size, string> = {
  md: 'h-9 px-3.5 text-body',
  sm: 'h-7 px-2.5 text-small',
};

export function buttonClass(variant: Variant = 'primary', size: Size = 'md', extra?: string) {
  return cn(base, variants[variant], sizes[size], extra);
}

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: Variant;
  size?: Size;
  /** Shows a spinner and blocks clicks while a request runs. */
  busy?: boolean;
  icon?: ReactNode;
};

export function Button({
  variant = 'primary',
  size = 'md',
  busy,
  icon,
  className,
  children,
  disabled,
  type,
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type ?? 'button'}
      className={buttonClass(variant, size, className)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy ? <Spinner size="sm" /> : icon}
      {children}
    </button>
  );
}

export function ButtonLink({
  variant = 'secondary',
  size = 'md',
  className,
  ...rest
}: LinkProps & { variant?: Variant; size?: Size }) {
  return <Link className={buttonClass(variant, size, className)} {...rest} />;
}
