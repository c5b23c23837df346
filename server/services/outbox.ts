import { Op, type Transaction } from 'sequelize';
import { OutboxMessage } from '../models';
import type { Actor } from '../policies';

/**
 * The mail the built-in fake caught that concerns only workspaces the actor
 * administers, newest first. Mail of any other workspace (a password-reset
 * link of someone in another group) and mail that names no workspace stay
 * hidden.
 */
export async function listOutbox(
  actor: Actor,
  transaction: Transaction | null,
  limit = 200,
): Promise<OutboxMessage[]> {
  const administered = [...actor.memberships]
    .filter(([, roles]) => roles.includes('admin'))
    .map(([workspaceId]) => workspaceId);
  if (administered.length === 0) return [];
  return OutboxMessage.findAll({
    where: {
      [Op.and]: [
        { workspaceIds: { [Op.contained]: administered } },
        { workspaceIds: { [Op.ne]: [] } },
      ],
    },
    order: [['receivedAt', 'DESC']],
    limit,
    transaction,
  });
}
