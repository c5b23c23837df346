import { Link } from 'react-router-dom';
import { Card } from '@/components/card';
import { formatDateTime } from '@/lib/format';
import { paths } from '@/paths';
import { useAttention } from '../api/revisions';

const KIND_LABEL = {
  review_requested: 'Review requested',
  returned: 'Returned to you',
  approved: 'Approved',
  comment: 'New comment',
} as const;

/** What needs the signed-in person in this workspace; hidden when nothing does. */
export function AttentionList({ workspaceId }: { workspaceId: string }) {
  const attention = useAttention(workspaceId);
  const items = attention.data?.items ?? [];
  if (!items.length) return null;
  return (
    <Card title="Needs your attention" className="mb-4">
      <ul className="divide-y divide-rule" aria-label="Needs your attention">
        {items.map((item, i) => (
          <li
            key={`${item.kind}-${item.routeId}-${item.revisionNumber}-${i}`}
            className="flex flex-wrap items-baseline gap-x-3 py-1.5 text-small"
          >
            <span className="font-medium">{KIND_LABEL[item.kind]}</span>
            <Link
              className="text-accent hover:underline"
              to={paths.workspace.revision.to(workspaceId, item.routeId, item.revisionNumber)}
            >
              {item.routeName}, revision {item.revisionNumber}
            </Link>
            <span className="text-ink-muted">
              {item.from.name} · {formatDateTime(item.at)}
            </span>
            <span className="min-w-0 flex-1 truncate text-ink-muted">{item.text}</span>
          </li>
        ))}
      </ul>
    </Card>
  );
}
