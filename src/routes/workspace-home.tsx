import { Link } from 'react-router-dom';
import { useWorkspace } from '@/features/auth/use-workspace';
import { useSession } from '@/features/auth/api/get-session';
import { canInviteMembers } from '@/features/auth/abilities';
import { PageHeader } from '@/components/page-header';
import { EmptyState } from '@/components/empty-state';
import { Button } from '@/components/button';
import { RoleBadges } from '@/components/role-picker';
import { paths } from '@/paths';

/** The workspace's routes. The list arrives with the route editor; until then, what to do next. */
export function Component() {
  const workspace = useWorkspace();
  const { data: session } = useSession();
  const isAdmin = session ? canInviteMembers(session, workspace.id) : false;
  return (
    <>
      <PageHeader
        eyebrow={workspace.name}
        title="Routes"
        description={
          <span className="inline-flex items-center gap-2">
            <span>Your roles here:</span> <RoleBadges roles={workspace.roles} />
          </span>
        }
      />
      <EmptyState
        title="No routes yet — create your first isolation route"
        glyph={<RouteSketch />}
        action={
          <Button disabled aria-describedby="new-route-note">
            Create a route
          </Button>
        }
      >
        <p>
          A route is the work-up and isolation drawn as steps: quench, washes and extractions, distillation, crystallisation, filtration
          and drying. Phasewright follows the product and every impurity through each step.
        </p>
        <p id="new-route-note" className="mt-2 text-small">
          Drawing routes is not open yet. Meanwhile, get ready:{' '}
          <Link to={paths.workspace.compounds.to(workspace.id)} className="font-medium text-accent hover:underline">
            enter your compounds
          </Link>{' '}
          and check the{' '}
          <Link to={paths.workspace.solvents.to(workspace.id)} className="font-medium text-accent hover:underline">
            solvent library
          </Link>
          {isAdmin ? (
            <>
              , or{' '}
              <Link to={paths.workspace.members.to(workspace.id)} className="font-medium text-accent hover:underline">
                invite your colleagues
              </Link>
            </>
          ) : null}
          .
        </p>
      </EmptyState>
    </>
  );
}

/** Three steps joined by streams, drawn in the phase colours. */
function RouteSketch() {
  return (
    <svg width="120" height="40" viewBox="0 0 120 40" fill="none" strokeWidth="1.5">
      <rect x="2" y="10" width="26" height="20" rx="4" className="stroke-ink-faint" strokeDasharray="3 2.5" />
      <rect x="47" y="10" width="26" height="20" rx="4" className="stroke-ink-faint" strokeDasharray="3 2.5" />
      <rect x="92" y="10" width="26" height="20" rx="4" className="stroke-ink-faint" strokeDasharray="3 2.5" />
      <path d="M28 16h19" className="stroke-phase-organic" />
      <path d="M28 24h19" className="stroke-phase-aqueous" />
      <path d="M73 20h19" className="stroke-phase-solid" />
    </svg>
  );
}
