import type { Request, RequestHandler, Response, Router } from 'express';
import type { Transaction } from 'sequelize';
import { z, type ZodType } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import { parseExact } from '@shared/schemas/exact';
import { database } from '../db/sequelize';
import { tokenReadOnly, unauthenticated, validationFailed } from '../errors';
import type { Actor } from '../policies';
import { API_PREFIX, registry } from '../openapi';
import { zodIssuesToDetails } from './validation';

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
type ZodObjectAny = z.ZodObject<z.ZodRawShape>;

export interface Reply {
  status: number;
  body?: unknown;
  /** A download instead of JSON (CSV, XLSX and PDF exports, stored files). */
  file?: { contentType: string; filename: string; content: string | Buffer };
  /**
   * A body already serialised as JSON (e.g. by an engine pool worker), sent as it is: the text,
   * or its UTF-8 bytes.
   */
  json?: string | Uint8Array;
}

/** Runs `work` in one database transaction, for handlers that opt out of the wrapping one. */
export function withTransaction<T>(work: (transaction: Transaction) => Promise<T>): Promise<T> {
  return database().transaction(work);
}

interface HandlerContext<P, Q, B, Authed extends boolean> {
  req: Request;
  res: Response;
  params: P;
  query: Q;
  body: B;
  actor: Authed extends true ? Actor : Actor | undefined;
  /** Null when the route opted out of the wrapping transaction. */
  transaction: Transaction | null;
}

export interface RouteSpec<
  P extends ZodObjectAny | undefined,
  Q extends ZodObjectAny | undefined,
  B extends ZodType | undefined,
  Authed extends boolean,
> {
  method: Method;
  /** Relative to /api/v1, OpenAPI style: '/workspaces/{workspaceId}/members'. */
  path: string;
  summary: string;
  tags: string[];
  /** true: 401 unless signed in (session cookie or Bearer token). */
  auth: Authed;
  params?: P;
  query?: Q;
  body?: B;
  /**
   * A multipart/form-data request (file uploads): described in the OpenAPI
   * document only; the handler reads the parts itself, after authorizing, so
   * nobody can push a large upload at an operation they may not use.
   */
  multipart?: ZodType;
  responses: Record<number, { description: string; schema?: ZodType }>;
  /**
   * Whether the operation changes stored data; read-only API tokens may call
   * only operations that do not. Default: every method but GET.
   */
  writes?: boolean;
  /** Runs before anything else, e.g. a rate limiter. */
  before?: RequestHandler[];
  /**
   * Default: true for every method but GET, false for GET (a read opens no
   * transaction, which would cost two more statements). In a transaction the
   * handler's work is committed before the reply is sent. Writes opt out when a
   * failure must still leave a trace (sign-in counts failed attempts) or when
   * slow work must not hold a connection; reads opt in when they need one
   * snapshot across several statements.
   */
  transaction?: boolean;
  handle: (
    ctx: HandlerContext<
      P extends ZodObjectAny ? z.output<P> : Record<string, never>,
      Q extends ZodObjectAny ? z.output<Q> : Record<string, never>,
      B extends ZodType ? z.output<B> : undefined,
      Authed
    >,
  ) => Promise<Reply>;
}

const registeredOperations = new Set<string>();

const errorResponse = (description: string) => ({
  description,
  content: { 'application/json': { schema: apiErrorSchema } },
});

/**
 * Declares one API operation: mounts it on the resource's router with the
 * standard chain (auth → validate → transaction → handler, which loads,
 * authorizes, calls a service and presents), and registers it in the OpenAPI
 * document from the same schemas.
 */
export function defineRoute<
  P extends ZodObjectAny | undefined = undefined,
  Q extends ZodObjectAny | undefined = undefined,
  B extends ZodType | undefined = undefined,
  Authed extends boolean = boolean,
>(router: Router, spec: RouteSpec<P, Q, B, Authed>): void {
  const responses: Record<string, unknown> = {};
  for (const [status, response] of Object.entries(spec.responses)) {
    responses[status] = response.schema
      ? {
          description: response.description,
          content: { 'application/json': { schema: response.schema } },
        }
      : { description: response.description };
  }
  if (spec.body || spec.multipart || spec.params || spec.query)
    responses['400'] ??= errorResponse('Invalid request; details lists every field problem.');
  if (spec.auth) responses['401'] ??= errorResponse('Not signed in.');
  // Several apps may be built in one process (tests); describe each operation once.
  const operationKey = `${spec.method} ${spec.path}`;
  if (!registeredOperations.has(operationKey)) {
    registeredOperations.add(operationKey);
    registry.registerPath({
      method: spec.method,
      path: API_PREFIX + spec.path,
      summary: spec.summary,
      tags: spec.tags,
      security: spec.auth ? [{ session: [] }, { bearer: [] }] : undefined,
      request: {
        params: spec.params,
        query: spec.query,
        body: spec.body
          ? { content: { 'application/json': { schema: spec.body } }, required: true }
          : spec.multipart
            ? { content: { 'multipart/form-data': { schema: spec.multipart } }, required: true }
            : undefined,
      },
      responses: responses as never,
    });
  }

  const writes = spec.writes ?? spec.method !== 'get';
  const expressPath = spec.path.replace(/\{(\w+)\}/g, ':$1');
  const handler: RequestHandler = async (req, res) => {
    if (spec.auth && !req.actor) throw unauthenticated();
    if (req.authMethod === 'token' && req.tokenScope === 'read' && writes) throw tokenReadOnly();
    const params = parsePart(spec.params, req.params, 'params');
    const query = parsePart(spec.query, req.query, 'query');
    const body = spec.body ? parsePart(spec.body, req.body ?? {}, 'body') : undefined;
    const run = async (transaction: Transaction | null) => {
      const reply = await spec.handle({
        req,
        res,
        params,
        query,
        body,
        actor: req.actor,
        transaction,
      } as never);
      // Inside the transaction, so a reply that breaks its contract also undoes the change.
      if (req.app.locals.checkReplies) checkReply(spec, reply);
      return reply;
    };
    const reply = !(spec.transaction ?? spec.method !== 'get')
      ? await run(null)
      : await database().transaction((t) => run(t));
    if (reply.file)
      res
        .status(reply.status)
        .type(reply.file.contentType)
        .attachment(reply.file.filename)
        .send(reply.file.content);
    else if (reply.json !== undefined)
      res.status(reply.status).type('application/json').send(jsonPayload(reply.json));
    else if (reply.body === undefined) res.status(reply.status).end();
    else res.status(reply.status).json(reply.body);
  };
  router[spec.method](expressPath, ...(spec.before ?? []), handler);
}

/**
 * Outside production, every reply is parsed exactly (no undeclared field) with the schema
 * declared for its status, as the client will parse it; a mismatch is a server defect and
 * answers 500, so an API test that reaches the operation catches a drifted contract.
 */
function checkReply(
  spec: {
    method: Method;
    path: string;
    responses: RouteSpec<undefined, undefined, undefined, boolean>['responses'];
  },
  reply: Reply,
) {
  const schema = spec.responses[reply.status]?.schema;
  const body =
    reply.json !== undefined ? JSON.parse(jsonPayload(reply.json).toString()) : reply.body;
  if (!schema || body === undefined) return;
  const checked = parseExact(schema, JSON.parse(JSON.stringify(body)));
  if (!checked.success) {
    const problems = checked.error.issues
      .map((issue) => `${issue.path.join('.') || '(body)'}: ${issue.message}`)
      .join('; ');
    throw new Error(
      `${spec.method.toUpperCase()} ${spec.path} answered ${reply.status} with a body that does not match its declared schema: ${problems}`,
    );
  }
}

/** Serialised JSON as express sends it: text as it is, bytes as a Buffer over the same memory. */
function jsonPayload(json: string | Uint8Array): string | Buffer {
  return typeof json === 'string'
    ? json
    : Buffer.from(json.buffer, json.byteOffset, json.byteLength);
}

function parsePart(schema: ZodType | undefined, value: unknown, part: 'params' | 'query' | 'body') {
  if (!schema) return {};
  const result = schema.safeParse(value);
  if (!result.success) {
    // Body paths are reported as the client wrote them ("roles.0"); params and query get a prefix.
    throw validationFailed(zodIssuesToDetails(result.error.issues, part === 'body' ? [] : [part]));
  }
  return result.data;
}
