import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/button';
import { TextField } from '@/components/text-field';
import { useForm } from '@/lib/use-form';
import { paths } from '@/paths';
import { createRouteInputSchema, useCreateRoute } from '../api/create-route';

/** Name and project of a new route; on success the editor opens on its empty canvas. */
export function CreateRouteForm({
  workspaceId,
  onCancel,
}: {
  workspaceId: string;
  onCancel?: () => void;
}) {
  const navigate = useNavigate();
  const create = useCreateRoute(workspaceId);
  const form = useForm(createRouteInputSchema, { name: '', projectName: '' });
  return (
    <form
      aria-label="New route"
      noValidate
      className="grid gap-3 rounded-card border border-rule bg-paper-raised p-4 shadow-card sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto] sm:items-start"
      onSubmit={(e) => {
        e.preventDefault();
        const input = form.validate();
        if (!input) return;
        create.mutate(
          { name: input.name, projectName: input.projectName || undefined },
          {
            onSuccess: (route) => navigate(paths.workspace.route.to(workspaceId, route.id)),
            onError: form.showServerError,
          },
        );
      }}
    >
      <TextField
        label="Route name"
        value={form.values.name}
        onValueChange={(v) => form.setField('name', v)}
        error={form.errors.name}
        autoFocus
        hint="For example “Amide isolation, 5 kg batch”."
      />
      <TextField
        label="Project (optional)"
        value={form.values.projectName ?? ''}
        onValueChange={(v) => form.setField('projectName', v)}
        error={form.errors.projectName}
        hint="The programme or compound it belongs to; routes are grouped by it."
      />
      <div className="flex gap-2 sm:pt-6">
        <Button type="submit" busy={create.isPending}>
          Create and open
        </Button>
        {onCancel ? (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
      {form.formError ? (
        <p role="alert" className="text-small text-caution-hazard-deep sm:col-span-3">
          {form.formError}
        </p>
      ) : null}
    </form>
  );
}
