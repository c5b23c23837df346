/**
 * Vapour pressure of pure liquids: a wide-range correlation (DIPPR 101 or
 * Wagner, triple point to critical point) where one is published; else the
 * Antoine equation inside its fitted range, joined smoothly to the normal
 * boiling point outside it (with a warning).
 *
 * Sources: Antoine, C. R. Acad. Sci. 1888, 107, 681; constants as published in
 * Poling, Prausnitz & O'Connell, The Properties of Gases and Liquids, 5th ed.
 * (McGraw-Hill 2001), Appendix A, and the NIST Chemistry WebBook
 * (doi:10.18434/T4D303). Clausius–Clapeyron: any physical-chemistry text,
 * e.g. Atkins' Physical Chemistry, §"the Clausius–Clapeyron equation".
 */
import { EngineError } from '../errors';
import type {
  AntoineSet,
  SolventRecord,
  Source,
  Sourced,
  VapourPressureCorrelation,
} from '../data/types';
import { findRoot } from '../numerics';
import { PA_PER_BAR, R_J_PER_MOL_K, STANDARD_ATMOSPHERE_PA, T0_K } from '../units';

const LN10 = Math.LN10;

/** How a vapour pressure was obtained. */
export type VapourPressureMethod =
  'dippr101' | 'wagner' | 'antoine' | 'antoine-anchored' | 'clausius-clapeyron';

/** Result of a vapour-pressure evaluation. */
export interface VapourPressureResult {
  /** Saturation pressure [Pa]. */
  pressurePa: number;
  method: VapourPressureMethod;
  /** Source of the constants used (for an extrapolation: the set or data it started from). */
  source: Source;
  warnings: string[];
}

/** Vapour pressure and its temperature derivative, for solvers. */
export interface VapourPressureWithSlope extends VapourPressureResult {
  /** d ln P^sat / dT [1/K]. */
  dlnPdT: number;
}

/**
 * Data of one pure liquid beyond its Antoine sets: a wide-range correlation,
 * the normal boiling point and the enthalpy of vaporisation there.
 */
export interface VapourPressureExtra {
  /** Wide-range correlation (triple point to critical point), preferred when present. */
  correlation?: Sourced<VapourPressureCorrelation>;
  /** Normal boiling point [K] (anchor of the Antoine extension and of Clausius–Clapeyron). */
  TbK?: number;
  /** Enthalpy of vaporisation at Tb [J/mol] (Clausius–Clapeyron when there is no Antoine set). */
  dHvapJmol?: number;
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
 * Source: Antoine, C. R. Acad. Sci. 1888, 107, 681; constants as published
 * (Poling et al. 5th ed. App. A, NIST WebBook, Landolt-Börnstein IV/20).
 *
 * @param set  Antoine constants (A [–], B [°C or K], C [°C or K]) and form
 * @param T_K  temperature [K]
 * @returns    ln(P/Pa) [–] and d ln P/dT [1/K]
 *
 * Validity: the set's own range [TminK, TmaxK]; no check here.
 */
export function antoineLnPressure(set: AntoineSet, T_K: number): { lnP: number; dlnPdT: number } {
  const denom = equationTemperature(set, T_K) + set.C;
  const log10Bar = set.A - set.B / denom;
  return {
    lnP: log10Bar * LN10 + Math.log(PA_PER_BAR),
    dlnPdT: (LN10 * set.B) / (denom * denom),
  };
}

/**
 * A wide-range correlation evaluated with no range check.
 *
 *   DIPPR 101:   ln(P/Pa) = C1 + C2/T + C3 ln T + C4 T^C5
 *   Wagner 2.5-5: ln(P/Pc) = (Tc/T)(A τ + B τ^1.5 + C τ^2.5 + D τ^5),  τ = 1 − T/Tc
 *
 * Source: Perry's Chemical Engineers' Handbook, 8th ed., Table 2-8 (DIPPR
 * 101); VDI Heat Atlas, PPDS Wagner form.
 *
 * A DIPPR 101 row with an `anchor` (Perry rows that miss the CRC normal boiling point by more than
 * 0.5 K) adds dLnP·(u − u1)(u − uc)/((ub − u1)(ub − uc)), u = 1/T, u1 = 1/T1 (25 °C), ub = 1/Tb,
 * uc = 1/Tc: exact at the CRC Tb, unchanged at 25 °C and at Tc, smooth in value and slope.
 *
 * @param c    correlation and coefficients (T in K, P in Pa)
 * @param T_K  temperature [K], > 0 (Wagner: ≤ Tc)
 * @returns    ln(P/Pa) [–] and d ln P/dT [1/K]
 *
 * Validity: [TminK, TmaxK] of the row (triple or melting point to the critical point).
 */
export function correlationLnPressure(
  c: VapourPressureCorrelation,
  T_K: number,
): { lnP: number; dlnPdT: number } {
  if (c.kind === 'dippr101') {
    const tPow = c.C5 === 0 ? 1 : T_K ** c.C5;
    let lnP = c.C1 + c.C2 / T_K + c.C3 * Math.log(T_K) + c.C4 * tPow;
    let dlnPdT = -c.C2 / (T_K * T_K) + c.C3 / T_K + (c.C5 === 0 ? 0 : (c.C4 * c.C5 * tPow) / T_K);
    if (c.anchor) {
      // Anchor at the CRC Tb: + dLnP·(u − u1)(u − uc)/((ub − u1)(ub − uc)), u = 1/T.
      const u = 1 / T_K;
      const u1 = 1 / c.anchor.T1K;
      const ub = 1 / c.anchor.TbK;
      const uc = 1 / c.TmaxK;
      const D = (ub - u1) * (ub - uc);
      lnP += (c.anchor.dLnP * (u - u1) * (u - uc)) / D;
      dlnPdT -= (c.anchor.dLnP * (2 * u - u1 - uc) * u * u) / D;
    }
    return { lnP, dlnPdT };
  }
  const tau = Math.max(0, 1 - T_K / c.TcK);
  const s = Math.sqrt(tau);
  const poly = c.A * tau + c.B * tau * s + c.C * tau * tau * s + c.D * tau ** 5;
  // d poly/dτ, with dτ/dT = −1/Tc.
  const dpoly = c.A + 1.5 * c.B * s + 2.5 * c.C * tau * s + 5 * c.D * tau ** 4;
  const lnP = Math.log(c.PcPa) + (c.TcK / T_K) * poly;
  const dlnPdT = -(c.TcK / (T_K * T_K)) * poly - (1 / T_K) * dpoly;
  return { lnP, dlnPdT };
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

const LN_ATM = Math.log(STANDARD_ATMOSPHERE_PA);

/**
 * Kirchhoff form ln P = a + b/T + c ln T through (T_e, ln P_e) with slope s_e
 * there and through (Tb, ln 1 atm): the Antoine extension anchored at the
 * normal boiling point. Returns null when the fit is unphysical (ΔH = R(cT − b)
 * not positive between the two anchors, or c > 0, i.e. ΔH rising with T).
 */
function anchoredKirchhoff(
  Te: number,
  lnPe: number,
  se: number,
  Tb: number,
): { a: number; b: number; c: number } | null {
  const dInv = 1 / Tb - 1 / Te;
  const denom = Te * dInv + Math.log(Tb / Te);
  if (Math.abs(denom) < 1e-12) return null;
  const c = (LN_ATM - lnPe + se * Te * Te * dInv) / denom;
  const b = c * Te - se * Te * Te;
  const a = lnPe - b / Te - c * Math.log(Te);
  if (c > 0) return null;
  for (const T of [Te, Tb]) if (!(c * T - b > 0)) return null;
  return { a, b, c };
}

/**
 * ln P and its slope from the normal boiling point, integrating
 * d ln P/dT = ΔH(T)/(R T²) with Watson's relation ΔH = ΔH_b ((1 − T/Tc)/(1 − Tb/Tc))^0.38
 * (Watson, Ind. Eng. Chem. 1943, 35, 398) and Tc = 1.5 Tb (Guldberg's rule),
 * by composite 8-point Gauss–Legendre quadrature in T, panels of at most 25 K
 * (ideal-gas vapour, liquid volume
 * neglected).
 */
function watsonClapeyron(TbK: number, dHb: number, T_K: number): { lnP: number; dlnPdT: number } {
  const Tc = 1.5 * TbK;
  const dH = (T: number) => (T >= Tc ? 0 : dHb * ((1 - T / Tc) / (1 - TbK / Tc)) ** 0.38);
  const upper = Math.min(T_K, Tc);
  // Composite rule: panels of at most 25 K, each integrated to about 1e-10 relative.
  const panels = Math.max(1, Math.ceil(Math.abs(upper - TbK) / 25));
  const width = (upper - TbK) / panels;
  let integral = 0;
  for (let p = 0; p < panels; p++) {
    const mid = TbK + (p + 0.5) * width;
    for (let k = 0; k < GL8_X.length; k++) {
      const T = mid + 0.5 * width * GL8_X[k];
      integral += 0.5 * width * GL8_W[k] * (dH(T) / (R_J_PER_MOL_K * T * T));
    }
  }
  return { lnP: LN_ATM + integral, dlnPdT: dH(T_K) / (R_J_PER_MOL_K * T_K * T_K) };
}

// Gauss–Legendre nodes and weights, 8 points on [−1, 1] (Abramowitz & Stegun, Table 25.4).
const GL8_X = [
  -0.9602898564975363, -0.7966664774136267, -0.525532409916329, -0.1834346424956498,
  0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363,
];
const GL8_W = [
  0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.362683783378362, 0.362683783378362,
  0.3137066458778873, 0.2223810344533745, 0.1012285362903763,
];

/**
 * Vapour pressure with its slope; same rules, sources and validity as
 * {@link vapourPressure}. The solvers use the slope for Newton steps.
 *
 * Source: as vapourPressure (Perry 8e Table 2-8, VDI PPDS, Antoine sets, Clausius–Clapeyron).
 * Validity: as vapourPressure.
 *
 * @param sets   Antoine sets, in order of preference (may be empty)
 * @param T_K    temperature [K], > 0
 * @param extra  correlation, TbK [K], dHvapJmol [J/mol] (see VapourPressureExtra)
 * @returns pressurePa [Pa], dlnPdT [1/K], method, source, warnings
 */
export function vapourPressureWithSlope(
  sets: readonly AntoineSet[],
  T_K: number,
  extra?: VapourPressureExtra,
): VapourPressureWithSlope {
  checkTemperature(T_K);
  const corr = extra?.correlation;
  if (corr) {
    const c = corr.value;
    const method: VapourPressureMethod = c.kind === 'dippr101' ? 'dippr101' : 'wagner';
    if (T_K >= c.TminK && T_K <= c.TmaxK) {
      const { lnP, dlnPdT } = correlationLnPressure(c, T_K);
      return { pressurePa: Math.exp(lnP), dlnPdT, method, source: corr.source, warnings: [] };
    }
    // Beyond the triple point or the critical point: constant-ΔH extension from the end, with a warning.
    const end = T_K < c.TminK ? c.TminK : c.TmaxK;
    const atEnd = correlationLnPressure(c, end);
    const lnP = atEnd.lnP + end * end * atEnd.dlnPdT * (1 / end - 1 / T_K);
    return {
      pressurePa: Math.exp(lnP),
      dlnPdT: (atEnd.dlnPdT * end * end) / (T_K * T_K),
      method: 'clausius-clapeyron',
      source: corr.source,
      warnings: [
        T_K > c.TmaxK
          ? `${T_K.toFixed(2)} K is above the critical temperature (${c.TmaxK} K): there is no liquid; vapour pressure extrapolated by Clausius–Clapeyron.`
          : `${T_K.toFixed(2)} K is below the triple point or fitted minimum (${c.TminK} K): vapour pressure of the subcooled liquid extrapolated by Clausius–Clapeyron.`,
      ],
    };
  }
  if (sets.length > 0) {
    // Only the preferred set is used, extended smoothly outside its range: no jump where sets hand over.
    const set = sets[0];
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
    const below = T_K < set.TminK;
    const end = below ? set.TminK : set.TmaxK;
    const atEnd = antoineLnPressure(set, end);
    const Tb = extra?.TbK;
    // Anchor only when Tb lies at least 5 K beyond the range end (closer, the fit is ill-conditioned
    // and the range end already carries the boiling point).
    const anchorBeyond = Tb !== undefined && (below ? Tb < end - 5 : Tb > end + 5);
    const fit = anchorBeyond ? anchoredKirchhoff(end, atEnd.lnP, atEnd.dlnPdT, Tb!) : null;
    if (fit) {
      // Between the range end and Tb the Kirchhoff equation; beyond Tb, Clausius–Clapeyron from Tb with
      // the Kirchhoff ΔH there, falling towards the critical point by Watson's relation (so ΔH never
      // collapses to zero far from the data). Value and slope are continuous at Tb.
      const beyondTb = below ? T_K < Tb! : T_K > Tb!;
      const ext = beyondTb
        ? watsonClapeyron(Tb!, R_J_PER_MOL_K * (fit.c * Tb! - fit.b), T_K)
        : {
            lnP: fit.a + fit.b / T_K + fit.c * Math.log(T_K),
            dlnPdT: -fit.b / (T_K * T_K) + fit.c / T_K,
          };
      const lnP = ext.lnP;
      return {
        pressurePa: Math.exp(lnP),
        dlnPdT: ext.dlnPdT,
        method: 'antoine-anchored',
        source: set.source,
        warnings: [
          `${T_K.toFixed(2)} K is outside the Antoine range ${set.TminK}–${set.TmaxK} K; vapour pressure from ` +
            `the Antoine set joined smoothly to the normal boiling point (${Tb!.toFixed(2)} K) by a Kirchhoff ` +
            `equation ln P = a + b/T + c ln T, ${Math.abs(T_K - end).toFixed(1)} K beyond the range.`,
        ],
      };
    }
    // Effective enthalpy of vaporisation at the range end: ΔH = R T² d ln P/dT.
    const dHvap = R_J_PER_MOL_K * end * end * atEnd.dlnPdT;
    const lnP = atEnd.lnP - (dHvap / R_J_PER_MOL_K) * (1 / T_K - 1 / end);
    return {
      pressurePa: Math.exp(lnP),
      dlnPdT: dHvap / (R_J_PER_MOL_K * T_K * T_K),
      method: 'clausius-clapeyron',
      source: set.source,
      warnings: [
        `${T_K.toFixed(2)} K is outside the Antoine range ${set.TminK}–${set.TmaxK} K; ` +
          `vapour pressure extrapolated by Clausius–Clapeyron from ${end} K ` +
          `(ΔHvap ${(dHvap / 1000).toFixed(1)} kJ/mol from the Antoine slope there), ${Math.abs(T_K - end).toFixed(1)} K beyond the range.`,
      ],
    };
  }
  const TbK = extra?.TbK;
  if (TbK !== undefined && TbK > 0) {
    const given = extra?.dHvapJmol !== undefined && extra.dHvapJmol > 0;
    // Kistiakowsky's rule when no enthalpy of vaporisation is known: ΔSvb = 36.1 + R ln Tb J/(mol K).
    const dHb = given ? extra!.dHvapJmol! : TbK * (36.1 + R_J_PER_MOL_K * Math.log(TbK));
    const { lnP, dlnPdT } = watsonClapeyron(TbK, dHb, T_K);
    return {
      pressurePa: Math.exp(lnP),
      dlnPdT,
      method: 'clausius-clapeyron',
      source: given
        ? {
            ref: 'Clausius–Clapeyron from the normal boiling point and the enthalpy of vaporisation, Watson temperature dependence',
            status: 'estimated',
          }
        : { ref: 'kistiakowsky-trouton', status: 'estimated' },
      warnings: [
        `No vapour-pressure correlation; vapour pressure estimated by integrating Clausius–Clapeyron from Tb = ${TbK.toFixed(2)} K ` +
          `with ΔHvap(Tb) = ${(dHb / 1000).toFixed(1)} kJ/mol (${given ? 'tabulated' : "estimated by Kistiakowsky's rule"}) ` +
          `varying with T by Watson's relation (Tc ≈ 1.5 Tb by Guldberg's rule); an estimate: expect up to a factor of 2 at 25 °C.`,
      ],
    };
  }
  throw new EngineError(
    'no-vapour-pressure-data',
    'No vapour-pressure correlation, no Antoine constants and no normal boiling point: vapour pressure cannot be computed.',
    { T_K },
  );
}

/**
 * Why the vapour pressure at T is extrapolated, as a key ('correlation-above', 'correlation-below',
 * 'antoine-above', 'antoine-below', 'boiling-point-estimate'), or null inside the preferred data
 * (where vapourPressureWithSlope gives no warning). Temperatures with the same key share one
 * warning in vapourPressureRangeWarning.
 *
 * Source: this project's own bookkeeping (the rules of vapourPressureWithSlope).
 * Validity: as vapourPressure.
 *
 * @param sets   Antoine sets, in order of preference (may be empty)
 * @param T_K    temperature [K], > 0
 * @param extra  as vapourPressure
 * @returns the cause, or null when no extrapolation is involved
 */
export function vapourPressureExtrapolation(
  sets: readonly AntoineSet[],
  T_K: number,
  extra?: VapourPressureExtra,
): string | null {
  const corr = extra?.correlation?.value;
  if (corr) {
    if (T_K >= corr.TminK && T_K <= corr.TmaxK) return null;
    return T_K > corr.TmaxK ? 'correlation-above' : 'correlation-below';
  }
  const set = sets[0];
  if (set) {
    if (T_K >= set.TminK && T_K <= set.TmaxK) return null;
    return T_K > set.TmaxK ? 'antoine-above' : 'antoine-below';
  }
  return 'boiling-point-estimate';
}

/**
 * One warning for every temperature from loK to hiK at which the vapour pressure is extrapolated
 * for the same cause (vapourPressureExtrapolation): the wording of vapourPressureWithSlope's
 * warnings, with the range of temperatures met (a distillation meets many) in °C instead of one
 * temperature.
 *
 * Source: as vapourPressureWithSlope.
 * Validity: as vapourPressure; loK ≤ hiK.
 *
 * @param sets   Antoine sets, in order of preference (may be empty)
 * @param loK    lowest temperature met [K]
 * @param hiK    highest temperature met [K] (same cause as loK)
 * @param extra  as vapourPressure
 * @returns the warning, in the chemist's words; null when loK lies inside the preferred data
 */
export function vapourPressureRangeWarning(
  sets: readonly AntoineSet[],
  loK: number,
  hiK: number,
  extra?: VapourPressureExtra,
): string | null {
  const cause = vapourPressureExtrapolation(sets, loK, extra);
  if (cause === null) return null;
  const c = (K: number) => (K - 273.15).toFixed(1);
  const met = c(loK) === c(hiK) ? `at ${c(loK)} °C` : `from ${c(loK)} to ${c(hiK)} °C`;
  if (cause === 'boiling-point-estimate') {
    const w = vapourPressureWithSlope(sets, loK, extra).warnings[0];
    return `${w.slice(0, -1)} (met ${met}).`;
  }
  const beyondData = `vapour pressure extrapolated beyond its data ${met}`;
  const corr = extra?.correlation?.value;
  if (corr) {
    return cause === 'correlation-above'
      ? `${beyondData}: above the critical temperature (${corr.TmaxK} K) there is no liquid; extrapolated by Clausius–Clapeyron.`
      : `${beyondData}: the subcooled liquid below the triple point or fitted minimum (${corr.TminK} K), by Clausius–Clapeyron.`;
  }
  const set = sets[0];
  const below = cause === 'antoine-below';
  const end = below ? set.TminK : set.TmaxK;
  const beyond = Math.max(Math.abs(loK - end), Math.abs(hiK - end)).toFixed(1);
  const outside = `${beyondData}: outside the Antoine range ${set.TminK}–${set.TmaxK} K (up to ${beyond} K beyond it), `;
  const Tb = extra?.TbK;
  const anchored =
    Tb !== undefined &&
    (below ? Tb < end - 5 : Tb > end + 5) &&
    vapourPressureWithSlope(sets, loK, extra).method === 'antoine-anchored';
  if (anchored)
    return (
      outside +
      `the Antoine set joined smoothly to the normal boiling point (${Tb.toFixed(2)} K) by a Kirchhoff ` +
      `equation ln P = a + b/T + c ln T.`
    );
  const atEnd = antoineLnPressure(set, end);
  const dHvap = R_J_PER_MOL_K * end * end * atEnd.dlnPdT;
  return (
    outside +
    `by Clausius–Clapeyron from ${end} K ` +
    `(ΔHvap ${(dHvap / 1000).toFixed(1)} kJ/mol from the Antoine slope there).`
  );
}

/**
 * Saturation (vapour) pressure of a pure liquid.
 *
 * Purpose: P^sat(T) for VLE, evaporation and drying models.
 *
 * Source: Perry's Chemical Engineers' Handbook, 8th ed., Table 2-8 (DIPPR
 * 101) and the VDI Heat Atlas PPDS Wagner set for the wide-range
 * correlations; Antoine constants as published (Poling et al. 5th ed., NIST
 * WebBook, Landolt-Börnstein); Clausius–Clapeyron (any physical-chemistry
 * text); Kistiakowsky's rule for ΔSvb.
 *
 * Formula, in order of preference:
 *  1. a wide-range correlation (extra.correlation) inside [Tmin, Tc];
 *  2. the first Antoine set inside its range, log10(P/bar) = A − B/(θ + C);
 *     outside it, when the normal boiling point lies beyond the range end on
 *     the same side, a Kirchhoff equation ln P = a + b/T + c ln T matching
 *     the Antoine value and slope at the range end and P = 101 325 Pa at Tb
 *     (continuous value and slope; exact at Tb), and beyond Tb
 *     Clausius–Clapeyron from Tb with ΔH(T) by Watson's relation; otherwise constant-ΔH
 *     Clausius–Clapeyron from the range end, ΔH = R T_end² (d ln P/dT)_end;
 *  3. with no set, Clausius–Clapeyron integrated from Tb with ΔHvap(Tb)
 *     tabulated or from Kistiakowsky's rule, varying with T by Watson's
 *     relation with Tc ≈ 1.5 Tb (Guldberg's rule): an estimate, up to a
 *     factor of 2 at 25 °C.
 * Only the first Antoine set is evaluated, so there is no jump where sets
 * would hand over; further sets are kept as data for cross-checks.
 *
 * @param sets   Antoine sets, in order of preference (may be empty)
 * @param T_K    temperature [K], > 0
 * @param extra  correlation (wide-range, T in K, P in Pa); TbK: normal boiling point [K]; dHvapJmol: ΔHvap at Tb [J/mol]
 * @returns pressurePa [Pa], the method, the source of the constants, warnings
 *
 * Validity: the correlations from the triple point to the critical point
 * (Perry states the Table 2-8 values as within 1–5 % for most liquids —
 * figure recalled); an Antoine set inside its range; the anchored extension
 * is exact at Tb and good to a few per cent within some tens of kelvin of it.
 * Errors: EngineError 'invalid-input' for T ≤ 0 or non-finite;
 * 'no-vapour-pressure-data' when there is nothing to compute from.
 *
 * Example: water (Perry Table 2-8) at 373.15 K → ≈ 1.013e5 Pa, method 'dippr101'.
 */
export function vapourPressure(
  sets: readonly AntoineSet[],
  T_K: number,
  extra?: VapourPressureExtra,
): VapourPressureResult {
  const { pressurePa, method, source, warnings } = vapourPressureWithSlope(sets, T_K, extra);
  return { pressurePa, method, source, warnings };
}

/**
 * Temperature at which a pure liquid's vapour pressure equals P (its boiling
 * point at P), by Brent's method (numerics/roots.ts) on ln P^sat(T) − ln P
 * with the same vapour-pressure rules as {@link vapourPressure}.
 *
 * Source: as vapourPressure; Brent 1973 for the root.
 *
 * @param sets   Antoine sets, in order of preference (may be empty)
 * @param P_Pa   pressure [Pa], > 0
 * @param extra  as vapourPressure
 * @returns T_K [K], converged flag
 *
 * Validity: as vapourPressure; between 20 K and 2000 K.
 */
export function saturationTemperature(
  sets: readonly AntoineSet[],
  P_Pa: number,
  extra?: VapourPressureExtra,
): { T_K: number; converged: boolean } {
  if (!Number.isFinite(P_Pa) || P_Pa <= 0) {
    throw new EngineError(
      'invalid-input',
      `Pressure must be a finite number of pascal above 0; got ${P_Pa}.`,
      { P_Pa },
    );
  }
  const lnTarget = Math.log(P_Pa);
  const f = (T: number) => Math.log(vapourPressureWithSlope(sets, T, extra).pressurePa) - lnTarget;
  const start = extra?.TbK ?? 350;
  const r = findRoot(f, start * 0.95, start * 1.05, {
    lower: 20,
    upper: 2000,
    xtol: 1e-9,
    rtol: 0,
  });
  return { T_K: r.root, converged: r.converged };
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
 * Source: Antoine, C. R. Acad. Sci. 1888, 107, 681 (the equation solved for T).
 * Validity: the set's range [TminK, TmaxK].
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

/**
 * The vapour-pressure data of a library solvent in the form the functions
 * above take: its Antoine sets, and its wide-range correlation, CRC normal
 * boiling point and ΔHvap at Tb.
 *
 * @param s  solvent record (data/solvents)
 * @returns sets and extra for vapourPressure(sets, T, extra)
 *
 * Source and validity: those of the record's values (data/sources.ts).
 */
export function solventVapourPressureData(s: SolventRecord): {
  sets: readonly AntoineSet[];
  extra: VapourPressureExtra;
} {
  return {
    sets: s.antoine,
    extra: {
      correlation: s.vapourPressure,
      TbK: s.boilingPointC.value + T0_K,
      dHvapJmol: s.enthalpyVapKJmol ? s.enthalpyVapKJmol.value * 1000 : undefined,
    },
  };
}
