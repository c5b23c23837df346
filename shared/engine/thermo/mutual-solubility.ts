/**
 * Mutually saturated water and solvent phases at any temperature, from the
 * activity model regressed to the library's tabulated mutual solubilities
 * (UNIFAC + NRTL, thermo/nrtl.ts), for washes, decanters and drying.
 */
import type { SolventRecord } from '../data/types';
import { EngineError } from '../errors';
import { solventVapourPressureData } from './antoine';
import type { MutualSolubilityCurvePoint, MutualSolubilityPoint } from './nrtl';
import { createVleSystem, liquidLiquidSplit, type VleComponent, type VleSystem } from './vle';

/**
 * The tabulated mutual solubility of a solvent with water as mole fractions.
 *
 * Formula: x = (w/M) / Σ(w/M) for each phase, from the wt % of the record.
 *
 * @param solvent  solvent record with waterMutualSolubility (wt %, °C)
 * @param water    the water record (molar mass [g/mol])
 * @returns mole fractions [–] and temperature [K], or undefined when not tabulated
 *
 * Source: the record's waterMutualSolubility source. Validity: as tabulated.
 */
export function mutualSolubilityPoint(
  solvent: SolventRecord,
  water: SolventRecord,
): MutualSolubilityPoint | undefined {
  const ms = solvent.waterMutualSolubility?.value;
  if (!ms) return undefined;
  const Mw = water.molarMassGmol.value;
  const Ms = solvent.molarMassGmol.value;
  const molFrac = (wSolute: number, Msolute: number, Mrest: number) =>
    wSolute / Msolute / (wSolute / Msolute + (100 - wSolute) / Mrest);
  return {
    xSolventInWater: molFrac(ms.solventInWaterWtPct, Ms, Mw),
    xWaterInSolvent: molFrac(ms.waterInSolventWtPct, Mw, Ms),
    T_K: ms.temperatureC + 273.15,
  };
}

/**
 * The record's further measured mutual solubilities with water (other
 * temperatures) as mole fractions.
 *
 * Formula: x = (w/M) / Σ(w/M) for each phase given, from the wt % of the record.
 *
 * @param solvent  solvent record with waterMutualSolubilityCurve (wt %, °C)
 * @param water    the water record (molar mass [g/mol])
 * @returns the points (mole fractions [–], T [K]); empty when none are tabulated
 *
 * Source: the record's waterMutualSolubilityCurve source. Validity: as tabulated.
 */
export function mutualSolubilityCurve(
  solvent: SolventRecord,
  water: SolventRecord,
): MutualSolubilityCurvePoint[] {
  const points = solvent.waterMutualSolubilityCurve?.value ?? [];
  const Mw = water.molarMassGmol.value;
  const Ms = solvent.molarMassGmol.value;
  const molFrac = (wSolute: number, Msolute: number, Mrest: number) =>
    wSolute / Msolute / (wSolute / Msolute + (100 - wSolute) / Mrest);
  return points.map((p) => ({
    T_K: p.temperatureC + 273.15,
    xSolventInWater:
      p.solventInWaterWtPct === undefined ? undefined : molFrac(p.solventInWaterWtPct, Ms, Mw),
    xWaterInSolvent:
      p.waterInSolventWtPct === undefined ? undefined : molFrac(p.waterInSolventWtPct, Mw, Ms),
  }));
}

/**
 * The VLE component of a library solvent, with the data the regressed
 * liquid–liquid model needs (water flag, mutual solubility with water).
 *
 * @param s      solvent record
 * @param water  the water record, for converting the mutual solubility to mole fractions
 * @returns the VleComponent (vapour-pressure data, UNIFAC groups, Tb [K], ΔHvap [J/mol])
 *
 * Source and validity: those of the record's values.
 */
export function vleComponentOf(s: SolventRecord, water?: SolventRecord): VleComponent {
  const vp = solventVapourPressureData(s);
  return {
    name: s.name,
    antoine: s.antoine,
    vapourPressure: s.vapourPressure,
    unifac: s.unifac.value,
    TbK: vp.extra.TbK,
    dHvapJmol: vp.extra.dHvapJmol,
    isWater: s.id === 'water',
    mutualSolubilityWithWater:
      water && s.id !== 'water' ? mutualSolubilityPoint(s, water) : undefined,
    mutualSolubilityCurveWithWater:
      water && s.id !== 'water' ? mutualSolubilityCurve(s, water) : undefined,
  };
}

/** The two mutually saturated liquid phases of water and one solvent. */
export type SaturatedPhases =
  | {
      split: true;
      /** Water-rich phase: mole fractions [water, solvent] [–] and wt % of the solvent [%]. */
      aqueous: { x: [number, number]; solventWtPct: number };
      /** Solvent-rich phase: mole fractions [water, solvent] [–] and wt % of water [%]. */
      organic: { x: [number, number]; waterWtPct: number };
      /** 'regressed' when the pair has tabulated data; 'unifac' otherwise. */
      basis: 'regressed' | 'unifac';
      warnings: string[];
    }
  | { split: false; basis: 'regressed' | 'unifac'; warnings: string[] };

/**
 * Compositions of the mutually saturated water-rich and solvent-rich phases
 * of water and one solvent at T.
 *
 * Source: UNIFAC + regressed pair term (thermo/nrtl.ts: Renon & Prausnitz
 * 1968; Margules 1895); the record's tabulated mutual solubility.
 *
 * Method: the binary activity model of createVleSystem (UNIFAC + NRTL
 * regressed to the tabulated mutual solubility, or UNIFAC alone when nothing
 * is tabulated), then the liquid–liquid flash (liquidLiquidSplit) of a feed
 * inside the miscibility gap.
 *
 * @param solvent  solvent record
 * @param water    the water record
 * @param T_K      temperature [K]
 * @returns the two phases (mole fractions [–] and wt % [%]) or split: false when miscible at T
 *
 * Validity: reproduces the tabulated phases at the tabulated temperature;
 * elsewhere the temperature dependence of UNIFAC with constant NRTL
 * interaction energies (a few tens of kelvin), or, for a pair tabulated at
 * several temperatures, the fitted τ(T) within the range of the data
 * (outside it by more than 5 K the result carries a warning).
 */
export function mutuallySaturatedPhases(
  solvent: SolventRecord,
  water: SolventRecord,
  T_K: number,
): SaturatedPhases {
  if (solvent.id === 'water')
    throw new EngineError('invalid-input', 'Mutual solubility needs a solvent other than water.');
  const sys: VleSystem = createVleSystem([
    vleComponentOf(water, water),
    vleComponentOf(solvent, water),
  ]);
  const basis = sys.regressedPairs.length > 0 ? 'regressed' : 'unifac';
  const point = mutualSolubilityPoint(solvent, water);
  // A feed inside the gap: midway between the tabulated phases, or 50/50 without data.
  const zS = point ? 0.5 * (point.xSolventInWater + 1 - point.xWaterInSolvent) : 0.5;
  const r = liquidLiquidSplit(sys, [1 - zS, zS], T_K);
  const warnings = [...sys.warnings, ...r.warnings];
  if (!r.split) return { split: false, basis, warnings };
  // phases[0] is the richer in water (component 0).
  const [aq, org] = r.phases;
  const Mw = water.molarMassGmol.value;
  const Ms = solvent.molarMassGmol.value;
  const wt = (xA: number, MA: number, xB: number, MB: number) =>
    (100 * xA * MA) / (xA * MA + xB * MB);
  return {
    split: true,
    aqueous: { x: [aq[0], aq[1]], solventWtPct: wt(aq[1], Ms, aq[0], Mw) },
    organic: { x: [org[0], org[1]], waterWtPct: wt(org[0], Mw, org[1], Ms) },
    basis,
    warnings,
  };
}
