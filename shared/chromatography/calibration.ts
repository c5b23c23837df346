/**
 * Back-calculation of an apparent distribution ratio from in-process levels
 * measured before and after a wash. Pure.
 *
 * Nernst partition over ideal stages (mass balance, as in shared/engine
 * unitops/wash.ts). With D = c_org / c_aq and phase volumes V_org, V_aq, one
 * stage leaves the fraction
 *     f = D·V_org / (D·V_org + V_aq)
 * of a solute in the organic phase, hence
 *     D = (f / (1 − f)) · (V_aq / V_org).
 * n cross-current stages with fresh V_aq each leave f = q^n with q the
 * single-stage fraction: D = (q / (1 − q)) · (V_aq / V_org), q = f^(1/n).
 * n counter-current stages leave the Kremser fraction
 *     f = (E − 1) / (E^(n+1) − 1),   E = V_aq / (D·V_org)
 * (Kremser 1930; e.g. Treybal, Mass-Transfer Operations), solved for E by bisection.
 *
 * The fraction remaining comes from the levels: by the ratio of the compound's
 * area to the product's area when the product peak is assigned in both
 * samples (the product stays in the organic phase, at the recovery given),
 * otherwise by the ratio of the area-% levels (which assumes the total area
 * hardly changes). Equal detector response before and after is assumed: the
 * same compound on the same method.
 */

export interface WashCalibrationInput {
  /** Level of the compound before the wash [area %]. */
  beforePct: number;
  /** Level of the compound after the wash [area %]. */
  afterPct: number;
  /** Level of the product before and after [area %], when assigned in both samples. */
  productBeforePct?: number | null;
  productAfterPct?: number | null;
  /** Fraction of the product kept in the organic phase (from the route's evaluation) [-]; default 1. */
  productRecovery?: number;
  /** Organic phase volume [L]. */
  organicL: number;
  /** Aqueous volume per stage (cross-current) or in total (counter-current) [L]. */
  aqueousL: number;
  stages?: number;
  mode?: 'cross-current' | 'counter-current';
}

export type WashCalibration =
  | {
      ok: true;
      /** Apparent distribution ratio D = c_org / c_aq [-]. */
      D: number;
      /** Fraction of the compound left in the organic phase [-]. */
      fractionRemaining: number;
      basis: 'ratio to product' | 'area %';
      /** The formula used, in words and symbols. */
      formula: string;
      warnings: string[];
    }
  | { ok: false; reason: string };

export function backCalculateD(input: WashCalibrationInput): WashCalibration {
  const { beforePct, afterPct, organicL, aqueousL } = input;
  const n = Math.max(1, Math.round(input.stages ?? 1));
  const mode = input.mode ?? 'cross-current';
  if (!(beforePct > 0))
    return {
      ok: false,
      reason: 'The compound was not found before the wash, so nothing can be compared.',
    };
  if (!(afterPct >= 0)) return { ok: false, reason: 'The level after the wash is missing.' };
  if (!(organicL > 0) || !(aqueousL > 0))
    return { ok: false, reason: 'Both phase volumes must be positive.' };

  const useProduct = (input.productBeforePct ?? 0) > 0 && (input.productAfterPct ?? 0) > 0;
  const recovery = Math.min(1, Math.max(0, input.productRecovery ?? 1));
  const f = useProduct
    ? (afterPct / input.productAfterPct! / (beforePct / input.productBeforePct!)) * recovery
    : afterPct / beforePct;
  if (f <= 0)
    return {
      ok: false,
      reason:
        'The compound was not found after the wash: it went (almost) wholly to the aqueous phase. Only an upper limit of D follows, from the reporting limit.',
    };
  if (f >= 1)
    return {
      ok: false,
      reason:
        'The level did not fall across the wash, so the compound stayed in the organic phase: D is too large to measure this way.',
    };

  const warnings: string[] = [];
  if (f > 0.9)
    warnings.push(
      `${(100 * f).toFixed(0)} % stayed in the organic phase: small errors in the levels change D a lot (dD/df = (V_aq/V_org)/(1 − f)²).`,
    );
  if (f < 0.02)
    warnings.push(
      'Less than 2 % remained: the level after the wash is near the reporting limit, so D is uncertain.',
    );

  let D: number;
  let formula: string;
  if (mode === 'counter-current' && n > 1) {
    const E = solveKremser(f, n);
    D = aqueousL / (E * organicL);
    formula = `f = (E − 1)/(E^(n+1) − 1), E = V_aq/(D·V_org), n = ${n} (Kremser)`;
  } else {
    const q = f ** (1 / n);
    D = (q / (1 - q)) * (aqueousL / organicL);
    formula =
      n === 1
        ? 'D = (f/(1 − f))·(V_aq/V_org)'
        : `D = (q/(1 − q))·(V_aq/V_org), q = f^(1/${n}) (${n} cross-current stages)`;
  }
  return {
    ok: true,
    D,
    fractionRemaining: f,
    basis: useProduct ? 'ratio to product' : 'area %',
    formula,
    warnings,
  };
}

/** Kremser fraction remaining after n counter-current stages at extraction factor E. */
export function kremserRemaining(E: number, n: number): number {
  if (Math.abs(E - 1) < 1e-12) return 1 / (n + 1);
  if (E > 1) {
    const inv = 1 / E;
    return (inv ** n - inv ** (n + 1)) / (1 - inv ** (n + 1));
  }
  return (1 - E) / (1 - E ** (n + 1));
}

/** E with kremserRemaining(E, n) = f, 0 < f < 1 (the fraction falls as E rises). */
function solveKremser(f: number, n: number): number {
  let lo = 0;
  let hi = 1;
  while (kremserRemaining(hi, n) > f) hi *= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-14 * hi; i++) {
    const mid = (lo + hi) / 2;
    if (kremserRemaining(mid, n) > f) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
