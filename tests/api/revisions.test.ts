import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  commentListSchema,
  createdRevisionSchema,
  decisionReplySchema,
  revisionCompareSchema,
  revisionDetailSchema,
  revisionListSchema,
} from '@shared/schemas/revisions';
import { AuditEvent, RouteRevision, User, type Workspace } from '../../server/models';
import { verifyChain } from '../../server/services/audit';
import { canonicalJson, revisionContentHash } from '../../server/services/content-hash';
import { findApprovedRevision, revisionHashIntact } from '../../server/services/revisions';
import { demoAmideIsolation } from '../fixtures/routes/demo-amide-isolation';
import { sha256 } from '../../server/services/secrets';
import { database } from '../../server/db/sequelize';
import { useTestServer } from '../support/app';
import {
  buildMember,
  buildWorkspace,
  DEFAULT_PASSWORD,
  signIn,
  type SignedIn,
} from '../support/factories';
import { waitForMail } from '../support/mail';

/** Failed password checks counted for the account by the sign-in throttle (rate_limits). */
async function failedSignIns(email: string): Promise<number> {
  const [rows] = (await database().query(
    `SELECT points FROM rate_limits WHERE key = :key AND (expire IS NULL OR expire > :now)`,
    { replacements: { key: `sign-in-failures-account:${sha256(email)}`, now: Date.now() } },
  )) as unknown as [Array<{ points: number }>];
  return rows[0]?.points ?? 0;
}
const server = useTestServer();

const demo = () => structuredClone(demoAmideIsolation) as unknown as Record<string, unknown>;
const post = (s: SignedIn, url: string, body: unknown) =>
  s.agent
    .post(url)
    .set('X-CSRF-Token', s.csrfToken)
    .send(body as object);

interface Scene {
  workspace: Workspace;
  chemist: User;
  reviewer: User;
  reviewer2: User;
  engineer: User;
  as: Record<'chemist' | 'reviewer' | 'reviewer2' | 'engineer' | 'admin' | 'outsider', SignedIn>;
}

async function scene(): Promise<Scene> {
  const workspace = await buildWorkspace({ name: 'Review group (invented)' });
  const other = await buildWorkspace();
  const chemist = await buildMember(workspace, ['chemist'], { name: 'Ada Chemist' });
  const reviewer = await buildMember(workspace, ['reviewer'], { name: 'Rui Reviewer' });
  const reviewer2 = await buildMember(workspace, ['reviewer', 'chemist'], { name: 'Rita Second' });
  const engineer = await buildMember(workspace, ['engineer']);
  const admin = await buildMember(workspace, ['admin']);
  const outsider = await buildMember(other, ['admin', 'chemist', 'reviewer']);
  return {
    workspace,
    chemist,
    reviewer,
    reviewer2,
    engineer,
    as: {
      chemist: await signIn(server.app, chemist.email),
      reviewer: await signIn(server.app, reviewer.email),
      reviewer2: await signIn(server.app, reviewer2.email),
      engineer: await signIn(server.app, engineer.email),
      admin: await signIn(server.app, admin.email),
      outsider: await signIn(server.app, outsider.email),
    },
  };
}

async function newRoute(s: Scene, name = 'Amide isolation (invented)') {
  const reply = await post(s.as.chemist, `/api/v1/workspaces/${s.workspace.id}/routes`, {
    name,
    document: demo(),
  });
  expect(reply.status).toBe(201);
  return {
    id: reply.body.id as string,
    base: `/api/v1/workspaces/${s.workspace.id}/routes/${reply.body.id}`,
    version: reply.body.draftVersion as number,
  };
}

/** Changes the cooling end point in the draft and returns the new draft version. */
async function coolTo(s: Scene, route: { base: string }, version: number, endC: number) {
  const document = demo() as { steps: Array<{ id: string; params: Record<string, unknown> }> };
  const cool = document.steps.find((step) => step.id === 'cool')!;
  cool.params = {
    ...cool.params,
    mode: { kind: 'cooling', startC: 60, endC: { value: endC, plusMinus: 2 } },
  };
  const reply = await s.as.chemist.agent
    .put(`${route.base}/draft`)
    .set('X-CSRF-Token', s.as.chemist.csrfToken)
    .send({ document, baseVersion: version });
  expect(reply.status, JSON.stringify(reply.body)).toBe(200);
  return reply.body.version as number;
}

describe('saving revisions', () => {
  let s: Scene;
  beforeAll(async () => {
    s = await scene();
  });

  it('requires authentication', async () => {
    const route = await newRoute(s);
    const reply = await request(server.app)
      .post(`${route.base}/revisions`)
      .send({ message: 'x', baseDraftVersion: 1 });
    expect(reply.status).toBe(401);
  });

  it('keeps an immutable, numbered snapshot with the server result and a content hash; the draft stays as it is', async () => {
    const route = await newRoute(s);
    const first = await post(s.as.chemist, `${route.base}/revisions`, {
      message: 'First complete route',
      baseDraftVersion: route.version,
    });
    expect(first.status).toBe(201);
    const created = createdRevisionSchema.parse(first.body);
    expect(created).toMatchObject({ number: 1, author: { id: s.chemist.id } });
    expect(created.totals!.yieldPct).toBeGreaterThan(0);

    const detail = revisionDetailSchema.parse(
      (await s.as.chemist.agent.get(`${route.base}/revisions/1`)).body,
    );
    expect(detail.document).toEqual(demo());
    expect(detail.result).not.toBeNull();
    expect(detail.status).toBe('draft');
    // The hash is SHA-256 over the canonical JSON of document, result and engine version.
    expect(
      revisionContentHash({
        document: detail.document,
        result: detail.result,
        engineVersion: detail.engineVersion,
      }),
    ).toBe(created.contentHash);
    const row = await RouteRevision.findOne({ where: { routeId: route.id, number: 1 } });
    expect(revisionHashIntact(row!)).toBe(true);
    await expect(row!.update({ message: 'rewritten' })).rejects.toThrow(/permission denied/);

    const draft = (await s.as.chemist.agent.get(route.base)).body;
    expect(draft.draftVersion).toBe(route.version);

    const second = await post(s.as.chemist, `${route.base}/revisions`, {
      message: 'Same draft again',
      baseDraftVersion: route.version,
    });
    expect(second.body.number).toBe(2);
    expect(second.body.contentHash).toBe(created.contentHash);
  });

  it('refuses a stale base with 409 naming the current draft version', async () => {
    const route = await newRoute(s);
    const now = await coolTo(s, route, route.version, 10);
    const reply = await post(s.as.chemist, `${route.base}/revisions`, {
      message: 'Based on what I saw',
      baseDraftVersion: route.version,
    });
    expect(reply.status).toBe(409);
    expect(reply.body.error).toMatchObject({
      code: 'stale_draft',
      details: { draftVersion: now, updatedBy: { id: s.chemist.id } },
    });
    expect(await RouteRevision.count({ where: { routeId: route.id } })).toBe(0);
  });

  it('never loses an update: concurrent saves each get their own number, and a revision holds exactly the draft it names', async () => {
    const route = await newRoute(s);
    const replies = await Promise.all(
      Array.from({ length: 6 }, (_, i) =>
        post(s.as.chemist, `${route.base}/revisions`, {
          message: `Concurrent ${i}`,
          baseDraftVersion: route.version,
        }),
      ),
    );
    expect(replies.map((r) => r.status)).toEqual(Array(6).fill(201));
    expect(replies.map((r) => r.body.number).sort()).toEqual([1, 2, 3, 4, 5, 6]);

    // A draft save racing a revision: either the revision is of the old draft, or it is refused.
    const document = demo() as { steps: Array<{ id: string; name: string }> };
    document.steps[0].name = 'Renamed in the race';
    const [draftSave, revisionSave] = await Promise.all([
      s.as.chemist.agent
        .put(`${route.base}/draft`)
        .set('X-CSRF-Token', s.as.chemist.csrfToken)
        .send({ document, baseVersion: route.version }),
      post(s.as.chemist, `${route.base}/revisions`, {
        message: 'Racing the draft',
        baseDraftVersion: route.version,
      }),
    ]);
    expect(draftSave.status).toBe(200);
    if (revisionSave.status === 201) {
      const saved = await RouteRevision.findOne({
        where: { routeId: route.id, number: revisionSave.body.number },
      });
      expect(saved!.draftVersion).toBe(route.version);
      expect((saved!.document as { steps: Array<{ name: string }> }).steps[0].name).not.toBe(
        'Renamed in the race',
      );
    } else {
      expect(revisionSave.status).toBe(409);
      expect(revisionSave.body.error.details.draftVersion).toBe(route.version + 1);
    }
  });

  it('lists newest first in pages and compares two revisions step by step and total by total', async () => {
    const route = await newRoute(s);
    await post(s.as.chemist, `${route.base}/revisions`, {
      message: 'Cool to 5 °C',
      baseDraftVersion: route.version,
    });
    const v2 = await coolTo(s, route, route.version, 20);
    await post(s.as.chemist, `${route.base}/revisions`, {
      message: 'Cool to 20 °C only',
      baseDraftVersion: v2,
    });

    const page1 = revisionListSchema.parse(
      (await s.as.chemist.agent.get(`${route.base}/revisions`).query({ limit: 1 })).body,
    );
    expect(page1.items.map((r) => r.number)).toEqual([2]);
    expect(page1.items[0]).toMatchObject({ message: 'Cool to 20 °C only', status: 'draft' });
    const page2 = revisionListSchema.parse(
      (
        await s.as.chemist.agent
          .get(`${route.base}/revisions`)
          .query({ limit: 1, cursor: page1.nextCursor })
      ).body,
    );
    expect(page2).toMatchObject({ items: [{ number: 1 }], nextCursor: null });

    const compare = revisionCompareSchema.parse(
      (await s.as.chemist.agent.get(`${route.base}/revisions/1/compare/2`)).body,
    );
    expect(compare.stepsAdded).toEqual([]);
    expect(compare.stepsRemoved).toEqual([]);
    expect(compare.stepsChanged).toEqual([
      expect.objectContaining({
        stepId: 'cool',
        changes: [{ path: 'params.mode.endC.value', from: 5, to: 20 }],
      }),
    ]);
    // A warmer end point leaves more product in the liquor.
    expect(compare.totals.yieldPct.to!).toBeLessThan(compare.totals.yieldPct.from!);
    expect(Object.keys(compare.totals)).toEqual(
      expect.arrayContaining(['yieldPct', 'purityWtPct', 'pmi']),
    );
    expect(Object.keys(compare.totals).some((name) => name.startsWith('purge.'))).toBe(true);

    expect((await s.as.chemist.agent.get(`${route.base}/revisions/9`)).status).toBe(404);
    expect((await s.as.chemist.agent.get(`${route.base}/revisions/x`)).status).toBe(400);
  });
});

describe('review: submit, comment, sign', () => {
  let s: Scene;
  beforeAll(async () => {
    s = await scene();
  });

  it('runs the whole workflow, with the e-mails read back from the SMTP fake', async () => {
    const route = await newRoute(s, 'Workflow route (invented)');
    await post(s.as.chemist, `${route.base}/revisions`, {
      message: 'Ready for review',
      baseDraftVersion: route.version,
    });
    const since = new Date(Date.now() - 1000);

    // Never the author; only members with the reviewer role.
    for (const [reviewerIds, path] of [
      [[s.chemist.id], 'reviewerIds.0'],
      [[s.reviewer.id, s.engineer.id], 'reviewerIds.1'],
    ] as const) {
      const refused = await post(s.as.chemist, `${route.base}/revisions/1/review-requests`, {
        reviewerIds,
        note: 'x',
      });
      expect(refused.status).toBe(422);
      expect(refused.body.error).toMatchObject({ code: 'invalid_reviewers', details: [{ path }] });
    }

    const submitted = await post(s.as.chemist, `${route.base}/revisions/1/review-requests`, {
      reviewerIds: [s.reviewer.id],
      note: 'Please check the crystallisation end point.',
    });
    expect(submitted.status).toBe(201);
    expect(submitted.body).toMatchObject({
      status: 'in_review',
      reviewers: [{ id: s.reviewer.id, decision: null }],
    });
    const requestMail = await waitForMail(s.reviewer.email, {
      subject: /Review requested/,
      after: since,
    });
    expect(requestMail.text).toContain('Please check the crystallisation end point.');
    expect(requestMail.text).toContain(
      `http://app.test/w/${s.workspace.id}/routes/${route.id}/revisions/1`,
    );
    expect(
      (
        await post(s.as.chemist, `${route.base}/revisions/1/review-requests`, {
          reviewerIds: [s.reviewer.id],
        })
      ).body.error.code,
    ).toBe('review_open');

    // The reviewer's attention list names the request.
    const attention = await s.as.reviewer.agent.get(
      `/api/v1/workspaces/${s.workspace.id}/attention`,
    );
    expect(attention.body.items).toEqual([
      expect.objectContaining({ kind: 'review_requested', routeId: route.id, revisionNumber: 1 }),
    ]);

    // A comment on the crystallisation step, a reply, resolve and reopen.
    const comment = await post(s.as.reviewer, `${route.base}/revisions/1/comments`, {
      body: 'Is 5 °C reachable in the plant jacket?',
      stepId: 'cool',
    });
    expect(comment.status).toBe(201);
    expect(comment.body).toMatchObject({ stepId: 'cool', parentId: null, resolved: false });
    const commentMail = await waitForMail(s.chemist.email, {
      subject: /New comment/,
      after: since,
    });
    expect(commentMail.text).toContain('Cool to 5 °C and age');
    expect(commentMail.text).toContain(`/routes/${route.id}/revisions/1`);
    const reply = await post(s.as.chemist, `${route.base}/revisions/1/comments`, {
      body: 'Yes, with brine at −10 °C.',
      parentId: comment.body.id,
    });
    expect(reply.body).toMatchObject({ parentId: comment.body.id, stepId: 'cool' });
    const badStep = await post(s.as.reviewer, `${route.base}/revisions/1/comments`, {
      body: 'x',
      stepId: 'no-such-step',
    });
    expect(badStep.status).toBe(400);
    expect(badStep.body.error.details).toEqual([{ path: 'stepId', message: expect.any(String) }]);
    const patch = (resolved: boolean) =>
      s.as.reviewer.agent
        .patch(`${route.base}/revisions/1/comments/${comment.body.id}`)
        .set('X-CSRF-Token', s.as.reviewer.csrfToken)
        .send({ resolved });
    expect((await patch(true)).body).toMatchObject({
      resolved: true,
      resolvedBy: { id: s.reviewer.id },
    });
    expect((await patch(false)).body).toMatchObject({ resolved: false, resolvedBy: null });
    const thread = commentListSchema.parse(
      (await s.as.chemist.agent.get(`${route.base}/revisions/1/comments`)).body,
    );
    expect(thread.items.map((c) => c.body)).toEqual([
      'Is 5 °C reachable in the plant jacket?',
      'Yes, with brine at −10 °C.',
    ]);

    // A wrong password: 401, nothing signed, and it counts as a failed sign-in.
    const wrong = await post(s.as.reviewer, `${route.base}/revisions/1/decisions`, {
      decision: 'approve',
      password: 'not-my-password',
    });
    expect(wrong.status).toBe(401);
    expect(wrong.body.error.code).toBe('invalid_password');
    expect(await failedSignIns(s.reviewer.email)).toBe(1);
    const detailAfterWrong = revisionDetailSchema.parse(
      (await s.as.chemist.agent.get(`${route.base}/revisions/1`)).body,
    );
    expect(detailAfterWrong.reviews[0].decisions).toEqual([]);
    // The author cannot sign, even with the reviewer role elsewhere.
    expect(
      (
        await post(s.as.chemist, `${route.base}/revisions/1/decisions`, {
          decision: 'approve',
          password: DEFAULT_PASSWORD,
        })
      ).status,
    ).toBe(403);

    const signed = await post(s.as.reviewer, `${route.base}/revisions/1/decisions`, {
      decision: 'approve',
      password: DEFAULT_PASSWORD,
    });
    expect(signed.status).toBe(201);
    const signature = decisionReplySchema.parse(signed.body);
    expect(signature).toMatchObject({
      decision: 'approve',
      signer: { name: 'Rui Reviewer', email: s.reviewer.email },
      meaning: expect.stringMatching(/^Approved as technical reviewer/),
      contentHash: detailAfterWrong.contentHash,
      status: 'approved',
    });
    expect(signature.signedAt).toMatch(/Z$/);
    expect(await failedSignIns(s.reviewer.email)).toBe(0);
    const approvalMail = await waitForMail(s.chemist.email, { subject: /^Approved/, after: since });
    expect(approvalMail.text).toContain('Rui Reviewer approved revision 1');

    const detail = revisionDetailSchema.parse(
      (await s.as.chemist.agent.get(`${route.base}/revisions/1`)).body,
    );
    expect(detail.status).toBe('approved');
    expect(detail.approval!.signatures).toEqual([
      expect.objectContaining({ signer: expect.objectContaining({ name: 'Rui Reviewer' }) }),
    ]);
    expect(
      (
        await post(s.as.reviewer, `${route.base}/revisions/1/decisions`, {
          decision: 'approve',
          password: DEFAULT_PASSWORD,
        })
      ).body.error.code,
    ).toBe('review_closed');

    // For exports: the approved revision with its signature, and nothing for an unapproved one.
    const approved = await findApprovedRevision(s.workspace.id, route.id, 1);
    expect(approved).toMatchObject({
      number: 1,
      contentHash: detail.contentHash,
      approval: { signatures: [{ signer: { name: 'Rui Reviewer' } }] },
    });
    expect(await findApprovedRevision(s.workspace.id, route.id, 2)).toBeNull();

    const authorAttention = await s.as.chemist.agent.get(
      `/api/v1/workspaces/${s.workspace.id}/attention`,
    );
    expect(authorAttention.body.items[0]).toMatchObject({ kind: 'approved', revisionNumber: 1 });

    // Every step is in the audit trail, whose chain is intact.
    const actions = (await AuditEvent.findAll({ where: { workspaceId: s.workspace.id } })).map(
      (e) => e.action,
    );
    for (const action of [
      'revision.create',
      'review.submit',
      'comment.create',
      'comment.resolve',
      'comment.reopen',
      'review.approve',
    ])
      expect(actions).toContain(action);
    expect((await verifyChain(s.workspace.id)).ok).toBe(true);
  });

  it('a return needs a reason; every reviewer must approve; a newer revision supersedes an open review', async () => {
    const route = await newRoute(s, 'Second route (invented)');
    const save = (message: string) =>
      post(s.as.chemist, `${route.base}/revisions`, { message, baseDraftVersion: route.version });
    await save('One');
    await post(s.as.chemist, `${route.base}/revisions/1/review-requests`, {
      reviewerIds: [s.reviewer.id, s.reviewer2.id],
    });
    const noReason = await post(s.as.reviewer, `${route.base}/revisions/1/decisions`, {
      decision: 'return',
      password: DEFAULT_PASSWORD,
    });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.details).toEqual([{ path: 'reason', message: expect.any(String) }]);

    const first = await post(s.as.reviewer, `${route.base}/revisions/1/decisions`, {
      decision: 'approve',
      password: DEFAULT_PASSWORD,
      meaning: 'Approved for the pilot plant only.',
    });
    expect(first.body).toMatchObject({
      status: 'in_review',
      meaning: 'Approved for the pilot plant only.',
    });
    const since = new Date(Date.now() - 1000);
    const returned = await post(s.as.reviewer2, `${route.base}/revisions/1/decisions`, {
      decision: 'return',
      password: DEFAULT_PASSWORD,
      reason: 'The cake wash volume is not justified.',
    });
    expect(returned.body).toMatchObject({ decision: 'return', status: 'returned' });
    const mail = await waitForMail(s.chemist.email, { subject: /^Returned/, after: since });
    expect(mail.text).toContain('The cake wash volume is not justified.');
    expect(await findApprovedRevision(s.workspace.id, route.id, null)).toBeNull();

    await save('Two');
    await post(s.as.chemist, `${route.base}/revisions/2/review-requests`, {
      reviewerIds: [s.reviewer.id],
    });
    await save('Three');
    const list = revisionListSchema.parse(
      (await s.as.chemist.agent.get(`${route.base}/revisions`)).body,
    );
    expect(list.items.map((r) => [r.number, r.status])).toEqual([
      [3, 'draft'],
      [2, 'superseded'],
      [1, 'returned'],
    ]);
    expect(
      (
        await post(s.as.chemist, `${route.base}/revisions/2/review-requests`, {
          reviewerIds: [s.reviewer.id],
        })
      ).body.error.code,
    ).toBe('revision_superseded');
  });

  it('scale-up engineers read approved revisions only', async () => {
    const route = await newRoute(s, 'Engineer route (invented)');
    const save = (message: string) =>
      post(s.as.chemist, `${route.base}/revisions`, { message, baseDraftVersion: route.version });
    await save('A');
    await post(s.as.chemist, `${route.base}/revisions/1/review-requests`, {
      reviewerIds: [s.reviewer.id],
    });
    const approval = await post(s.as.reviewer, `${route.base}/revisions/1/decisions`, {
      decision: 'approve',
      password: DEFAULT_PASSWORD,
    });
    expect(approval.status).toBe(201);
    await save('B');
    const list = await s.as.engineer.agent.get(`${route.base}/revisions`);
    expect(list.body.items.map((r: { number: number }) => r.number)).toEqual([1]);
    expect((await s.as.engineer.agent.get(`${route.base}/revisions/1`)).status).toBe(200);
    expect((await s.as.engineer.agent.get(`${route.base}/revisions/2`)).status).toBe(403);
    expect((await s.as.engineer.agent.get(`${route.base}/revisions/1/compare/2`)).status).toBe(403);
  });
});

describe('every revision endpoint against every role and another workspace', () => {
  let s: Scene;
  let route: { id: string; base: string; version: number };
  beforeAll(async () => {
    s = await scene();
    route = await newRoute(s, 'Matrix route (invented)');
    for (const message of ['one', 'two'])
      await post(s.as.chemist, `${route.base}/revisions`, {
        message,
        baseDraftVersion: route.version,
      });
    await post(s.as.chemist, `${route.base}/revisions/2/review-requests`, {
      reviewerIds: [s.reviewer.id],
    });
  });

  type Role = keyof Scene['as'];
  const roles: Role[] = ['chemist', 'reviewer', 'engineer', 'admin', 'outsider'];
  // Expected status per role; the outsider always gets 404.
  const cases: Array<{
    name: string;
    call: (a: SignedIn) => Promise<request.Response>;
    expect: Record<Exclude<Role, 'outsider' | 'reviewer2'>, number>;
  }> = [
    {
      name: 'save a revision',
      call: (a) =>
        post(a, `${route.base}/revisions`, { message: 'm', baseDraftVersion: route.version }),
      expect: { chemist: 201, reviewer: 403, engineer: 403, admin: 201 },
    },
    {
      name: 'list revisions',
      call: (a) => a.agent.get(`${route.base}/revisions`),
      expect: { chemist: 200, reviewer: 200, engineer: 200, admin: 200 },
    },
    {
      name: 'read a revision',
      call: (a) => a.agent.get(`${route.base}/revisions/1`),
      expect: { chemist: 200, reviewer: 200, engineer: 403, admin: 200 },
    },
    {
      name: 'compare',
      call: (a) => a.agent.get(`${route.base}/revisions/1/compare/2`),
      expect: { chemist: 200, reviewer: 200, engineer: 403, admin: 200 },
    },
    {
      name: 'submit for review (bad reviewer list is checked after permission)',
      call: (a) =>
        post(a, `${route.base}/revisions/1/review-requests`, { reviewerIds: [s.engineer.id] }),
      expect: { chemist: 422, reviewer: 403, engineer: 403, admin: 422 },
    },
    {
      name: 'list comments',
      call: (a) => a.agent.get(`${route.base}/revisions/2/comments`),
      expect: { chemist: 200, reviewer: 200, engineer: 403, admin: 200 },
    },
    {
      name: 'comment',
      call: (a) => post(a, `${route.base}/revisions/2/comments`, { body: 'A note' }),
      expect: { chemist: 201, reviewer: 201, engineer: 403, admin: 403 },
    },
    {
      name: 'sign a decision (wrong password after permission)',
      call: (a) =>
        post(a, `${route.base}/revisions/2/decisions`, { decision: 'approve', password: 'nope' }),
      expect: { chemist: 403, reviewer: 401, engineer: 403, admin: 403 },
    },
    {
      name: 'attention list',
      call: (a) => a.agent.get(`/api/v1/workspaces/${s.workspace.id}/attention`),
      expect: { chemist: 200, reviewer: 200, engineer: 200, admin: 200 },
    },
  ];

  for (const c of cases) {
    it(`${c.name}: ${Object.entries(c.expect)
      .map(([r, st]) => `${r} ${st}`)
      .join(', ')}, another workspace 404, signed out 401`, async () => {
      for (const role of roles) {
        const expected = role === 'outsider' ? 404 : c.expect[role as keyof typeof c.expect];
        expect((await c.call(s.as[role])).status, role).toBe(expected);
      }
      const anonymous = { agent: request.agent(server.app), csrfToken: '' } as unknown as SignedIn;
      expect((await c.call(anonymous)).status).toBe(401);
    });
  }

  it('resolving a comment: chemists and reviewers; others 403; another workspace 404', async () => {
    const comment = await post(s.as.reviewer, `${route.base}/revisions/2/comments`, {
      body: 'Thread',
    });
    const patch = (a: SignedIn, resolved: boolean) =>
      a.agent
        .patch(`${route.base}/revisions/2/comments/${comment.body.id}`)
        .set('X-CSRF-Token', a.csrfToken)
        .send({ resolved });
    expect((await patch(s.as.chemist, true)).status).toBe(200);
    expect((await patch(s.as.reviewer, false)).status).toBe(200);
    expect((await patch(s.as.engineer, true)).status).toBe(403);
    expect((await patch(s.as.admin, true)).status).toBe(403);
    expect((await patch(s.as.outsider, true)).status).toBe(404);
  });

  it('canonical JSON sorts keys and drops undefined members', () => {
    expect(canonicalJson({ b: 1, a: [true, null, { d: 'x', c: undefined }] })).toBe(
      '{"a":[true,null,{"d":"x"}],"b":1}',
    );
  });
});

describe('the revisions and attention lists search and sort on the server', () => {
  let s: Scene;
  beforeAll(async () => {
    s = await scene();
  });

  it('revisions: newest or oldest first, keyset paged, searched by message or author', async () => {
    const route = await newRoute(s, 'Ester wash (invented)');
    let version = route.version;
    const messages = ['Cool to 5 °C', 'Wash with 50% less_water', 'Cool to 20 °C only'];
    for (const [i, message] of messages.entries()) {
      if (i > 0) version = await coolTo(s, route, version, 5 + 5 * i);
      const saved = await post(s.as.chemist, `${route.base}/revisions`, {
        message,
        baseDraftVersion: version,
      });
      expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    }
    const list = async (query: Record<string, string | number>) => {
      const reply = await s.as.chemist.agent.get(`${route.base}/revisions`).query(query);
      expect(reply.status, JSON.stringify(reply.body)).toBe(200);
      return revisionListSchema.parse(reply.body);
    };
    const numbers = async (query: Record<string, string | number>) =>
      (await list(query)).items.map((r) => r.number);

    expect(await numbers({})).toEqual([3, 2, 1]);
    expect(await numbers({ sort: 'oldest' })).toEqual([1, 2, 3]);
    // Paged one at a time, oldest first: every revision once, in order.
    const walked: number[] = [];
    let cursor: string | null = null;
    do {
      const page = await list({ sort: 'oldest', limit: 1, ...(cursor ? { cursor } : {}) });
      walked.push(...page.items.map((r) => r.number));
      cursor = page.nextCursor;
    } while (cursor && walked.length < 10);
    expect(walked).toEqual([1, 2, 3]);
    // A cursor of one order is refused in the other.
    const first = await list({ sort: 'oldest', limit: 1 });
    const crossed = await s.as.chemist.agent
      .get(`${route.base}/revisions`)
      .query({ sort: 'newest', cursor: first.nextCursor! });
    expect(crossed.status).toBe(400);
    expect(crossed.body.error.details[0].path).toBe('query.cursor');

    expect(await numbers({ q: 'COOL' })).toEqual([3, 1]);
    expect(await numbers({ q: 'cool', sort: 'oldest', limit: 1 })).toEqual([1]);
    expect(await numbers({ q: 'ada chem' })).toEqual([3, 2, 1]);
    // Wildcards of the search text are taken literally.
    expect(await numbers({ q: '50%' })).toEqual([2]);
    expect(await numbers({ q: 'h_w' })).toEqual([]); // would match "Wash with" as a wildcard
    expect(await numbers({ q: 'less_water' })).toEqual([2]);
    expect(await list({ q: 'nothing like it' })).toEqual({ items: [], nextCursor: null });

    const badSort = await s.as.chemist.agent.get(`${route.base}/revisions`).query({ sort: 'name' });
    expect(badSort.status).toBe(400);
    expect(badSort.body.error.details[0].path).toBe('query.sort');
  });

  it('attention: newest or oldest first, searched by route, text or person', async () => {
    const routes = [
      await newRoute(s, 'Amide isolation (invented)'),
      await newRoute(s, 'Salt break (invented)'),
    ];
    for (const route of routes) {
      const saved = await post(s.as.chemist, `${route.base}/revisions`, {
        message: 'Ready for review',
        baseDraftVersion: route.version,
      });
      expect(saved.status).toBe(201);
      const asked = await post(s.as.chemist, `${route.base}/revisions/1/review-requests`, {
        reviewerIds: [s.reviewer2.id],
        note: route === routes[0] ? 'Check the end point.' : 'Check the filter cake wash.',
      });
      expect(asked.status).toBe(201);
    }
    const attention = `/api/v1/workspaces/${s.workspace.id}/attention`;
    const names = async (query: Record<string, string | number>) => {
      const reply = await s.as.reviewer2.agent.get(attention).query(query);
      expect(reply.status, JSON.stringify(reply.body)).toBe(200);
      expect(Object.keys(reply.body).sort()).toEqual(['items', 'nextCursor']);
      return (reply.body.items as Array<{ routeName: string }>).map((i) => i.routeName);
    };

    expect(await names({})).toEqual(['Salt break (invented)', 'Amide isolation (invented)']);
    expect(await names({ sort: 'oldest' })).toEqual([
      'Amide isolation (invented)',
      'Salt break (invented)',
    ]);
    expect(await names({ q: 'salt' })).toEqual(['Salt break (invented)']);
    expect(await names({ q: 'CAKE WASH' })).toEqual(['Salt break (invented)']);
    expect(await names({ q: 'ada chemist' })).toHaveLength(2);
    expect(await names({ q: 'nothing like it' })).toEqual([]);
    // One at a time, oldest first.
    const first = await s.as.reviewer2.agent.get(attention).query({ sort: 'oldest', limit: 1 });
    expect(first.body.items.map((i: { routeName: string }) => i.routeName)).toEqual([
      'Amide isolation (invented)',
    ]);
    const second = await s.as.reviewer2.agent
      .get(attention)
      .query({ sort: 'oldest', limit: 1, cursor: first.body.nextCursor });
    expect(second.body).toMatchObject({
      items: [{ routeName: 'Salt break (invented)' }],
      nextCursor: null,
    });
    const badSort = await s.as.reviewer2.agent.get(attention).query({ sort: 'name' });
    expect(badSort.status).toBe(400);
  });
});
