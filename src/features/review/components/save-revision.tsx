import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { isApiError } from '@/api/client';
import { Button, buttonClass } from '@/components/button';
import { FieldError, inputClass } from '@/components/text-field';
import { paths } from '@/paths';
import { toast } from '@/stores/toasts';
import { useSaveRevision } from '../api/revisions';

/**
 * "Save revision" and "History" in the editor's header. The draft is saved
 * first, so the revision holds exactly what the chemist sees.
 */
export function RevisionActions({
  workspaceId,
  routeId,
  canSave,
  saveDraft,
}: {
  workspaceId: string;
  routeId: string;
  canSave: boolean;
  /** Saves pending edits and answers the draft version now on the server (null: not saved). */
  saveDraft: () => Promise<number | null>;
}) {
  const [open, setOpen] = useState(false);
  const [message, setMessage] = useState('');
  const [error, setError] = useState<string | null>(null);
  const save = useSaveRevision(workspaceId, routeId);
  const navigate = useNavigate();
  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setError(null);
    if (!message.trim()) return setError('Say what changed in this revision.');
    const version = await saveDraft();
    if (version === null) return setError('The draft is not saved yet; resolve that first.');
    try {
      const created = await save.mutateAsync({
        message: message.trim(),
        baseDraftVersion: version,
      });
      toast.success(`Revision ${created.number} saved.`);
      setOpen(false);
      setMessage('');
      navigate(paths.workspace.revision.to(workspaceId, routeId, created.number));
    } catch (failure) {
      setError(isApiError(failure) ? failure.message : 'The revision could not be saved.');
    }
  };
  return (
    <div className="relative flex items-center gap-1">
      <Link
        to={paths.workspace.revisions.to(workspaceId, routeId)}
        className={buttonClass('secondary', 'sm')}
      >
        History
      </Link>
      {canSave ? (
        <Button size="sm" onClick={() => setOpen((o) => !o)} aria-expanded={open}>
          Save revision
        </Button>
      ) : null}
      {open ? (
        <form
          onSubmit={onSubmit}
          aria-label="Save revision"
          className="absolute top-9 right-0 z-20 w-80 space-y-2 rounded-card border border-rule bg-paper-raised p-3 shadow-overlay"
        >
          <label className="block space-y-1 text-small">
            <span className="font-medium">What changed in this revision?</span>
            <textarea
              autoFocus
              value={message}
              onChange={(e) => setMessage(e.target.value)}
              rows={3}
              className={`${inputClass} h-auto border-rule-strong py-1`}
            />
          </label>
          <p className="text-caption text-ink-muted">
            A revision keeps the route as it is now with its computed results, and can be sent for
            review.
          </p>
          {error ? <FieldError>{error}</FieldError> : null}
          <div className="flex gap-2">
            <Button type="submit" size="sm" disabled={save.isPending}>
              Save revision
            </Button>
            <Button size="sm" variant="quiet" onClick={() => setOpen(false)}>
              Cancel
            </Button>
          </div>
        </form>
      ) : null}
    </div>
  );
}
