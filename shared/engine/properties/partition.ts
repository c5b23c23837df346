/**
 * Liquid–liquid partition of a solute between an organic phase and water:
 * ionisation (Henderson–Hasselbalch), Collander relation from logP,
 * activity-coefficient estimate (UNIFAC) and salting-out (Setschenow).
 *
 * References:
 *  - Henderson–Hasselbalch: e.g. P. W. Atkins, J. de Paula, *Physical
 *    Chemistry*, any edition, acid–base equilibria (definition).
 *  - R. Collander, Acta Chem. Scand. 1951, 5, 774; A. Leo, C. Hansch,
 *    D. Elkins, Chem. Rev. 1971, 71, 525. doi:10.1021/cr60274a001
 *  - J. Setschenow, Z. Phys. Chem. 1889, 4, 117 (salting-out relation
 *    log(S0/S) = ks·Cs).
 *  - UNIFAC: Fredenslund, Jones & Prausnitz, AIChE J. 1975, 21, 1086
 *    (doi:10.1002/aic.690210607); parameters Hansen et al., Ind. Eng. Chem.
 *    Res. 1991, 30, 2352 (doi:10.1021/ie00058a017).
 */
import { EngineError } from '../errors';
import type { SolventRecord, Source, UnifacGroups } from '../data/types';
import { COLLANDER } from '../data/collander';
import { gammaInfiniteDilution, V_WATER_M3MOL, WATER_GROUPS, WATER_MOLAR_MASS_GMOL } from './logp';
import type { UnifacModelCache } from '../thermo/unifac';

export { estimateLogPow } from './logp';

/** An ionisable site. For a base, `value` is the pKa of its conjugate acid BH⁺. */
export type PKa = { value: number; type: 'acid' | 'base' };

function checkPKa(pKa: readonly PKa[], pH: number): void {
  if (!Number.isFinite(pH) || pH < -2 || pH > 16) {
    throw new EngineError('invalid-input', `pH must be a number between −2 and 16 (got ${pH}).`, {
      pH,
    });
  }
  for (const s of pKa) {
    if (!Number.isFinite(s.value) || (s.type !== 'acid' && s.type !== 'base')) {
      throw new EngineError(
        'invalid-input',
        `A pKa needs a finite value and type 'acid' or 'base' (got ${JSON.stringify(s)}).`,
        { site: s },
      );
    }
  }
}

/**
 * Fraction of the solute present as the uncharged species at a given pH
 * (Henderson–Hasselbalch applied to every site):
 *
 *   f_n = Π_acids 1 / (1 + 10^(pH − pKa)) · Π_bases 1 / (1 + 10^(pKa − pH))
 *
 * @param pKa the ionisable sites; for a base the pKa of BH⁺ [-]
 * @param pH aqueous pH [-], −2 … 16
 * @returns f_n [-], in (0, 1]; 1 when there is no ionisable site
 *
 * Microspecies assumption: the sites ionise independently (the given pKa
 * are treated as microscopic constants), so the fraction with every site
 * uncharged is the product above. For a zwitterion (an acid and a base) the
 * net-neutral but charged zwitterion is NOT counted as neutral: only the
 * uncharged microspecies partitions into the organic phase. For overlapping
 * pKa (closer than ~2 units) the independence assumption is approximate.
 *
 * Example: benzoic acid (pKa 4.20) at pH 4.20 → 0.5; at pH 7 → 1.58·10⁻³.
 *
 * Source: Henderson–Hasselbalch (module comment).
 * Validity: pH −2 … 16; ideal dilute solution (activities = concentrations); independent sites.
 */
export function neutralFraction(pKa: readonly PKa[], pH: number): number {
  checkPKa(pKa, pH);
  let f = 1;
  for (const s of pKa) {
    f *=
      s.type === 'acid'
        ? 1 / (1 + Math.pow(10, pH - s.value))
        : 1 / (1 + Math.pow(10, s.value - pH));
  }
  return f;
}

/**
 * log D from log P when only the neutral species partitions:
 *
 *   log D = log P + log10 f_n(pH)
 *
 * @param logP partition coefficient of the neutral species [-] (log10)
 * @param pKa ionisable sites; @param pH aqueous pH [-]
 * @returns log D [-] (log10)
 *
 * Assumption: ion pairs do not partition (for lipophilic ions with a
 * counter-ion, e.g. quaternary salts, the real log D is higher).
 * Example: benzoic acid log P 1.88, pH 7 → 1.88 − 2.80 = −0.92.
 *
 * Source: Henderson–Hasselbalch with only the neutral species partitioning (module comment).
 * Validity: as neutralFraction; ion-pair partition neglected (it limits log D at large ionisation,
 * typically 3–4 log units below log P).
 */
export function logDFromLogP(logP: number, pKa: readonly PKa[], pH: number): number {
  if (!Number.isFinite(logP))
    throw new EngineError('invalid-input', `log P must be a finite number (got ${logP}).`, {
      logP,
    });
  return logP + Math.log10(neutralFraction(pKa, pH));
}

/** Slope and intercept used when a solvent has no published Collander pair. */
const COLLANDER_FALLBACK = { a: 1, b: 0 };

/**
 * Partition coefficient in another solvent/water system from octanol/water
 * log P by the Collander relation:
 *
 *   log K(solvent/water) = a · log P(octanol/water) + b
 *
 * @param logPow log10 P(octanol/water) of the neutral solute [-]
 * @param organicSolventId solvent-library id of the organic solvent
 * @returns log K [-], the a and b used, their source and warnings
 *
 * Validity: the regression's own solute class (for chloroform and benzene
 * the equations were fitted on H-bond donors; acceptors deviate) and the
 * logP range of its training set (roughly −1 … 4). Typical scatter 0.2–0.4.
 * Unknown solvent: falls back to a = 1, b = 0 (octanol-like), with a warning
 * — a poor guess for alkanes (real slopes > 1.5) and for chlorinated solvents.
 *
 * Example: diethyl ether, log P 1.88 → 1.13·1.88 − 0.17 = 1.95.
 *
 * Source: R. Collander, Acta Chem. Scand. 1951, 5, 774; Leo, Hansch & Elkins, Chem. Rev. 1971, 71,
 * 525 (module comment).
 */
export function collanderLogK(
  logPow: number,
  organicSolventId: string,
): { logK: number; a: number; b: number; source: Source; warnings: string[] } {
  if (!Number.isFinite(logPow))
    throw new EngineError('invalid-input', `log P must be a finite number (got ${logPow}).`, {
      logPow,
    });
  const warnings: string[] = [];
  const entry = COLLANDER[organicSolventId];
  if (!entry) {
    warnings.push(
      `No published Collander coefficients for '${organicSolventId}': log K taken equal to octanol/water log P (a = 1, b = 0), a rough guess.`,
    );
    return {
      logK: COLLANDER_FALLBACK.a * logPow + COLLANDER_FALLBACK.b,
      ...COLLANDER_FALLBACK,
      source: {
        ref: 'fallback a = 1, b = 0 (octanol as proxy)',
        status: 'estimated',
      },
      warnings,
    };
  }
  if (entry.source.status === 'unverified-memory') {
    warnings.push(
      `Collander coefficients for '${organicSolventId}' are from memory (${entry.source.ref}); verify.`,
    );
  }
  if (entry.soluteClass === 'h-bond-donors') {
    warnings.push(
      `The '${organicSolventId}' equation was fitted on H-bond-donor solutes; acceptors deviate.`,
    );
  }
  if (logPow < -1 || logPow > 5) {
    warnings.push(
      `log P ${logPow.toFixed(2)} is outside the usual range of the regressions (−1 … 5).`,
    );
  }
  return {
    logK: entry.a * logPow + entry.b,
    a: entry.a,
    b: entry.b,
    source: entry.source,
    warnings,
  };
}

/**
 * Setschenow salting-out factor on the partition coefficient:
 *
 *   K(salt) / K(water) = 10^(ks · Cs)
 *
 * (the solute's aqueous activity coefficient rises by the same factor, so
 * more of it goes to the organic phase).
 *
 * @param ks_Lmol Setschenow constant of the solute–salt pair [L/mol]
 *   (typically 0.1–0.3 for neutral organics in NaCl; negative = salting in)
 * @param saltMolar salt concentration [mol/L], ≥ 0
 * @returns factor [-]
 *
 * Validity: up to a few mol/L; ks is specific to solute and salt.
 * Example: benzene in NaCl, ks ≈ 0.195 L/mol, 1 M → 10^0.195 = 1.567.
 *
 * Source: J. Setschenow, Z. Phys. Chem. 1889, 4, 117 (module comment).
 */
export function setschenowFactor(ks_Lmol: number, saltMolar: number): number {
  if (!Number.isFinite(ks_Lmol))
    throw new EngineError(
      'invalid-input',
      `ks must be a finite number of L/mol (got ${ks_Lmol}).`,
      { ks_Lmol },
    );
  if (!Number.isFinite(saltMolar) || saltMolar < 0)
    throw new EngineError(
      'invalid-input',
      `Salt concentration must be ≥ 0 mol/L (got ${saltMolar}).`,
      { saltMolar },
    );
  return Math.pow(10, ks_Lmol * saltMolar);
}

export interface PhaseSpec {
  groups: UnifacGroups[];
  /** solute-free mole fractions of the phase's solvents [-], sum 1 */
  moleFractions: number[];
  /** molar volume of the phase [m³/mol] */
  molarVolumeM3mol: number;
}

/**
 * A binary liquid phase of a library solvent holding w wt % water, as the
 * activity-coefficient estimate needs it: mole fractions from the masses,
 *   x_W = (w/M_W) / (w/M_W + (100 − w)/M_S),
 * and the molar volume by ideal mixing, V̄ = (1 − x_W) M_S/ρ_S + x_W V̄_W.
 * Components in the order [solvent, water].
 *
 * Source: definition of mole fraction; ideal mixing of volumes (excess volume
 * neglected); water's molar volume at 25 °C (logp.ts V_WATER_M3MOL); the
 * solvent's molar mass and density from the solvent library.
 * Validity: 0 ≤ w ≤ 100; the excess volume of solvent–water mixtures (a few
 * % at most for the partially miscible solvents) is neglected.
 * @param solvent     the library solvent (molar mass [g/mol], density [g/mL], UNIFAC groups)
 * @param waterWtPct  water in the phase [wt %]
 * @returns the phase: groups [solvent, water], mole fractions [–], molar volume [m³/mol]
 */
export function solventWaterPhase(solvent: SolventRecord, waterWtPct: number): PhaseSpec {
  if (!(waterWtPct >= 0 && waterWtPct <= 100))
    throw new EngineError(
      'invalid-input',
      `Water in the phase must be 0–100 wt % (got ${waterWtPct}).`,
      { waterWtPct },
    );
  const M_S = solvent.molarMassGmol.value;
  const nW = waterWtPct / WATER_MOLAR_MASS_GMOL;
  const nS = (100 - waterWtPct) / M_S;
  const xW = nW / (nW + nS);
  const vS = (M_S / solvent.density.value.gPerMl) * 1e-6;
  return {
    groups: [solvent.unifac.value, WATER_GROUPS],
    moleFractions: [1 - xW, xW],
    molarVolumeM3mol: (1 - xW) * vS + xW * V_WATER_M3MOL,
  };
}

/**
 * The two mutually saturated liquid phases of a library solvent and water,
 * from the library's tabulated mutual solubility: the organic phase holds
 * the tabulated water (solventWaterPhase with w = water in solvent), the
 * aqueous phase the tabulated solvent (w = 100 − solvent in water), its
 * components ordered [water, solvent]. Without a tabulated mutual
 * solubility the phases are the pure liquids, with a warning that says so.
 *
 * Source: mutual solubilities of the solvent library (docs/data-sources.md,
 * each with its own source); phases as solventWaterPhase.
 * Validity: the tabulated temperature of the mutual solubility (about
 * 20–25 °C); used at other temperatures it ignores the change of the
 * solubilities with temperature. Partially miscible solvents only (a
 * miscible solvent has no second phase).
 * @param solvent  the library solvent
 * @returns the organic and aqueous phases (mole fractions [–], molar volumes [m³/mol]) and warnings
 */
export function saturatedPhasesWithWater(solvent: SolventRecord): {
  organic: PhaseSpec;
  aqueous: PhaseSpec;
  warnings: string[];
} {
  const mutual = solvent.waterMutualSolubility?.value;
  const warnings: string[] = [];
  if (!mutual)
    warnings.push(
      `No curated mutual solubility of ${solvent.name} with water: the phases are taken as pure for the activity estimate.`,
    );
  const organic = solventWaterPhase(solvent, mutual?.waterInSolventWtPct ?? 0);
  const raw = solventWaterPhase(solvent, 100 - (mutual?.solventInWaterWtPct ?? 0));
  return {
    organic,
    aqueous: {
      groups: [WATER_GROUPS, solvent.unifac.value],
      moleFractions: [raw.moleFractions[1], raw.moleFractions[0]],
      molarVolumeM3mol: raw.molarVolumeM3mol,
    },
    warnings,
  };
}

/**
 * Partition coefficient of a neutral solute at infinite dilution between two
 * mutually saturated liquid phases, from UNIFAC:
 *
 *   K_x = γ∞_aq / γ∞_org,   K_c = K_x · V̄_aq / V̄_org
 *
 * @param input.soluteGroups UNIFAC subgroups of the solute
 * @param input.organic, input.aqueous compositions (mutually saturated, as
 *   the caller knows them) and molar volumes of the phases [m³/mol]
 * @param input.T_K temperature [K]
 * @param input.models optional cache of UNIFAC models (same numbers, fewer model builds)
 * @returns K_x (mole-fraction basis) [-], K_c (molar concentrations,
 *   organic/aqueous) [-], the two γ∞ and warnings
 *
 * Validity: original UNIFAC was fitted to VLE; liquid–liquid partition
 * coefficients from it are typically within a factor 3 (0.5 log) for
 * simple solutes, worse for multifunctional ones. 275–425 K.
 *
 * Source: UNIFAC (Fredenslund, Jones & Prausnitz 1975; Hansen et al. 1991), module comment.
 */
export function partitionByActivity(input: {
  soluteGroups: UnifacGroups;
  organic: PhaseSpec;
  aqueous: PhaseSpec;
  T_K: number;
  models?: UnifacModelCache;
}): {
  Kx: number;
  Kc: number;
  gammaOrganic: number;
  gammaAqueous: number;
  warnings: string[];
} {
  const { soluteGroups, organic, aqueous, T_K } = input;
  if (!Number.isFinite(T_K) || T_K <= 0)
    throw new EngineError(
      'invalid-input',
      `Temperature must be a positive number of kelvin (got ${T_K}).`,
      { T_K },
    );
  for (const [name, ph] of [
    ['organic', organic],
    ['aqueous', aqueous],
  ] as const) {
    if (!Number.isFinite(ph.molarVolumeM3mol) || ph.molarVolumeM3mol <= 0) {
      throw new EngineError(
        'invalid-input',
        `Molar volume of the ${name} phase must be a positive number of m³/mol (got ${ph.molarVolumeM3mol}).`,
        { phase: name },
      );
    }
  }
  const warnings: string[] = [
    'Estimate from UNIFAC (VLE parameters) at infinite dilution; typical error about 0.5 log unit for simple solutes.',
  ];
  if (T_K < 275 || T_K > 425)
    warnings.push(
      `UNIFAC parameters were fitted at about 275–425 K; ${T_K.toFixed(1)} K is outside.`,
    );
  const gammaOrganic = gammaInfiniteDilution(
    soluteGroups,
    organic.groups,
    organic.moleFractions,
    T_K,
    input.models,
  );
  const gammaAqueous = gammaInfiniteDilution(
    soluteGroups,
    aqueous.groups,
    aqueous.moleFractions,
    T_K,
    input.models,
  );
  const Kx = gammaAqueous / gammaOrganic;
  const Kc = (Kx * aqueous.molarVolumeM3mol) / organic.molarVolumeM3mol;
  return { Kx, Kc, gammaOrganic, gammaAqueous, warnings };
}

export type DistributionInput = {
  solute: {
    logP?: number;
    pKa?: readonly PKa[];
    unifac?: UnifacGroups;
    measured?: Array<{
      organicSolventId: string;
      pH?: number;
      temperatureC?: number;
      D: number;
      source?: string;
    }>;
  };
  organic: {
    solventId: string;
    groups?: UnifacGroups[];
    moleFractions?: number[];
    molarVolumeM3mol?: number;
  };
  aqueous: {
    pH?: number;
    salt?: { ks_Lmol: number; molar: number };
    groups?: UnifacGroups[];
    moleFractions?: number[];
    molarVolumeM3mol?: number;
  };
  T_K: number;
  prefer?: 'activity' | 'collander';
  /** Optional cache of UNIFAC models for the activity estimate (same numbers, fewer model builds). */
  models?: UnifacModelCache;
  /**
   * Optional stand-in for partitionByActivity that must return what it returns for the same input
   * (a caller's memo of the estimate for phases it asks about repeatedly); called only when the
   * activity estimate is the method used.
   */
  activityEstimate?: typeof partitionByActivity;
};

export interface DistributionResult {
  /** distribution ratio, organic/aqueous, of total solute (all species) [-] */
  D: number;
  logD: number;
  basis: 'molar-concentration';
  method: 'measured' | 'activity-coefficients (UNIFAC)' | 'Collander from logP';
  source: Source;
  warnings: string[];
}

function activityReady(input: DistributionInput): boolean {
  const { solute, organic, aqueous } = input;
  return !!(
    solute.unifac &&
    organic.groups &&
    organic.moleFractions &&
    organic.molarVolumeM3mol &&
    aqueous.groups &&
    aqueous.moleFractions &&
    aqueous.molarVolumeM3mol
  );
}

/**
 * Distribution ratio D = c_org(total) / c_aq(total) of a solute between an
 * organic solvent and an aqueous phase.
 *
 * Order of evidence:
 *  1. a measured D for the same organic solvent wins; of several, the one
 *     nearest in pH (then in temperature) is used and the choice is stated.
 *     If its pH differs from the requested one and pKa are known, it is
 *     shifted by the ratio of neutral fractions (HH) with a warning.
 *  2. otherwise K of the neutral species is estimated — by default from
 *     the Collander relation when a log P is given and the solvent has
 *     published coefficients, else from UNIFAC activity coefficients
 *     (`prefer` overrides) — and corrected:
 *        D = K · f_n(pH) · 10^(ks·Cs)
 *
 * @param input see DistributionInput; T_K [K]; pH [-]; salt ks [L/mol],
 *   molar [mol/L]; molar volumes [m³/mol]
 * @returns D, log D, basis, the method and its source, warnings
 *
 * Throws EngineError('invalid-input') when neither a measurement, a log P
 * nor the UNIFAC inputs are given.
 *
 * Source: the methods it combines (module comment): measured D, Collander 1951, UNIFAC,
 * Henderson–Hasselbalch, Setschenow 1889.
 * Validity: that of the method used (named in the result); dilute solutes.
 */
export function distributionRatio(input: DistributionInput): DistributionResult {
  const { solute, organic, aqueous, T_K } = input;
  if (!Number.isFinite(T_K) || T_K <= 0)
    throw new EngineError(
      'invalid-input',
      `Temperature must be a positive number of kelvin (got ${T_K}).`,
      { T_K },
    );
  const warnings: string[] = [];
  const pKa = solute.pKa ?? [];
  const pH = aqueous.pH;
  if (pKa.length > 0 && pH === undefined) {
    warnings.push(
      'The solute is ionisable but no pH was given: the neutral form is assumed throughout.',
    );
  }
  const fn = (p: number | undefined): number =>
    p === undefined || pKa.length === 0 ? 1 : neutralFraction(pKa, p);

  const measured = (solute.measured ?? []).filter((m) => m.organicSolventId === organic.solventId);
  if (measured.length > 0) {
    const tC = T_K - 273.15;
    const ranked = [...measured].sort((m1, m2) => {
      const dp1 = pH === undefined || m1.pH === undefined ? 0 : Math.abs(m1.pH - pH);
      const dp2 = pH === undefined || m2.pH === undefined ? 0 : Math.abs(m2.pH - pH);
      if (dp1 !== dp2) return dp1 - dp2;
      const dt1 = m1.temperatureC === undefined ? 0 : Math.abs(m1.temperatureC - tC);
      const dt2 = m2.temperatureC === undefined ? 0 : Math.abs(m2.temperatureC - tC);
      return dt1 - dt2;
    });
    const m = ranked[0];
    if (!Number.isFinite(m.D) || m.D <= 0)
      throw new EngineError(
        'invalid-input',
        `A measured D must be a positive number (got ${m.D}).`,
        { D: m.D },
      );
    let D = m.D;
    const desc = `measured D = ${m.D} in ${m.organicSolventId}${m.pH !== undefined ? ` at pH ${m.pH}` : ''}${m.temperatureC !== undefined ? `, ${m.temperatureC} °C` : ''}`;
    if (measured.length > 1)
      warnings.push(
        `Of ${measured.length} measurements the nearest in pH, then temperature, was used (${desc}).`,
      );
    if (m.pH !== undefined && pH !== undefined && m.pH !== pH) {
      if (pKa.length > 0) {
        D = D * (fn(pH) / fn(m.pH));
        warnings.push(
          `Measured at pH ${m.pH}; shifted to pH ${pH} by Henderson–Hasselbalch with the given pKa.`,
        );
      } else {
        warnings.push(
          `Measured at pH ${m.pH}, requested pH ${pH}; no pKa given, so no pH correction.`,
        );
      }
    }
    if (m.temperatureC !== undefined && Math.abs(m.temperatureC - tC) > 5) {
      warnings.push(
        `Measured at ${m.temperatureC} °C, requested ${tC.toFixed(1)} °C; no temperature correction applied.`,
      );
    }
    if (aqueous.salt) {
      D *= setschenowFactor(aqueous.salt.ks_Lmol, aqueous.salt.molar);
      warnings.push(
        'Setschenow salting-out factor applied on top of the measured value (the measurement is taken as salt-free).',
      );
    }
    return {
      D,
      logD: Math.log10(D),
      basis: 'molar-concentration',
      method: 'measured',
      source: { ref: m.source ?? desc, status: 'confirmed', note: desc },
      warnings,
    };
  }

  const canActivity = activityReady(input);
  const canCollander = solute.logP !== undefined;
  let useCollander: boolean;
  if (input.prefer === 'activity') {
    useCollander = !canActivity && canCollander;
    if (useCollander)
      warnings.push(
        'Activity-coefficient estimate preferred but UNIFAC groups, compositions or molar volumes are missing: Collander used.',
      );
  } else if (input.prefer === 'collander') {
    useCollander = canCollander;
    if (!useCollander && canActivity)
      warnings.push('Collander preferred but no log P given: UNIFAC activity coefficients used.');
  } else {
    useCollander = canCollander && (COLLANDER[organic.solventId] !== undefined || !canActivity);
  }
  if (!useCollander && !canActivity) {
    throw new EngineError(
      'invalid-input',
      'Cannot estimate the partition: give a measured D, a log P, or UNIFAC groups with both phase compositions and molar volumes.',
      {},
    );
  }

  let K: number;
  let method: DistributionResult['method'];
  let source: Source;
  if (useCollander) {
    const c = collanderLogK(solute.logP as number, organic.solventId);
    K = Math.pow(10, c.logK);
    method = 'Collander from logP';
    source = c.source;
    warnings.push(...c.warnings);
    if (Math.abs(T_K - 298.15) > 10)
      warnings.push(
        'Collander coefficients and log P refer to about 25 °C; no temperature correction applied.',
      );
  } else {
    const r = (input.activityEstimate ?? partitionByActivity)({
      soluteGroups: solute.unifac as UnifacGroups,
      organic: {
        groups: organic.groups as UnifacGroups[],
        moleFractions: organic.moleFractions as number[],
        molarVolumeM3mol: organic.molarVolumeM3mol as number,
      },
      aqueous: {
        groups: aqueous.groups as UnifacGroups[],
        moleFractions: aqueous.moleFractions as number[],
        molarVolumeM3mol: aqueous.molarVolumeM3mol as number,
      },
      T_K,
      models: input.models,
    });
    K = r.Kc;
    method = 'activity-coefficients (UNIFAC)';
    source = {
      ref: 'UNIFAC (Fredenslund et al. 1975; parameters Hansen et al. 1991)',
      status: 'estimated',
    };
    warnings.push(...r.warnings);
  }
  let D = K * fn(pH);
  if (aqueous.salt) D *= setschenowFactor(aqueous.salt.ks_Lmol, aqueous.salt.molar);
  return {
    D,
    logD: Math.log10(D),
    basis: 'molar-concentration',
    method,
    source,
    warnings,
  };
}
