import { Button } from '@/components/button';
import { TextField } from '@/components/text-field';
import { useForm } from '@/lib/use-form';
import { toast } from '@/stores/toasts';
import { renameRouteInputSchema } from '../api/create-route';
import { useUpdateRoute } from '../api/update-route';

/**
 * A new name for a route, checked as New route checks a name (not empty, not too long), each
 * problem under the field in the chemist's words; the server's answer lands on the same field.
 */
export function RenameRouteForm({
  workspaceId,
  route,
  onDone,
}: {
  workspaceId: string;
  route: { id: string; name: string; version: number };
  onDone: () => void;
}) {
  const update = useUpdateRoute(workspaceId);
  const form = useForm(renameRouteInputSchema, { name: route.name });
  return (
    <form
      aria-label="Rename route"
      noValidate
      className="flex items-start gap-2 rounded-card border border-rule bg-paper-raised p-3"
      onSubmit={(e) => {
        e.preventDefault();
        const input = form.validate();
        if (!input) return;
        update.mutate(
          { routeId: route.id, input: { name: input.name, baseVersion: route.version } },
          {
            onSuccess: () => {
              toast.success('Route renamed.');
              onDone();
            },
            onError: form.showServerError,
          },
        );
      }}
    >
      <div className="w-80">
        <TextField
          label="New name"
          value={form.values.name}
          onValueChange={(v) => form.setField('name', v)}
          error={form.errors.name}
          autoFocus
        />
      </div>
      <div className="flex gap-2 pt-6">
        <Button type="submit" busy={update.isPending}>
          Save name
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
      {form.formError ? (
        <p role="alert" className="basis-full text-small text-caution-hazard-deep">
          {form.formError}
        </p>
      ) : null}
    </form>
  );
}
