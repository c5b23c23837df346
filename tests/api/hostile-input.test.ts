/**
 * Inputs that once answered 500: text PostgreSQL cannot store, malformed
 * percent-escapes in the address, request bodies the parser cannot read, a
 * structure with no atoms, and identifiers that are JavaScript built-in
 * names. Each must get a clear 4xx and leave nothing behind.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { brotliCompressSync, deflateSync, gzipSync } from 'node:zlib';
import type { Express } from 'express';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import type { RouteDocumentInput } from '@shared/schemas/route';
import { RESERVED_IDS } from '@shared/schemas/text';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { Route, type Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();
const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

const NUL = 'Wash\u0000 step';
const LONE_HIGH = 'Ester \ud83d wash';
const LONE_LOW = 'Ester \ude00 wash';

/** A POST with exactly these bytes and headers (supertest re-encodes compressed buffers). */
function rawPost(
  app: Express,
  path: string,
  headers: Record<string, string>,
  body: Buffer,
): Promise<{ status: number; body: { error?: { code: string } } }> {
  return new Promise((resolve, reject) => {
    const listener = app.listen(0, '127.0.0.1', () => {
      const { port } = listener.address() as AddressInfo;
      const req = http.request(
        {
          host: '127.0.0.1',
          port,
          path,
          method: 'POST',
          headers: { ...headers, 'content-length': String(body.length) },
        },
        (res) => {
          let data = '';
          res.on('data', (chunk: Buffer) => (data += chunk.toString()));
          res.on('end', () => {
            listener.close();
            resolve({ status: res.statusCode ?? 0, body: data ? JSON.parse(data) : {} });
          });
        },
      );
      req.on('error', (error) => {
        listener.close();
        reject(error);
      });
      req.end(body);
    });
  });
}

const COMPRESS = { gzip: gzipSync, deflate: deflateSync, br: brotliCompressSync } as const;

describe('hostile input gets a clear 4xx, never a 500', () => {
  let workspace: Workspace;
  let asChemist: SignedIn;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    asChemist = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
  });

  const post = (path: string, body: unknown) =>
    asChemist.agent
      .post(`/api/v1${path}`)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send(body as object);

  describe('text PostgreSQL cannot store is refused at the schema, with the field path', () => {
    for (const [label, value] of [
      ['a NUL character', NUL],
      ['a lone high surrogate', LONE_HIGH],
      ['a lone low surrogate', LONE_LOW],
    ] as const) {
      it(`route name with ${label}`, async () => {
        const before = await Route.count({ where: { workspaceId: workspace.id } });
        const response = await post(`/workspaces/${workspace.id}/routes`, { name: value });
        expect(response.status).toBe(400);
        expect(response.body.error.details).toContainEqual({
          path: 'name',
          message: expect.stringMatching(/cannot be stored/),
        });
        expect(await Route.count({ where: { workspaceId: workspace.id } })).toBe(before);
      });

      it(`compound name, token name and a string inside a route document with ${label}`, async () => {
        const compound = await post(`/workspaces/${workspace.id}/compounds`, {
          name: value,
          smiles: 'CCO',
          role: 'impurity',
        });
        expect(compound.status).toBe(400);
        expect(compound.body.error.details[0].path).toBe('name');

        const token = await post('/tokens', { name: value });
        expect(token.status).toBe(400);

        const doc = demo();
        (doc.steps[1] as { name: string }).name = value;
        const route = await post(`/workspaces/${workspace.id}/routes`, {
          name: 'Hostile document',
          document: doc,
        });
        expect(route.status).toBe(400);
        expect(route.body.error.details[0].path).toBe('document.steps.1.name');
      });
    }

    it('a search with a NUL character in the query string', async () => {
      const response = await asChemist.agent.get(
        `/api/v1/workspaces/${workspace.id}/routes?q=a%00b`,
      );
      expect(response.status).toBe(400);
      expect(response.body.error.details[0].path).toBe('query.q');
    });
  });

  describe('malformed percent-escapes in the address answer 400', () => {
    it('signed in', async () => {
      const response = await asChemist.agent.get(`/api/v1/workspaces/%E0%A4%A/routes`);
      expect(response.status).toBe(400);
      expect(apiErrorSchema.parse(response.body).error.code).toBe('malformed_path');
    });

    it('signed out, on a public endpoint', async () => {
      const invitation = await request(server.app).get('/api/v1/invitations/%ZZ-not-a-token');
      expect(invitation.status).toBe(400);
      const reset = await request(server.app)
        .post('/api/v1/password-resets/%C0%AF%')
        .send({ password: 'new-password-123' });
      expect(reset.status).toBe(400);
      expect(reset.body.error.code).toBe('malformed_path');
    });
  });

  describe('request bodies the parser cannot read', () => {
    it('an unsupported charset answers 415', async () => {
      const response = await request(server.app)
        .post('/api/v1/session')
        .set('Content-Type', 'application/json; charset=ebcdic-fr')
        .send('{"email":"a@example.com","password":"x"}');
      expect(response.status).toBe(415);
      expect(response.body.error.code).toBe('unsupported_charset');
    });

    it('an unknown content encoding answers 415', async () => {
      const response = await request(server.app)
        .post('/api/v1/session')
        .set('Content-Type', 'application/json')
        .set('Content-Encoding', 'compress')
        .send('{}');
      expect(response.status).toBe(415);
      expect(response.body.error.code).toBe('unsupported_encoding');
    });

    for (const encoding of ['gzip', 'deflate', 'br'] as const) {
      const json = Buffer.from('{"email":"nobody@example.com","password":"wrong-one"}');
      it(`a damaged ${encoding} body answers 400, a sound one is read`, async () => {
        const headers = { 'content-type': 'application/json', 'content-encoding': encoding };
        const sound = COMPRESS[encoding](json);
        const damaged = Buffer.concat([sound.subarray(0, 8), Buffer.from('garbage-garbage')]);
        const bad = await rawPost(server.app, '/api/v1/session', headers, damaged);
        expect(bad.status).toBe(400);
        expect(bad.body.error?.code).toBe('unreadable_body');
        const good = await rawPost(server.app, '/api/v1/session', headers, sound);
        expect(good.body.error?.code).toBe('invalid_credentials');
      });
    }
  });

  describe('a structure with no atoms is refused at preview and creation', () => {
    for (const smiles of ['()']) {
      it(`SMILES "${smiles}"`, async () => {
        const preview = await post('/structures/preview', { smiles });
        expect(preview.status).toBe(422);
        expect(preview.body.error.code).toBe('structure_unparsable');
        expect(preview.body.error.message).toMatch(/no atoms/);
        const created = await post(`/workspaces/${workspace.id}/compounds`, {
          name: 'Empty structure (invented)',
          smiles,
          role: 'impurity',
        });
        expect(created.status).toBe(422);
        expect(created.body.error.details[0].path).toBe('smiles');
      });
    }
  });

  describe('identifiers may not be JavaScript built-in names', () => {
    for (const reserved of ['hasOwnProperty', 'valueOf', '__proto__', 'constructor', 'toString']) {
      it(`a component id "${reserved}" is refused with its path at evaluation and in drafts`, async () => {
        expect(RESERVED_IDS.has(reserved)).toBe(true);
        const doc = demo() as unknown as { components: { id: string }[] };
        const original = doc.components[1].id;
        // JSON.parse keeps "__proto__" as an ordinary key, as a client's JSON would.
        const body = JSON.parse(
          JSON.stringify({ document: doc }).replaceAll(`"${original}"`, `"${reserved}"`),
        );
        const evaluated = await asChemist.agent
          .post('/api/v1/evaluate')
          .set('X-CSRF-Token', asChemist.csrfToken)
          .set('Content-Type', 'application/json')
          .send(JSON.stringify(body));
        expect(evaluated.status).toBe(400);
        expect(evaluated.body.error.details).toContainEqual({
          path: 'document.components.1.id',
          message: expect.stringMatching(/reserved/),
        });
        const created = await asChemist.agent
          .post(`/api/v1/workspaces/${workspace.id}/routes`)
          .set('X-CSRF-Token', asChemist.csrfToken)
          .set('Content-Type', 'application/json')
          .send(JSON.stringify({ name: 'Reserved id', ...body }));
        expect(created.status).toBe(400);
      });
    }
  });
});
