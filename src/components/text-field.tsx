import { useId, type InputHTMLAttributes, type ReactNode } from 'react';
import { cn } from './cn';

export const inputClass =
  'block w-full h-9 rounded-control border bg-paper-raised px-2.5 text-body text-ink placeholder:text-ink-faint ' +
  'focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-accent ' +
  // A field that may only be read looks it: sunken, muted, no edit cursor.
  'disabled:cursor-not-allowed disabled:border-rule disabled:bg-paper-sunken disabled:text-ink-muted read-only:border-rule read-only:bg-paper-sunken';

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'onChange' | 'value'> & {
  label: string;
  value: string;
  onValueChange: (value: string) => void;
  error?: string;
  hint?: ReactNode;
};

export function TextField({
  label,
  value,
  onValueChange,
  error,
  hint,
  className,
  id,
  ...rest
}: TextFieldProps) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = error ? `${inputId}-error` : undefined;
  return (
    <div className={cn('space-y-1', className)}>
      <label htmlFor={inputId} className="block text-small font-medium text-ink">
        {label}
      </label>
      <input
        id={inputId}
        value={value}
        onChange={(e) => onValueChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
        className={cn(inputClass, error ? 'border-caution-hazard' : 'border-rule-strong')}
        {...rest}
      />
      {hint && !error ? (
        <p id={hintId} className="text-caption text-ink-muted">
          {hint}
        </p>
      ) : null}
      {error ? <FieldError id={errorId}>{error}</FieldError> : null}
    </div>
  );
}

export function FieldError({ id, children }: { id?: string; children: ReactNode }) {
  return (
    <p id={id} className="flex items-start gap-1 text-caption font-medium text-caution-hazard-deep">
      <span
        aria-hidden="true"
        className="mt-[3px] inline-block size-2 shrink-0 rotate-45 bg-caution-hazard"
      />
      <span>{children}</span>
    </p>
  );
}
