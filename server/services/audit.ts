/**
 * The audit trail: append-only, time set by the database, and a hash chain
 * per workspace (plus one "account" chain for sign-ins, passwords and
 * tokens). The chain is written by a database trigger; this module records
 * entries, lists them for a workspace and verifies the chains.
 */
import { Op, QueryTypes, type Sequelize, type Transaction, type WhereOptions } from 'sequelize';
import type { AuditEventPayload, AuditFilter, AuditVerify } from '@shared/schemas/audit';
import { database } from '../db/sequelize';
import { badRequest } from '../errors';
import { AuditEvent, User } from '../models';
import { matchingRows } from './keyset';

export interface AuditEntry {
  workspaceId: string | null;
  actorId: string | null;
  action: string;
  entityType: string;
  entityId: string | null;
  before?: unknown;
  after?: unknown;
}

/** The chain of account events (no workspace). */
export const ACCOUNT_CHAIN = 'account';
const GENESIS_HASH = '0'.repeat(64);

/** Appends to the audit trail in the caller's transaction, so the record and the change commit together. */
export async function recordAudit(
  entry: AuditEntry,
  transaction: Transaction | null,
): Promise<void> {
  await AuditEvent.create(
    {
      workspaceId: entry.workspaceId,
      actorId: entry.actorId,
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId,
      before: entry.before ?? null,
      after: entry.after ?? null,
    },
    { transaction },
  );
}

// ---------------------------------------------------------------- listing

const startOf = (value: string) => (value.length === 10 ? `${value}T00:00:00Z` : value);
const endOf = (value: string) => (value.length === 10 ? `${value}T23:59:59.999999Z` : value);

interface Cursor {
  at: string;
  id: string;
}
const encodeCursor = (cursor: Cursor) =>
  Buffer.from(`${cursor.at}|${cursor.id}`, 'utf8').toString('base64url');
function decodeCursor(text: string): Cursor {
  const [at, id] = Buffer.from(text, 'base64url').toString('utf8').split('|');
  if (!at || !id || Number.isNaN(Date.parse(at)) || !/^[0-9a-f-]{36}$/.test(id))
    throw badRequest('The page link is not valid; start from the first page.', [
      { path: 'query.cursor', message: 'Not a cursor from a previous page.' },
    ]);
  return { at, id };
}

/**
 * The workspace's events, and the account events (sign-ins, passwords,
 * tokens) of the people who are its members now: two scopes, each read on its
 * own index in time order (audit_events_workspace_at_id_idx,
 * audit_events_account_at_idx) and merged, so a page never sorts the whole
 * trail. Members are named by a subquery, not a list, however many there are.
 */
async function workspaceScopes(workspaceId: string, filter: AuditFilter): Promise<WhereOptions[]> {
  const conditions: WhereOptions[] = [];
  if (filter.entityType) conditions.push({ entityType: filter.entityType });
  if (filter.entityId) conditions.push({ entityId: filter.entityId });
  if (filter.actorId) conditions.push({ actorId: filter.actorId });
  if (filter.action) conditions.push({ action: { [Op.startsWith]: filter.action } });
  if (filter.from) conditions.push({ at: { [Op.gte]: startOf(filter.from) } });
  if (filter.to) conditions.push({ at: { [Op.lte]: endOf(filter.to) } });
  const ws = database().escape(workspaceId);
  // Each scope starts from the trigram match of its own events (audit_events_action_trgm_idx,
  // the same expression); see matchingRows() in keyset.ts for why.
  const search = async (scope: (alias: string) => string): Promise<WhereOptions[]> =>
    filter.q
      ? [
          await matchingRows(
            {
              model: 'AuditEvent',
              table: 'audit_events',
              expressions: [(t) => `(${t}.action || ' ' || ${t}.entity_type)`],
              scope,
            },
            filter.q,
          ),
        ]
      : [];
  const accountOfMember = database().literal(
    `("AuditEvent"."actor_id" IN (SELECT m.user_id FROM memberships m WHERE m.workspace_id = ${ws})` +
      ` OR ("AuditEvent"."entity_type" = 'user' AND "AuditEvent"."entity_id" IN (SELECT m.user_id::text FROM memberships m WHERE m.workspace_id = ${ws})))`,
  ) as unknown as WhereOptions;
  return [
    {
      [Op.and]: [
        { workspaceId },
        ...conditions,
        ...(await search((t) => `${t}.workspace_id = ${ws}`)),
      ],
    },
    {
      [Op.and]: [
        { workspaceId: null },
        accountOfMember,
        ...conditions,
        ...(await search((t) => `${t}.workspace_id IS NULL`)),
      ],
    },
  ];
}

const AT_TEXT = `to_char("AuditEvent"."at" AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`;

/** The newest `limit` events of the scopes after the cursor, merged in time order. */
async function findEvents(
  scopes: WhereOptions[],
  limit: number,
  after: Cursor | null,
): Promise<Array<AuditEvent & { atText: string }>> {
  const parts = await Promise.all(scopes.map((where) => findScopeEvents(where, limit, after)));
  const key = (e: AuditEvent & { atText?: string }) => `${e.get('atText') as string}|${e.id}`;
  return parts
    .flat()
    .sort((a, b) => (key(a) < key(b) ? 1 : key(a) > key(b) ? -1 : 0))
    .slice(0, limit);
}

async function findScopeEvents(
  where: WhereOptions,
  limit: number,
  after: Cursor | null,
): Promise<Array<AuditEvent & { atText: string }>> {
  const conditions: WhereOptions[] = [where];
  if (after) {
    conditions.push(
      database().literal(
        `("AuditEvent"."at", "AuditEvent"."id") < (${database().escape(after.at)}::timestamptz, ${database().escape(after.id)}::uuid)`,
      ) as unknown as WhereOptions,
    );
  }
  const rows = await AuditEvent.findAll({
    where: { [Op.and]: conditions },
    attributes: { include: [[database().literal(AT_TEXT), 'atText']] },
    include: [{ model: User, as: 'actor', attributes: ['id', 'name', 'email'] }],
    order: [
      ['at', 'DESC'],
      ['id', 'DESC'],
    ],
    limit,
  });
  return rows as Array<AuditEvent & { atText: string }>;
}

export function presentAuditEvent(event: AuditEvent & { atText?: string }): AuditEventPayload {
  const atText = (event.get('atText') as string | undefined) ?? event.at.toISOString();
  return {
    id: event.id,
    at: atText,
    action: event.action,
    entityType: event.entityType,
    entityId: event.entityId,
    actor: event.actor
      ? { id: event.actor.id, name: event.actor.name, email: event.actor.email }
      : null,
    workspaceId: (event.workspaceId as string | null) ?? null,
    before: event.before ?? null,
    after: event.after ?? null,
    chain: event.chain,
    position: Number(event.position),
    prevHash: event.prevHash,
    hash: event.hash,
  };
}

export async function listAudit(
  workspaceId: string,
  filter: AuditFilter & { limit: number; cursor?: string },
): Promise<{ items: AuditEventPayload[]; nextCursor: string | null }> {
  const after = filter.cursor ? decodeCursor(filter.cursor) : null;
  const rows = await findEvents(
    await workspaceScopes(workspaceId, filter),
    filter.limit + 1,
    after,
  );
  const page = rows.slice(0, filter.limit);
  const last = page.at(-1);
  return {
    items: page.map(presentAuditEvent),
    nextCursor:
      rows.length > filter.limit && last
        ? encodeCursor({ at: last.get('atText') as string, id: last.id })
        : null,
  };
}

/** Every matching event, newest first, in pages (for the CSV export). */
export async function* allAuditEvents(
  workspaceId: string,
  filter: AuditFilter,
): AsyncGenerator<AuditEventPayload> {
  const where = await workspaceScopes(workspaceId, filter);
  let after: Cursor | null = null;
  for (;;) {
    const rows = await findEvents(where, 1000, after);
    for (const row of rows) yield presentAuditEvent(row);
    if (rows.length < 1000) return;
    const last = rows.at(-1)!;
    after = { at: last.get('atText') as string, id: last.id };
  }
}

// ---------------------------------------------------------------- verifying

interface ChainRow {
  id: string;
  at: string;
  position: string;
  prev_hash: string;
  hash: string;
  recomputed: string;
}

/**
 * Walks one chain from its first row: each row's position follows the one
 * before, its prev_hash is the previous row's hash, and its hash recomputed
 * from its content matches the stored one; the chain head must name the last
 * row (so removing the newest rows is caught too). Reads one consistent
 * snapshot.
 */
export async function verifyChain(
  chain: string,
  sequelize: Sequelize = database(),
): Promise<AuditVerify> {
  return sequelize.transaction(
    { isolationLevel: 'REPEATABLE READ' as Transaction.ISOLATION_LEVELS },
    async (transaction) => {
      await sequelize.query('SET TRANSACTION READ ONLY', { transaction }).catch(() => undefined);
      let checked = 0;
      let previous = { hash: GENESIS_HASH, position: 0, id: '', at: '' };
      const broken = (row: { id: string; at: string; position: number }, reason: string) => ({
        ok: false,
        checked,
        firstBroken: { id: row.id, at: row.at, chain, position: row.position, reason },
      });
      for (;;) {
        const rows = await sequelize.query<ChainRow>(
          `SELECT id, to_char(at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"') AS at,
                  position, prev_hash, hash,
                  audit_event_digest(prev_hash, id, chain, position, workspace_id, actor_id, action,
                    entity_type, entity_id, before, after, at) AS recomputed
             FROM audit_events WHERE chain = :chain AND position > :from
            ORDER BY position LIMIT 2000`,
          {
            replacements: { chain, from: previous.position },
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        for (const row of rows) {
          const position = Number(row.position);
          const here = { id: row.id, at: row.at, position };
          checked += 1;
          if (position !== previous.position + 1)
            return broken(
              here,
              `Rows ${previous.position + 1} to ${position - 1} of the chain are missing.`,
            );
          if (row.prev_hash !== previous.hash)
            return broken(here, 'The previous-row hash does not match the row before it.');
          if (row.recomputed !== row.hash)
            return broken(here, 'The row was changed after it was written (its hash differs).');
          previous = { hash: row.hash, position, id: row.id, at: row.at };
        }
        if (rows.length < 2000) break;
      }
      const [head] = await sequelize.query<{ position: string; hash: string }>(
        'SELECT position, hash FROM audit_chain_heads WHERE chain = :chain',
        { replacements: { chain }, type: QueryTypes.SELECT, transaction },
      );
      const headPosition = head ? Number(head.position) : 0;
      if (headPosition !== previous.position || (head && head.hash !== previous.hash)) {
        return broken(
          { id: previous.id, at: previous.at, position: previous.position },
          `The chain ends at row ${previous.position} but was last written at row ${headPosition}: newer rows are missing or the chain head was altered.`,
        );
      }
      return { ok: true, checked };
    },
  );
}

/** Verifies several chains; the first broken link wins, the counts add up. */
export async function verifyChains(
  chains: string[],
  sequelize: Sequelize = database(),
): Promise<AuditVerify> {
  let checked = 0;
  for (const chain of chains) {
    const result = await verifyChain(chain, sequelize);
    checked += result.checked;
    if (!result.ok) return { ...result, checked };
  }
  return { ok: true, checked };
}

/** The chains shown to a workspace's admin: its own and the account chain. */
export const workspaceChains = (workspaceId: string) => [workspaceId, ACCOUNT_CHAIN];

export async function allChains(sequelize: Sequelize = database()): Promise<string[]> {
  const rows = await sequelize.query<{ chain: string }>(
    `SELECT chain FROM audit_chain_heads UNION SELECT DISTINCT chain FROM audit_events ORDER BY chain`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((row) => row.chain);
}
