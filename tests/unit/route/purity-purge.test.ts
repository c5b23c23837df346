import { describe, expect, it } from 'vitest';
import { evaluateRoute, ICH_NEAR_LIMIT_FRACTION } from '../../../shared/engine/route/evaluate';
import { purgeCascades } from '../../../shared/engine/route/purge';
import { groupWarnings } from '../../../shared/engine/route/cautions';
import { tanimotoHex, CLOSE_ANALOGUE_TANIMOTO } from '../../../shared/engine/properties/similarity';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';

const doc = JSON.parse(JSON.stringify(demoAmideIsolation));

describe('purity as the trade means it', () => {
  const r = evaluateRoute(doc);
  const solid = r.terminals.find((t) => t.isolated)!.stream.kg;
  const compounds = [
    'pw417-amide',
    'pw417-acid',
    'pw417-amine',
    'deschloro-amide',
    'coupling-urea',
  ];
  const organic = compounds.reduce((a, id) => a + solid[id], 0);

  it('solvent-free purity counts the organic compounds only', () => {
    // Hand computation from the isolated solid: product / (product + the four other compounds).
    expect(r.totals.solventFreePurityPct!).toBeCloseTo((100 * solid['pw417-amide']) / organic, 10);
    // The assay includes the residual solvents and water, so it is lower.
    expect(r.totals.solventFreePurityPct!).toBeGreaterThan(r.totals.purityWtPct!);
  });

  it('lists each impurity against its limit with a pass mark', () => {
    expect(r.totals.impurities.map((i) => i.componentId)).toEqual(compounds.slice(1));
    for (const i of r.totals.impurities) {
      expect(i.levelPct).toBeCloseTo((100 * solid[i.componentId]) / organic, 12);
      expect(i.limitPct).toBe(i.componentId === 'coupling-urea' ? 0.1 : 0.15);
      expect(i.pass).toBe(true);
    }
  });

  it('a level above its limit fails, and no limit gives no mark', () => {
    const d = JSON.parse(JSON.stringify(doc));
    const deschloro = d.components.find((c: { id?: string }) => c.id === 'deschloro-amide');
    const level = r.totals.impurities.find((i) => i.componentId === 'deschloro-amide')!.levelPct;
    deschloro.specLimitPct = level / 2;
    delete d.components.find((c: { id?: string }) => c.id === 'pw417-acid').specLimitPct;
    const r2 = evaluateRoute(d);
    const byId = Object.fromEntries(r2.totals.impurities.map((i) => [i.componentId, i]));
    expect(byId['deschloro-amide'].pass).toBe(false);
    expect(byId['pw417-acid']).toMatchObject({ limitPct: null, pass: null });
  });
});

describe('purge per step', () => {
  const r = evaluateRoute(doc);
  it('each step reports in, out with the product and their ratio', () => {
    const kg = (conn: string, id: string) => r.streams[conn].kg[id];
    const e = r.steps['acid-wash'].purge!['pw417-amine'];
    // c1 feeds the acid wash, c2 carries its organic phase (the product) on.
    expect(e.inKg).toBeCloseTo(kg('c1', 'pw417-amine'), 15);
    expect(e.outKg).toBeCloseTo(kg('c2', 'pw417-amine'), 15);
    expect(e.purgeFactor).toBeCloseTo(e.inKg / e.outKg, 6);
    // A step that only carries the impurity on purges nothing.
    expect(r.steps['swap'].purge!['deschloro-amide'].purgeFactor).toBeCloseTo(1, 12);
  });

  it('the demo route removes each impurity where a chemist expects', () => {
    const main = Object.fromEntries(purgeCascades(r).map((c) => [c.componentId, c.mainStepId]));
    expect(main['pw417-amine']).toBe('acid-wash');
    // The dimethylamino group of the urea (pKa estimated from the structure) takes it into the acid wash.
    expect(main['coupling-urea']).toBe('acid-wash');
    expect(r.streams['c2'].kg['coupling-urea'] / r.streams['c1'].kg['coupling-urea']).toBeLessThan(
      1e-3,
    );
    // The acid leaves mostly in the bicarbonate wash, the rest with the mother liquor.
    expect(main['pw417-acid']).toBe('base-wash');
    expect(r.steps['base-wash'].purge!['pw417-acid'].purgeFactor!).toBeGreaterThan(3);
    // The des-chloro analogue is not removed by any wash: only the liquor takes it.
    expect(main['deschloro-amide']).toBe('filter');
  });
});

describe('purge cascades', () => {
  // Hand-made result: 10 kg in, ÷2 at a, ÷5 at b, complete at c.
  const steps = {
    a: { purge: { x: { inKg: 10, outKg: 5, purgeFactor: 2 } } },
    b: { purge: { x: { inKg: 5, outKg: 1, purgeFactor: 5 } } },
    c: { purge: { x: { inKg: 1, outKg: 0, purgeFactor: null } } },
  };
  const result = {
    order: ['a', 'b', 'c'],
    steps,
    totals: { impurities: [{ componentId: 'x' }], purge: {} },
  } as unknown as Parameters<typeof purgeCascades>[0];
  it('multiplies the step factors; complete once a step removes it all', () => {
    const [c] = purgeCascades(result);
    expect(c.rows.map((row) => row.cumulativeFactor)).toEqual([2, 10, null]);
    // Removed: 5 kg at a, 4 kg at b, 1 kg at c: step a removes the most.
    expect(c.mainStepId).toBe('a');
  });
});

describe('cautions a chemist reads', () => {
  it('groups the same caution for the same cause, listing the steps', () => {
    const g = groupWarnings([
      { severity: 'advisory', code: 'static', message: 'Heptane static', stepId: 'a' },
      { severity: 'info', code: 'x', message: 'other', stepId: 'a' },
      { severity: 'advisory', code: 'static', message: 'Heptane static', stepId: 'b' },
      { severity: 'advisory', code: 'static', message: 'Heptane static', stepId: 'b' },
    ]);
    expect(g).toHaveLength(2);
    expect(g[0].stepIds).toEqual(['a', 'b']);
  });

  it('the demo route repeats no caution once grouped, and the flash-point advisory names no temperature', () => {
    const r = evaluateRoute(doc);
    const grouped = groupWarnings(r.warnings);
    expect(grouped.length).toBeLessThan(r.warnings.length);
    const flash = grouped.filter((w) => w.code === 'flammable-above-flash-point');
    expect(flash.length).toBe(2); // {2-propanol, heptane} and {heptane}
    expect(flash.some((w) => w.stepIds.length >= 3)).toBe(true);
  });

  it('notes a residual solvent within 20 % of its ICH limit', () => {
    const r = evaluateRoute(doc);
    // Dried to 0.5 % LOD, almost all heptane: about 5000 ppm against the 5000 ppm class 3 limit.
    const note = r.warnings.find((w) => w.code === 'ich-near-limit');
    expect(note?.stepId).toBe('dry');
    expect(note?.message).toMatch(/n-Heptane/);
    expect(ICH_NEAR_LIMIT_FRACTION).toBe(0.8);
  });
});

describe('close analogues', () => {
  it('Tanimoto by hand: 4 bits against 2 shared', () => {
    expect(tanimotoHex('0000000f', '00000003')).toBe(0.5);
    expect(tanimotoHex('00000000', '00000000')).toBeNull();
    expect(tanimotoHex('0f', '0000000f')).toBeNull();
  });

  it('cautions on the crystallisations for the des-chloro analogue only, until an incorporation is set', () => {
    const r = evaluateRoute(doc);
    const c = r.warnings.filter((w) => w.code === 'close-analogue');
    expect(c.map((w) => w.stepId)).toEqual(['antisolvent', 'cool']);
    expect(c.every((w) => w.message.includes('Des-chloro'))).toBe(true);
    expect(CLOSE_ANALOGUE_TANIMOTO).toBe(0.8);

    const d = JSON.parse(JSON.stringify(doc));
    d.components.find((x: { id?: string }) => x.id === 'deschloro-amide').solidIncorporation = 0.05;
    const r2 = evaluateRoute(d);
    expect(r2.warnings.some((w) => w.code === 'close-analogue')).toBe(false);
    // Incorporation by K: m = K·S_P·L_i/(L_P + K·S_P) at the antisolvent step (hand check from its slurry).
    const slurry = r2.streams['c6'];
    const inc = (r2.steps['antisolvent'].details as { incorporatedKg: Record<string, number> })
      .incorporatedKg['deschloro-amide'];
    const S_P = slurry.solidKg['pw417-amide'];
    const L_P = slurry.kg['pw417-amide'] - S_P;
    const L_i = slurry.kg['deschloro-amide'] - (slurry.solidKg['deschloro-amide'] - inc);
    expect(inc).toBeCloseTo((0.05 * S_P * L_i) / (L_P + 0.05 * S_P), 12);
    // With 5 % incorporation the analogue now ends far above its trace level without.
    const lvl = (res: typeof r) =>
      res.totals.impurities.find((i) => i.componentId === 'deschloro-amide')!.levelPct;
    expect(lvl(r2)).toBeGreaterThan(100 * lvl(r));
  });
});
