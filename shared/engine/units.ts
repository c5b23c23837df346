/**
 * SI constants and unit conversions used by the engine. The engine works in
 * SI inside (K, Pa, J/mol); conversions happen only at its edges.
 *
 * References:
 *  - Molar gas constant R = 8.314 462 618 J/(mol·K): exact in the 2019 SI,
 *    CODATA 2018 recommended values (Tiesinga et al., Rev. Mod. Phys. 2021,
 *    93, 025010, doi:10.1103/RevModPhys.93.025010).
 *  - 1 bar = 10^5 Pa; 1 standard atmosphere = 101 325 Pa; 1 mmHg =
 *    101 325/760 Pa (conventional millimetre of mercury, ≈ 133.322 Pa);
 *    0 °C = 273.15 K (BIPM, The International System of Units, 9th ed., 2019).
 */

/** Molar gas constant [J/(mol·K)] (CODATA 2018, exact). */
export const R_J_PER_MOL_K = 8.314462618;

/** Temperature of the ice point, 0 °C, in kelvin [K]. */
export const T0_K = 273.15;

/** One bar in pascal [Pa/bar]. */
export const PA_PER_BAR = 1e5;

/** One kilopascal in pascal [Pa/kPa]. */
export const PA_PER_KPA = 1e3;

/** One standard atmosphere [Pa]. */
export const STANDARD_ATMOSPHERE_PA = 101325;

/** One conventional millimetre of mercury (torr) in pascal [Pa/mmHg]. */
export const PA_PER_MMHG = 101325 / 760;

/**
 * Celsius to kelvin: T = t + 273.15.
 * Source: BIPM, The International System of Units (SI), 9th ed., 2019 (module comment).
 * Validity: any finite value (exact conversion).
 * @param t_C  temperature [°C]
 * @returns temperature [K]
 */
export function celsiusToKelvin(t_C: number): number {
  return t_C + T0_K;
}

/**
 * Kelvin to Celsius: t = T − 273.15.
 * Source: BIPM, The International System of Units (SI), 9th ed., 2019 (module comment).
 * Validity: any finite value (exact conversion).
 * @param T_K  temperature [K]
 * @returns temperature [°C]
 */
export function kelvinToCelsius(T_K: number): number {
  return T_K - T0_K;
}

/**
 * Bar to pascal: P = 10⁵ P_bar.
 * Source: BIPM, The International System of Units (SI), 9th ed., 2019 (module comment).
 * Validity: any finite value (exact conversion).
 * @param P_bar  pressure [bar]
 * @returns pressure [Pa]
 */
export function barToPa(P_bar: number): number {
  return P_bar * PA_PER_BAR;
}

/**
 * Pascal to bar: P_bar = P / 10⁵.
 * Source: BIPM, The International System of Units (SI), 9th ed., 2019 (module comment).
 * Validity: any finite value (exact conversion).
 * @param P_Pa  pressure [Pa]
 * @returns pressure [bar]
 */
export function paToBar(P_Pa: number): number {
  return P_Pa / PA_PER_BAR;
}

/**
 * Kilopascal to pascal: P = 10³ P_kPa.
 * Source: BIPM, The International System of Units (SI), 9th ed., 2019 (module comment).
 * Validity: any finite value (exact conversion).
 * @param P_kPa  pressure [kPa]
 * @returns pressure [Pa]
 */
export function kPaToPa(P_kPa: number): number {
  return P_kPa * PA_PER_KPA;
}

/**
 * Pascal to kilopascal: P_kPa = P / 10³.
 * Source: BIPM, The International System of Units (SI), 9th ed., 2019 (module comment).
 * Validity: any finite value (exact conversion).
 * @param P_Pa  pressure [Pa]
 * @returns pressure [kPa]
 */
export function paToKPa(P_Pa: number): number {
  return P_Pa / PA_PER_KPA;
}

/**
 * Millimetres of mercury to pascal: P = P_mmHg · 101 325/760 (mmHg taken as the torr; the conventional mmHg, 133.322 387 Pa, differs by about 1 part in 10⁷).
 * Source: BIPM, The International System of Units (SI), 9th ed., 2019 (module comment).
 * Validity: any finite value (exact conversion).
 * @param P_mmHg  pressure [mmHg]
 * @returns pressure [Pa]
 */
export function mmHgToPa(P_mmHg: number): number {
  return P_mmHg * PA_PER_MMHG;
}

/**
 * Pascal to millimetres of mercury: P_mmHg = P · 760/101 325 (mmHg taken as the torr).
 * Source: BIPM, The International System of Units (SI), 9th ed., 2019 (module comment).
 * Validity: any finite value (exact conversion).
 * @param P_Pa  pressure [Pa]
 * @returns pressure [mmHg]
 */
export function paToMmHg(P_Pa: number): number {
  return P_Pa / PA_PER_MMHG;
}
