/**
 * Vapour pressure over the whole range a route can reach, for every solvent
 * of the library.
 *
 * 1. Normal boiling point: the temperature at which the engine's vapour
 *    pressure is 101.325 kPa, against the record's CRC Handbook value
 *    ("Physical Constants of Organic Compounds", via CalebBell/chemicals
 *    chemicals/Misc/Physical Constants of Organic Compounds.csv; water from the
 *    inorganic table), within 0.5 K, for every solvent: the four Perry 8e
 *    Table 2-8 rows that missed the CRC value by 0.6–1.2 K are anchored at it
 *    (data/vapour-pressure.ts). Twice per solvent: tight against this
 *    implementation's own value (regression, 0.01 K), loose against CRC.
 * 2. At 25 °C: against an independent published Antoine set whose fitted range
 *    covers 25 °C (Poling 5e App. A, NIST WebBook or Landolt-Börnstein IV/20,
 *    as stored in the library), within the stated uncertainty of the two
 *    sources where one is stated — none is, as read (table AT_25C below, per
 *    solvent) — else within 3 % (common practice), and tight against our own
 *    value (regression, 1e-4 relative).
 * 3. Continuity from 200 K (or the triple point) to the critical point: no jump
 *    in ln P or in its slope anywhere, including where methanol's and
 *    ethanol's former Antoine sets handed over.
 * 4. Outside former fitted ranges: DMF, DMAc, 1,4-dioxane and DMSO at 25 °C and
 *    at their normal boiling points.
 */
import { describe, expect, it } from 'vitest';
import { SOLVENTS, solventById } from '@shared/engine/data';
import {
  antoineLnPressure,
  correlationLnPressure,
  saturationTemperature,
  solventVapourPressureData,
  vapourPressure,
  vapourPressureWithSlope,
} from '@shared/engine/thermo/antoine';

/** [id, engine Tb / K, engine P(25 °C) / Pa] — this implementation's own values (regression). */
const OWN: Array<[string, number, number]> = [
  ['water', 373.168, 3170.4],
  ['methanol', 337.685, 16826],
  ['ethanol', 351.46, 7924.1],
  ['1-propanol', 370.34, 2808.5],
  ['2-propanol', 355.36, 6027.0],
  ['1-butanol', 390.758, 902.39],
  ['2-butanol', 372.698, 2437.9],
  ['isobutanol', 381.004, 1392.7],
  ['tert-butanol', 355.62, 5583.2],
  ['1-octanol', 467.85, 11.139],
  ['ethyl-acetate', 350.353, 12426],
  ['isopropyl-acetate', 362.051, 8045.8],
  ['n-butyl-acetate', 399.165, 1492.7],
  ['acetone', 329.287, 30752],
  ['2-butanone', 352.492, 12314],
  ['mibk', 389.293, 2651.1],
  ['thf', 339.124, 21541],
  ['2-methyltetrahydrofuran', 353.37, 12843],
  ['mtbe', 328.186, 33321],
  ['cpme', 378.59, 5065.6],
  ['diethyl-ether', 307.544, 71732],
  ['diisopropyl-ether', 341.609, 19827],
  ['1-4-dioxane', 374.521, 5093.9],
  ['dme', 357.953, 9963.1],
  ['anisole', 426.98, 482.96],
  ['n-heptane', 371.549, 6066.1],
  ['n-hexane', 341.884, 20266],
  ['cyclohexane', 353.932, 13044],
  ['methylcyclohexane', 373.876, 6138.7],
  ['toluene', 383.829, 3803.9],
  ['o-xylene', 417.443, 886.18],
  ['dichloromethane', 312.814, 58411],
  ['chloroform', 334.249, 26165],
  ['chlorobenzene', 405.112, 1585.8],
  ['acetonitrile', 354.63, 12147],
  ['dmf', 425.95, 542.29],
  ['dmac', 439.05, 547.87],
  ['nmp', 477.35, 73.83],
  ['dmso', 465.05, 80.192],
  ['acetic-acid', 391.158, 2079.2],
  ['pyridine', 388.39, 2767.1],
];

/**
 * CRC–correlation differences above 0.5 K, with the bound they are held to and why. None since the four
 * Perry rows that missed the CRC value (2-propanol by 0.60 K, 1-octanol 0.79 K, DMF 1.03 K, DMSO 1.16 K)
 * are anchored there (data/vapour-pressure.ts anchoredAtTb; unchanged at 25 °C and at Tc).
 */
const TB_EXCEPTIONS: Record<string, { bound: number; why: string }> = {};

describe('normal boiling point of every library solvent against the CRC Handbook', () => {
  it('the table of own values covers the whole library', () => {
    expect(OWN.map((r) => r[0]).sort()).toEqual(SOLVENTS.map((s) => s.id).sort());
  });
  for (const [id, ownTb] of OWN) {
    const s = solventById(id)!;
    const crc = s.boilingPointC.value + 273.15;
    const exception = TB_EXCEPTIONS[id];
    it(`${s.name}: Tb within ${exception ? exception.bound : 0.5} K of ${s.boilingPointC.value} °C (${s.boilingPointC.source.ref}, ${s.boilingPointC.source.status})`, () => {
      const { sets, extra } = solventVapourPressureData(s);
      const r = saturationTemperature(sets, 101325, extra);
      expect(r.converged).toBe(true);
      expect(r.T_K).toBeCloseTo(ownTb, 2);
      expect(Math.abs(r.T_K - crc)).toBeLessThanOrEqual(exception ? exception.bound : 0.5);
    });
  }
});

/**
 * What each source says about its own uncertainty at 25 °C, as read. Sources: the engine's value
 * (Perry 8e Table 2-8, DIPPR eq. 101, or VDI Heat Atlas PPDS Wagner, read through the `chemicals` data
 * files) against an independent Antoine set (Poling 5e App. A, NIST WebBook, Landolt-Börnstein IV/20,
 * read the same way). None of these carries a per-compound uncertainty in the copy read: the data files
 * hold coefficients and fitted ranges only (Table 2-8: C1–C5, Tmin, Tmax; PPDS: Tc, Pc, A–D; the Antoine
 * files: A, B, C, Tmin, Tmax), and the stated accuracy of the printed tables (Perry's 1–5 % for Table 2-8,
 * DIPPR's per-row codes, Poling's remarks on its Appendix A) was not read, only recalled. So every row
 * holds `statedUncertainty: null` and the check uses 3 %, a common-practice agreement between two
 * evaluated vapour-pressure sets near room temperature — not a source's statement. Where a source's own
 * stated uncertainty is read later, put it (fraction, both sources combined in quadrature) in its row:
 * the test then uses it instead.
 * `dev` is the deviation found here (engine/comparison − 1, %), for the reader.
 */
interface At25C {
  engine: string;
  comparison: string;
  statedUncertainty: { engine: number; comparison: number; where: string } | null;
  dev: number;
  note?: string;
}
const NONE_STATED = null;
const AT_25C: Record<string, At25C> = {
  water: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.26,
    note: 'also checked against IAPWS-95 (value recalled) within 0.5 % below',
  },
  methanol: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.68,
  },
  ethanol: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.61,
  },
  '1-propanol': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.82,
  },
  '2-propanol': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.1,
  },
  '1-butanol': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'nist-webbook-antoine',
    statedUncertainty: NONE_STATED,
    dev: 1.95,
  },
  'tert-butanol': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.24,
  },
  'ethyl-acetate': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: -1.49,
  },
  acetone: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.09,
  },
  '2-butanone': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 2.33,
  },
  mibk: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.56,
  },
  thf: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.38,
  },
  mtbe: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'landolt-iv20-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.06,
  },
  'diethyl-ether': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.71,
  },
  'diisopropyl-ether': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'landolt-iv20-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.33,
  },
  'n-heptane': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.52,
  },
  'n-hexane': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.39,
  },
  cyclohexane: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.21,
  },
  methylcyclohexane: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.78,
  },
  toluene: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.39,
  },
  dichloromethane: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.21,
  },
  chloroform: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.08,
  },
  acetonitrile: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'nist-webbook-antoine',
    statedUncertainty: NONE_STATED,
    dev: 2.98,
    note: 'the two sets differ by almost the whole 3 %: which one is nearer the measurements is not known from the library',
  },
  dmso: {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'nist-webbook-antoine',
    statedUncertainty: NONE_STATED,
    dev: -0.05,
    note: 'the comparison set (NIST, 293–323 K) was read as quoted on a non-publication page and not checked in the WebBook itself (library note): a weak check',
  },
  'acetic-acid': {
    engine: 'perry-8e-2-8-vapour-pressure',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.58,
  },
  pyridine: {
    engine: 'vdi-ppds-wagner',
    comparison: 'poling-5e-antoine',
    statedUncertainty: NONE_STATED,
    dev: 0.66,
  },
};

/** Stated uncertainties of the two sources combined in quadrature, else 3 % (common practice). */
function toleranceAt25C(row: At25C): number {
  const u = row.statedUncertainty;
  return u ? Math.hypot(u.engine, u.comparison) : 0.03;
}

describe('vapour pressure at 25 °C against an independent published Antoine set', () => {
  for (const [id, , ownP25] of OWN) {
    const s = solventById(id)!;
    const { sets, extra } = solventVapourPressureData(s);
    const p = vapourPressure(sets, 298.15, extra);
    it(`${s.name}: own value ${ownP25} Pa (regression)`, () => {
      expect(Math.abs(p.pressurePa / ownP25 - 1)).toBeLessThan(1e-4);
    });
    const independent = s.antoine.find(
      (a) => 298.15 >= a.TminK && 298.15 <= a.TmaxK && a.source.ref !== p.source.ref,
    );
    if (independent) {
      const row = AT_25C[id];
      const tol = row ? toleranceAt25C(row) : 0;
      it(`${s.name}: within ${(100 * tol).toFixed(1)} % (${row ? (row.statedUncertainty ? 'stated uncertainty' : 'common practice, no uncertainty stated') : 'no row'}) of ${independent.source.ref} at 25 °C`, () => {
        expect(
          row,
          `${id}: add a row to AT_25C naming both sources and their stated uncertainty`,
        ).toBeDefined();
        expect(p.source.ref).toBe(row!.engine);
        expect(independent.source.ref).toBe(row!.comparison);
        const ref = Math.exp(antoineLnPressure(independent, 298.15).lnP);
        expect(Math.abs(p.pressurePa / ref - 1)).toBeLessThan(tol);
        // The deviation printed in the table is the one found (kept true for the reader).
        expect(100 * (p.pressurePa / ref - 1)).toBeCloseTo(row!.dev, 1);
      });
    }
  }
  it('the 25 °C table names exactly the solvents that have an independent set', () => {
    const withSet = OWN.map((r) => r[0]).filter((id) => {
      const s = solventById(id)!;
      const { sets, extra } = solventVapourPressureData(s);
      const used = vapourPressure(sets, 298.15, extra).source.ref;
      return s.antoine.some((a) => 298.15 >= a.TminK && 298.15 <= a.TmaxK && a.source.ref !== used);
    });
    expect(Object.keys(AT_25C).sort()).toEqual(withSet.sort());
  });
  it('every solvent without an independent set at 25 °C is named, with why (a new solvent must be classified)', () => {
    // The library holds one correlation for these (or none covering 25 °C besides the one used), so
    // no independent value at 25 °C can be computed from the library; their 25 °C values rest on the
    // one source named (Perry Table 2-8, VDI PPDS, NIST, Landolt, Poling) or are estimates that warn.
    // Checks elsewhere in this file: 1,4-dioxane (recalled 4.95 kPa), NMP and CPME (estimates).
    const NO_INDEPENDENT_SET_AT_25C: Record<string, string> = {
      '2-butanol': 'Landolt IV/20 set only',
      isobutanol: 'VDI PPDS Wagner only',
      '1-octanol': 'Perry Table 2-8 only',
      'isopropyl-acetate': 'NIST WebBook set only',
      'n-butyl-acetate': 'Perry Table 2-8 only',
      '2-methyltetrahydrofuran': 'Poling set only',
      cpme: 'estimated from Tb (Kistiakowsky), warns',
      '1-4-dioxane': 'Perry Table 2-8 only; checked against a recalled value below',
      dme: 'Landolt set from 30 °C only, extended below it, warns',
      anisole: 'Perry Table 2-8 only',
      'o-xylene': 'Perry Table 2-8 only',
      chlorobenzene: 'Perry Table 2-8 only',
      dmf: 'Perry Table 2-8 only',
      dmac: 'Landolt set from 30 °C only, extended below it, warns',
      nmp: 'estimated from Tb (Kistiakowsky), warns',
    };
    const unchecked = SOLVENTS.filter((s) => {
      const { sets, extra } = solventVapourPressureData(s);
      const used = vapourPressure(sets, 298.15, extra).source.ref;
      return !s.antoine.some(
        (a) => 298.15 >= a.TminK && 298.15 <= a.TmaxK && a.source.ref !== used,
      );
    }).map((s) => s.id);
    expect(unchecked.sort()).toEqual(Object.keys(NO_INDEPENDENT_SET_AT_25C).sort());
  });
  it('the anchored rows reach the CRC Tb and keep their value at 25 °C and at Tc', () => {
    for (const id of ['2-propanol', '1-octanol', 'dmf', 'dmso']) {
      const s = solventById(id)!;
      const c = s.vapourPressure!.value;
      if (c.kind !== 'dippr101' || !c.anchor) throw new Error(`${id}: not anchored`);
      expect(c.anchor.TbK).toBeCloseTo(s.boilingPointC.value + 273.15, 6);
      const bare = { ...c, anchor: undefined };
      for (const T of [298.15, c.TmaxK])
        expect(correlationLnPressure(c, T).lnP).toBeCloseTo(correlationLnPressure(bare, T).lnP, 10);
      expect(Math.exp(correlationLnPressure(c, c.anchor.TbK).lnP)).toBeCloseTo(101325, 3);
      // The slope agrees with a central difference (the anchor term is differentiated exactly).
      const T = 330;
      const h = 1e-4;
      const fd =
        (correlationLnPressure(c, T + h).lnP - correlationLnPressure(c, T - h).lnP) / (2 * h);
      expect(correlationLnPressure(c, T).dlnPdT).toBeCloseTo(fd, 7);
    }
  });

  it('water at 25 °C: 3.1699 kPa (IAPWS-95, Wagner & Pruß, J. Phys. Chem. Ref. Data 2002, 31, 387 — value recalled) within 0.5 %', () => {
    const { sets, extra } = solventVapourPressureData(solventById('water')!);
    expect(Math.abs(vapourPressure(sets, 298.15, extra).pressurePa / 3169.9 - 1)).toBeLessThan(
      0.005,
    );
  });
});

describe('continuity over the whole liquid range', () => {
  for (const s of SOLVENTS) {
    it(`${s.name}: no jump in ln P or its slope from 200 K to the critical point (1.4 Tb without a correlation)`, () => {
      const { sets, extra } = solventVapourPressureData(s);
      // Without a correlation the critical point is not known: scan to 1.4 Tb (Tc ≈ 1.5 Tb, Guldberg).
      const Tmax = extra.correlation ? extra.correlation.value.TmaxK - 0.5 : 1.4 * extra.TbK!;
      const h = 0.05;
      let prev = vapourPressureWithSlope(sets, 200, extra);
      for (let T = 200 + h; T < Tmax; T += h) {
        const cur = vapourPressureWithSlope(sets, T, extra);
        const step = Math.log(cur.pressurePa / prev.pressurePa);
        // The step in ln P over 0.05 K matches the slope (trapezoid) to 1e-3 of itself: no jump anywhere.
        expect(Math.abs(step - 0.5 * h * (cur.dlnPdT + prev.dlnPdT))).toBeLessThan(
          1e-3 * Math.abs(step) + 1e-7,
        );
        // The slope itself changes by less than 2 % over 0.05 K: no kink.
        expect(Math.abs(cur.dlnPdT / prev.dlnPdT - 1)).toBeLessThan(0.02);
        prev = cur;
      }
    });
  }
});

describe('outside the formerly fitted ranges', () => {
  const at = (id: string, T: number) => {
    const { sets, extra } = solventVapourPressureData(solventById(id)!);
    return vapourPressure(sets, T, extra);
  };
  it('DMF, 1,4-dioxane and DMSO use Perry Table 2-8 at 25 °C and at Tb (no extrapolation)', () => {
    for (const id of ['dmf', '1-4-dioxane', 'dmso']) {
      const tb = solventById(id)!.boilingPointC.value + 273.15;
      expect(at(id, 298.15).method).toBe('dippr101');
      expect(at(id, tb).method).toBe('dippr101');
      expect(at(id, 298.15).warnings).toEqual([]);
    }
  });
  it('1,4-dioxane at 25 °C: 4.95 kPa (37.1 mmHg, value recalled from the handbook tables) within 5 %', () => {
    expect(Math.abs(at('1-4-dioxane', 298.15).pressurePa / 4950 - 1)).toBeLessThan(0.05);
  });
  it('DMAc (Landolt set 303–363 K) reaches 1 atm at its CRC Tb through the anchored extension', () => {
    const tb = solventById('dmac')!.boilingPointC.value + 273.15;
    const p = at('dmac', tb);
    expect(p.method).toBe('antoine-anchored');
    expect(p.pressurePa).toBeCloseTo(101325, 3);
    expect(p.warnings[0]).toMatch(/joined smoothly to the normal boiling point/);
  });
  it('NMP and CPME have an estimated vapour pressure with a warning that says so', () => {
    for (const id of ['nmp', 'cpme']) {
      const p = at(id, 298.15);
      expect(p.method).toBe('clausius-clapeyron');
      expect(p.source.status).toBe('estimated');
      expect(p.warnings[0]).toMatch(/estimate/);
    }
    // NMP at 25 °C: published values are near 0.04–0.05 kPa (recalled); the estimate is within a factor of 2.
    const nmp = at('nmp', 298.15).pressurePa;
    expect(nmp).toBeGreaterThan(20);
    expect(nmp).toBeLessThan(100);
  });
  it('above the critical point the extension warns that there is no liquid', () => {
    expect(at('acetone', 520).warnings[0]).toMatch(/above the critical temperature/);
  });
});
