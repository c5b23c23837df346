import { useCallback, useState, type FormEvent } from 'react';
import type { AuditFilter } from '@shared/schemas/audit';
import { Button, buttonClass } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { ListSearch } from '@/components/list-controls';
import { ErrorState } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { Table, Td, Th } from '@/components/table';
import { TextField } from '@/components/text-field';
import { auditCsvUrl, useAuditTrail, useVerifyAudit } from '../api/audit';

const ENTITY_TYPES = [
  '',
  'route',
  'revision',
  'review',
  'comment',
  'compound',
  'member',
  'invitation',
  'user',
  'token',
];

const value = (v: unknown) => (v === null || v === undefined ? '' : JSON.stringify(v));

/** The audit trail of a workspace: filters, the list, CSV export and the chain check. */
export function AuditTrail({ workspaceId }: { workspaceId: string }) {
  const [draft, setDraft] = useState<Record<string, string>>({});
  const [filter, setFilter] = useState<AuditFilter>({});
  // The search goes to the server as `q` (part of the action or the kind of record).
  const [q, setQ] = useState('');
  const onSearch = useCallback((text: string) => setQ(text), []);
  const shown: AuditFilter = q ? { ...filter, q } : filter;
  const trail = useAuditTrail(workspaceId, shown);
  const searching = trail.isPlaceholderData && trail.isFetching;
  const verify = useVerifyAudit(workspaceId);
  const apply = (e: FormEvent) => {
    e.preventDefault();
    const next: Record<string, string> = {};
    for (const [k, v] of Object.entries(draft)) if (v.trim()) next[k] = v.trim();
    setFilter(next as AuditFilter);
  };
  const set = (key: string) => (v: string) => setDraft((d) => ({ ...d, [key]: v }));
  const rows = trail.data?.pages.flatMap((p) => p.items) ?? [];
  return (
    <div className="space-y-4">
      <section
        aria-label="Chain check"
        className="flex flex-wrap items-center gap-3 rounded-card border border-rule bg-paper-raised p-3 text-small"
      >
        <Button
          size="sm"
          variant="secondary"
          onClick={() => verify.mutate()}
          disabled={verify.isPending}
        >
          Check the chain
        </Button>
        {verify.data ? (
          verify.data.ok ? (
            <span role="status" data-chain="ok">
              Intact: {verify.data.checked} entries checked; none was changed, removed or inserted
              afterwards.
            </span>
          ) : (
            <span role="alert" data-chain="broken" className="font-medium text-caution-hazard-deep">
              Broken at entry {verify.data.firstBroken!.position} ({verify.data.firstBroken!.at}, id{' '}
              {verify.data.firstBroken!.id}): {verify.data.firstBroken!.reason}
            </span>
          )
        ) : (
          <span className="text-ink-muted">
            Every entry carries the hash of the one before; the check recomputes them all.
          </span>
        )}
        {verify.isError ? (
          <span role="alert">The check could not run: {verify.error.message}</span>
        ) : null}
      </section>
      <form onSubmit={apply} aria-label="Filter" className="flex flex-wrap items-end gap-3">
        <label className="space-y-1 text-small">
          <span className="block font-medium">Kind of record</span>
          <select
            className="h-9 rounded-control border border-rule-strong bg-paper-raised px-2"
            value={draft.entityType ?? ''}
            onChange={(e) => set('entityType')(e.target.value)}
          >
            {ENTITY_TYPES.map((t) => (
              <option key={t} value={t}>
                {t || 'Any'}
              </option>
            ))}
          </select>
        </label>
        <TextField
          label="Record id"
          value={draft.entityId ?? ''}
          onValueChange={set('entityId')}
          className="w-64"
        />
        <TextField
          label="Action starts with"
          value={draft.action ?? ''}
          onValueChange={set('action')}
          className="w-48"
          placeholder="review."
        />
        <TextField
          label="From (UTC)"
          type="date"
          value={draft.from ?? ''}
          onValueChange={set('from')}
        />
        <TextField label="To (UTC)" type="date" value={draft.to ?? ''} onValueChange={set('to')} />
        <Button type="submit" size="sm">
          Apply
        </Button>
        <a
          className={buttonClass('secondary', 'sm')}
          href={auditCsvUrl(workspaceId, shown)}
          download
        >
          Export CSV
        </a>
      </form>
      <div className="flex items-end gap-3">
        <ListSearch
          label="Search the trail"
          placeholder="Action or kind of record, e.g. rename"
          onSearch={onSearch}
        />
        <span role="status" aria-live="polite" className="pb-2 text-small text-ink-muted">
          {searching ? 'Searching…' : ''}
        </span>
      </div>
      {trail.isPending ? (
        <Loading label="Loading the audit trail…" />
      ) : trail.isError ? (
        <ErrorState
          title="The audit trail could not be loaded"
          error={trail.error}
          onRetry={() => trail.refetch()}
        />
      ) : rows.length === 0 ? (
        <EmptyState title={q ? `No entries match “${q}”` : 'No entries match'}>
          {q
            ? 'Clear the search or a filter to see more of the trail.'
            : 'Clear a filter to see more of the trail.'}
        </EmptyState>
      ) : (
        <>
          <div aria-busy={searching} className={searching ? 'opacity-60' : undefined}>
            <Table caption="Audit trail">
              <thead>
                <tr>
                  <Th>Time (UTC)</Th>
                  <Th>Who</Th>
                  <Th>Action</Th>
                  <Th>Record</Th>
                  <Th>Old value</Th>
                  <Th>New value</Th>
                </tr>
              </thead>
              <tbody>
                {rows.map((e) => (
                  <tr key={e.id} data-action={e.action}>
                    <Td className="whitespace-nowrap tabular-nums">
                      {e.at.replace('T', ' ').slice(0, 19)}
                    </Td>
                    <Td>{e.actor?.name ?? '—'}</Td>
                    <Td className="font-mono text-caption">{e.action}</Td>
                    <Td className="text-caption">
                      {e.entityType}
                      {e.entityId ? ` ${e.entityId.slice(0, 8)}` : ''}
                    </Td>
                    <Td
                      className="max-w-64 truncate font-mono text-caption"
                      title={value(e.before)}
                    >
                      {value(e.before)}
                    </Td>
                    <Td className="max-w-72 truncate font-mono text-caption" title={value(e.after)}>
                      {value(e.after)}
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          </div>
          {trail.hasNextPage ? (
            <Button
              size="sm"
              variant="secondary"
              onClick={() => trail.fetchNextPage()}
              disabled={trail.isFetchingNextPage}
            >
              Show more
            </Button>
          ) : null}
        </>
      )}
    </div>
  );
}
