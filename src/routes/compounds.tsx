import { useState } from 'react';
import { ListMore, ListSearch } from '@/components/list-controls';
import type { Compound } from '@shared/schemas/compounds';
import { canInWorkspace } from '@/features/auth/abilities';
import { useSession } from '@/features/auth/api/get-session';
import { useWorkspace } from '@/features/auth/use-workspace';
import { useCompoundPages } from '@/features/compounds/api/get-compounds';
import { useCreateCompound } from '@/features/compounds/api/create-compound';
import { useUpdateCompound } from '@/features/compounds/api/update-compound';
import { useDeleteCompound } from '@/features/compounds/api/delete-compound';
import { CompoundForm } from '@/features/compounds/components/compound-form';
import { CompoundTable } from '@/features/compounds/components/compound-table';
import { useSolvents } from '@/features/solvents/api/get-solvents';
import { Button } from '@/components/button';
import { Card } from '@/components/card';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { PageHeader } from '@/components/page-header';
import { Loading } from '@/components/spinner';
import { toast } from '@/stores/toasts';

type Editing = { mode: 'new' } | { mode: 'edit'; compound: Compound } | null;

export function Component() {
  const workspace = useWorkspace();
  const { data: session } = useSession();
  const [q, setQ] = useState('');
  const compounds = useCompoundPages(workspace.id, q);
  const solvents = useSolvents();
  const create = useCreateCompound(workspace.id);
  const update = useUpdateCompound(workspace.id);
  const remove = useDeleteCompound(workspace.id);
  const [editing, setEditing] = useState<Editing>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);
  if (!session) return null;
  const canWrite = canInWorkspace(session, workspace.id, 'compound.create');

  const addButton = canWrite ? (
    <Button onClick={() => setEditing({ mode: 'new' })} disabled={editing?.mode === 'new'}>
      Add a compound
    </Button>
  ) : undefined;

  const current = editing?.mode === 'edit' ? editing.compound : null;

  return (
    <>
      <PageHeader
        eyebrow={workspace.name}
        title="Compounds"
        description="The product, its impurities, reagents and by-products. Enter a structure and your measured data; what you do not enter is estimated and marked so."
        actions={addButton}
      />
      {editing ? (
        <Card
          title={
            editing.mode === 'new'
              ? 'Add a compound'
              : canWrite
                ? `Edit ${editing.compound.name}`
                : editing.compound.name
          }
          description={
            editing.mode === 'new'
              ? 'Start with the structure: the drawing, formula and groups appear as you type.'
              : undefined
          }
          className="mb-6"
        >
          <CompoundForm
            key={editing.mode === 'edit' ? editing.compound.id : 'new'}
            compound={current}
            solvents={solvents.data ?? []}
            readOnly={!canWrite}
            busy={create.isPending || update.isPending}
            onCancel={() => setEditing(null)}
            onDelete={current ? () => setConfirmDelete(true) : undefined}
            onSubmit={async ({ input }) => {
              if (current) {
                const saved = await update.mutateAsync({
                  compoundId: current.id,
                  input: { ...input, baseVersion: current.version },
                });
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
      {compounds.isPending ? (
        <Loading label="Loading compounds…" />
      ) : compounds.isError ? (
        <ErrorState
          error={compounds.error}
          title="Compounds could not be loaded"
          onRetry={() => compounds.refetch()}
        />
      ) : compounds.items.length === 0 && !q ? (
        editing ? null : (
          <EmptyState
            title="No compounds yet — add your product and its impurities from a SMILES"
            action={addButton}
          >
            {canWrite
              ? 'Each compound gets its formula, molar mass, UNIFAC groups and logP and Hansen estimates from the structure; add your own measured solubility and partition data when you have them.'
              : 'Chemists and admins enter compounds; you will see them here.'}
          </EmptyState>
        )
      ) : (
        <div className="space-y-3">
          <ListSearch label="Search compounds" placeholder="Name or formula" onSearch={setQ} />
          {compounds.items.length === 0 ? (
            <p className="px-3 py-2 text-body text-ink-muted">
              No compound matches “{q}”. Clear the search to see them all.
            </p>
          ) : (
            <CompoundTable
              compounds={compounds.items}
              canWrite={canWrite}
              selectedId={current?.id}
              onOpen={(c) => setEditing({ mode: 'edit', compound: c })}
            />
          )}
          <ListMore
            shown={compounds.items.length}
            noun={['compound', 'compounds']}
            hasMore={compounds.hasNextPage}
            loading={compounds.isFetchingNextPage}
            onMore={() => compounds.fetchNextPage()}
          />
        </div>
      )}
      <ConfirmDialog
        open={confirmDelete && current !== null}
        title={`Delete ${current?.name ?? 'this compound'}?`}
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
        Routes that already use it keep their own copy of its data. The deletion is recorded in the
        audit trail.
      </ConfirmDialog>
    </>
  );
}
