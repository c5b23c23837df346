/**
 * Octanol–water partition coefficient estimated from UNIFAC activity
 * coefficients at infinite dilution in the two mutually saturated phases.
 *
 * Method (a standard route, e.g. Wienke & Gmehling, Toxicol. Environ. Chem.
 * 1998, 65, 57, who used modified UNIFAC; here the original UNIFAC VLE
 * parameters of Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352):
 *
 *   K_x = γ∞(water-rich phase) / γ∞(octanol-rich phase)
 *   P   = K_x · V̄(water-rich) / V̄(octanol-rich)
 *
 * Phase compositions at 298 K, IUPAC–NIST Solubility Data Series recommended
 * values (Maczynski et al., J. Phys. Chem. Ref. Data 2007, 36, 685), as quoted
 * in the critical evaluation of 1-octanol + hexane + water, IUPAC-NIST
 * Solubility Database (NIST SRD 106): octanol-rich phase x(octanol) = 0.742;
 * water-rich phase x(octanol) = 7.5·10⁻⁵.
 * Molar volumes: water 18.015 g/mol / 0.99705 g/mL (25 °C) = 18.07 cm³/mol
 * (density 997.047 kg/m³ at 25 °C from the recommended equation of Tanaka et
 * al., Metrologia 2001, 38, 301, as coded in chempy); 1-octanol 130.23 g/mol /
 * 0.8262 g/mL (25 °C, CRC "Physical Constants of Organic Compounds", the
 * library's read value) = 157.6 cm³/mol; the octanol-rich phase by ideal
 * mixing of volumes.
 */
import { EngineError } from '../errors';
import type { UnifacGroups } from '../data/types';
import { activityCoefficients, type UnifacModelCache } from '../thermo/unifac';

/** UNIFAC subgroups of 1-octanol: CH3 + 7 CH2 + OH. */
export const OCTANOL_GROUPS: UnifacGroups = { 1: 1, 2: 7, 14: 1 };
/** UNIFAC subgroup of water: H2O (16). */
export const WATER_GROUPS: UnifacGroups = { 16: 1 };

/** Mole fraction of octanol in the octanol-rich phase at 298 K (IUPAC–NIST SDS recommended). */
export const X_OCTANOL_IN_ORGANIC = 0.742;
/** Mole fraction of octanol in the water-rich phase at 298 K (IUPAC–NIST SDS recommended). */
export const X_OCTANOL_IN_AQUEOUS = 7.5e-5;

/** Molar mass of water [g/mol] (2 × 1.008 + 15.999, IUPAC standard atomic weights). */
export const WATER_MOLAR_MASS_GMOL = 18.015;
/** Density of water at 25 °C [g/mL] (0.99705; Tanaka et al., Metrologia 2001, 38, 301: 997.047 kg/m³). */
export const WATER_DENSITY_25C_GML = 0.99705;
/** Molar volume of water at 25 °C [m³/mol] (18.015 g/mol, 0.99705 g/mL, Tanaka et al. 2001). */
export const V_WATER_M3MOL = (WATER_MOLAR_MASS_GMOL / WATER_DENSITY_25C_GML) * 1e-6;
/** Molar volume of 1-octanol at 25 °C [m³/mol] (130.23 g/mol, 0.8262 g/mL at 25 °C, CRC organic constants as read for the library). */
export const V_OCTANOL_M3MOL = (130.23 / 0.8262) * 1e-6;

/** Solute mole fraction used for "infinite dilution" [-]; its effect on γ is below 1e−6 relative. */
export const INFINITE_DILUTION_X = 1e-9;

/**
 * γ of a solute at (practically) infinite dilution in a solvent mixture.
 *
 * @param soluteGroups UNIFAC subgroups of the solute
 * @param groups UNIFAC subgroups of each solvent of the phase
 * @param moleFractions solute-free mole fractions of the solvents [-], sum 1
 * @param T_K temperature [K]
 * @param models optional cache of UNIFAC models (same numbers; the model is built once per mixture)
 * @returns γ∞ [-]
 *
 * Source: UNIFAC (Fredenslund, Jones & Prausnitz 1975; parameters Hansen et al. 1991), see the
 * module comment.
 * Validity: UNIFAC's range (about 275–425 K); γ∞ evaluated at a solute mole fraction of 1e−9.
 */
export function gammaInfiniteDilution(
  soluteGroups: UnifacGroups,
  groups: UnifacGroups[],
  moleFractions: number[],
  T_K: number,
  models?: UnifacModelCache,
): number {
  if (groups.length === 0 || groups.length !== moleFractions.length) {
    throw new EngineError(
      'invalid-input',
      'Give one mole fraction for each solvent of a phase (at least one).',
      { groups: groups.length, fractions: moleFractions.length },
    );
  }
  const s = moleFractions.reduce((a, b) => a + b, 0);
  if (!moleFractions.every((z) => Number.isFinite(z) && z >= 0) || Math.abs(s - 1) > 1e-6) {
    throw new EngineError(
      'invalid-input',
      `Phase mole fractions must be ≥ 0 and sum to 1 (sum = ${s}).`,
      { sum: s },
    );
  }
  const x = INFINITE_DILUTION_X;
  const xs = [x, ...moleFractions.map((z) => (1 - x) * z)];
  if (models) return models.model([soluteGroups, ...groups]).gammas(xs, T_K)[0];
  return activityCoefficients([soluteGroups, ...groups], xs, T_K)[0];
}

/**
 * Estimate log10 P(octanol/water) of a neutral solute from its UNIFAC groups.
 *
 * @param soluteGroups UNIFAC subgroups of the solute (neutral form)
 * @param T_K temperature [K], default 298.15; the phase compositions are
 *   those at 298 K whatever T is (warned when |T − 298.15| > 10 K)
 * @returns logP [-] (molar-concentration basis), the method and warnings
 *
 * Validity and accuracy: simple neutral organics whose groups have VLE
 * parameters with both water and the alkane/OH groups. Original UNIFAC
 * (fitted to VLE, not LLE) tends to overestimate logP of large hydrophobic
 * molecules and is weak for multifunctional solutes (proximity effects are
 * not represented). Measured against the CRC Handbook compilation in the
 * reference tests (see docs/methods.md for MAE and share within 0.5).
 * Throws UnifacParameterError when a group pair has no parameter.
 *
 * Example: benzene {9: 6} → logP ≈ 2.1–2.3 (measured 2.13).
 *
 * Source: see the module comment (UNIFAC activity coefficients in the mutually saturated octanol
 * and water phases).
 */
export function estimateLogPow(
  soluteGroups: UnifacGroups,
  T_K = 298.15,
): { logP: number; method: string; warnings: string[] } {
  if (!Number.isFinite(T_K) || T_K <= 0) {
    throw new EngineError(
      'invalid-input',
      `Temperature must be a positive number of kelvin (got ${T_K}).`,
      { T_K },
    );
  }
  const warnings: string[] = [
    'Estimate from UNIFAC (VLE parameters) γ∞ in mutually saturated octanol/water; typical error 0.3–1 log unit, larger for multifunctional solutes.',
  ];
  if (Math.abs(T_K - 298.15) > 10) {
    warnings.push(
      `Octanol/water phase compositions are those at 298 K; ${T_K.toFixed(1)} K is far from it.`,
    );
  }
  if (T_K < 275 || T_K > 425) {
    warnings.push(
      `UNIFAC parameters were fitted at about 275–425 K; ${T_K.toFixed(1)} K is outside.`,
    );
  }
  const gOrg = gammaInfiniteDilution(
    soluteGroups,
    [OCTANOL_GROUPS, WATER_GROUPS],
    [X_OCTANOL_IN_ORGANIC, 1 - X_OCTANOL_IN_ORGANIC],
    T_K,
  );
  const gAq = gammaInfiniteDilution(
    soluteGroups,
    [OCTANOL_GROUPS, WATER_GROUPS],
    [X_OCTANOL_IN_AQUEOUS, 1 - X_OCTANOL_IN_AQUEOUS],
    T_K,
  );
  const vOrg = X_OCTANOL_IN_ORGANIC * V_OCTANOL_M3MOL + (1 - X_OCTANOL_IN_ORGANIC) * V_WATER_M3MOL;
  const vAq = X_OCTANOL_IN_AQUEOUS * V_OCTANOL_M3MOL + (1 - X_OCTANOL_IN_AQUEOUS) * V_WATER_M3MOL;
  const logP = Math.log10(gAq / gOrg) + Math.log10(vAq / vOrg);
  return {
    logP,
    method:
      'UNIFAC γ∞ in water-saturated 1-octanol vs octanol-saturated water (IUPAC–NIST phase compositions, 298 K), converted to molar concentrations',
    warnings,
  };
}
