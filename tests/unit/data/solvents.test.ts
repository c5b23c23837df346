import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { countByStatus, sourcedValues } from '@shared/engine/data/provenance';
import { SOLVENTS } from '@shared/engine/data/solvents';
import { SOURCES } from '@shared/engine/data/sources';
import { UNIFAC_SUBGROUPS } from '@shared/engine/data/unifac';
import type { AntoineSet, Source, SolventRecord } from '@shared/engine/data/types';

const STATUSES: ReadonlyArray<Source['status']> = [
  'confirmed',
  'secondary',
  'unverified-memory',
  'estimated',
  'common-practice',
  'not-confirmed',
];

/** The fields whose values feed safety cautions and regulatory comparisons. */
const SAFETY_FIELDS = ['ich', 'flashPointC', 'peroxideFormer', 'lowConductivity'] as const;

/** Safety-relevant fields of a record whose value is recalled from memory (path list). */
function recalledSafetyFields(s: SolventRecord): string[] {
  return SAFETY_FIELDS.filter((f) => s[f].source.status === 'unverified-memory').map(
    (f) => `${s.id}.${f}`,
  );
}

/** CAS Registry Number check digit (CAS, "CAS Registry Number and Check Digit"):
 * the digits before the check digit, read right to left, are weighted 1, 2, 3, …;
 * the weighted sum modulo 10 is the check digit. */
function casCheckDigitValid(cas: string): boolean {
  const m = /^(\d{2,7})-(\d{2})-(\d)$/.exec(cas);
  if (!m) return false;
  const digits = (m[1] + m[2]).split('').reverse();
  const sum = digits.reduce((acc, d, i) => acc + (i + 1) * Number(d), 0);
  return sum % 10 === Number(m[3]);
}

/** Vapour pressure in bar from the two published Antoine forms (see AntoineSet in types.ts). */
function antoineBar(set: AntoineSet, T_K: number): number {
  const x = set.form === 'log10-bar-degC' ? T_K - 273.15 + set.C : T_K + set.C;
  return 10 ** (set.A - set.B / x);
}

/** Temperature (K) at which the set gives 1.01325 bar, by bisection on 150–800 K. */
function antoineBoilingPointK(set: AntoineSet): number {
  let lo = 150;
  let hi = 800;
  for (let i = 0; i < 100; i++) {
    const mid = (lo + hi) / 2;
    if (antoineBar(set, mid) > 1.01325) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}

/** Every Source object inside a record, with the path that leads to it. */
function sourcesIn(
  value: unknown,
  path: string,
  out: Array<{ path: string; source: unknown }>,
): void {
  if (Array.isArray(value)) {
    value.forEach((v, i) => sourcesIn(v, `${path}[${i}]`, out));
    return;
  }
  if (value === null || typeof value !== 'object') return;
  const obj = value as Record<string, unknown>;
  if ('source' in obj) out.push({ path: `${path}.source`, source: obj.source });
  for (const [k, v] of Object.entries(obj)) if (k !== 'source') sourcesIn(v, `${path}.${k}`, out);
}

const REQUIRED_IDS = [
  'water',
  'methanol',
  'ethanol',
  '1-propanol',
  '2-propanol',
  '1-butanol',
  '2-butanol',
  'tert-butanol',
  'ethyl-acetate',
  'isopropyl-acetate',
  'n-butyl-acetate',
  'acetone',
  '2-butanone',
  'mibk',
  'thf',
  '2-methyltetrahydrofuran',
  'mtbe',
  'cpme',
  'diethyl-ether',
  '1-4-dioxane',
  'dme',
  'anisole',
  'n-heptane',
  'n-hexane',
  'cyclohexane',
  'methylcyclohexane',
  'toluene',
  'o-xylene',
  'dichloromethane',
  'chloroform',
  'chlorobenzene',
  'acetonitrile',
  'dmf',
  'dmac',
  'nmp',
  'dmso',
  'acetic-acid',
  '1-octanol',
  'pyridine',
];

describe('solvent library fingerprint', () => {
  it('holds 41 records with unique slug ids, CAS numbers and SMILES', () => {
    expect(SOLVENTS).toHaveLength(41);
    const ids = SOLVENTS.map((s) => s.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ids) expect(id).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
    expect(new Set(SOLVENTS.map((s) => s.cas)).size).toBe(SOLVENTS.length);
    expect(new Set(SOLVENTS.map((s) => s.smiles)).size).toBe(SOLVENTS.length);
  });

  it('contains every solvent the issue asks for', () => {
    const ids = new Set(SOLVENTS.map((s) => s.id));
    for (const id of REQUIRED_IDS) expect(ids.has(id), id).toBe(true);
  });

  it('check-digit validator rejects a wrong digit and a malformed number', () => {
    expect(casCheckDigitValid('7732-18-5')).toBe(true);
    expect(casCheckDigitValid('7732-18-4')).toBe(false);
    expect(casCheckDigitValid('773218-5')).toBe(false);
  });

  it.each(SOLVENTS.map((s) => [s.id, s.cas] as const))('%s has a valid CAS RN (%s)', (_id, cas) => {
    expect(casCheckDigitValid(cas)).toBe(true);
  });
});

describe('provenance', () => {
  const all = SOLVENTS.flatMap((s) => {
    const out: Array<{ path: string; source: unknown }> = [];
    sourcesIn(s, s.id, out);
    return out;
  });

  it('finds the sources of every sourced field', () => {
    // 12 sourced fields on every record (the guide category is read from the guide's table,
    // not held in the record), the optional ones present, and one per Antoine set.
    const expected = SOLVENTS.reduce(
      (n, s) =>
        n +
        12 +
        s.antoine.length +
        (s.vapourPressure ? 1 : 0) +
        (s.enthalpyVapKJmol ? 1 : 0) +
        (s.waterMutualSolubility ? 1 : 0) +
        (s.waterMutualSolubilityCurve ? 1 : 0) +
        (s.dielectricConstant ? 1 : 0) +
        (s.pKa ? 1 : 0),
      0,
    );
    expect(all.length).toBe(expected);
  });

  it('gives every value a bibliography id and a status', () => {
    for (const { path, source } of all) {
      const s = source as Source;
      expect(typeof s.ref, path).toBe('string');
      expect(s.ref.length, path).toBeGreaterThan(0);
      expect(Object.keys(SOURCES), `${path}: ${s.ref}`).toContain(s.ref);
      expect(STATUSES, path).toContain(s.status);
      if (s.note !== undefined) expect(s.note.length, path).toBeGreaterThan(0);
    }
  });

  it('marks every value that points to a recalled-value entry as unverified-memory', () => {
    for (const { path, source } of all) {
      const s = source as Source;
      if (s.ref.endsWith('-memory')) expect(s.status, path).toBe('unverified-memory');
    }
  });

  it('holds no safety-relevant value recalled from memory (ICH Q3C, flash point, peroxide former, static accumulator)', () => {
    expect(SOLVENTS.flatMap(recalledSafetyFields)).toEqual([]);
  });

  it('the recalled-value check fires on a record with a recalled flash point', () => {
    const toluene = SOLVENTS.find((s) => s.id === 'toluene')!;
    const recalled: SolventRecord = {
      ...toluene,
      flashPointC: { value: 4, source: { ref: 'flash-point-memory', status: 'unverified-memory' } },
    };
    expect(recalledSafetyFields(recalled)).toEqual(['toluene.flashPointC']);
  });

  it('holds no number where a safety value is not confirmed', () => {
    for (const s of SOLVENTS) {
      if (s.flashPointC.source.status === 'not-confirmed')
        expect(s.flashPointC.value, s.id).toBeNull();
      if (s.ich.source.status === 'not-confirmed') {
        expect(s.ich.value.class, s.id).toBeNull();
        expect(s.ich.value.limitPpm, s.id).toBeNull();
      }
    }
  });

  it('cites no vendor, retail or homework page', () => {
    const pages = Object.values(SOURCES)
      .map((e) => ('url' in e ? String(e.url) : ''))
      .filter(Boolean);
    for (const url of pages)
      expect(url).not.toMatch(/caslab|vacuu-lan|sparxoversea|biologyinsights|druglead|justaaa/);
  });
});

describe('physical properties are in plausible ranges', () => {
  it.each(SOLVENTS.map((s) => [s.id, s] as const))('%s', (_id, s: SolventRecord) => {
    expect(s.density.value.gPerMl).toBeGreaterThan(0.6);
    expect(s.density.value.gPerMl).toBeLessThan(1.6);
    expect([20, 25]).toContain(s.density.value.temperatureC);
    expect(s.meltingPointC.value).toBeLessThan(s.boilingPointC.value);
    expect(s.boilingPointC.value).toBeGreaterThan(30);
    expect(s.boilingPointC.value).toBeLessThan(210);
    if (s.flashPointC.value !== null)
      expect(s.flashPointC.value).toBeLessThan(s.boilingPointC.value);
    expect(s.molarMassGmol.value).toBeGreaterThan(18);
    expect(s.molarMassGmol.value).toBeLessThan(160);
    expect(s.molarVolumeCm3mol!.value).toBeCloseTo(
      s.molarMassGmol.value / s.density.value.gPerMl,
      0,
    );
    expect(s.hansen.value.d).toBeGreaterThanOrEqual(12);
    expect(s.hansen.value.d).toBeLessThanOrEqual(22);
    expect(s.hansen.value.p).toBeGreaterThanOrEqual(0);
    expect(s.hansen.value.h).toBeGreaterThanOrEqual(0);
    expect(s.viscosityMPas25C.value).toBeGreaterThan(0.1);
    expect(s.viscosityMPas25C.value).toBeLessThan(20);
    if (s.enthalpyVapKJmol) {
      expect(s.enthalpyVapKJmol.value).toBeGreaterThan(20);
      expect(s.enthalpyVapKJmol.value).toBeLessThan(60);
    }
  });

  it('stores the density of water at 20 °C as 0.9982 g/mL', () => {
    const water = SOLVENTS.find((s) => s.id === 'water')!;
    expect(water.density.value.gPerMl).toBeCloseTo(0.9982, 4);
  });
});

describe('Antoine sets', () => {
  const sets = SOLVENTS.flatMap((s) => s.antoine.map((a, i) => ({ s, a, i })));

  it('have Tmin < Tmax, a known form and positive B', () => {
    expect(sets.length).toBeGreaterThanOrEqual(50);
    for (const { s, a, i } of sets) {
      const where = `${s.id}[${i}]`;
      expect(a.TminK, where).toBeLessThan(a.TmaxK);
      expect(a.TminK, where).toBeGreaterThan(100);
      expect(['log10-bar-degC', 'log10-bar-K'], where).toContain(a.form);
      expect(a.B, where).toBeGreaterThan(0);
      expect(['confirmed', 'secondary'], where).toContain(a.source.status);
    }
  });

  it('reproduce the tabulated normal boiling point within 1.5 K where Tb is within 10 K of the range', () => {
    let checked = 0;
    for (const { s, a, i } of sets) {
      const tbK = s.boilingPointC.value + 273.15;
      if (tbK < a.TminK - 10 || tbK > a.TmaxK + 10) continue;
      checked++;
      expect(Math.abs(antoineBoilingPointK(a) - tbK), `${s.id}[${i}]`).toBeLessThanOrEqual(1.5);
    }
    expect(checked).toBeGreaterThanOrEqual(40);
  });

  it('the Tb check would catch a set whose C is given in the wrong form', () => {
    const water = SOLVENTS.find((s) => s.id === 'water')!.antoine[0];
    const wrongForm: AntoineSet = { ...water, form: 'log10-bar-K' };
    expect(Math.abs(antoineBoilingPointK(wrongForm) - 373.12)).toBeGreaterThan(1.5);
  });

  it('leaves only CPME and NMP without an Antoine set', () => {
    expect(
      SOLVENTS.filter((s) => s.antoine.length === 0)
        .map((s) => s.id)
        .sort(),
    ).toEqual(['cpme', 'nmp']);
  });
});

describe('ICH Q3C class and limit are consistent', () => {
  it.each(SOLVENTS.map((s) => [s.id, s] as const))('%s', (_id, s: SolventRecord) => {
    const { class: cls, limitPpm, pdeMgDay } = s.ich.value;
    if (cls === null) {
      expect(limitPpm).toBeNull();
      return;
    }
    expect(limitPpm).not.toBeNull();
    if (cls === 3) expect(limitPpm).toBe(5000);
    if (cls === 2) expect(limitPpm!).toBeLessThan(5000);
    // Option 1: concentration (ppm) = 1000 × PDE (mg/day) / 10 g/day.
    if (pdeMgDay !== undefined && pdeMgDay !== null)
      expect(pdeMgDay).toBeCloseTo((limitPpm! * 10) / 1000, 6);
  });

  it('has no Class 1 solvent in the library', () => {
    expect(SOLVENTS.filter((s) => s.ich.value.class === 1)).toHaveLength(0);
  });
});

describe('UNIFAC groups', () => {
  it.each(SOLVENTS.map((s) => [s.id, s] as const))(
    '%s uses known subgroups with positive integer counts',
    (_id, s) => {
      const groups = Object.entries(s.unifac.value);
      expect(groups.length).toBeGreaterThan(0);
      for (const [k, n] of groups) {
        expect(UNIFAC_SUBGROUPS.has(Number(k)), `subgroup ${k}`).toBe(true);
        expect(Number.isInteger(n) && n > 0).toBe(true);
      }
    },
  );

  it('assigns the examples given in the issue', () => {
    const g = (id: string) => SOLVENTS.find((s) => s.id === id)!.unifac.value;
    expect(g('water')).toEqual({ 16: 1 });
    expect(g('methanol')).toEqual({ 15: 1 });
    expect(g('ethanol')).toEqual({ 1: 1, 2: 1, 14: 1 });
    expect(g('ethyl-acetate')).toEqual({ 1: 1, 2: 1, 21: 1 });
    expect(g('thf')).toEqual({ 2: 3, 27: 1 });
    expect(g('toluene')).toEqual({ 9: 5, 11: 1 });
    expect(g('dmf')).toEqual({ 72: 1 });
    expect(g('dmso')).toEqual({ 67: 1 });
    expect(g('chloroform')).toEqual({ 50: 1 });
    expect(g('acetonitrile')).toEqual({ 40: 1 });
    expect(g('pyridine')).toEqual({ 37: 1 });
    expect(g('chlorobenzene')).toEqual({ 9: 5, 53: 1 });
  });

  it('gives n-alkanes and 1-alkanols carbon counts that match their formulas', () => {
    const carbons: Record<number, number> = { 1: 1, 2: 1, 3: 1, 4: 1 };
    const count = (id: string) =>
      Object.entries(SOLVENTS.find((s) => s.id === id)!.unifac.value).reduce(
        (acc, [k, n]) => acc + (carbons[Number(k)] ?? 0) * n,
        0,
      );
    expect(count('n-hexane')).toBe(6);
    expect(count('n-heptane')).toBe(7);
    expect(count('1-butanol')).toBe(4);
    expect(count('1-octanol')).toBe(8);
    expect(count('tert-butanol')).toBe(4);
  });
});

describe('water miscibility', () => {
  it.each(SOLVENTS.map((s) => [s.id, s] as const))(
    '%s carries mutual solubility exactly when partly miscible',
    (_id, s) => {
      if (s.waterMiscibility === 'partial') {
        const m = s.waterMutualSolubility!.value;
        expect(m.solventInWaterWtPct).toBeGreaterThan(0);
        expect(m.solventInWaterWtPct).toBeLessThan(50);
        expect(m.waterInSolventWtPct).toBeGreaterThan(0);
        expect(m.waterInSolventWtPct).toBeLessThan(50);
        expect(m.temperatureC).toBeGreaterThanOrEqual(15);
        expect(m.temperatureC).toBeLessThanOrEqual(30);
      } else {
        expect(s.waterMutualSolubility).toBeUndefined();
      }
    },
  );
});

describe('safety flags', () => {
  it('flags the classic ethers as peroxide formers and the hydrocarbons as low-conductivity', () => {
    const f = (id: string) => SOLVENTS.find((s) => s.id === id)!;
    for (const id of [
      'thf',
      '2-methyltetrahydrofuran',
      'diethyl-ether',
      '1-4-dioxane',
      'dme',
      'diisopropyl-ether',
    ]) {
      expect(f(id).peroxideFormer.value, id).toBe(true);
    }
    for (const id of [
      'n-heptane',
      'n-hexane',
      'cyclohexane',
      'methylcyclohexane',
      'toluene',
      'o-xylene',
    ]) {
      expect(f(id).lowConductivity.value, id).toBe(true);
      expect(f(id).peroxideFormer.value, id).toBe(false);
    }
    for (const id of ['water', 'methanol', 'acetonitrile', 'dmso'])
      expect(f(id).lowConductivity.value, id).toBe(false);
  });

  it('records no flash point for water, dichloromethane and chloroform only', () => {
    expect(
      SOLVENTS.filter(
        (s) => s.flashPointC.value === null && s.flashPointC.source.status !== 'not-confirmed',
      )
        .map((s) => s.id)
        .sort(),
    ).toEqual(['chloroform', 'dichloromethane', 'water']);
  });

  it('says which flash points no standard table confirms (IEC 60079-20-1, NFPA 497)', () => {
    expect(
      SOLVENTS.filter((s) => s.flashPointC.source.status === 'not-confirmed')
        .map((s) => s.id)
        .sort(),
    ).toEqual(['2-methyltetrahydrofuran', 'anisole', 'cpme', 'dmac', 'nmp']);
  });
});

describe('docs/data-sources.md', () => {
  it('states the current counts of values by status (regenerate with tests/support/data-sources-report.ts)', () => {
    const doc = readFileSync(join(process.cwd(), 'docs/data-sources.md'), 'utf8').replace(
      /\s+/g,
      ' ',
    );
    const values = sourcedValues('solvents');
    const c = countByStatus(values);
    expect(doc).toContain(`Counts (41 solvents, ${values.length} sourced values)`);
    expect(doc).toContain(`${c['unverified-memory']} unverified-memory`);
    expect(doc).toContain(`${c['not-confirmed']} not-confirmed`);
    expect(doc).toContain(`${c.secondary} secondary`);
    const aqueous = sourcedValues('aqueous');
    const a = countByStatus(aqueous);
    expect(doc).toContain(
      `Aqueous media (8 solutes, ${aqueous.length} sourced values): ${a.secondary} secondary, ${a['unverified-memory']} unverified-memory`,
    );
  });
});
