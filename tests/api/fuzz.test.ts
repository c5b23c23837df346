/**
 * Property-based fuzzing of every public payload: for each operation in the
 * OpenAPI document, requests built from valid samples with hostile mutations
 * (NUL and broken Unicode, reserved identifiers, malformed %-escapes, wrong
 * types, deep nesting, huge numbers, unreadable bodies) must never answer 5xx
 * and never hang. A fixed seed keeps the run reproducible; FUZZ_RUNS sets its
 * length (`npm run test:fuzz` runs a longer one).
 */
import { randomBytes } from 'node:crypto';
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { buildOpenApiDocument } from '../../server/openapi';
import { testConfig, useTestServer } from '../support/app';
import { createApp } from '../../server/app';
import type { Sequelize } from 'sequelize';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer({ ENGINE_TASK_SECONDS: '20' });

// The routers register their operations when an app is built; build one now (it connects to
// nothing until used) so the list exists when the tests are declared.
await createApp(testConfig(), { sequelize: {} as Sequelize }).close();
const RUNS = Number(process.env.FUZZ_RUNS ?? 6);
const SEED = Number(process.env.FUZZ_SEED ?? 20261203);
/** A reply slower than this counts as a hang. */
const HANG_MS = 45_000;

interface Operation {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  hasBody: boolean;
}

const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

/** Operations that end the fuzzer's own session or account are left out; everything else is fuzzed. */
const SELF_ENDING = new Set(['delete /session', 'post /account/password']);

function operations(): Operation[] {
  const document = buildOpenApiDocument() as unknown as {
    paths: Record<string, Record<string, { requestBody?: unknown }>>;
  };
  return Object.entries(document.paths).flatMap(([path, methods]) =>
    Object.entries(methods)
      .map(([method, op]) => ({
        method: method as Operation['method'],
        path: path.replace(/^\/api\/v1/, ''),
        hasBody: op.requestBody !== undefined,
      }))
      .filter((op) => !SELF_ENDING.has(`${op.method} ${op.path}`)),
  );
}

// ----- hostile values -------------------------------------------------------

const hostileString = fc.oneof(
  fc.constantFrom(
    '\u0000',
    'a\u0000b',
    '\ud800',
    'x\udc00y',
    '\ud83d',
    '__proto__',
    'constructor',
    'hasOwnProperty',
    'valueOf',
    'toString',
    '',
    ' ',
    '()',
    '[]',
    '%',
    '%E0%A4%A',
    '../../etc/passwd',
    "'; DROP TABLE users; --",
    '<script>alert(1)</script>',
    '\u202e\u200b',
    'C'.repeat(5000),
  ),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
);

const hostileLeaf: fc.Arbitrary<unknown> = fc.oneof(
  hostileString,
  fc.constantFrom(1e308, -1e308, -0, 0, 2 ** 53 + 1, -1, 1e-320, 4294967296, null, true, false),
  fc.integer(),
  fc.double({ noNaN: true }),
  fc.constant([]),
  fc.constant({}),
  fc.array(fc.integer(), { maxLength: 3 }),
);

/** Deep nesting, to look for recursion limits. */
const deep = fc.integer({ min: 50, max: 2000 }).map((depth) => {
  let value: unknown = 1;
  for (let i = 0; i < depth; i++) value = { a: value };
  return value;
});

type Json = unknown;

/** Every path to a leaf (or container) of a JSON value. */
function paths(value: Json, prefix: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [prefix];
  if (Array.isArray(value)) value.forEach((v, i) => out.push(...paths(v, [...prefix, i])));
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) out.push(...paths(v, [...prefix, k]));
  return out;
}

function setAt(value: Json, path: (string | number)[], leaf: unknown): Json {
  if (path.length === 0) return leaf;
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<
    string | number,
    unknown
  >;
  copy[path[0]] = setAt(copy[path[0]], path.slice(1), leaf);
  return copy;
}

function deleteAt(value: Json, path: (string | number)[]): Json {
  if (path.length === 0) return undefined;
  if (path.length === 1) {
    if (Array.isArray(value)) return value.filter((_, i) => i !== path[0]);
    const { [path[0]]: _dropped, ...rest } = value as Record<string, unknown>;
    return rest;
  }
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<
    string | number,
    unknown
  >;
  copy[path[0]] = deleteAt(copy[path[0]], path.slice(1));
  return copy;
}

type Mutation =
  | { kind: 'none' }
  | { kind: 'replace'; pick: number; leaf: unknown }
  | { kind: 'delete'; pick: number }
  | { kind: 'deep'; pick: number; leaf: unknown }
  | { kind: 'random'; value: unknown }
  | { kind: 'reserved-key'; pick: number; key: string };

const mutation: fc.Arbitrary<Mutation[]> = fc.array(
  fc.oneof(
    { weight: 1, arbitrary: fc.constant({ kind: 'none' } as Mutation) },
    {
      weight: 4,
      arbitrary: fc.record({
        kind: fc.constant('replace' as const),
        pick: fc.nat(),
        leaf: hostileLeaf,
      }),
    },
    { weight: 2, arbitrary: fc.record({ kind: fc.constant('delete' as const), pick: fc.nat() }) },
    {
      weight: 1,
      arbitrary: fc.record({ kind: fc.constant('deep' as const), pick: fc.nat(), leaf: deep }),
    },
    {
      weight: 1,
      arbitrary: fc.record({
        kind: fc.constant('random' as const),
        value: fc.jsonValue({ maxDepth: 4 }),
      }),
    },
    {
      weight: 1,
      arbitrary: fc.record({
        kind: fc.constant('reserved-key' as const),
        pick: fc.nat(),
        key: fc.constantFrom('__proto__', 'constructor', 'hasOwnProperty', 'valueOf'),
      }),
    },
  ),
  { minLength: 1, maxLength: 3 },
);

/** The body as JSON text (so "__proto__" keys survive, as a client's JSON would send them). */
function mutate(sample: Json, mutations: Mutation[]): string {
  let value = sample;
  let reservedKey: { path: (string | number)[]; key: string } | null = null;
  for (const m of mutations) {
    const all = paths(value);
    if (m.kind === 'replace') value = setAt(value, all[m.pick % all.length], m.leaf);
    else if (m.kind === 'delete') value = deleteAt(value, all[m.pick % all.length]) ?? {};
    else if (m.kind === 'deep') value = setAt(value, all[m.pick % all.length], m.leaf);
    else if (m.kind === 'random') value = m.value;
    else if (m.kind === 'reserved-key')
      reservedKey = { path: all[m.pick % all.length], key: m.key };
  }
  let text = JSON.stringify(value ?? {});
  if (reservedKey && text.startsWith('{') && text.length > 2)
    text = `{"${reservedKey.key}":{"polluted":true},${text.slice(1)}`;
  return text;
}

const hostilePathSegment = fc.constantFrom(
  '%',
  '%E0%A4%A',
  '%00',
  '%ZZ',
  '%C0%AF',
  '..',
  '__proto__',
  'constructor',
  '%ED%A0%80',
  'x'.repeat(300),
  '00000000-0000-0000-0000-000000000000',
  '123',
);

const rawBody = fc.record({
  contentType: fc.constantFrom(
    'application/json',
    'application/json; charset=utf-16',
    'application/json; charset=koi8-r',
    'application/json; charset=nonsense',
    'text/plain',
    'application/x-www-form-urlencoded',
    'multipart/form-data; boundary=x',
  ),
  encoding: fc.constantFrom(undefined, 'gzip', 'deflate', 'br', 'identity', 'compress'),
  bytes: fc.uint8Array({ maxLength: 200 }),
});

describe('fuzzing every public payload (fast-check, fixed seed)', () => {
  let who: SignedIn;
  const ids: Record<string, string> = {};

  beforeAll(async () => {
    const workspace = await buildWorkspace();
    const user = await buildMember(workspace, ['admin', 'chemist']);
    const target = await buildMember(workspace, ['chemist']);
    who = await signIn(server.app, user.email);
    const post = (path: string, body: object) =>
      who.agent.post(`/api/v1${path}`).set('X-CSRF-Token', who.csrfToken).send(body);
    const route = await post(`/workspaces/${workspace.id}/routes`, {
      name: 'Fuzz route (invented)',
      document: demo(),
    });
    const compound = await post(`/workspaces/${workspace.id}/compounds`, {
      name: 'Fuzz compound (invented)',
      smiles: 'CCO',
      role: 'impurity',
    });
    const job = await post('/evaluate/monte-carlo', { document: demo(), draws: 3, seed: 1 });
    const token = await post('/tokens', { name: 'Fuzz token' });
    Object.assign(ids, {
      workspaceId: workspace.id,
      routeId: route.body.id,
      compoundId: compound.body.id,
      userId: target.id,
      jobId: job.body.jobId,
      id: token.body.id,
      solventId: 'ethanol',
      token: randomBytes(32).toString('base64url'),
    });
  });

  const samples = (): Record<string, Json> => ({
    'post /session': { email: 'fuzz@example.com', password: 'not-the-password' },
    'post /password-resets': { email: 'fuzz@example.com' },
    'post /password-resets/{token}': { password: 'a-new-password-123' },
    'post /invitations/{token}/accept': { name: 'Fuzz Person', password: 'a-new-password-123' },
    'post /tokens': { name: 'Fuzzed token', scope: 'read', expiresInDays: 30 },
    'post /workspaces/{workspaceId}/invitations': {
      email: 'fuzz-invitee@example.com',
      roles: ['chemist'],
    },
    'patch /workspaces/{workspaceId}/members/{userId}': { roles: ['chemist'] },
    'post /structures/preview': { smiles: 'CC(=O)O' },
    'post /workspaces/{workspaceId}/compounds': { name: 'Fuzz', smiles: 'CCO', role: 'impurity' },
    'patch /workspaces/{workspaceId}/compounds/{compoundId}': { name: 'Fuzz renamed', logP: 1.2 },
    'post /workspaces/{workspaceId}/routes': { name: 'Fuzz', document: demo() },
    'patch /workspaces/{workspaceId}/routes/{routeId}': { name: 'Fuzz renamed', archived: false },
    'post /workspaces/{workspaceId}/routes/{routeId}/duplicate': { name: 'Fuzz copy' },
    'put /workspaces/{workspaceId}/routes/{routeId}/draft': { document: demo(), baseVersion: 1 },
    'post /evaluate': { document: demo() },
    'post /evaluate/monte-carlo': { document: demo(), draws: 3, seed: 7 },
    'post /calc/vapour-pressure': { component: { smiles: 'CCO' }, temperatureC: 40 },
    'post /calc/activity-coefficients': {
      components: [{ smiles: 'CCO' }, { smiles: 'O' }],
      moleFractions: [0.4, 0.6],
      temperatureC: 25,
    },
    'post /calc/bubble-point': {
      components: [{ smiles: 'CCO' }, { smiles: 'O' }],
      moleFractions: [0.4, 0.6],
      pressureKPa: 101.325,
    },
    'post /calc/azeotrope': {
      components: [{ smiles: 'CCO' }, { smiles: 'O' }],
      pressureKPa: 101.325,
    },
    'post /calc/partition': {
      solute: { smiles: 'CC(=O)Nc1ccccc1', pKa: [{ value: 4.5, type: 'acid' }] },
      organic: { smiles: 'CCOC(C)=O' },
      aqueous: { pH: 7 },
    },
    'post /calc/solubility': {
      solute: { meltingPointC: 120, enthalpyFusionKJmol: 25 },
      solvent: { smiles: 'CCO' },
      temperatureC: 25,
    },
    'post /calc/hansen-distance': { a: { smiles: 'CCO' }, b: { d: 15, p: 5, h: 10 } },
    'post /jobs/{jobId}/cancel': {},
  });

  const all = operations();

  it('covers every operation of the OpenAPI document', () => {
    expect(all.length).toBeGreaterThan(30);
  });

  for (const op of all) {
    it(`${op.method.toUpperCase()} ${op.path}: no 5xx, no hang`, async () => {
      const sample = samples()[`${op.method} ${op.path}`] ?? (op.hasBody ? {} : undefined);
      const params = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
      const request$ = fc.record({
        segments: fc.array(
          fc.oneof(
            { weight: 3, arbitrary: fc.constant(null) },
            { weight: 1, arbitrary: hostilePathSegment },
          ),
          { minLength: params.length, maxLength: params.length },
        ),
        query: fc.option(
          fc.dictionary(fc.constantFrom('q', 'archived', 'limit', 'cursor', 'sort'), hostileString),
          {
            nil: undefined,
          },
        ),
        mutations: mutation,
        raw: fc.option(rawBody, { freq: 5, nil: undefined }),
      });
      await fc.assert(
        fc.asyncProperty(request$, async ({ segments, query, mutations, raw }) => {
          let i = 0;
          const path = op.path.replace(/\{(\w+)\}/g, (_, name: string) => {
            const hostile = segments[i++];
            return (
              hostile ?? encodeURIComponent(ids[name] ?? '00000000-0000-4000-8000-000000000000')
            );
          });
          let call = who.agent[op.method](`/api/v1${path}`)
            .set('X-CSRF-Token', who.csrfToken)
            .timeout({ response: HANG_MS, deadline: HANG_MS });
          if (query) call = call.query(query);
          if (sample !== undefined && raw) {
            call = call.set('Content-Type', raw.contentType);
            if (raw.encoding) call = call.set('Content-Encoding', raw.encoding);
            call = call.send(Buffer.from(raw.bytes));
          } else if (sample !== undefined) {
            call = call.set('Content-Type', 'application/json').send(mutate(sample, mutations));
          }
          const response = await call;
          if (response.status >= 500)
            throw new Error(
              `${op.method.toUpperCase()} ${path} answered ${response.status}: ${response.text.slice(0, 300)}`,
            );
        }),
        { seed: SEED, numRuns: RUNS, endOnFailure: true },
      );
    }, 600_000);
  }
});
