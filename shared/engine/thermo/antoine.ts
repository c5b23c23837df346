/**
 * Vapour pressure of pure liquids: the Antoine equation inside its fitted
 * range, Clausius–Clapeyron outside it (with a warning).
 *
 * Sources: Antoine, C. R. Acad. Sci. 1888, 107, 681; constants as published in
 * Poling, Prausnitz & O'Connell, The Properties of Gases and Liquids, 5th ed.
 * (McGraw-Hill 2001), Appendix A, and the NIST Chemistry WebBook
 * (doi:10.18434/T4D303). Clausius–Clapeyron: any physical-chemistry text,
 * e.g. Atkins' Physical Chemistry, §"the Clausius–Clapeyron equation".
 */
import { EngineError } from '../errors';
import type { AntoineSet, Source } from '../data/types';
import { PA_PER_BAR, R_J_PER_MOL_K, STANDARD_ATMOSPHERE_PA, T0_K } from '../units';

const LN10 = Math.LN10;

/** Result of a vapour-pressure evaluation. */
export interface VapourPressureResult {
  /** Saturation pressure [Pa]. */
  pressurePa: number;
  method: 'antoine' | 'clausius-clapeyron';
  /** Source of the constants used (for an extrapolation: the set or data it started from). */
  source: Source;
  warnings: string[];
}

/** Vapour pressure and its temperature derivative, for solvers. */
export interface VapourPressureWithSlope extends VapourPressureResult {
  /** d ln P^sat / dT [1/K]. */
  dlnPdT: number;
}

/** Temperature on the equation's own scale (°C or K) for a set. */
function equationTemperature(set: AntoineSet, T_K: number): number {
  return set.form === 'log10-bar-degC' ? T_K - T0_K : T_K;
}

/**
 * Antoine equation for one set, with no range check.
 *
 *   log10(P/bar) = A − B / (θ + C),   θ = t/°C  ('log10-bar-degC')  or  T/K  ('log10-bar-K')
 *
 * @param set  Antoine constants (A [–], B [°C or K], C [°C or K]) and form
 * @param T_K  temperature [K]
 * @returns    ln(P/Pa) [–] and d ln P/dT [1/K]
 */
export function antoineLnPressure(set: AntoineSet, T_K: number): { lnP: number; dlnPdT: number } {
  const denom = equationTemperature(set, T_K) + set.C;
  const log10Bar = set.A - set.B / denom;
  return {
    lnP: log10Bar * LN10 + Math.log(PA_PER_BAR),
    dlnPdT: (LN10 * set.B) / (denom * denom),
  };
}

function checkTemperature(T_K: number): void {
  if (!Number.isFinite(T_K) || T_K <= 0) {
    throw new EngineError(
      'invalid-input',
      `Temperature must be a finite number of kelvin above 0; got ${T_K}.`,
      { T_K },
    );
  }
}

/**
 * Vapour pressure with its slope; same rules as {@link vapourPressure}.
 * The solvers use the slope for Newton steps.
 */
export function vapourPressureWithSlope(
  sets: readonly AntoineSet[],
  T_K: number,
  fallback?: { TbK: number; dHvapJmol: number },
): VapourPressureWithSlope {
  checkTemperature(T_K);
  for (const set of sets) {
    if (T_K >= set.TminK && T_K <= set.TmaxK) {
      const { lnP, dlnPdT } = antoineLnPressure(set, T_K);
      return {
        pressurePa: Math.exp(lnP),
        dlnPdT,
        method: 'antoine',
        source: set.source,
        warnings: [],
      };
    }
  }
  if (sets.length > 0) {
    // Nearest range end over all sets.
    let best = sets[0];
    let bestEnd = T_K < best.TminK ? best.TminK : best.TmaxK;
    let bestDistance = Math.abs(T_K - bestEnd);
    for (const set of sets) {
      const end = T_K < set.TminK ? set.TminK : set.TmaxK;
      const distance = Math.abs(T_K - end);
      if (distance < bestDistance) {
        best = set;
        bestEnd = end;
        bestDistance = distance;
      }
    }
    const atEnd = antoineLnPressure(best, bestEnd);
    // Effective enthalpy of vaporisation at the range end: ΔH = R T² d ln P/dT.
    const dHvap = R_J_PER_MOL_K * bestEnd * bestEnd * atEnd.dlnPdT;
    const lnP = atEnd.lnP - (dHvap / R_J_PER_MOL_K) * (1 / T_K - 1 / bestEnd);
    return {
      pressurePa: Math.exp(lnP),
      dlnPdT: dHvap / (R_J_PER_MOL_K * T_K * T_K),
      method: 'clausius-clapeyron',
      source: best.source,
      warnings: [
        `${T_K.toFixed(2)} K is outside the Antoine range ${best.TminK}–${best.TmaxK} K; ` +
          `vapour pressure extrapolated by Clausius–Clapeyron from ${bestEnd} K ` +
          `(ΔHvap ${(dHvap / 1000).toFixed(1)} kJ/mol from the Antoine slope there), ${bestDistance.toFixed(1)} K beyond the range.`,
      ],
    };
  }
  if (fallback && fallback.TbK > 0 && fallback.dHvapJmol > 0) {
    const lnP =
      Math.log(STANDARD_ATMOSPHERE_PA) -
      (fallback.dHvapJmol / R_J_PER_MOL_K) * (1 / T_K - 1 / fallback.TbK);
    return {
      pressurePa: Math.exp(lnP),
      dlnPdT: fallback.dHvapJmol / (R_J_PER_MOL_K * T_K * T_K),
      method: 'clausius-clapeyron',
      source: {
        ref: 'Clausius–Clapeyron from the normal boiling point and the enthalpy of vaporisation',
        status: 'estimated',
      },
      warnings: [
        `No Antoine constants; vapour pressure estimated by Clausius–Clapeyron from Tb = ${fallback.TbK} K ` +
          `and ΔHvap = ${(fallback.dHvapJmol / 1000).toFixed(1)} kJ/mol (constant ΔHvap assumed).`,
      ],
    };
  }
  throw new EngineError(
    'no-vapour-pressure-data',
    'No Antoine constants and no normal boiling point with enthalpy of vaporisation: vapour pressure cannot be computed.',
    { T_K },
  );
}

/**
 * Saturation (vapour) pressure of a pure liquid.
 *
 * Purpose: P^sat(T) for VLE, evaporation and drying models.
 *
 * Formula: inside a set's range, log10(P/bar) = A − B/(θ + C) (θ in °C or K by
 * the set's `form`). Sets are tried in order; the first whose [TminK, TmaxK]
 * covers T is used. Outside every range, Clausius–Clapeyron with constant
 * ΔHvap from the nearest range end,
 *   ln P = ln P_end − (ΔH/R)(1/T − 1/T_end),  ΔH = R T_end² (d ln P/dT)_end,
 * so P and its slope are continuous at the range end. With no set at all,
 * the same equation from the normal boiling point (P = 101 325 Pa at Tb) with
 * the given ΔHvap.
 *
 * @param sets      Antoine sets, in order of preference (may be empty)
 * @param T_K       temperature [K], > 0
 * @param fallback  TbK: normal boiling point [K]; dHvapJmol: enthalpy of vaporisation at Tb [J/mol]
 * @returns pressurePa [Pa], the method, the source of the constants, warnings
 *
 * Validity: the Antoine ranges; extrapolation is reasonable for some tens of
 * kelvin (constant ΔHvap overestimates P^sat far above the range). Errors:
 * EngineError 'invalid-input' for T ≤ 0 or non-finite; 'no-vapour-pressure-data'
 * when there is nothing to compute from.
 *
 * Example: water (Poling 5e, A 5.11564, B 1687.537, C 230.17, °C form) at
 * 373.15 K → ≈ 1.01e5 Pa, method 'antoine'.
 */
export function vapourPressure(
  sets: readonly AntoineSet[],
  T_K: number,
  fallback?: { TbK: number; dHvapJmol: number },
): VapourPressureResult {
  const { pressurePa, method, source, warnings } = vapourPressureWithSlope(sets, T_K, fallback);
  return { pressurePa, method, source, warnings };
}

/**
 * Inverse Antoine equation: the temperature at which one set gives P.
 *
 *   θ = B / (A − log10(P/bar)) − C,   T = θ + 273.15 for the °C form
 *
 * @param set   Antoine constants and form
 * @param P_Pa  pressure [Pa], > 0
 * @returns     temperature [K]; no range check (compare with set.TminK/TmaxK)
 *
 * Example: water (Poling 5e set) at 101 325 Pa → ≈ 373.2 K.
 */
export function antoineTemperature(set: AntoineSet, P_Pa: number): number {
  if (!Number.isFinite(P_Pa) || P_Pa <= 0) {
    throw new EngineError(
      'invalid-input',
      `Pressure must be a finite number of pascal above 0; got ${P_Pa}.`,
      { P_Pa },
    );
  }
  const theta = set.B / (set.A - Math.log10(P_Pa / PA_PER_BAR)) - set.C;
  return set.form === 'log10-bar-degC' ? theta + T0_K : theta;
}
