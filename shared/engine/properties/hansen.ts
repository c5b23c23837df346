/**
 * Hansen solubility parameters: distance, relative energy difference and
 * mixture parameters.
 *
 * References:
 *  - C. M. Hansen, *Hansen Solubility Parameters: A User's Handbook*, 2nd ed.,
 *    CRC Press, Boca Raton 2007, ch. 1 (the distance Ra with the factor 4 on
 *    the dispersion term, RED = Ra/R0, and volume-fraction averaging of the
 *    parameters of a solvent blend). ISBN 978-0-8493-7248-3.
 *    doi:10.1201/9781420006834
 */
import { EngineError } from '../errors';

/** Hansen parameters, each in MPa^0.5 (numerically the same as (J/cm³)^0.5). */
export interface HansenParams {
  /** δD, dispersion component [MPa^0.5] */
  d: number;
  /** δP, polar component [MPa^0.5] */
  p: number;
  /** δH, hydrogen-bonding component [MPa^0.5] */
  h: number;
}

function assertParams(x: HansenParams, label: string): void {
  for (const k of ['d', 'p', 'h'] as const) {
    const v = x[k];
    if (!Number.isFinite(v) || v < 0) {
      throw new EngineError(
        'invalid-input',
        `Hansen parameter δ${k.toUpperCase()} of ${label} must be a finite number ≥ 0 MPa^0.5 (got ${v}).`,
        { label, component: k, value: v },
      );
    }
  }
}

/**
 * Hansen distance Ra between two materials (Hansen 2007, eq. 1.9).
 *
 * Formula: Ra² = 4(δD1 − δD2)² + (δP1 − δP2)² + (δH1 − δH2)²
 *
 * @param a first material, δD/δP/δH [MPa^0.5]
 * @param b second material, δD/δP/δH [MPa^0.5]
 * @returns Ra [MPa^0.5], ≥ 0
 *
 * Validity: any non-negative parameters; the factor 4 is Hansen's empirical
 * weighting that makes the solubility region a sphere. Ra says nothing about
 * size effects (small molecules dissolve better than Ra suggests).
 * Throws EngineError('invalid-input') on a negative or non-finite value.
 *
 * Example: toluene (18.0, 1.4, 2.0) vs ethanol (15.8, 8.8, 19.4):
 * Ra = √(4·2.2² + 7.4² + 17.4²) = √(19.36 + 54.76 + 302.76) = 19.41.
 *
 * Source: C. M. Hansen, Hansen Solubility Parameters: A User's Handbook, 2nd ed., CRC Press 2007,
 * eq. 1.9.
 */
export function hansenDistance(a: HansenParams, b: HansenParams): number {
  assertParams(a, 'the first material');
  assertParams(b, 'the second material');
  const dd = a.d - b.d;
  const dp = a.p - b.p;
  const dh = a.h - b.h;
  return Math.sqrt(4 * dd * dd + dp * dp + dh * dh);
}

/**
 * Relative energy difference RED = Ra / R0 (Hansen 2007, eq. 1.10).
 *
 * @param a solute (the sphere's centre) [MPa^0.5]
 * @param b solvent [MPa^0.5]
 * @param R0 interaction radius of the solute's sphere [MPa^0.5], > 0
 * @returns RED [-]: < 1 the solvent is expected to dissolve the solute,
 *   ≈ 1 borderline, > 1 progressively poorer.
 *
 * Throws EngineError('invalid-input') when R0 is not a positive finite number.
 * Example: Ra = 19.41, R0 = 8 → RED = 2.43.
 *
 * Source: Hansen 2007 (module comment), eq. 1.10.
 * Validity: R0 > 0, fitted for the solute from its good/bad solvents; RED < 1 predicts dissolution,
 * a screening rule, not a solubility.
 */
export function relativeEnergyDifference(a: HansenParams, b: HansenParams, R0: number): number {
  if (!Number.isFinite(R0) || R0 <= 0) {
    throw new EngineError(
      'invalid-input',
      `The interaction radius R0 must be a positive number of MPa^0.5 (got ${R0}).`,
      { R0 },
    );
  }
  return hansenDistance(a, b) / R0;
}

/**
 * Hansen parameters of a blend as the volume-fraction average of its parts
 * (Hansen 2007, §1.x, common practice for solvent blends):
 *
 *   δk,mix = Σ φi·δk,i / Σ φi     for k = D, P, H
 *
 * @param parts each part's parameters [MPa^0.5] and volume fraction [-] (≥ 0).
 *   Fractions are normalised by their sum, so they may be given as volumes.
 * @returns the blend's δD/δP/δH [MPa^0.5]
 *
 * Assumptions: ideal mixing of volumes, no specific association between the
 * parts (for water–alcohol blends the average is only a rough guide).
 * Throws EngineError('invalid-input') for an empty list, a negative or
 * non-finite fraction, or fractions summing to zero.
 *
 * Example: 50/50 by volume of toluene (18.0, 1.4, 2.0) and ethanol
 * (15.8, 8.8, 19.4) → (16.9, 5.1, 10.7).
 *
 * Source: Hansen 2007 (module comment), ch. 1: volume-fraction average of the blend's parameters
 * (common practice).
 * Validity: ideal volume mixing; blends without strong specific interactions between the solvents.
 */
export function mixtureHansen(
  parts: Array<{ params: HansenParams; volumeFraction: number }>,
): HansenParams {
  if (parts.length === 0) {
    throw new EngineError('invalid-input', 'A blend needs at least one part.', {});
  }
  let sum = 0;
  let d = 0;
  let p = 0;
  let h = 0;
  parts.forEach((part, i) => {
    assertParams(part.params, `part ${i + 1}`);
    const phi = part.volumeFraction;
    if (!Number.isFinite(phi) || phi < 0) {
      throw new EngineError(
        'invalid-input',
        `Volume fraction of part ${i + 1} must be a finite number ≥ 0 (got ${phi}).`,
        { index: i, value: phi },
      );
    }
    sum += phi;
    d += phi * part.params.d;
    p += phi * part.params.p;
    h += phi * part.params.h;
  });
  if (sum <= 0) {
    throw new EngineError('invalid-input', 'The volume fractions of a blend sum to zero.', {});
  }
  return { d: d / sum, p: p / sum, h: h / sum };
}
