/**
 * Every API operation × every role × another workspace's objects. The list of
 * operations is read from the OpenAPI document the routes register
 * themselves in, so an endpoint added later is covered without editing this
 * file: a member of one workspace must get 404 for anything addressed inside
 * another workspace (or owned by another person), must change nothing there,
 * and no reply, whatever the endpoint, may carry anything of the other
 * workspace (its ids, names, members' e-mails, its mail in the outbox).
 */
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { AuditEvent, Compound, Route } from '../../server/models';
import { buildOpenApiDocument } from '../../server/openapi';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';
import { waitForMail } from '../support/mail';

const server = useTestServer();
const ROLES = ['admin', 'chemist', 'reviewer', 'engineer'] as const;
const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

interface Operation {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  hasBody: boolean;
  auth: boolean;
}

function operations(): Operation[] {
  const document = buildOpenApiDocument() as unknown as {
    paths: Record<string, Record<string, { requestBody?: unknown; security?: unknown[] }>>;
  };
  const out: Operation[] = [];
  for (const [path, methods] of Object.entries(document.paths)) {
    for (const [method, operation] of Object.entries(methods)) {
      out.push({
        method: method as Operation['method'],
        path: path.replace(/^\/api\/v1/, ''),
        hasBody: operation.requestBody !== undefined,
        auth: (operation.security?.length ?? 0) > 0,
      });
    }
  }
  return out;
}

/** Valid bodies, so a request reaches the loading and authorization steps (not just a 400). */
function sampleBody(op: Operation): object | undefined {
  const key = `${op.method.toUpperCase()} ${op.path}`;
  const samples: Record<string, object> = {
    'POST /workspaces/{workspaceId}/invitations': {
      email: 'scope-probe@example.com',
      roles: ['chemist'],
    },
    'PATCH /workspaces/{workspaceId}/members/{userId}': { roles: ['reviewer'] },
    'POST /workspaces/{workspaceId}/compounds': {
      name: 'Scope probe (invented)',
      smiles: 'CCO',
      role: 'impurity',
    },
    'PATCH /workspaces/{workspaceId}/compounds/{compoundId}': {
      name: 'Renamed by a stranger',
      baseVersion: 1,
    },
    'POST /workspaces/{workspaceId}/routes': { name: 'Scope probe route (invented)' },
    'PATCH /workspaces/{workspaceId}/routes/{routeId}': {
      name: 'Renamed by a stranger',
      baseVersion: 1,
    },
    'POST /workspaces/{workspaceId}/routes/{routeId}/revisions': {
      message: 'Revision by a stranger',
      baseDraftVersion: 1,
    },
    'POST /workspaces/{workspaceId}/routes/{routeId}/revisions/{number}/review-requests': {
      reviewerIds: ['00000000-0000-4000-8000-000000000000'],
    },
    'POST /workspaces/{workspaceId}/routes/{routeId}/revisions/{number}/comments': {
      body: 'Comment by a stranger',
    },
    'PATCH /workspaces/{workspaceId}/routes/{routeId}/revisions/{number}/comments/{id}': {
      resolved: true,
    },
    'POST /workspaces/{workspaceId}/routes/{routeId}/revisions/{number}/decisions': {
      decision: 'approve',
      password: 'not-the-password',
    },
    'POST /workspaces/{workspaceId}/routes/{routeId}/duplicate': {},
    'PUT /workspaces/{workspaceId}/routes/{routeId}/draft': { document: demo(), baseVersion: 1 },
    'POST /jobs/{jobId}/cancel': {},
    'POST /workspaces/{workspaceId}/equipment': {
      kind: 'filter',
      name: 'Scope probe filter (invented)',
      areaM2: 1,
      capacityL: 100,
    },
    'PATCH /workspaces/{workspaceId}/equipment/{id}': { name: 'Renamed by a stranger' },
    'POST /workspaces/{workspaceId}/routes/{routeId}/revisions/{number}/step-list': {
      batchKg: 10,
      basis: 'input',
      format: 'json',
    },
    'POST /workspaces/{workspaceId}/routes/import': {
      format: 'phasewright-step-list',
      formatVersion: 1,
      route: { id: 'scope-probe', name: 'Scope probe (invented)', document: demo() },
      revision: 1,
      approval: null,
      draft: true,
      batchKg: 1,
      basis: 'input',
      scaleFactor: 1,
      exportedAt: '2026-01-01T00:00:00.000Z',
      equipment: [],
      operations: [],
      processSafetyNote: 'Scope probe.',
    },
  };
  return samples[key] ?? (op.hasBody ? {} : undefined);
}

describe('workspace scope: every endpoint × every role × another workspace', () => {
  const home: Record<string, SignedIn> = {};
  const foreign = {
    workspaceId: '',
    routeId: '',
    compoundId: '',
    userId: '',
    jobId: '',
    tokenId: '',
    secrets: [] as string[],
  };

  beforeAll(async () => {
    const homeWorkspace = await buildWorkspace({ name: 'Home site (invented)' });
    for (const role of ROLES)
      home[role] = await signIn(server.app, (await buildMember(homeWorkspace, [role])).email);

    // The other workspace, with one of everything, made through the API as its members would.
    const away = await buildWorkspace({ name: 'Far site (invented)' });
    const awayAdmin = await buildMember(away, ['admin', 'chemist'], { name: 'Far Admin Person' });
    const asAway = await signIn(server.app, awayAdmin.email);
    const post = (path: string, body: object) =>
      asAway.agent.post(`/api/v1${path}`).set('X-CSRF-Token', asAway.csrfToken).send(body);
    const route = await post(`/workspaces/${away.id}/routes`, {
      name: 'Far route (invented)',
      projectName: 'Far project (invented)',
      document: demo(),
    });
    const compound = await post(`/workspaces/${away.id}/compounds`, {
      name: 'Far compound (invented)',
      smiles: 'CC(=O)Nc1ccccc1',
      role: 'impurity',
    });
    // A kept revision, so the revision, review and comment paths address something real.
    const revision = await post(`/workspaces/${away.id}/routes/${route.body.id}/revisions`, {
      message: 'Far revision (invented)',
      baseDraftVersion: route.body.draftVersion ?? 1,
    });
    expect(revision.status).toBe(201);
    const job = await post('/evaluate/monte-carlo', { document: demo(), draws: 5, seed: 1 });
    const token = await post('/tokens', { name: 'Far token' });
    const before = new Date();
    await post(`/workspaces/${away.id}/invitations`, {
      email: 'far-invitee@example.com',
      roles: ['chemist'],
    });
    await request(server.app).post('/api/v1/password-resets').send({ email: awayAdmin.email });
    await waitForMail('far-invitee@example.com', { after: before });
    await waitForMail(awayAdmin.email, { after: before });
    Object.assign(foreign, {
      workspaceId: away.id,
      routeId: route.body.id,
      compoundId: compound.body.id,
      userId: awayAdmin.id,
      jobId: job.body.jobId,
      tokenId: token.body.id,
    });
    foreign.secrets = [
      away.id,
      away.slug,
      'Far site (invented)',
      route.body.id,
      'Far route (invented)',
      'Far project (invented)',
      compound.body.id,
      'Far compound (invented)',
      awayAdmin.id,
      awayAdmin.email,
      'Far Admin Person',
      'far-invitee@example.com',
      job.body.jobId,
      token.body.id,
      'Far token',
    ];
    for (const value of Object.values(foreign).slice(0, 6)) expect(value).toBeTruthy();
  });

  const fill = (path: string) =>
    path.replace(/\{(\w+)\}/g, (_, name: string) => {
      const samples: Record<string, string> = {
        workspaceId: foreign.workspaceId,
        routeId: foreign.routeId,
        compoundId: foreign.compoundId,
        userId: foreign.userId,
        jobId: foreign.jobId,
        id: foreign.tokenId,
        solventId: 'ethanol',
        number: '1',
        token: 'not-a-real-link-token-0123456789abcdef',
      };
      // Parameters added later (a revision, a review, a chromatogram) get an id nobody has.
      return samples[name] ?? '00000000-0000-4000-8000-000000000000';
    });

  it('reads every operation from the OpenAPI document', () => {
    const all = operations();
    expect(all.length).toBeGreaterThan(30);
    expect(all.map((op) => `${op.method} ${op.path}`)).toContain('get /outbox');
  });

  for (const role of ROLES) {
    it(`as ${role} of another workspace: 404 for its objects, nothing changed, nothing leaked`, async () => {
      const who = home[role];
      const counts = async () => ({
        routes: await Route.count({ where: { workspaceId: foreign.workspaceId } }),
        compounds: await Compound.count({ where: { workspaceId: foreign.workspaceId } }),
        audit: await AuditEvent.count({ where: { workspaceId: foreign.workspaceId } }),
      });
      const before = await counts();
      const problems: string[] = [];
      for (const op of operations()) {
        if (op.method === 'delete' && op.path === '/session') continue; // would sign the caller out
        const url = `/api/v1${fill(op.path)}`;
        let call = who.agent[op.method](url).set('X-CSRF-Token', who.csrfToken);
        const body = sampleBody(op);
        if (body !== undefined) call = call.send(body);
        const response = await call;
        const label = `${op.method.toUpperCase()} ${op.path} → ${response.status}`;
        const scoped = /\{(workspaceId|jobId|id)\}/.test(op.path);
        if (response.status >= 500) problems.push(`${label}: a server error`);
        else if (scoped && response.status !== 404 && !(response.status === 400 && !sampleBody(op)))
          problems.push(`${label}: expected 404 for another workspace's object`);
        const text = JSON.stringify(response.body ?? '') + String(response.text ?? '');
        for (const secret of foreign.secrets)
          if (text.includes(secret)) problems.push(`${label}: the reply contains "${secret}"`);
      }
      expect(problems).toEqual([]);
      expect(await counts()).toEqual(before);
    }, 120_000);
  }
});
