/**
 * Octanol–water log P: UNIFAC estimate (estimateLogPow on automatically
 * assigned groups) against the CRC Handbook compilation "Octanol–Water
 * Partition Coefficients" (values from Hansch, Leo & Hoekman 1995 and
 * Sangster 1989), read in CalebBell/chemicals "CRC logP table.tsv".
 *
 * Stated bound for the whole set (46 compounds): mean absolute error ≤ 0.50
 * log units and at least 60 % of compounds within 0.5 log units. The per-
 * compound regression values (our own output, tight) guard the numerics;
 * the printed values are compared loosely (within 1.5 log units each).
 */
import { describe, expect, it } from 'vitest';
import { assignUnifacGroups } from '@shared/chemistry';
import { estimateLogPow } from '@shared/engine/properties';
import { LOGP_REFERENCE, LOGP_REFERENCE_SOURCE } from '@shared/engine/data/logp-reference';

// Our own values at the time the check was written (regression, ±0.005).
const OWN: Record<string, number> = {
  benzene: 2.165,
  toluene: 2.779,
  ethylbenzene: 3.165,
  'p-xylene': 3.393,
  naphthalene: 3.524,
  'n-hexane': 2.73,
  'n-heptane': 3.165,
  cyclohexane: 2.531,
  methanol: -0.2,
  ethanol: 0.033,
  '1-propanol': 0.468,
  '2-propanol': 0.469,
  '1-butanol': 0.903,
  '1-hexanol': 1.774,
  '1-octanol': 2.644,
  'benzyl alcohol': 1.773,
  phenol: 1.715,
  'p-cresol': 2.329,
  'methyl acetate': 0.439,
  'ethyl acetate': 0.874,
  'butyl acetate': 1.745,
  acetone: 0.031,
  '2-butanone': 0.466,
  '4-methyl-2-pentanone': 1.337,
  cyclohexanone: 1.437,
  acetophenone: 1.673,
  'diethyl ether': 1.635,
  'methyl tert-butyl ether': 1.897,
  tetrahydrofuran: 1.168,
  anisole: 2.262,
  dichloromethane: 1.369,
  trichloromethane: 1.917,
  tetrachloromethane: 2.824,
  chlorobenzene: 1.902,
  'acetic acid': -0.15,
  'propanoic acid': 0.285,
  'benzoic acid': 1.491,
  aniline: 1.407,
  butylamine: 1.233,
  triethylamine: 2.337,
  pyridine: 1.45,
  acetonitrile: -0.153,
  nitromethane: -0.161,
  nitrobenzene: 1.843,
  'N,N-dimethylformamide': 0.301,
  'dimethyl sulfoxide': -0.965,
};

const MAE_BOUND = 0.5;
const SHARE_WITHIN_05_BOUND = 0.6;

describe(`log P (octanol/water) vs ${LOGP_REFERENCE_SOURCE.ref}`, () => {
  const rows = LOGP_REFERENCE.map((c) => {
    const a = assignUnifacGroups({ smiles: c.smiles });
    return { ...c, unassigned: a.unassignedAtoms.length, est: estimateLogPow(a.groups).logP };
  });

  it('uses at least 15 compounds, all fully assigned', () => {
    expect(rows.length).toBeGreaterThanOrEqual(15);
    expect(rows.filter((r) => r.unassigned > 0).map((r) => r.name)).toEqual([]);
  });

  for (const r of rows) {
    it(`${r.name} (CAS ${r.cas}): printed ${r.logP}`, () => {
      expect(r.est).toBeCloseTo(OWN[r.name], 2); // regression, own value
      expect(Math.abs(r.est - r.logP)).toBeLessThan(1.5); // validity, printed value
    });
  }

  it(`mean absolute error ≤ ${MAE_BOUND} and ≥ ${SHARE_WITHIN_05_BOUND * 100} % within 0.5 log units`, () => {
    const errs = rows.map((r) => r.est - r.logP);
    const mae = errs.reduce((s, e) => s + Math.abs(e), 0) / errs.length;
    const within = errs.filter((e) => Math.abs(e) <= 0.5).length / errs.length;
    const bias = errs.reduce((s, e) => s + e, 0) / errs.length;
    console.log(
      `log P reference set: n = ${rows.length}, MAE = ${mae.toFixed(3)}, within 0.5 = ${(within * 100).toFixed(1)} %, mean signed error = ${bias.toFixed(3)}\n` +
        rows
          .map(
            (r) =>
              `  ${r.name.padEnd(26)} printed ${r.logP.toFixed(2).padStart(5)}  estimate ${r.est.toFixed(2).padStart(5)}  error ${(r.est - r.logP).toFixed(2).padStart(5)}`,
          )
          .join('\n'),
    );
    expect(mae).toBeLessThanOrEqual(MAE_BOUND);
    expect(within).toBeGreaterThanOrEqual(SHARE_WITHIN_05_BOUND);
    // own-value regression of the summary statistics
    expect(mae).toBeCloseTo(0.395, 2);
  });
});
