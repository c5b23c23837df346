/**
 * Idle engine workers are retired: after ENGINE_IDLE_SECONDS without a task the pool stops its
 * threads (each holds a whole engine, its data and a step memo), and the next calculation starts
 * them again and is answered as usual. Once they have stopped, the web thread collects its garbage
 * (when the process exposes gc, as the start command does), so what the workers handed over is
 * freed and their memory goes back to the system. The conditions are waited for, not timed.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer({
  ENGINE_WORKERS: '1',
  ENGINE_TASK_SECONDS: '15',
  ENGINE_IDLE_SECONDS: '0.3',
});

const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

async function until(condition: () => boolean, what: string): Promise<void> {
  const deadline = Date.now() + 30_000;
  while (!condition()) {
    if (Date.now() > deadline) throw new Error(`waited 30 s for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

describe('idle engine workers', () => {
  let asChemist: SignedIn;
  const evaluate = () =>
    asChemist.agent
      .post('/api/v1/evaluate')
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ document: demo() });

  beforeAll(async () => {
    const workspace = await buildWorkspace();
    asChemist = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
  });

  it('are retired after the idle time, and the next calculation starts them again', async () => {
    const pool = server.runtime.pool;
    const first = await evaluate();
    expect(first.status).toBe(200);
    expect(first.body.result.totals).toBeTruthy();
    expect(pool.stats().started).toBe(true);
    const retiredBefore = pool.stats().retirements;

    await until(() => !pool.stats().started, 'the idle workers to be retired');
    expect(pool.stats().retirements).toBe(retiredBefore + 1);

    const again = await evaluate();
    expect(again.status).toBe(200);
    // The same route gives the same answer from fresh workers (no memo survives retirement).
    expect(again.body.result.totals).toEqual(first.body.result.totals);

    await until(() => !pool.stats().started, 'the restarted workers to be retired');
    expect(pool.stats().retirements).toBe(retiredBefore + 2);
  });

  it('collects the web thread garbage once per retirement, once the workers have stopped', async () => {
    const pool = server.runtime.pool;
    const exposed = (globalThis as { gc?: () => void }).gc;
    let collections = 0;
    (globalThis as { gc?: () => void }).gc = () => collections++;
    try {
      // Workers retired by the test before may still be stopping.
      await until(() => pool.stats().retiring === 0, 'earlier retirements to finish');
      collections = 0;
      for (const round of [1, 2]) {
        expect((await evaluate()).status).toBe(200);
        await until(() => !pool.stats().started, 'the idle workers to be retired');
        await until(() => pool.stats().retiring === 0, 'the retired workers to stop');
        expect(collections).toBe(round);
      }
    } finally {
      (globalThis as { gc?: () => void }).gc = exposed;
    }
  });
});
