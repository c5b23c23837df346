import type { Role } from '@shared/schemas/session';

/** Who is asking: the user and the roles they hold in each workspace they belong to. */
export interface Actor {
  userId: string;
  /** workspace id → roles held there */
  memberships: ReadonlyMap<string, readonly Role[]>;
}

/** Anything that lives inside one workspace. */
export interface WorkspaceScoped {
  workspaceId: string;
}

/** Anything that belongs to one user (tokens, account settings). */
export interface UserOwned {
  userId: string;
}

/**
 * A rule says how the resource is scoped and who may act on it.
 * - 'workspace': only members of the resource's workspace can see it (others get 404);
 *   `allow` decides, from the member's roles, whether they may act (else 403).
 * - 'owner': only the owning user can see it (others get 404).
 * - 'account': any signed-in user; `allow` decides (else 403). No resource.
 */
export type WorkspaceRule<R> = {
  scope: 'workspace';
  allow: (roles: readonly Role[], actor: Actor, resource: R) => boolean;
};
export type OwnerRule<R> = { scope: 'owner'; allow: (actor: Actor, resource: R) => boolean };
export type AccountRule = { scope: 'account'; allow: (actor: Actor) => boolean };
export type Rule<R> = WorkspaceRule<R> | OwnerRule<R> | AccountRule;

export const workspaceRule = <R extends WorkspaceScoped>(
  allow: (roles: readonly Role[], actor: Actor, resource: R) => boolean,
): WorkspaceRule<R> => ({ scope: 'workspace', allow });

export const ownerRule = <R extends UserOwned>(
  allow: (actor: Actor, resource: R) => boolean = () => true,
): OwnerRule<R> => ({
  scope: 'owner',
  allow,
});

export const accountRule = (allow: (actor: Actor) => boolean = () => true): AccountRule => ({
  scope: 'account',
  allow,
});

export const hasRole = (roles: readonly Role[], ...wanted: Role[]) =>
  wanted.some((role) => roles.includes(role));
