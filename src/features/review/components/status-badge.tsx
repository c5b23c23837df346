import { REVISION_STATUS_LABELS, type RevisionStatus } from '@shared/schemas/revisions';

const TONES: Record<RevisionStatus, string> = {
  draft: 'bg-paper-sunken text-ink-muted',
  in_review: 'bg-phase-aqueous-soft text-phase-aqueous-deep',
  approved: 'bg-accent-soft text-accent',
  returned: 'bg-caution-warning-soft text-caution-warning-deep',
  superseded: 'bg-paper-sunken text-ink-faint',
};

/** A revision's status in plain words. */
export function StatusBadge({ status }: { status: RevisionStatus }) {
  return (
    <span
      className={`inline-block rounded-control px-1.5 py-0.5 text-caption font-medium ${TONES[status]}`}
      data-status={status}
    >
      {REVISION_STATUS_LABELS[status]}
    </span>
  );
}
