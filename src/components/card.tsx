import type { ReactNode } from 'react';
import { cn } from './cn';

type CardProps = {
  title?: string;
  description?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
};

export function Card({ title, description, actions, children, className }: CardProps) {
  return (
    <section
      aria-label={title}
      className={cn('rounded-card border border-rule bg-paper-raised shadow-card', className)}
    >
      {title ? (
        <header className="flex items-start justify-between gap-4 border-b border-rule px-4 py-3">
          <div>
            <h2 className="text-title font-medium text-ink">{title}</h2>
            {description ? <p className="mt-0.5 text-small text-ink-muted">{description}</p> : null}
          </div>
          {actions}
        </header>
      ) : null}
      <div className="px-4 py-4">{children}</div>
    </section>
  );
}
