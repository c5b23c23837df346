import type { ReactNode } from 'react';
import { cn } from './cn';

type EmptyStateProps = {
  title: string;
  children?: ReactNode;
  action?: ReactNode;
  /** The little drawing above the title; defaults to an empty flask outline. */
  glyph?: ReactNode;
  className?: string;
};

/** What a page shows when there is nothing yet, and what to do next. */
export function EmptyState({ title, children, action, glyph, className }: EmptyStateProps) {
  return (
    <div
      className={cn(
        'flex flex-col items-center rounded-card border border-dashed border-rule-strong bg-paper px-6 py-10 text-center',
        className,
      )}
    >
      <div aria-hidden="true" className="mb-3 text-ink-faint">
        {glyph ?? <FlaskGlyph />}
      </div>
      <h2 className="text-title font-medium text-ink">{title}</h2>
      {children ? (
        <div className="mt-1.5 max-w-prose text-body text-ink-muted">{children}</div>
      ) : null}
      {action ? <div className="mt-4 flex flex-wrap justify-center gap-2">{action}</div> : null}
    </div>
  );
}

function FlaskGlyph() {
  return (
    <svg
      width="40"
      height="40"
      viewBox="0 0 40 40"
      fill="none"
      stroke="currentColor"
      strokeWidth="1.5"
    >
      <path
        d="M15 5h10M17 5v10L8 32a3 3 0 0 0 2.6 4.5h18.8A3 3 0 0 0 32 32l-9-17V5"
        strokeLinejoin="round"
      />
      <path d="M12.5 25h15" strokeDasharray="2 2.5" />
    </svg>
  );
}
