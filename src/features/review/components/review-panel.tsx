/**
 * The review side of a revision: its status and signatures, submitting it
 * for review, the comment threads (on the route or a step) and the signed
 * decision of a reviewer.
 */
import { useState, type FormEvent } from 'react';
import {
  DEFAULT_SIGNATURE_MEANING,
  type CommentPayload,
  type RevisionDetail,
} from '@shared/schemas/revisions';
import { ENGINE_VERSION } from '@shared/engine/version';
import { isApiError } from '@/api/client';
import { Button } from '@/components/button';
import { FieldError, TextField, inputClass } from '@/components/text-field';
import { formatDateTime } from '@/lib/format';
import { useEditorStore } from '@/stores/editor-store';
import { toast } from '@/stores/toasts';
import { useMembersWithRole } from '@/features/members';
import {
  useAddComment,
  useComments,
  useResolveComment,
  useSignDecision,
  useSubmitForReview,
} from '../api/revisions';
import { SignatureRecord } from './signature';
import { StatusBadge } from './status-badge';

interface Props {
  workspaceId: string;
  routeId: string;
  revision: RevisionDetail;
}

/**
 * When a revision was stored by an earlier engine version than today's, what its stored figures
 * were: the canvas and the route totals beside it are recomputed by today's engine and may
 * differ, while the stored figures are what was saved (and signed). Null when the versions agree.
 */
export function storedFiguresNotice(
  revision: Pick<RevisionDetail, 'engineVersion' | 'totals'>,
): string | null {
  if (revision.engineVersion === ENGINE_VERSION) return null;
  const pct = (v: number | null | undefined) =>
    v === null || v === undefined ? '—' : `${v.toFixed(1)} %`;
  const t = revision.totals;
  const figures = t
    ? `: yield ${pct(t.yieldPct)}, purity ${pct(t.purityWtPct)}, PMI ${t.pmi === null ? '—' : t.pmi.toFixed(0)}`
    : ' (it could not be evaluated then)';
  return (
    `Stored with version ${revision.engineVersion} of the calculations${figures}. ` +
    `The canvas and the route totals here are recomputed by today's version (${ENGINE_VERSION}) ` +
    'and may differ; the stored figures are the record of this revision.'
  );
}

export function ReviewPanel({ workspaceId, routeId, revision }: Props) {
  const review = revision.reviews[0] ?? null;
  const notice = storedFiguresNotice(revision);
  return (
    <div className="space-y-4" data-review-panel>
      <section aria-label="Status" className="space-y-2">
        <p className="flex items-center gap-2 text-small">
          <StatusBadge status={revision.status} />
          <span className="text-ink-muted">
            Revision {revision.number} by {revision.author.name},{' '}
            {formatDateTime(revision.createdAt)}
          </span>
        </p>
        <p className="text-small">{revision.message}</p>
        {notice ? (
          <p
            role="note"
            className="rounded-card border border-caution-info/40 bg-caution-info-soft px-2.5 py-2 text-small text-caution-info-deep"
          >
            {notice}
          </p>
        ) : null}
        {review ? (
          <p className="text-small text-ink-muted">
            Sent by {review.submittedBy.name} to{' '}
            {review.reviewers
              .map(
                (r) =>
                  `${r.name}${r.decision ? ` (${r.decision === 'approve' ? 'approved' : 'returned'})` : ''}`,
              )
              .join(', ')}
            {review.note ? ` — “${review.note}”` : ''}
          </p>
        ) : null}
        {review?.decisions.map((signature) => (
          <SignatureRecord key={signature.id} signature={signature} />
        ))}
      </section>
      {revision.abilities.submit ? (
        <SubmitForm workspaceId={workspaceId} routeId={routeId} revision={revision} />
      ) : null}
      {revision.abilities.decide ? (
        <DecisionForm workspaceId={workspaceId} routeId={routeId} revision={revision} />
      ) : null}
      <Comments workspaceId={workspaceId} routeId={routeId} revision={revision} />
    </div>
  );
}

function SubmitForm({ workspaceId, routeId, revision }: Props) {
  const members = useMembersWithRole(workspaceId, 'reviewer');
  const submit = useSubmitForReview(workspaceId, routeId, revision.number);
  const [chosen, setChosen] = useState<string[]>([]);
  const [note, setNote] = useState('');
  const [error, setError] = useState<string | null>(null);
  const reviewers = (members.data ?? []).filter((m) => m.userId !== revision.author.id);
  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setError(null);
    if (!chosen.length) return setError('Choose at least one reviewer.');
    try {
      await submit.mutateAsync({ reviewerIds: chosen, note });
      toast.success('Sent for review.');
    } catch (failure) {
      setError(isApiError(failure) ? failure.message : 'The revision could not be sent.');
    }
  };
  return (
    <form
      onSubmit={onSubmit}
      className="space-y-2 rounded-card border border-rule p-2.5"
      aria-label="Send for review"
    >
      <h3 className="text-small font-semibold">Send for review</h3>
      {reviewers.length === 0 ? (
        <p className="text-small text-ink-muted">
          Nobody else in this workspace has the reviewer role yet; an admin can give it on the
          Members page.
        </p>
      ) : (
        <fieldset className="space-y-1">
          <legend className="text-small text-ink-muted">Reviewers</legend>
          {reviewers.map((m) => (
            <label key={m.userId} className="flex items-center gap-2 text-small">
              <input
                type="checkbox"
                checked={chosen.includes(m.userId)}
                onChange={(e) =>
                  setChosen((c) =>
                    e.target.checked ? [...c, m.userId] : c.filter((id) => id !== m.userId),
                  )
                }
              />
              {m.name} <span className="text-ink-muted">{m.email}</span>
            </label>
          ))}
        </fieldset>
      )}
      <label className="block space-y-1 text-small">
        <span className="font-medium">Note for the reviewers</span>
        <textarea
          value={note}
          onChange={(e) => setNote(e.target.value)}
          rows={2}
          className={`${inputClass} h-auto border-rule-strong py-1`}
        />
      </label>
      {error ? <FieldError>{error}</FieldError> : null}
      <Button type="submit" size="sm" disabled={submit.isPending || reviewers.length === 0}>
        Send for review
      </Button>
    </form>
  );
}

function DecisionForm({ workspaceId, routeId, revision }: Props) {
  const sign = useSignDecision(workspaceId, routeId, revision.number);
  const [decision, setDecision] = useState<'approve' | 'return'>('approve');
  const [password, setPassword] = useState('');
  const [meaning, setMeaning] = useState<string>(DEFAULT_SIGNATURE_MEANING.approve);
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const choose = (next: 'approve' | 'return') => {
    setDecision(next);
    setMeaning(DEFAULT_SIGNATURE_MEANING[next]);
  };
  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setErrors({});
    if (!password) return setErrors({ password: 'Enter your password to sign.' });
    if (decision === 'return' && !reason.trim())
      return setErrors({ reason: 'Say why the revision goes back to its author.' });
    try {
      await sign.mutateAsync({ decision, password, meaning, reason: reason.trim() || undefined });
      setPassword('');
      toast.success(decision === 'approve' ? 'Approval signed.' : 'Returned with your signature.');
    } catch (failure) {
      setPassword('');
      if (isApiError(failure) && failure.code === 'invalid_password')
        setErrors({ password: 'The password is not correct, so nothing was signed.' });
      else if (isApiError(failure) && Object.keys(failure.fieldErrors()).length)
        setErrors(failure.fieldErrors());
      else setErrors({ form: isApiError(failure) ? failure.message : 'Nothing was signed.' });
    }
  };
  return (
    <form
      onSubmit={onSubmit}
      className="space-y-2 rounded-card border border-accent/40 p-2.5"
      aria-label="Your decision"
    >
      <h3 className="text-small font-semibold">Your decision</h3>
      <div role="radiogroup" aria-label="Decision" className="flex gap-3 text-small">
        <label className="flex items-center gap-1">
          <input
            type="radio"
            name="decision"
            checked={decision === 'approve'}
            onChange={() => choose('approve')}
          />
          Approve
        </label>
        <label className="flex items-center gap-1">
          <input
            type="radio"
            name="decision"
            checked={decision === 'return'}
            onChange={() => choose('return')}
          />
          Return for changes
        </label>
      </div>
      {decision === 'return' ? (
        <label className="block space-y-1 text-small">
          <span className="font-medium">Reason</span>
          <textarea
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            rows={2}
            className={`${inputClass} h-auto border-rule-strong py-1`}
          />
          {errors.reason ? <FieldError>{errors.reason}</FieldError> : null}
        </label>
      ) : null}
      <label className="block space-y-1 text-small">
        <span className="font-medium">Meaning of your signature</span>
        <textarea
          value={meaning}
          onChange={(e) => setMeaning(e.target.value)}
          rows={3}
          className={`${inputClass} h-auto border-rule-strong py-1`}
        />
      </label>
      <TextField
        label="Your password (signs the decision)"
        type="password"
        autoComplete="current-password"
        value={password}
        onValueChange={setPassword}
        error={errors.password}
      />
      <p className="text-caption text-ink-muted">
        Signing records your full name, the date and time (UTC), this meaning and the revision’s
        content hash.
      </p>
      {errors.form ? <FieldError>{errors.form}</FieldError> : null}
      <Button type="submit" size="sm" disabled={sign.isPending}>
        {decision === 'approve' ? 'Sign and approve' : 'Sign and return'}
      </Button>
    </form>
  );
}

function Comments({ workspaceId, routeId, revision }: Props) {
  const comments = useComments(workspaceId, routeId, revision.number);
  const add = useAddComment(workspaceId, routeId, revision.number);
  const resolve = useResolveComment(workspaceId, routeId, revision.number);
  const selectedStep = useEditorStore((s) =>
    s.selection.steps.length === 1 ? s.selection.steps[0] : null,
  );
  const stepName = (id: string | null) =>
    id ? (revision.document.steps.find((s) => s.id === id)?.name ?? id) : null;
  const [body, setBody] = useState('');
  const [onStep, setOnStep] = useState(true);
  const [error, setError] = useState<string | null>(null);
  const items = comments.data?.items ?? [];
  const threads = items.filter((c) => c.parentId === null);
  const repliesTo = (id: string) => items.filter((c) => c.parentId === id);
  const post = async (input: { body: string; stepId?: string; parentId?: string }) => {
    setError(null);
    try {
      await add.mutateAsync(input);
      return true;
    } catch (failure) {
      setError(isApiError(failure) ? failure.message : 'The comment could not be saved.');
      return false;
    }
  };
  return (
    <section aria-label="Comments" className="space-y-2">
      <h3 className="text-small font-semibold">Comments ({threads.length})</h3>
      {threads.length === 0 && !comments.isPending ? (
        <p className="text-small text-ink-muted">No comments yet.</p>
      ) : null}
      {threads.map((thread) => (
        <Thread
          key={thread.id}
          thread={thread}
          replies={repliesTo(thread.id)}
          stepName={stepName(thread.stepId)}
          canWrite={revision.abilities.comment}
          onReply={(text) => post({ body: text, parentId: thread.id })}
          onResolve={(resolved) => resolve.mutate({ id: thread.id, resolved })}
          onShowStep={() =>
            thread.stepId &&
            useEditorStore.getState().select({ steps: [thread.stepId], connections: [] })
          }
        />
      ))}
      {revision.abilities.comment ? (
        <form
          aria-label="Write a comment"
          className="space-y-1.5"
          onSubmit={async (e) => {
            e.preventDefault();
            if (!body.trim()) return setError('Write a comment.');
            const stepId = onStep && selectedStep ? selectedStep : undefined;
            if (await post({ body: body.trim(), stepId })) setBody('');
          }}
        >
          <label className="block space-y-1 text-small">
            <span className="font-medium">New comment</span>
            <textarea
              value={body}
              onChange={(e) => setBody(e.target.value)}
              rows={3}
              className={`${inputClass} h-auto border-rule-strong py-1`}
            />
          </label>
          <label className="flex items-center gap-2 text-caption text-ink-muted">
            <input
              type="checkbox"
              checked={onStep}
              onChange={(e) => setOnStep(e.target.checked)}
              disabled={!selectedStep}
            />
            {selectedStep
              ? `On the step “${stepName(selectedStep)}”`
              : 'Select a step on the canvas to comment on it; otherwise the comment is on the whole route'}
          </label>
          {error ? <FieldError>{error}</FieldError> : null}
          <Button type="submit" size="sm" variant="secondary" disabled={add.isPending}>
            Add comment
          </Button>
        </form>
      ) : null}
    </section>
  );
}

function Thread({
  thread,
  replies,
  stepName,
  canWrite,
  onReply,
  onResolve,
  onShowStep,
}: {
  thread: CommentPayload;
  replies: CommentPayload[];
  stepName: string | null;
  canWrite: boolean;
  onReply: (body: string) => Promise<boolean>;
  onResolve: (resolved: boolean) => void;
  onShowStep: () => void;
}) {
  const [reply, setReply] = useState('');
  return (
    <article
      aria-label={`Comment by ${thread.author.name}`}
      data-comment-thread={thread.id}
      className={`rounded-card border p-2 text-small ${thread.resolved ? 'border-rule bg-paper-sunken text-ink-muted' : 'border-rule-strong bg-paper-raised'}`}
    >
      <p className="text-caption text-ink-muted">
        {stepName ? (
          <button type="button" className="text-accent hover:underline" onClick={onShowStep}>
            On “{stepName}”
          </button>
        ) : (
          'On the route'
        )}{' '}
        · {thread.resolved ? `resolved by ${thread.resolvedBy?.name ?? 'someone'}` : 'open'}
      </p>
      {[thread, ...replies].map((c) => (
        <div key={c.id} className="mt-1">
          <p>
            <span className="font-medium">{c.author.name}</span>{' '}
            <span className="text-caption text-ink-muted">{formatDateTime(c.createdAt)}</span>
          </p>
          <p className="whitespace-pre-wrap">{c.body}</p>
        </div>
      ))}
      {canWrite ? (
        <div className="mt-2 flex flex-wrap items-center gap-1.5">
          <input
            aria-label="Reply"
            placeholder="Reply…"
            value={reply}
            onChange={(e) => setReply(e.target.value)}
            className={`${inputClass} h-8 flex-1 border-rule-strong`}
          />
          <Button
            size="sm"
            variant="secondary"
            onClick={async () => {
              if (reply.trim() && (await onReply(reply.trim()))) setReply('');
            }}
          >
            Reply
          </Button>
          <Button size="sm" variant="quiet" onClick={() => onResolve(!thread.resolved)}>
            {thread.resolved ? 'Reopen' : 'Resolve'}
          </Button>
        </div>
      ) : null}
    </article>
  );
}
