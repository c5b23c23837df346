import type { Transaction } from 'sequelize';
import { OutboxMessage } from '../models';

export async function listOutbox(
  transaction: Transaction | null,
  limit = 200,
): Promise<OutboxMessage[]> {
  return OutboxMessage.findAll({ order: [['receivedAt', 'DESC']], limit, transaction });
}
