import type { ReactNode } from 'react';
import { isApiError } from '@/api/client';
import { paths } from '@/paths';
import { Button, ButtonLink } from './button';
import { cn } from './cn';

/** A failed load: says what went wrong in plain words and offers a retry. */
export function ErrorState({
  error,
  title = 'This could not be loaded',
  onRetry,
  children,
  className,
}: {
  error?: unknown;
  title?: string;
  onRetry?: () => void;
  children?: ReactNode;
  className?: string;
}) {
  const message = error instanceof Error ? error.message : undefined;
  // Not found: trying again cannot help; say what may have happened and where to go instead.
  if (isApiError(error) && error.status === 404)
    return (
      <div
        role="alert"
        className={cn('rounded-card border border-rule bg-paper-raised px-4 py-3', className)}
      >
        <p className="font-medium text-ink">
          {title.replace(/could not be (opened|loaded)/, 'was not found')}
        </p>
        <p className="mt-0.5 text-body text-ink">
          The link may be mistyped or cut short, or it belongs to a workspace you are not a member
          of (each workspace sees only its own routes and revisions).
        </p>
        {children}
        <p className="mt-2 flex flex-wrap gap-2">
          <ButtonLink to={paths.root.to()} variant="primary" size="sm">
            Go to your routes
          </ButtonLink>
        </p>
        <p className="mt-1 text-small text-ink-muted">
          Archived routes are listed under “Archived” in the routes list; the route’s owner or your
          workspace admin can send you the right link.
        </p>
      </div>
    );
  return (
    <div
      role="alert"
      className={cn(
        'rounded-card border border-caution-hazard/40 bg-caution-hazard-soft px-4 py-3',
        className,
      )}
    >
      <p className="font-medium text-caution-hazard-deep">{title}</p>
      {message ? <p className="mt-0.5 text-body text-ink">{message}</p> : null}
      {isApiError(error) && error.status >= 500 ? (
        <p className="mt-0.5 text-small text-ink-muted">
          If this keeps happening, tell your workspace admin.
        </p>
      ) : null}
      {children}
      {onRetry ? (
        <Button variant="secondary" size="sm" className="mt-2" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}

/** An inline message above a form: the server's answer to a submit. */
export function FormMessage({
  tone,
  children,
}: {
  tone: 'error' | 'success';
  children: ReactNode;
}) {
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={cn(
        'rounded-control border px-3 py-2 text-body',
        tone === 'error'
          ? 'border-caution-hazard/40 bg-caution-hazard-soft text-caution-hazard-deep'
          : 'border-phase-aqueous/40 bg-phase-aqueous-soft text-phase-aqueous-deep',
      )}
    >
      {children}
    </div>
  );
}
