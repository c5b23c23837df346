/**
 * POST /api/v1/solvent-alternatives: the advisor's ranking is reproduced by
 * evaluating each substitute one by one through POST /api/v1/evaluate.
 */
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { evaluateResponseSchema, type EvaluateResponse } from '@shared/schemas/evaluate';
import { apiErrorSchema } from '@shared/schemas/errors';
import type { RouteDocumentInput } from '@shared/schemas/route';
import { solventAlternativesResponseSchema } from '@shared/schemas/solvent-alternatives';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();
const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

type Totals = EvaluateResponse['result']['totals'];
/** The fields these tests change, typed loosely enough to set them on a copy of the fixture. */
interface Editable {
  components: Array<{ kind: string; id?: string; solventId?: string }>;
  steps: Array<{
    id: string;
    params: {
      mode: { addSolventId?: string; antisolventId?: string };
      cakeWash: { solventId: string };
    };
  }>;
}
const editable = () => demo() as unknown as Editable;

describe('POST /api/v1/solvent-alternatives', () => {
  let asEngineer: SignedIn;

  beforeAll(async () => {
    const workspace = await buildWorkspace();
    // Like an evaluation, it stores nothing: any signed-in member may ask.
    asEngineer = await signIn(server.app, (await buildMember(workspace, ['engineer'])).email);
  });

  const post = (path: string, body: object) =>
    asEngineer.agent.post(`/api/v1${path}`).set('X-CSRF-Token', asEngineer.csrfToken).send(body);

  it('requires authentication', async () => {
    const response = await request(server.app)
      .post('/api/v1/solvent-alternatives')
      .send({ document: demo(), stepId: 'swap', role: 'swap-target' });
    expect(response.status).toBe(401);
  });

  it('ranks the swap solvent’s substitutes as evaluating each one through POST /evaluate does', async () => {
    const response = await post('/solvent-alternatives', {
      document: demo(),
      stepId: 'swap',
      role: 'swap-target',
    });
    expect(response.status).toBe(200);
    const list = solventAlternativesResponseSchema.parse(response.body);
    const ids = list.map((a) => a.solventId);
    expect(ids).not.toContain('2-propanol');
    expect(new Set(ids).size).toBe(ids.length);
    for (const a of list) {
      expect(a.cautions[0]).toMatch(/model result.*bench.*process-safety review/);
      expect(['miscible', 'partial']).toContain(a.waterMiscibility);
    }
    // Every suggestion the engine could evaluate carries its spread, not only the first ones.
    for (const a of list) {
      if (a.totals === null) {
        expect(a.uncertainty, a.solventId).toBeNull();
        continue;
      }
      expect(a.uncertainty?.draws, a.solventId).toBe(8);
      expect(a.uncertainty!.pmi.p5!).toBeLessThanOrEqual(a.uncertainty!.pmi.p95!);
    }

    const current = evaluateResponseSchema.parse(
      (await post('/evaluate', { document: demo() })).body,
    ).result.totals;

    // Each of the first five, and the last evaluated one, by hand: substitute in the swap only.
    const evaluated = list.filter((a) => a.totals !== null);
    const sample = [...evaluated.slice(0, 5), evaluated[evaluated.length - 1]];
    const byHand = new Map<string, Totals>();
    for (const a of sample) {
      const doc = editable();
      if (!doc.components.some((c) => (c as { solventId?: string }).solventId === a.solventId))
        doc.components.push({ kind: 'solvent', id: a.solventId, solventId: a.solventId });
      const id = (doc.components as Array<{ id?: string; solventId?: string }>).find(
        (c) => c.solventId === a.solventId,
      )!.id!;
      doc.steps.find((s) => s.id === 'swap')!.params.mode.addSolventId = id;
      const r = await post('/evaluate', { document: doc });
      expect(r.status).toBe(200);
      const totals = evaluateResponseSchema.parse(r.body).result.totals;
      byHand.set(a.solventId, totals);
      expect(a.totals).toEqual(totals);
      expect(a.deltaVsCurrent!.pmi).toBeCloseTo(totals.pmi! - current.pmi!, 9);
    }
    // The stated rule, applied to the totals evaluated by hand, gives the advisor's order.
    const keeps = (t: Totals) =>
      t.yieldPct! >= current.yieldPct! - 2 &&
      t.solventFreePurityPct! >= current.solventFreePurityPct! - 1e-9;
    const rank = (t: Totals) => (keeps(t) ? 0 : 1);
    const order = [...byHand.entries()]
      .sort(([, a], [, b]) => rank(a) - rank(b) || a.pmi! - b.pmi!)
      .map(([id]) => id);
    expect(order).toEqual(sample.map((a) => a.solventId));
    for (const a of sample) expect(a.keepsYieldAndPurity).toBe(keeps(byHand.get(a.solventId)!));
    // Those that keep yield and purity come before the others, each group by PMI.
    const firstOther = list.findIndex((a) => !a.keepsYieldAndPurity);
    if (firstOther >= 0)
      expect(list.slice(firstOther).every((a) => !a.keepsYieldAndPurity)).toBe(true);
  });

  it('changes only the chosen step’s role: the cake wash keeps its heptane when the antisolvent changes', async () => {
    const response = await post('/solvent-alternatives', {
      document: demo(),
      stepId: 'antisolvent',
      role: 'antisolvent',
    });
    expect(response.status).toBe(200);
    const list = solventAlternativesResponseSchema.parse(response.body);
    expect(list.map((a) => a.solventId)).not.toContain('n-heptane');
    const top = list.find((a) => a.totals !== null)!;
    // Substituting the antisolvent and the cake wash together gives other totals than the advisor's.
    const both = editable();
    if (!both.components.some((c) => (c as { id?: string }).id === top.solventId))
      both.components.push({ kind: 'solvent', id: top.solventId, solventId: top.solventId });
    both.steps.find((s) => s.id === 'antisolvent')!.params.mode.antisolventId = top.solventId;
    const onlyAntisolvent = evaluateResponseSchema.parse(
      (await post('/evaluate', { document: both })).body,
    ).result.totals;
    expect(top.totals).toEqual(onlyAntisolvent);
    both.steps.find((s) => s.id === 'filter')!.params.cakeWash.solventId = top.solventId;
    const withWash = evaluateResponseSchema.parse(
      (await post('/evaluate', { document: both })).body,
    ).result.totals;
    expect(withWash).not.toEqual(top.totals);
  });

  it('answers an unknown step and a role the step does not have with a clear 400', async () => {
    const unknown = await post('/solvent-alternatives', {
      document: demo(),
      stepId: 'no-such-step',
      role: 'swap-target',
    });
    expect(unknown.status).toBe(400);
    const a = apiErrorSchema.parse(unknown.body);
    expect(a.error.message).toBe('The route has no step "no-such-step".');
    expect(unknown.body.error.details).toEqual([{ path: 'stepId', message: a.error.message }]);

    const wrongRole = await post('/solvent-alternatives', {
      document: demo(),
      stepId: 'filter',
      role: 'swap-target',
    });
    expect(wrongRole.status).toBe(400);
    const b = apiErrorSchema.parse(wrongRole.body);
    expect(b.error.message).toMatch(/is not a solvent swap/);
    expect(wrongRole.body.error.details).toEqual([{ path: 'role', message: b.error.message }]);

    const aqueous = await post('/solvent-alternatives', {
      document: demo(),
      stepId: 'acid-wash',
      role: 'extraction',
    });
    expect(aqueous.status).toBe(400);
    expect(aqueous.body.error.message).toMatch(/adds an aqueous solution, not a solvent/);

    const badRole = await post('/solvent-alternatives', {
      document: demo(),
      stepId: 'swap',
      role: 'reaction',
    });
    expect(badRole.status).toBe(400);
    expect(badRole.body.error.code).toBe('validation_failed');
    expect(badRole.body.error.details[0].path).toBe('role');
  });
});
