import { describe, expect, it } from 'vitest';
import { AQUEOUS_SOLUTES } from '@shared/engine/data/aqueous';
import { SOURCES } from '@shared/engine/data/sources';
import type { AqueousSoluteRecord, Source } from '@shared/engine/data/types';

function casCheckDigitValid(cas: string): boolean {
  const m = /^(\d{2,7})-(\d{2})-(\d)$/.exec(cas);
  if (!m) return false;
  const sum = (m[1] + m[2])
    .split('')
    .reverse()
    .reduce((acc, d, i) => acc + (i + 1) * Number(d), 0);
  return sum % 10 === Number(m[3]);
}

function sourcesOf(a: AqueousSoluteRecord): Source[] {
  const out = [a.molarMassGmol.source, a.densityPoints.source];
  if (a.setschenowKs) out.push(a.setschenowKs.source);
  if ('pKa' in a.acidBase) out.push(a.acidBase.pKa.source);
  return out;
}

describe('aqueous media', () => {
  it('holds the washes the issue asks for, with unique ids', () => {
    const ids = AQUEOUS_SOLUTES.map((a) => a.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ['nacl', 'nahco3', 'na2co3', 'naoh', 'hcl', 'citric-acid', 'nh4cl'])
      expect(ids).toContain(id);
  });

  it.each(AQUEOUS_SOLUTES.map((a) => [a.id, a] as const))(
    '%s: CAS, sources and molar mass',
    (_id, a) => {
      expect(casCheckDigitValid(a.cas)).toBe(true);
      for (const s of sourcesOf(a)) {
        expect(Object.keys(SOURCES)).toContain(s.ref);
        expect([
          'confirmed',
          'secondary',
          'unverified-memory',
          'estimated',
          'common-practice',
        ]).toContain(s.status);
      }
      expect(a.molarMassGmol.value).toBeGreaterThan(30);
      expect(a.molarMassGmol.value).toBeLessThan(200);
    },
  );

  it.each(AQUEOUS_SOLUTES.map((a) => [a.id, a] as const))(
    '%s: density rises with wt %% from pure water',
    (_id, a) => {
      const pts = a.densityPoints.value;
      expect(pts[0]).toEqual([0, 0.9982]);
      for (let i = 1; i < pts.length; i++) {
        expect(pts[i][0]).toBeGreaterThan(pts[i - 1][0]);
        expect(pts[i][1]).toBeGreaterThan(pts[i - 1][1]);
      }
      expect(pts[pts.length - 1][1]).toBeLessThan(1.6);
      // The table reaches (close to) the usual maximum concentration.
      expect(a.maxWtPct).toBeGreaterThanOrEqual(pts[pts.length - 1][0]);
      expect(a.maxWtPct - pts[pts.length - 1][0]).toBeLessThanOrEqual(10);
    },
  );

  it('lists pKa values in ascending order and the carbonate pair at 6.35 / 10.33', () => {
    for (const a of AQUEOUS_SOLUTES) {
      if (!('pKa' in a.acidBase)) continue;
      const pk = a.acidBase.pKa.value;
      for (let i = 1; i < pk.length; i++) expect(pk[i]).toBeGreaterThan(pk[i - 1]);
    }
    const bicarb = AQUEOUS_SOLUTES.find((a) => a.id === 'nahco3')!.acidBase;
    expect(bicarb.kind).toBe('amphoteric-salt');
    expect('pKa' in bicarb && bicarb.pKa.value).toEqual([6.35, 10.33]);
  });

  it('models NaOH and HCl as strong, brine as neutral', () => {
    const k = (id: string) => AQUEOUS_SOLUTES.find((a) => a.id === id)!.acidBase;
    expect(k('naoh')).toEqual({ kind: 'strong-base', hydroxides: 1 });
    expect(k('hcl')).toEqual({ kind: 'strong-acid', protons: 1 });
    expect(k('nacl')).toEqual({ kind: 'neutral' });
  });
});
