import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { Role } from '@shared/schemas/session';
import type { Actor } from '../policies';
import { conflict, notFound } from '../errors';
import { Membership, User, Workspace } from '../models';
import { recordAudit } from './audit';
import {
  afterCursor,
  matchingRows,
  keyAttributes,
  keyOrder,
  pageOf,
  type KeysetOrder,
} from './keyset';

/**
 * Loads a workspace by id. Callers authorize next; a workspace the actor does
 * not belong to answers 404 there, exactly like one that does not exist.
 */
export async function loadWorkspace(
  id: string,
  transaction: Transaction | null,
): Promise<Workspace> {
  const workspace = await Workspace.findByPk(id, { transaction });
  // The generic message: a workspace the actor cannot see must answer exactly like a missing one.
  if (!workspace) throw notFound();
  return workspace;
}

/**
 * The workspace of a read, known from the caller's memberships without a
 * statement: a member's workspace exists. Anyone else gets the same 404 as for a
 * missing workspace. Use loadWorkspace when the workspace's fields are needed.
 */
export function memberWorkspace(actor: Actor, id: string): { id: string } {
  if (!actor.memberships.has(id)) throw notFound();
  return { id };
}

const MEMBER_ORDER: KeysetOrder = {
  name: 'name',
  columns: [
    { sql: 'lower("user"."name")', type: 'text' },
    { sql: '"user"."id"', type: 'uuid' },
  ],
  direction: 'ASC',
};

/**
 * One page of the workspace's members by name (memberships_workspace_idx, then
 * users_name_id_idx); `q` matches part of the name or e-mail (trigram indexes),
 * `role` keeps those who hold it.
 */
export async function listMembers(
  workspaceId: string,
  query: { q?: string; role?: Role; limit: number; cursor?: string },
  transaction: Transaction | null,
): Promise<{ items: Membership[]; nextCursor: string | null }> {
  const conditions: WhereOptions[] = [{ workspaceId }];
  if (query.role) conditions.push({ roles: { [Op.contains]: [query.role] } });
  if (query.q)
    conditions.push(
      await matchingRows(
        { model: 'user', table: 'users', expressions: [(t) => `${t}.name`, (t) => `${t}.email`] },
        query.q,
      ),
    );
  if (query.cursor) conditions.push(afterCursor(MEMBER_ORDER, query.cursor));
  const rows = await Membership.findAll({
    where: { [Op.and]: conditions },
    attributes: { include: keyAttributes(MEMBER_ORDER) },
    include: [{ model: User, as: 'user', required: true }],
    order: keyOrder(MEMBER_ORDER),
    limit: query.limit + 1,
    subQuery: false,
    transaction,
  });
  return pageOf(rows, query.limit, MEMBER_ORDER);
}

export async function loadMembership(
  workspaceId: string,
  userId: string,
  transaction: Transaction | null,
): Promise<Membership> {
  const membership = await Membership.findOne({
    where: { workspaceId, userId },
    include: [{ model: User, as: 'user', required: true }],
    transaction,
    // Locked so two changes to the same member are applied one after the other.
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: Membership } : undefined,
  });
  if (!membership) throw notFound('The member');
  return membership;
}

/**
 * Refuses a change that would leave the workspace without an admin. The
 * workspace row is locked first (SELECT ... FOR UPDATE) and held to the end of
 * the transaction, so changes to admins of one workspace are counted one after
 * another: of two admins demoting each other at once, the second counts after
 * the first has committed and is refused. Locking only the membership being
 * changed is not enough, since each would count the other as still admin.
 */
async function assertAnotherAdminRemains(
  membership: Membership,
  transaction: Transaction | null,
): Promise<void> {
  if (transaction)
    await Workspace.findByPk(membership.workspaceId as string, {
      attributes: ['id'],
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
  const otherAdmins = await Membership.count({
    where: {
      workspaceId: membership.workspaceId,
      userId: { [Op.ne]: membership.userId },
      roles: { [Op.contains]: ['admin'] },
    },
    transaction,
  });
  if (otherAdmins === 0) {
    throw conflict(
      'last_admin',
      'A workspace needs at least one admin. Make someone else admin first.',
    );
  }
}

export async function updateRoles(
  membership: Membership,
  roles: Role[],
  actorId: string,
  transaction: Transaction | null,
): Promise<Membership> {
  const before = [...membership.roles];
  if (before.includes('admin') && !roles.includes('admin'))
    await assertAnotherAdminRemains(membership, transaction);
  await membership.update({ roles }, { transaction });
  await recordAudit(
    {
      workspaceId: membership.workspaceId as string,
      actorId,
      action: 'member.roles_changed',
      entityType: 'membership',
      entityId: membership.id,
      before: { userId: membership.userId, roles: before },
      after: { userId: membership.userId, roles },
    },
    transaction,
  );
  return membership;
}

export async function removeMember(
  membership: Membership,
  actorId: string,
  transaction: Transaction | null,
): Promise<void> {
  if (membership.roles.includes('admin')) await assertAnotherAdminRemains(membership, transaction);
  await membership.destroy({ transaction });
  await recordAudit(
    {
      workspaceId: membership.workspaceId as string,
      actorId,
      action: 'member.removed',
      entityType: 'membership',
      entityId: membership.id,
      before: { userId: membership.userId, roles: membership.roles },
    },
    transaction,
  );
}

/** Adds the user to the workspace, or merges roles when they are already a member. */
export async function addMember(
  workspaceId: string,
  userId: string,
  roles: Role[],
  transaction: Transaction | null,
): Promise<Membership> {
  const existing = await Membership.findOne({ where: { workspaceId, userId }, transaction });
  if (existing) {
    const merged = [...new Set([...existing.roles, ...roles])];
    return existing.update({ roles: merged }, { transaction });
  }
  return Membership.create({ workspaceId, userId, roles }, { transaction });
}
