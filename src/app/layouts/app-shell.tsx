import type { ReactNode } from 'react';
import { createContext, useContext } from 'react';
import {
  Navigate,
  NavLink,
  Outlet,
  useLocation,
  useMatch,
  useNavigate,
  useParams,
} from 'react-router-dom';
import type { Session } from '@shared/schemas/session';
import { useSession } from '@/features/auth/api/get-session';
import { useSignOut } from '@/features/auth/api/sign-out';
import { canInWorkspace, canOnAccount } from '@/features/auth/abilities';
import { lastWorkspace } from '@/features/auth/last-workspace';
import { useSessionEnd } from '@/features/auth/session-end';
import { WorkspaceSwitcher } from '@/features/auth/components/workspace-switcher';
import { Logo } from '@/components/logo';
import { Loading } from '@/components/spinner';
import { ErrorState } from '@/components/error-state';
import { cn } from '@/components/cn';
import { paths } from '@/paths';
import { toast } from '@/stores/toasts';

/** Signed-in pages: the guard, the navigation rail and the page area. */
export function Component() {
  const session = useSession();
  const location = useLocation();
  const signedOut = useSessionEnd((s) => s.reason === 'signed-out');

  if (session.isPending)
    return <Loading label="Checking your session…" className="justify-center pt-24" />;
  if (session.isError) {
    return (
      <div className="mx-auto mt-24 max-w-form px-6">
        <ErrorState
          error={session.error}
          title="Phasewright could not reach the server"
          onRetry={() => session.refetch()}
        />
      </div>
    );
  }
  if (!session.data) {
    // Someone who signed out starts afresh; anyone else comes back here after signing in.
    return (
      <Navigate
        to={paths.signIn.to(signedOut ? undefined : location.pathname + location.search)}
        replace
      />
    );
  }
  return <Shell session={session.data} />;
}

function Shell({ session }: { session: Session }) {
  const { workspaceId: routeWorkspaceId } = useParams();
  const remembered = lastWorkspace();
  const workspaceId =
    routeWorkspaceId ??
    (session.workspaces.some((w) => w.id === remembered) ? remembered! : session.workspaces[0]?.id);

  // The route editor needs the width for its canvas: there the rail keeps only its marks (names as tooltips and accessible names).
  // The pages that open the editor (a route and one of its revisions) take the page from the
  // compact rail's edge on: a full rail there would sit under the canvas.
  const onRoute = useMatch(paths.workspace.route.pattern) !== null;
  const onRevision = useMatch(paths.workspace.revision.pattern) !== null;
  const compact = onRoute || onRevision;

  return (
    <CompactRail.Provider value={compact}>
      <div className="flex min-h-screen">
        <aside
          className={cn(
            // Above the pages that fill the window beside it (the editor): nothing draws over the rail.
            'sticky top-0 z-20 flex h-screen shrink-0 flex-col border-r border-rule bg-paper-sunken print:hidden',
            compact ? 'w-14' : 'w-rail',
          )}
          data-rail={compact ? 'compact' : 'full'}
        >
          <a
            href="#main"
            className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded-control focus:bg-paper-raised focus:px-3 focus:py-2"
          >
            Skip to content
          </a>
          <div
            className={cn(
              'flex h-bar items-center gap-2 border-b border-rule',
              compact ? 'justify-center' : 'px-4',
            )}
          >
            <Logo className="text-ink" />
            <span
              className={compact ? 'sr-only' : 'text-lead font-semibold tracking-tight text-ink'}
            >
              Phasewright
            </span>
          </div>
          {compact ? null : (
            <div className="border-b border-rule px-3 py-3">
              <WorkspaceSwitcher workspaces={session.workspaces} currentId={workspaceId} />
            </div>
          )}
          <nav
            aria-label="Main"
            className={cn('flex-1 overflow-y-auto py-3', compact ? 'px-1.5' : 'px-2')}
          >
            {workspaceId ? (
              <NavGroup label="Process">
                <NavItem to={paths.workspace.home.to(workspaceId)} end glyph={<RouteGlyph />}>
                  Routes
                </NavItem>
                <NavItem to={paths.workspace.compounds.to(workspaceId)} glyph={<CompoundGlyph />}>
                  Compounds
                </NavItem>
                <NavItem to={paths.workspace.solvents.to(workspaceId)} glyph={<SolventGlyph />}>
                  Solvent library
                </NavItem>
                <NavItem to={paths.workspace.equipment.to(workspaceId)} glyph={<VesselGlyph />}>
                  Equipment
                </NavItem>
              </NavGroup>
            ) : null}
            {workspaceId ? (
              <NavGroup label="Workspace">
                <NavItem to={paths.workspace.members.to(workspaceId)} glyph={<PeopleGlyph />}>
                  Members
                </NavItem>
                {canInWorkspace(session, workspaceId, 'audit.read') ? (
                  <NavItem to={paths.workspace.audit.to(workspaceId)} glyph={<PeopleGlyph />}>
                    Audit trail
                  </NavItem>
                ) : null}
              </NavGroup>
            ) : null}
            <NavGroup label="You">
              <NavItem to={paths.account.to()} glyph={<PersonGlyph />}>
                Account
              </NavItem>
              {canOnAccount(session, 'outbox.read') ? (
                <NavItem to={paths.outbox.to()} glyph={<MailGlyph />}>
                  Outbox
                </NavItem>
              ) : null}
            </NavGroup>
          </nav>
          <UserPanel session={session} />
        </aside>
        <main
          id="main"
          tabIndex={-1}
          className="min-w-0 flex-1 px-gutter py-5 focus:outline-none print:p-0"
        >
          <div className="mx-auto max-w-page">
            <Outlet />
          </div>
        </main>
      </div>
    </CompactRail.Provider>
  );
}

/** Whether the rail shows only its marks (on the route editor). */
const CompactRail = createContext(false);

function UserPanel({ session }: { session: Session }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  const compact = useContext(CompactRail);
  const onSignOut = () =>
    signOut.mutate(undefined, {
      onSuccess: () => navigate(paths.signIn.to(), { replace: true }),
      onError: (e) => toast.error(e.message),
    });
  if (compact) {
    const initials = session.user.name
      .split(/\s+/)
      .filter(Boolean)
      .slice(0, 2)
      .map((w) => w[0]!.toUpperCase())
      .join('');
    return (
      <div className="flex flex-col items-center gap-1 border-t border-rule py-2">
        <span
          title={`${session.user.name} (${session.user.email})`}
          className="flex size-8 items-center justify-center rounded-full border border-rule-strong bg-paper-raised text-caption font-medium text-ink"
        >
          <span aria-hidden="true">{initials}</span>
          <span className="sr-only">Signed in as {session.user.name}</span>
        </span>
        <button
          type="button"
          disabled={signOut.isPending}
          onClick={onSignOut}
          aria-label="Sign out"
          title="Sign out"
          className="flex size-8 items-center justify-center rounded-control text-accent hover:bg-accent-soft hover:text-accent-deep"
        >
          <SignOutGlyph />
        </button>
      </div>
    );
  }
  return (
    <div className="border-t border-rule px-3 py-3">
      <p className="text-body leading-snug font-medium text-ink">{session.user.name}</p>
      <p className="truncate text-caption text-ink-muted" title={session.user.email}>
        {session.user.email}
      </p>
      <button
        type="button"
        disabled={signOut.isPending}
        onClick={onSignOut}
        className="mt-2 rounded-control px-1 py-0.5 text-small font-medium text-accent hover:bg-accent-soft hover:text-accent-deep"
      >
        {signOut.isPending ? 'Signing out…' : 'Sign out'}
      </button>
    </div>
  );
}

function NavGroup({ label, children }: { label: string; children: ReactNode }) {
  const compact = useContext(CompactRail);
  return (
    <div className={compact ? 'mb-3 border-b border-rule pb-3 last:border-0' : 'mb-4'}>
      <p
        className={
          compact
            ? 'sr-only'
            : 'px-2 pb-1 text-caption font-medium tracking-wide text-ink-faint uppercase'
        }
      >
        {label}
      </p>
      <ul className="space-y-px">{children}</ul>
    </div>
  );
}

function NavItem({
  to,
  end,
  glyph,
  soon,
  children,
}: {
  to: string;
  end?: boolean;
  glyph: ReactNode;
  soon?: boolean;
  children: ReactNode;
}) {
  const compact = useContext(CompactRail);
  return (
    <li>
      <NavLink
        to={to}
        end={end}
        title={compact && typeof children === 'string' ? children : undefined}
        className={({ isActive }) =>
          cn(
            'flex h-8 items-center gap-2 rounded-control border-l-2 text-body',
            compact ? 'justify-center px-0' : 'px-2',
            isActive
              ? 'border-accent bg-paper-raised font-medium text-accent-deep'
              : 'border-transparent text-ink-muted hover:bg-paper-raised/70 hover:text-ink',
          )
        }
      >
        <span aria-hidden="true" className="text-current">
          {glyph}
        </span>
        <span className={compact ? 'sr-only' : 'flex-1'}>{children}</span>
        {soon && !compact ? (
          <span className="rounded-control bg-paper px-1 text-caption text-ink-faint">soon</span>
        ) : null}
      </NavLink>
    </li>
  );
}

const glyphProps = {
  width: 16,
  height: 16,
  viewBox: '0 0 16 16',
  fill: 'none',
  stroke: 'currentColor',
  strokeWidth: 1.4,
} as const;

function RouteGlyph() {
  return (
    <svg {...glyphProps}>
      <rect x="1.5" y="2" width="4" height="3" rx="0.8" />
      <rect x="10.5" y="6.5" width="4" height="3" rx="0.8" />
      <rect x="1.5" y="11" width="4" height="3" rx="0.8" />
      <path d="M5.5 3.5h2.5v4.5h2.5M8 8v4.5H5.5" />
    </svg>
  );
}
function CompoundGlyph() {
  return (
    <svg {...glyphProps}>
      <path d="M8 1.8l5.3 3.1v6.2L8 14.2l-5.3-3.1V4.9z" />
      <path d="M8 5.2v5.6" />
    </svg>
  );
}
function SolventGlyph() {
  return (
    <svg {...glyphProps}>
      <path d="M5.5 1.8h5M6.5 1.8v3.4L3 12.6a1.2 1.2 0 0 0 1.1 1.7h7.8a1.2 1.2 0 0 0 1.1-1.7L9.5 5.2V1.8" />
      <path d="M4.4 10h7.2" />
    </svg>
  );
}
function VesselGlyph() {
  return (
    <svg {...glyphProps}>
      <path d="M4 3.5h8M5 3.5v8.2a3 3 0 0 0 6 0V3.5" />
      <path d="M8 1.5v5.5M6.3 7h3.4" />
    </svg>
  );
}
function PeopleGlyph() {
  return (
    <svg {...glyphProps}>
      <circle cx="5.5" cy="5.5" r="2.3" />
      <path d="M1.5 13.5c.4-2.4 2-3.7 4-3.7s3.6 1.3 4 3.7" />
      <circle cx="11.3" cy="6" r="1.8" />
      <path d="M11 9.6c1.8 0 3 1.1 3.4 3.2" />
    </svg>
  );
}
function PersonGlyph() {
  return (
    <svg {...glyphProps}>
      <circle cx="8" cy="5.3" r="2.6" />
      <path d="M3 14c.5-2.8 2.4-4.3 5-4.3s4.5 1.5 5 4.3" />
    </svg>
  );
}
function SignOutGlyph() {
  return (
    <svg {...glyphProps} aria-hidden="true">
      <path d="M6.5 2.5h-3a1 1 0 0 0-1 1v9a1 1 0 0 0 1 1h3" />
      <path d="M10 5l3 3-3 3M6.5 8H13" />
    </svg>
  );
}
function MailGlyph() {
  return (
    <svg {...glyphProps}>
      <rect x="1.8" y="3.3" width="12.4" height="9.4" rx="1.2" />
      <path d="M2.2 4l5.8 4.6L13.8 4" />
    </svg>
  );
}
