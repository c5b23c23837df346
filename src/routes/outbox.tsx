import { useState } from 'react';
import { useOutbox } from '@/features/outbox/api/get-outbox';
import { MessageBody } from '@/features/outbox/components/message-body';
import { isApiError } from '@/api/client';
import { PageHeader } from '@/components/page-header';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { Button } from '@/components/button';
import { cn } from '@/components/cn';
import { formatDateTime } from '@/lib/format';

/** The demo's mail fake: the e-mails about the workspaces you administer, as they were received. */
export function Component() {
  const outbox = useOutbox();
  const [openId, setOpenId] = useState<string | null>(null);

  const header = (
    <PageHeader
      title="Outbox"
      description="E-mails Phasewright sent about the workspaces you administer, caught by the built-in mail server of the demo and of development. Production sends real mail instead."
      actions={
        <Button
          variant="secondary"
          onClick={() => outbox.refetch()}
          busy={outbox.isFetching && !outbox.isPending}
        >
          Refresh
        </Button>
      }
    />
  );

  if (outbox.isPending)
    return (
      <>
        {header}
        <Loading label="Loading e-mails…" />
      </>
    );
  if (outbox.isError) {
    const off = isApiError(outbox.error) && outbox.error.status === 404;
    const denied = isApiError(outbox.error) && outbox.error.status === 403;
    return (
      <>
        {header}
        {off ? (
          <EmptyState title="The outbox is off here">
            This server sends real e-mail; look in the recipients' mailboxes instead.
          </EmptyState>
        ) : denied ? (
          <EmptyState title="Only admins read the outbox">
            Ask an admin of your workspace if you are waiting for an e-mail.
          </EmptyState>
        ) : (
          <ErrorState
            error={outbox.error}
            title="The outbox could not be loaded"
            onRetry={() => outbox.refetch()}
          />
        )}
      </>
    );
  }

  const messages = [...outbox.data].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
  const selected = messages.find((m) => m.id === openId) ?? messages[0];

  return (
    <>
      {header}
      {messages.length === 0 || !selected ? (
        <EmptyState title="No e-mails yet">
          Invite a member or ask for a password reset; the e-mail appears here a moment later. Press
          Refresh to check.
        </EmptyState>
      ) : (
        <div className="grid grid-cols-[22rem_minmax(0,1fr)] items-start gap-4">
          <ul
            aria-label="E-mails"
            className="overflow-hidden rounded-card border border-rule bg-paper-raised"
          >
            {messages.map((m) => (
              <li key={m.id} className="border-b border-rule last:border-b-0">
                <button
                  type="button"
                  aria-current={m.id === selected.id ? 'true' : undefined}
                  onClick={() => setOpenId(m.id)}
                  className={cn(
                    'block w-full border-l-2 px-3 py-2 text-left',
                    m.id === selected.id
                      ? 'border-accent bg-accent-soft'
                      : 'border-transparent hover:bg-paper-sunken',
                  )}
                >
                  <span className="block truncate font-medium text-ink">{m.subject}</span>
                  <span className="flex justify-between gap-2 text-caption text-ink-muted">
                    <span className="truncate">{m.to}</span>
                    <span className="shrink-0">{formatDateTime(m.receivedAt)}</span>
                  </span>
                </button>
              </li>
            ))}
          </ul>
          <article
            aria-label={selected.subject}
            className="rounded-card border border-rule bg-paper-raised"
          >
            <header className="border-b border-rule px-4 py-3">
              <h2 className="text-title font-medium">{selected.subject}</h2>
              <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-small">
                <dt className="text-ink-muted">To</dt>
                <dd>{selected.to}</dd>
                <dt className="text-ink-muted">Received</dt>
                <dd>{formatDateTime(selected.receivedAt)}</dd>
              </dl>
            </header>
            <div className="px-4 py-4">
              <MessageBody text={selected.text} />
            </div>
          </article>
        </div>
      )}
    </>
  );
}
