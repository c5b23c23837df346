import { useCallback, useState } from 'react';
import { useWorkspace } from '@/features/auth/use-workspace';
import { useSolvents } from '@/features/solvents/api/get-solvents';
import { SolventDrawer } from '@/features/solvents/components/solvent-drawer';
import { SolventTable } from '@/features/solvents/components/solvent-table';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { PageHeader } from '@/components/page-header';
import { Loading } from '@/components/spinner';

export function Component() {
  const workspace = useWorkspace();
  const solvents = useSolvents();
  const [openId, setOpenId] = useState<string | null>(null);
  const close = useCallback(() => setOpenId(null), []);
  return (
    <>
      <PageHeader
        eyebrow={workspace.name}
        title="Solvent library"
        description="The solvents routes can use. Open one to see every value with the source it was read from; values from memory are marked."
      />
      {solvents.isPending ? (
        <Loading label="Loading the solvent library…" />
      ) : solvents.isError ? (
        <ErrorState
          error={solvents.error}
          title="The solvent library could not be loaded"
          onRetry={() => solvents.refetch()}
        />
      ) : solvents.data.length === 0 ? (
        <EmptyState title="The solvent library is empty">
          Ask your administrator to check the installation.
        </EmptyState>
      ) : (
        <SolventTable solvents={solvents.data} onOpen={setOpenId} selectedId={openId} />
      )}
      {openId ? <SolventDrawer solventId={openId} onClose={close} /> : null}
    </>
  );
}
