import { Op, type Transaction } from 'sequelize';
import { ApiToken, User } from '../models';
import { notFound } from '../errors';
import { recordAudit } from './audit';
import { randomSecret, sha256 } from './secrets';

const TOKEN_PREFIX = 'pwt_';

/** The user a Bearer token authenticates and the token's scope; null when unknown, revoked or expired. */
export async function findUserByApiToken(
  token: string,
): Promise<{ user: User; scope: 'read' | 'read-write' } | null> {
  const record = await ApiToken.findOne({
    where: { tokenHash: sha256(token), revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [{ model: User, as: 'user', required: true }],
  });
  if (!record?.user) return null;
  // Recorded so people can spot tokens nobody uses any more.
  await ApiToken.update({ lastUsedAt: new Date() }, { where: { id: record.id } });
  return { user: record.user, scope: record.scope };
}

export async function listTokens(
  userId: string,
  transaction: Transaction | null,
): Promise<ApiToken[]> {
  return ApiToken.findAll({
    where: { userId, revokedAt: null },
    order: [['createdAt', 'DESC']],
    transaction,
  });
}

/** Creates a token and returns its secret — the only time it exists outside the caller's hands. */
export async function createToken(
  userId: string,
  input: { name: string; scope: 'read' | 'read-write'; expiresInDays: number },
  transaction: Transaction | null,
): Promise<{ record: ApiToken; token: string }> {
  const { name, scope } = input;
  const token = randomSecret(TOKEN_PREFIX);
  const expiresAt = new Date(Date.now() + input.expiresInDays * 24 * 3600_000);
  const record = await ApiToken.create(
    { userId, name, scope, expiresAt, tokenHash: sha256(token) },
    { transaction },
  );
  await recordAudit(
    {
      workspaceId: null,
      actorId: userId,
      action: 'token.created',
      entityType: 'api_token',
      entityId: record.id,
      after: { name, scope, expiresAt: expiresAt.toISOString() },
    },
    transaction,
  );
  return { record, token };
}

export async function findActiveToken(
  id: string,
  transaction: Transaction | null,
): Promise<ApiToken> {
  const record = await ApiToken.findOne({ where: { id, revokedAt: null }, transaction });
  if (!record) throw notFound(); // generic: another user's token must look missing
  return record;
}

export async function revokeToken(
  record: ApiToken,
  actorId: string,
  transaction: Transaction | null,
): Promise<void> {
  await record.update({ revokedAt: new Date() }, { transaction });
  await recordAudit(
    {
      workspaceId: null,
      actorId,
      action: 'token.revoked',
      entityType: 'api_token',
      entityId: record.id,
      before: { name: record.name },
    },
    transaction,
  );
}
