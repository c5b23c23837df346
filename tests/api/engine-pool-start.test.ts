/**
 * The engine pool starts its workers on first use, not at boot: the health
 * check answers without them, and the first evaluation starts them and is
 * answered like any other. A repeated evaluation of the same route gives the
 * same reply (the workers reuse unchanged steps; the numbers are the same).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer({ ENGINE_WORKERS: '1' });

describe('engine pool start', () => {
  let asChemist: SignedIn;
  beforeAll(async () => {
    const workspace = await buildWorkspace();
    asChemist = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
  });

  it('holds no engine workers until the first evaluation, then answers it', async () => {
    const health = await asChemist.agent.get('/api/v1/health');
    expect(health.status).toBe(200);
    expect(server.runtime.pool.stats().started).toBe(false);
    const evaluate = () =>
      asChemist.agent
        .post('/api/v1/evaluate')
        .set('X-CSRF-Token', asChemist.csrfToken)
        .send({ document: demoRoute });
    const first = await evaluate();
    expect(first.status).toBe(200);
    expect(server.runtime.pool.stats().started).toBe(true);
    const second = await evaluate();
    expect(second.status).toBe(200);
    expect(second.text).toBe(first.text);
  });
});
