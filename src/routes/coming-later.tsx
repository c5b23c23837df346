import { Link } from 'react-router-dom';
import { useWorkspace } from '@/features/auth/use-workspace';
import { PageHeader } from '@/components/page-header';
import { EmptyState } from '@/components/empty-state';
import { paths } from '@/paths';

/** A section that is on its way: says what it will hold and where to go meanwhile. */
export function ComingLater({ title, what }: { title: string; what: string }) {
  const workspace = useWorkspace();
  return (
    <>
      <PageHeader eyebrow={workspace.name} title={title} />
      <EmptyState title={`${title} open in a coming release`}>
        <p>{what}</p>
        <p className="mt-2">
          <Link
            to={paths.workspace.home.to(workspace.id)}
            className="font-medium text-accent hover:underline"
          >
            Back to routes
          </Link>
        </p>
      </EmptyState>
    </>
  );
}
