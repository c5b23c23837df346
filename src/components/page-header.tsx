import type { ReactNode } from 'react';

export function PageHeader({
  title,
  eyebrow,
  description,
  actions,
}: {
  title: string;
  eyebrow?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-rule pb-4">
      <div>
        {eyebrow ? <p className="text-small font-medium text-ink-muted">{eyebrow}</p> : null}
        <h1 className="text-heading font-semibold text-ink">{title}</h1>
        {description ? (
          <div className="mt-1 max-w-prose text-body text-ink-muted">{description}</div>
        ) : null}
      </div>
      {actions ? <div className="flex gap-2">{actions}</div> : null}
    </header>
  );
}
