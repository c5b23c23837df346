import { accountRule, hasRole, workspaceRule, type Actor, type WorkspaceScoped } from './types';

const isMemberSomewhere = (actor: Actor) => actor.memberships.size > 0;

/**
 * Workspace compounds: every member reads them; chemists and admins enter and
 * change them. The solvent library, the calculation API and the structure
 * preview are open to anyone who belongs to a workspace.
 */
export const compoundRules = {
  'compound.list': workspaceRule<WorkspaceScoped>(() => true),
  'compound.read': workspaceRule<WorkspaceScoped>(() => true),
  'compound.create': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'chemist', 'admin')),
  'compound.update': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'chemist', 'admin')),
  'compound.delete': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'chemist', 'admin')),
  'structure.preview': accountRule(isMemberSomewhere),
  'solvent.read': accountRule(isMemberSomewhere),
  'calc.run': accountRule(isMemberSomewhere),
} as const;
