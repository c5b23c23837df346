/**
 * One source of truth for who may do what.
 *
 * To add rules for a new resource: write server/policies/<resource>.ts exporting
 * `<resource>Rules = { '<resource>.<verb>': workspaceRule(...), ... } as const`,
 * spread it into `rules` below, and name each action in shared/schemas/actions.ts
 * under its scope (the type-check below insists). The action names become typed
 * everywhere (`authorize(actor, 'route.create', route)`), and workspace and
 * account rules show up in the abilities map the client receives with the session.
 */
import type {
  AccountAction,
  Action as SharedAction,
  OwnerAction,
  WorkspaceAction,
} from '@shared/schemas/actions';
import type { Abilities } from '@shared/schemas/session';
import type { Exactly } from '@shared/schemas/exact';
import { forbidden, notFound } from '../errors';
import { accountRules } from './account';
import { auditRules } from './audit';
import { chromatogramRules } from './chromatogram';
import { commentRules } from './comment';
import { reviewRules } from './review';
import { revisionRules } from './revision';
import { compoundRules } from './compound';
import { equipmentRules } from './equipment';
import { stepListRules } from './step-list';
import { outboxRules } from './outbox';
import { routeRules } from './route';
import { tokenRules } from './token';
import type { Actor, Rule } from './types';
import { workspaceRules } from './workspace';

export type { Actor } from './types';

export const rules = {
  ...workspaceRules,
  ...tokenRules,
  ...accountRules,
  ...outboxRules,
  ...routeRules,
  ...compoundRules,
  ...equipmentRules,
  ...stepListRules,
  ...auditRules,
  ...revisionRules,
  ...reviewRules,
  ...commentRules,
  ...chromatogramRules,
} as const;

type Rules = typeof rules;
export type Action = keyof Rules;
/** The resource type an action applies to (null for account-wide actions). */
export type ResourceOf<A extends Action> = Rules[A] extends Rule<infer R> ? R : never;

// The client types its abilities from shared/schemas/actions.ts: these fail the type-check
// when a rule is added, renamed, removed or changes scope without that list following.
type ActionsOfScope<S extends Rule<unknown>['scope']> = {
  [A in Action]: Rules[A] extends { scope: S } ? A : never;
}[Action];
const _sameActions: Exactly<Action, SharedAction> = true;
const _sameWorkspaceActions: Exactly<ActionsOfScope<'workspace'>, WorkspaceAction> = true;
const _sameAccountActions: Exactly<ActionsOfScope<'account'>, AccountAction> = true;
const _sameOwnerActions: Exactly<ActionsOfScope<'owner'>, OwnerAction> = true;

/**
 * Decides whether the actor may perform the action; false for resources they
 * cannot even see.
 */
export function can<A extends Action>(actor: Actor, action: A, resource: ResourceOf<A>): boolean {
  return decide(actor, rules[action] as Rule<unknown>, resource) === 'allow';
}

/**
 * Throws unless the actor may perform the action: 404 when the resource lies
 * outside what the actor can see (so its existence does not leak), 403 when
 * they can see it but their roles do not allow the action.
 */
export function authorize<A extends Action>(
  actor: Actor,
  action: A,
  resource: ResourceOf<A>,
): void {
  const decision = decide(actor, rules[action] as Rule<unknown>, resource);
  if (decision === 'hidden') throw notFound();
  if (decision === 'forbidden') throw forbidden();
}

function decide(
  actor: Actor,
  rule: Rule<unknown>,
  resource: unknown,
): 'allow' | 'forbidden' | 'hidden' {
  switch (rule.scope) {
    case 'workspace': {
      const roles = actor.memberships.get((resource as { workspaceId: string }).workspaceId);
      if (!roles) return 'hidden';
      return rule.allow(roles, actor, resource) ? 'allow' : 'forbidden';
    }
    case 'owner':
      if ((resource as { userId: string }).userId !== actor.userId) return 'hidden';
      return rule.allow(actor, resource) ? 'allow' : 'forbidden';
    case 'account':
      return rule.allow(actor) ? 'allow' : 'forbidden';
  }
}

/**
 * The abilities map sent with the session: account-wide actions under
 * `global`, workspace actions per workspace the actor belongs to.
 * Owner-scoped actions depend on the object and are left out.
 */
export function abilitiesFor(actor: Actor): Abilities {
  const global: Record<string, boolean> = {};
  const workspaces: Record<string, Record<string, boolean>> = {};
  for (const [action, rule] of Object.entries(rules) as [string, Rule<unknown>][]) {
    if (rule.scope === 'account') global[action] = rule.allow(actor);
  }
  for (const workspaceId of actor.memberships.keys()) {
    const abilities: Record<string, boolean> = {};
    for (const [action, rule] of Object.entries(rules) as [string, Rule<unknown>][]) {
      if (rule.scope === 'workspace')
        abilities[action] = decide(actor, rule, { workspaceId }) === 'allow';
    }
    workspaces[workspaceId] = abilities;
  }
  // Every account and workspace action is named, by the type-checks above.
  return { global, workspaces } as Abilities;
}
