import type { Transaction } from 'sequelize';
import type { Role } from '@shared/schemas/session';
import { Membership } from '../models';
import type { Actor } from '../policies';

/** Loads the roles a user holds in each workspace: what the policies decide on. */
export async function loadActor(userId: string, transaction?: Transaction | null): Promise<Actor> {
  const memberships = await Membership.findAll({
    where: { userId },
    attributes: ['workspaceId', 'roles'],
    transaction,
  });
  return actorFrom(
    userId,
    memberships.map((m) => ({ workspaceId: m.workspaceId as string, roles: m.roles as Role[] })),
  );
}

export function actorFrom(
  userId: string,
  memberships: readonly { workspaceId: string; roles: Role[] }[],
): Actor {
  return { userId, memberships: new Map(memberships.map((m) => [m.workspaceId, m.roles])) };
}
