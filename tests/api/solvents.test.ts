import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { solventDetailSchema, solventListSchema } from '@shared/schemas/solvents';
import { SOLVENTS } from '@shared/engine/data';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

describe('solvent library API', () => {
  let asReviewer: SignedIn;

  beforeAll(async () => {
    const workspace = await buildWorkspace();
    asReviewer = await signIn(server.app, (await buildMember(workspace, ['reviewer'])).email);
  });

  it('requires authentication', async () => {
    expect((await request(server.app).get('/api/v1/solvents')).status).toBe(401);
    expect((await request(server.app).get('/api/v1/solvents/water')).status).toBe(401);
  });

  it('lists every library solvent with ICH class, boiling point, density, flash point, Hansen parameters and a source per value', async () => {
    const response = await asReviewer.agent.get('/api/v1/solvents');
    expect(response.status).toBe(200);
    const list = solventListSchema.parse(response.body);
    expect(list).toHaveLength(SOLVENTS.length);
    expect(list.length).toBeGreaterThanOrEqual(40);
    const toluene = list.find((s) => s.id === 'toluene')!;
    // ICH Q3C(R9): toluene is class 2, 890 ppm.
    expect(toluene.ich).toEqual({ class: 2, limitPpm: 890 });
    expect(toluene.smiles).toBeTruthy();
    expect(toluene.cas).toBe('108-88-3');
    expect(toluene.boilingPointC).toBeCloseTo(110.6, 0);
    expect(toluene.hansen).toEqual({ d: 18, p: 1.4, h: 2 });
    for (const field of [
      'boilingPointC',
      'densityGmL',
      'flashPointC',
      'ich',
      'hansen',
      'guideCategory',
    ]) {
      expect(toluene.sources[field]?.ref, field).toBeTruthy();
    }
    expect(toluene.sources.ich.citation).toMatch(/Q3C/);
    const water = list.find((s) => s.id === 'water')!;
    expect(water.flashPointC).toBeNull();
  });

  it('gives one solvent with its Antoine sets, and 404 for an unknown id', async () => {
    const detail = solventDetailSchema.parse(
      (await asReviewer.agent.get('/api/v1/solvents/ethanol')).body,
    );
    expect(detail.antoine.length).toBeGreaterThan(0);
    expect(detail.antoine[0]).toMatchObject({
      form: 'log10-bar-degC',
      A: 5.33675,
      B: 1648.22,
      C: 230.918,
    });
    expect(detail.antoine[0].source.ref).toBe('poling-5e-antoine');
    expect(detail.unifac.map((g) => g.name)).toEqual(['CH3', 'CH2', 'OH']);
    const missing = await asReviewer.agent.get('/api/v1/solvents/no-such-solvent');
    expect(missing.status).toBe(404);
    expect(missing.body.error.code).toBe('not_found');
  });
});
