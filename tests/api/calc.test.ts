import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  activityCoefficientsReplySchema,
  azeotropeReplySchema,
  bubblePointReplySchema,
  hansenDistanceReplySchema,
  partitionReplySchema,
  solubilityReplySchema,
  vapourPressureReplySchema,
} from '@shared/schemas/calc';
import { apiErrorSchema } from '@shared/schemas/errors';
import { useTestServer } from '../support/app';
import { buildMember, buildUser, buildWorkspace, signIn } from '../support/factories';

const server = useTestServer();

describe('calculation API', () => {
  let token: string;
  const bearer = (path: string, body: unknown) =>
    request(server.app)
      .post(`/api/v1/calc/${path}`)
      .set('Authorization', `Bearer ${token}`)
      .send(body as object);

  beforeAll(async () => {
    const workspace = await buildWorkspace();
    const engineer = await buildMember(workspace, ['engineer']);
    const asEngineer = await signIn(server.app, engineer.email);
    token = (
      await asEngineer.agent
        .post('/api/v1/tokens')
        .set('X-CSRF-Token', asEngineer.csrfToken)
        .send({ name: 'calc script' })
    ).body.token;
  });

  it('requires authentication', async () => {
    for (const path of [
      'vapour-pressure',
      'activity-coefficients',
      'bubble-point',
      'azeotrope',
      'partition',
      'solubility',
      'hansen-distance',
    ]) {
      const response = await request(server.app).post(`/api/v1/calc/${path}`).send({});
      expect(response.status, path).toBe(401);
      expect(response.body.error.code).toBe('unauthenticated');
    }
  });

  it('refuses a signed-in user who belongs to no workspace (403)', async () => {
    const loner = await buildUser();
    const asLoner = await signIn(server.app, loner.email);
    const response = await asLoner.agent
      .post('/api/v1/calc/vapour-pressure')
      .set('X-CSRF-Token', asLoner.csrfToken)
      .send({ component: { smiles: 'O' }, temperatureC: 100 });
    expect(response.status).toBe(403);
  });

  it('answers with a session cookie as well as a token', async () => {
    const workspace = await buildWorkspace();
    const reviewer = await buildMember(workspace, ['reviewer']);
    const asReviewer = await signIn(server.app, reviewer.email);
    const response = await asReviewer.agent
      .post('/api/v1/calc/vapour-pressure')
      .set('X-CSRF-Token', asReviewer.csrfToken)
      .send({ component: { smiles: 'O' }, temperatureC: 100 });
    expect(response.status).toBe(200);
  });

  it('vapour pressure of water at 100 °C is one atmosphere (Perry 8e Table 2-8, DIPPR 101)', async () => {
    const response = await bearer('vapour-pressure', {
      component: { smiles: 'O' },
      temperatureC: 100,
    });
    expect(response.status).toBe(200);
    const reply = vapourPressureReplySchema.parse(response.body);
    // Regression against this implementation, then the printed value (101.325 kPa at the normal boiling point, 99.97 °C).
    expect(reply.pressureKPa).toBeCloseTo(101.261, 2);
    expect(Math.abs(reply.pressureKPa - 101.325)).toBeLessThan(1.5);
    expect(reply.method).toBe('dippr101');
    expect(reply.source.ref).toBe('perry-8e-2-8-vapour-pressure');
    expect(reply.source.citation).toMatch(/Perry/);
    expect(reply.component).toMatchObject({ basis: 'library', solventId: 'water' });
  });

  it('resolves another writing of a library SMILES through the canonical form', async () => {
    // Toluene written from the methyl end is not one of the listed strings.
    const response = await bearer('vapour-pressure', {
      component: { smiles: 'C(c1ccccc1)' },
      temperatureC: 110.6,
    });
    expect(response.status).toBe(200);
    const reply = vapourPressureReplySchema.parse(response.body);
    expect(reply.component.solventId).toBe('toluene');
    // CRC normal boiling point of toluene 110.6 °C.
    expect(Math.abs(reply.pressureKPa - 101.325)).toBeLessThan(3);
  });

  it('uses the wide-range correlation up to the critical point and warns beyond it', async () => {
    const inside = vapourPressureReplySchema.parse(
      (await bearer('vapour-pressure', { component: { smiles: 'O' }, temperatureC: 250 })).body,
    );
    expect(inside.method).toBe('dippr101');
    expect(inside.warnings).toEqual([]);
    const beyond = vapourPressureReplySchema.parse(
      (await bearer('vapour-pressure', { component: { smiles: 'O' }, temperatureC: 400 })).body,
    );
    expect(beyond.method).toBe('clausius-clapeyron');
    expect(beyond.warnings.join(' ')).toMatch(/above the critical temperature/);
  });

  it('a vapour pressure of a compound not in the library is a 422 no_data', async () => {
    const response = await bearer('vapour-pressure', {
      component: { smiles: 'CCCCCCCCCCCCO' },
      temperatureC: 100,
    });
    expect(response.status).toBe(422);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('no_data');
  });

  it('UNIFAC activity coefficients of ethanol–water, with the groups used', async () => {
    const response = await bearer('activity-coefficients', {
      components: [{ smiles: 'CCO' }, { smiles: 'O' }],
      moleFractions: [0.5, 0.5],
      temperatureC: 25,
    });
    expect(response.status).toBe(200);
    const reply = activityCoefficientsReplySchema.parse(response.body);
    expect(reply.activityCoefficients[0]).toBeCloseTo(1.2037, 3);
    expect(reply.activityCoefficients[1]).toBeCloseTo(1.4967, 3);
    // Both positive deviations from Raoult's law, as measured for this system.
    expect(reply.activityCoefficients.every((g) => g > 1)).toBe(true);
    expect(reply.groups[0].subgroups.map((g) => g.name)).toEqual(['CH3', 'CH2', 'OH']);
    expect(reply.groups[1].subgroups).toEqual([
      { subgroup: 16, name: 'H2O', mainGroup: 7, mainGroupName: 'H2O', count: 1 },
    ]);
    expect(reply.source.ref).toMatch(/Hansen et al\., Ind\. Eng\. Chem\. Res\. 1991/);
  });

  it('takes a compound outside the library by its structure-derived groups', async () => {
    const reply = activityCoefficientsReplySchema.parse(
      (
        await bearer('activity-coefficients', {
          components: [{ smiles: 'OC(=O)CCc1ccccc1' }, { smiles: 'Cc1ccccc1' }],
          moleFractions: [0.1, 0.9],
          temperatureC: 40,
        })
      ).body,
    );
    expect(reply.groups[0].basis).toBe('structure');
    expect(reply.groups[0].subgroups.map((g) => g.name).sort()).toEqual(
      ['ACCH2', 'ACH', 'CH2', 'COOH'].sort(),
    );
    expect(reply.warnings.join(' ')).toMatch(/assigned automatically/);
  });

  it('bubble point of ethanol–water 50/50 at 1 atm is near 80 °C, the vapour richer in ethanol', async () => {
    const response = await bearer('bubble-point', {
      components: [{ smiles: 'CCO' }, { smiles: 'O' }],
      moleFractions: [0.5, 0.5],
      pressureKPa: 101.325,
    });
    expect(response.status).toBe(200);
    const reply = bubblePointReplySchema.parse(response.body);
    expect(reply.temperatureC).toBeCloseTo(79.868, 2);
    // Measured (Gmehling DECHEMA series): about 79.8 °C, y_ethanol ≈ 0.65 at x = 0.5.
    expect(Math.abs(reply.temperatureC - 79.8)).toBeLessThan(1.5);
    expect(reply.vapourMoleFractions[0]).toBeGreaterThan(0.6);
    expect(reply.vapourMoleFractions[0] + reply.vapourMoleFractions[1]).toBeCloseTo(1, 9);
  });

  it('finds the ethanol–water azeotrope near 78 °C (handbook: 78.2 °C, 89.4 mol % ethanol)', async () => {
    const response = await bearer('azeotrope', {
      components: [{ smiles: 'CCO' }, { smiles: 'O' }],
      pressureKPa: 101.325,
    });
    expect(response.status).toBe(200);
    const reply = azeotropeReplySchema.parse(response.body);
    expect(reply.found).toBe(true);
    expect(reply.kind).toBe('minimum-boiling');
    expect(reply.temperatureC!).toBeCloseTo(78.057, 2);
    expect(Math.abs(reply.temperatureC! - 78.2)).toBeLessThan(1.5);
    expect(Math.abs(reply.moleFractions![0] - 0.894)).toBeLessThan(0.05);
  });

  it('reports no azeotrope for methanol–water', async () => {
    const reply = azeotropeReplySchema.parse(
      (
        await bearer('azeotrope', {
          components: [{ smiles: 'CO' }, { smiles: 'O' }],
          pressureKPa: 101.325,
        })
      ).body,
    );
    // Methanol–water has no azeotrope (handbook tables list none).
    expect(reply.found).toBe(false);
    expect(reply.temperatureC).toBeNull();
    expect(reply.method).toMatch(/relative volatility/);
  });

  it('partition of benzoic acid: Collander from logP, and Henderson–Hasselbalch lowers D at pH 7 by the neutral fraction', async () => {
    const body = (pH: number) => ({
      solute: { smiles: 'OC(=O)c1ccccc1', pKa: [{ value: 4.2, type: 'acid' }], logP: 1.87 },
      organic: { smiles: 'CCOC(C)=O' },
      aqueous: { pH },
    });
    const acidic = partitionReplySchema.parse((await bearer('partition', body(1))).body);
    const neutral = partitionReplySchema.parse((await bearer('partition', body(7))).body);
    expect(acidic.basis).toBe('molar-concentration');
    expect(acidic.method).toBe('Collander from logP');
    // neutral fraction at pH 7 = 1/(1 + 10^(7 − 4.2)) = 1.582e-3 (Henderson–Hasselbalch)
    expect(neutral.D / acidic.D).toBeCloseTo(1.5823e-3 / (1 / (1 + 10 ** (1 - 4.2))), 4);
    expect(neutral.logD).toBeCloseTo(Math.log10(neutral.D), 10);
  });

  it('partition by UNIFAC when no logP is given, with salting-out by Setschenow', async () => {
    const plain = partitionReplySchema.parse(
      (
        await bearer('partition', {
          solute: { smiles: 'c1ccccc1' },
          organic: { smiles: 'Cc1ccccc1' },
          temperatureC: 25,
        })
      ).body,
    );
    const salted = partitionReplySchema.parse(
      (
        await bearer('partition', {
          solute: { smiles: 'c1ccccc1' },
          organic: { smiles: 'Cc1ccccc1' },
          aqueous: { salt: { name: 'nacl', molar: 1 } },
          temperatureC: 25,
        })
      ).body,
    );
    expect(plain.method).toBe('activity-coefficients (UNIFAC)');
    expect(salted.D).toBeGreaterThan(plain.D);
    // Benzene between toluene and water: strongly organic (log D of order 2–3).
    expect(plain.logD).toBeGreaterThan(1.5);
  });

  it('partition into a water-miscible solvent is refused with a reason', async () => {
    const response = await bearer('partition', {
      solute: { smiles: 'c1ccccc1', logP: 2.13 },
      organic: { smiles: 'CC(C)=O' },
    });
    expect(response.status).toBe(422);
    expect(response.body.error.message).toMatch(/miscible with water/);
  });

  it('ideal solubility of naphthalene at 25 °C is 0.302 (Prausnitz et al. 1999, eq. 11-13; Tm 80.2 °C, ΔHfus 18.98 kJ/mol)', async () => {
    const ideal = solubilityReplySchema.parse(
      (
        await bearer('solubility', {
          solute: { meltingPointC: 80.2, enthalpyFusionKJmol: 18.98 },
          temperatureC: 25,
        })
      ).body,
    );
    expect(ideal.idealMoleFraction).toBeCloseTo(0.30238, 4);
    expect(Math.abs(ideal.idealMoleFraction - 0.302)).toBeLessThan(0.005);
    expect(ideal.moleFraction).toBe(ideal.idealMoleFraction);
    expect(ideal.method).toMatch(/ideal solubility/);
    const inToluene = solubilityReplySchema.parse(
      (
        await bearer('solubility', {
          solute: { smiles: 'c1ccc2ccccc2c1', meltingPointC: 80.2, enthalpyFusionKJmol: 18.98 },
          solvent: { smiles: 'Cc1ccccc1' },
          temperatureC: 25,
        })
      ).body,
    );
    expect(inToluene.method).toMatch(/UNIFAC/);
    expect(inToluene.activityCoefficient!).toBeGreaterThan(0.9);
    expect(inToluene.moleFraction).toBeCloseTo(
      inToluene.idealMoleFraction / inToluene.activityCoefficient!,
      3,
    );
  });

  it('Hansen distance toluene–ethanol is 19.41 (Hansen 2007, eq. 1.9, worked with handbook parameters)', async () => {
    const response = await bearer('hansen-distance', {
      a: { smiles: 'Cc1ccccc1' },
      b: { d: 15.8, p: 8.8, h: 19.4 },
    });
    expect(response.status).toBe(200);
    const reply = hansenDistanceReplySchema.parse(response.body);
    expect(reply.ra).toBeCloseTo(19.413, 3);
    expect(reply.a.basis).toBe('library');
    expect(reply.a.source?.ref).toBe('hansen-hspipy');
    expect(reply.b.basis).toBe('given');
  });

  it('estimates Hansen parameters of a structure outside the library and says so', async () => {
    const reply = hansenDistanceReplySchema.parse(
      (await bearer('hansen-distance', { a: { smiles: 'CCCCCCCCCCO' }, b: { smiles: 'O' } })).body,
    );
    expect(reply.a.basis).toBe('estimated');
    expect(reply.a.method).toMatch(/Hoftyzer–Van Krevelen/);
    expect(reply.warnings.join(' ')).toMatch(/estimated/);
  });

  it('refuses empty, mismatched, oversized and non-finite inputs with 400 and field paths', async () => {
    const expectPaths = async (path: string, body: unknown, paths: string[]) => {
      const response = await bearer(path, body);
      expect(response.status, JSON.stringify(body)).toBe(400);
      const error = apiErrorSchema.parse(response.body).error;
      if (error.code !== 'validation_failed') throw new Error(`unexpected ${error.code}`);
      for (const p of paths)
        expect(
          error.details.map((d) => d.path),
          JSON.stringify(error.details),
        ).toContain(p);
    };
    await expectPaths(
      'activity-coefficients',
      { components: [], moleFractions: [], temperatureC: 25 },
      ['components', 'moleFractions'],
    );
    await expectPaths(
      'activity-coefficients',
      { components: [{ smiles: 'CCO' }, { smiles: 'O' }], moleFractions: [1], temperatureC: 25 },
      ['moleFractions'],
    );
    await expectPaths(
      'activity-coefficients',
      {
        components: [{ smiles: 'CCO' }, { smiles: 'O' }],
        moleFractions: [0.5, 0.6],
        temperatureC: 25,
      },
      ['moleFractions'],
    );
    await expectPaths(
      'activity-coefficients',
      {
        components: [{ smiles: 'CCO' }, { smiles: 'O' }],
        moleFractions: [0.5, 'NaN'],
        temperatureC: 25,
      },
      ['moleFractions.1'],
    );
    const many = Array.from({ length: 21 }, () => ({ smiles: 'O' }));
    await expectPaths(
      'bubble-point',
      { components: many, moleFractions: many.map(() => 1 / 21), pressureKPa: 101.325 },
      ['components', 'moleFractions'],
    );
    await expectPaths('vapour-pressure', { component: { smiles: '' }, temperatureC: 500 }, [
      'component.smiles',
      'temperatureC',
    ]);
    await expectPaths('azeotrope', { components: [{ smiles: 'CCO' }], pressureKPa: -1 }, [
      'components',
      'pressureKPa',
    ]);
    await expectPaths('hansen-distance', { a: { d: -1, p: 1, h: 1 }, b: { smiles: 'O' } }, ['a.d']);
    await expectPaths(
      'partition',
      {
        solute: { smiles: 'CCO', pKa: [{ value: 4, type: 'neutral' }] },
        organic: { smiles: 'Cc1ccccc1' },
      },
      ['solute.pKa.0.type'],
    );
  });

  it('JSON that overflows to Infinity or is not JSON at all is a 400, and the server keeps answering', async () => {
    const overflow = await request(server.app)
      .post('/api/v1/calc/vapour-pressure')
      .set('Authorization', `Bearer ${token}`)
      .set('Content-Type', 'application/json')
      .send('{"component":{"smiles":"O"},"temperatureC":1e999}');
    expect(overflow.status).toBe(400);
    expect(overflow.body.error.details.map((d: { path: string }) => d.path)).toContain(
      'temperatureC',
    );
    const notJson = await request(server.app)
      .post('/api/v1/calc/vapour-pressure')
      .set('Authorization', `Bearer ${token}`)
      .set('Content-Type', 'application/json')
      .send('{"component":{"smiles":"O"},"temperatureC":NaN}');
    expect(notJson.status).toBe(400);
    expect(notJson.body.error.code).toBe('malformed_json');
    expect(
      (await bearer('vapour-pressure', { component: { smiles: 'O' }, temperatureC: 100 })).status,
    ).toBe(200);
  });

  it('an unparsable SMILES is a 422 whose message names the problem', async () => {
    const response = await bearer('activity-coefficients', {
      components: [{ smiles: 'CCO' }, { smiles: 'C1CC' }],
      moleFractions: [0.5, 0.5],
      temperatureC: 25,
    });
    expect(response.status).toBe(422);
    const error = apiErrorSchema.parse(response.body).error;
    expect(error.code).toBe('structure_unparsable');
    expect(error.message).toMatch(/Component 2/);
    expect(error.message).toMatch(/ring closure/);
  });

  it('a group pair without UNIFAC parameters is a 422 naming the pair (water – CH3SH main groups)', async () => {
    const response = await bearer('activity-coefficients', {
      components: [{ smiles: 'CCS' }, { smiles: 'O' }],
      moleFractions: [0.5, 0.5],
      temperatureC: 25,
    });
    expect(response.status).toBe(422);
    const error = apiErrorSchema.parse(response.body).error;
    expect(error.code).toBe('unifac_missing_parameters');
    expect(error.message).toMatch(/H2O–CH3SH/);
  });

  it('atoms no UNIFAC group covers are a 422 that lists them', async () => {
    const response = await bearer('activity-coefficients', {
      components: [{ smiles: 'CC(=O)Nc1ccccc1' }, { smiles: 'O' }],
      moleFractions: [0.5, 0.5],
      temperatureC: 25,
    });
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('unifac_missing_parameters');
    expect(response.body.error.message).toMatch(/no UNIFAC group covers 3 atom/);
  });

  it('lists every calculation path in the OpenAPI document', async () => {
    const doc = (await request(server.app).get('/api/v1/openapi.json')).body;
    for (const path of [
      'vapour-pressure',
      'activity-coefficients',
      'bubble-point',
      'azeotrope',
      'partition',
      'solubility',
      'hansen-distance',
    ]) {
      expect(Object.keys(doc.paths)).toContain(`/api/v1/calc/${path}`);
    }
    expect(Object.keys(doc.paths)).toContain('/api/v1/solvents');
  });
});
