import { useState } from 'react';
import type { Equipment } from '@shared/schemas/equipment';
import { canInWorkspace } from '@/features/auth/abilities';
import { useSession } from '@/features/auth/api/get-session';
import { useWorkspace } from '@/features/auth/use-workspace';
import { useEquipmentPages } from '@/features/equipment/api/get-equipment';
import { ListMore, ListSearch } from '@/components/list-controls';
import { useCreateEquipment } from '@/features/equipment/api/create-equipment';
import { useUpdateEquipment } from '@/features/equipment/api/update-equipment';
import { useDeleteEquipment } from '@/features/equipment/api/delete-equipment';
import { EquipmentForm } from '@/features/equipment/components/equipment-form';
import { EquipmentTable } from '@/features/equipment/components/equipment-table';
import { Button } from '@/components/button';
import { Card } from '@/components/card';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { PageHeader } from '@/components/page-header';
import { Loading } from '@/components/spinner';
import { toast } from '@/stores/toasts';

type Editing = { mode: 'new' } | { mode: 'edit'; item: Equipment } | null;

export function Component() {
  const workspace = useWorkspace();
  const { data: session } = useSession();
  const [q, setQ] = useState('');
  const equipment = useEquipmentPages(workspace.id, q);
  const create = useCreateEquipment(workspace.id);
  const update = useUpdateEquipment(workspace.id);
  const remove = useDeleteEquipment(workspace.id);
  const [editing, setEditing] = useState<Editing>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);
  if (!session) return null;
  const canWrite = canInWorkspace(session, workspace.id, 'equipment.create');
  const current = editing?.mode === 'edit' ? editing.item : null;

  const addButton = canWrite ? (
    <Button onClick={() => setEditing({ mode: 'new' })} disabled={editing?.mode === 'new'}>
      Add equipment
    </Button>
  ) : undefined;

  return (
    <>
      <PageHeader
        eyebrow={workspace.name}
        title="Equipment"
        description="The vessels, filters and dryers of your plant. The step list checks every operation's volume against the vessel you choose for it."
        actions={addButton}
      />
      {editing ? (
        <Card
          title={
            editing.mode === 'new'
              ? 'Add equipment'
              : canWrite
                ? `Edit ${editing.item.name}`
                : editing.item.name
          }
          className="mb-6"
        >
          <EquipmentForm
            key={current?.id ?? 'new'}
            item={current}
            readOnly={!canWrite}
            busy={create.isPending || update.isPending}
            onCancel={() => setEditing(null)}
            onDelete={current ? () => setConfirmDelete(true) : undefined}
            onSubmit={async (input) => {
              if (current) {
                const { kind: _kind, ...fields } = input;
                const saved = await update.mutateAsync({ id: current.id, input: fields });
                toast.success(`${saved.name} saved.`);
              } else {
                const saved = await create.mutateAsync(input);
                toast.success(`${saved.name} added.`);
              }
              setEditing(null);
            }}
          />
        </Card>
      ) : null}
      {equipment.isPending ? (
        <Loading label="Loading equipment…" />
      ) : equipment.isError ? (
        <ErrorState
          error={equipment.error}
          title="Equipment could not be loaded"
          onRetry={() => equipment.refetch()}
        />
      ) : equipment.items.length === 0 && !q ? (
        editing ? null : (
          <EmptyState
            title="No equipment yet — add the vessels you run batches in"
            action={addButton}
          >
            {canWrite
              ? 'Give each vessel its nominal, minimum stirrable and maximum working volume, its temperature and pressure range and its material; add your filters and dryers with their area and capacity.'
              : 'Scale-up engineers and admins enter the plant equipment; you will see it here.'}
          </EmptyState>
        )
      ) : (
        <div className="space-y-3">
          <ListSearch label="Search equipment" placeholder="Name" onSearch={setQ} />
          {equipment.items.length === 0 ? (
            <p className="px-3 py-2 text-body text-ink-muted">
              No equipment matches “{q}”. Clear the search to see it all.
            </p>
          ) : (
            <EquipmentTable
              items={equipment.items}
              canWrite={canWrite}
              selectedId={current?.id}
              onOpen={(item) => setEditing({ mode: 'edit', item })}
            />
          )}
          <ListMore
            shown={equipment.items.length}
            noun={['item', 'items']}
            hasMore={equipment.hasNextPage}
            loading={equipment.isFetchingNextPage}
            onMore={() => equipment.fetchNextPage()}
          />
        </div>
      )}
      <ConfirmDialog
        open={confirmDelete && current !== null}
        title={`Delete ${current?.name ?? 'this equipment'}?`}
        confirmLabel="Delete"
        busy={remove.isPending}
        onCancel={() => setConfirmDelete(false)}
        onConfirm={() => {
          if (!current) return;
          remove.mutate(current.id, {
            onSuccess: () => {
              toast.success(`${current.name} deleted.`);
              setConfirmDelete(false);
              setEditing(null);
            },
            onError: (error) => {
              toast.error(error.message);
              setConfirmDelete(false);
            },
          });
        }}
      >
        Step lists already exported keep what they said. The deletion is recorded in the audit
        trail.
      </ConfirmDialog>
    </>
  );
}
