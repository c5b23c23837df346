/**
 * What the advisor shows beside each substitute, from the solvent library:
 * ICH Q3C class and limit, the solvent-guide category read from the guide's
 * table, boiling and flash points, water miscibility, whether it boils with
 * water as two liquids (a heteroazeotrope), and the cautions.
 */
import { solventById } from '../data';
import { guideCategoryOf } from '../data/solvent-guide';
import type { GuideCategory, SolventRecord } from '../data/types';
import { heterogeneousBubblePoint, createVleSystem } from '../thermo/vle';
import { mutualSolubilityPoint, vleComponentOf } from '../thermo/mutual-solubility';

/** Every suggestion carries this caution first. */
export const MODEL_RESULT_CAUTION =
  "A model result: confirm it at the bench and through the site's process-safety review before any change to the route.";

export interface HeteroazeotropeWithWater {
  /** True when the solvent and water boil as two liquid phases at 1 atm. */
  forms: boolean;
  /** Boiling point of the two-liquid mixture at 1 atm [°C], when it forms. */
  temperatureC: number | null;
}

export interface SolventFacts {
  name: string;
  ich: { class: 1 | 2 | 3 | null; limitPpm: number | null };
  guideCategory: GuideCategory | null;
  boilingPointC: number;
  flashPointC: number | null;
  waterMiscibility: 'miscible' | 'partial';
  heteroazeotropeWithWater: HeteroazeotropeWithWater | null;
  cautions: string[];
}

const ATMOSPHERE_PA = 101_325;

/**
 * Whether a solvent forms a heteroazeotrope with water at 1 atm: the
 * heterogeneous bubble point (thermo/vle.ts heterogeneousBubblePoint, UNIFAC
 * with the pair regressed to the library's mutual solubility) of a feed in
 * the middle of the miscibility gap, z_S = ½(x_S,aq + 1 − x_W,org), boils
 * with two liquids present; then its temperature is the heteroazeotrope's.
 * Miscible solvents: forms false. Null when the model cannot say.
 * Source: heterogeneous bubble point (Michelsen, Fluid Phase Equilib. 1982,
 * 9, 1 for the split; modified Raoult with the library's Antoine constants);
 * mutual solubilities from the solvent library (docs/data-sources.md).
 * Validity: 1 atm (101.325 kPa); as thermo/vle.ts and the regressed liquid
 * model (the reference checks in tests/reference/thermo/heteroazeotropes.test.ts
 * state the accuracy against handbook tables).
 * @param solvent  the library solvent
 * @param water    the library's water record
 * @returns forms and the boiling point [°C], or null
 */
export function heteroazeotropeWithWater(
  solvent: SolventRecord,
  water: SolventRecord,
): HeteroazeotropeWithWater | null {
  if (solvent.id === 'water') return null;
  if (solvent.waterMiscibility === 'miscible') return { forms: false, temperatureC: null };
  try {
    const sys = createVleSystem([vleComponentOf(water, water), vleComponentOf(solvent, water)]);
    const point = mutualSolubilityPoint(solvent, water);
    const zS = point ? 0.5 * (point.xSolventInWater + 1 - point.xWaterInSolvent) : 0.5;
    const r = heterogeneousBubblePoint(sys, [1 - zS, zS], ATMOSPHERE_PA);
    return r.liquidPhases === 2
      ? { forms: true, temperatureC: r.T_K - 273.15 }
      : { forms: false, temperatureC: null };
  } catch {
    return null;
  }
}

/**
 * The cautions of a library solvent, from its hazard and ICH Q3C records:
 * flash point, peroxide former, static accumulator, ICH Q3C class 1, class 2
 * with its limit, Table 4.
 * Source: the solvent library's flash point, peroxide-former and
 * low-conductivity flags and ICH Q3C class and limit, each with its source in
 * docs/data-sources.md; the handling advice is common practice (defer to the
 * site's process-safety review).
 * Validity: any library solvent.
 * @param s  the library solvent
 * @returns the cautions in the chemist's words
 */
export function solventCautions(s: SolventRecord): string[] {
  const out: string[] = [];
  const fp = s.flashPointC;
  if (fp.value !== null)
    out.push(
      `Flammable: flash point ${fp.value.toFixed(0)} °C (closed cup). Keep ignition sources away and inert the vessel as the site's review requires.`,
    );
  else if (fp.source.status === 'not-confirmed')
    out.push('No flash point could be confirmed: treat it as flammable at any temperature.');
  if (s.peroxideFormer.value)
    out.push(
      'Peroxide former: test for peroxides before distilling or concentrating, never distil to dryness, and use stabilised solvent (common practice).',
    );
  if (s.lowConductivity.value)
    out.push(
      'Static accumulator (low conductivity): earth and bond the equipment, inert the vessel and limit transfer velocities (common practice).',
    );
  const ich = s.ich.value;
  if (ich.class === 1)
    out.push('ICH Q3C class 1: to be avoided in the manufacture of drug substances.');
  else if (ich.class === 2 && ich.limitPpm !== null)
    out.push(`ICH Q3C class 2: residue limited to ${ich.limitPpm} ppm in the product.`);
  else if (ich.table === 'Table 4')
    out.push('ICH Q3C Table 4: no adequate toxicological data, no limit given.');
  return out;
}

/**
 * The facts shown beside a substitute: ICH Q3C class and limit [ppm], guide
 * category, boiling and flash points [°C], water miscibility, heteroazeotrope
 * with water and the cautions (the model-result caution first).
 * Source: the solvent library (docs/data-sources.md); the solvent guide's
 * table (data/solvent-guide.ts); heteroazeotropeWithWater.
 * Validity: any library solvent id (throws for an id not in the library).
 * @param solventId  library id of the solvent
 * @returns the facts
 */
export function solventFacts(solventId: string): SolventFacts {
  const s = solventById(solventId);
  const water = solventById('water');
  if (!s || !water) throw new Error(`Solvent "${solventId}" is not in the library.`);
  return {
    name: s.name,
    ich: { class: s.ich.value.class, limitPpm: s.ich.value.limitPpm },
    guideCategory: guideCategoryOf(s.id),
    boilingPointC: s.boilingPointC.value,
    flashPointC: s.flashPointC.value,
    waterMiscibility: s.waterMiscibility,
    heteroazeotropeWithWater: heteroazeotropeWithWater(s, water),
    cautions: [MODEL_RESULT_CAUTION, ...solventCautions(s)],
  };
}
