/**
 * Filtration and cake wash.
 *
 * Retained liquor: the cake holds r L of liquor per kg of solid (default
 * 0.5 L/kg, common practice for crystalline pharmaceutical cakes), of the
 * mother-liquor composition.
 *
 * Cake wash, per wash of volume V_w on the retained volume V_r (wash ratio
 * W = V_w/V_r):
 *  - displacement: the fraction of each dissolved component of the retained
 *    liquor left in the cake is
 *        R(W) = φ + (1 − φ) max(1 − W, (1 − E)^W)
 *    (the exponential washing curve of Choudhury & Dahlstrom, AIChE J. 1957,
 *    3, 433 — citation recalled — with E the fraction displaced by one
 *    retained volume, default 0.8, common practice; bounded below by plug
 *    flow, which cannot displace more liquor than the wash volume), with a
 *    stagnant fraction φ of the liquor that no wash displaces (Rhodes, Ind.
 *    Eng. Chem. 1934, 26, 1331, recalled; default 0.05, common practice):
 *    a larger wash displaces more, but never below φ per wash;
 *  - the wash's own composition: the liquid charged is the wash solvent; the
 *    part that stays in the cake, (1 − R) V_r, replaces the displaced liquor;
 *    the rest, V_p = V_w − (1 − R) V_r, passes through the cake;
 *  - dissolution of the solid by the passing wash: the wash, entering free of
 *    solute, approaches saturation in its own solvent while it crosses the
 *    cake, dc/dt = k a (c_sat − c), so it leaves at a fraction
 *        η = 1 − exp(−k a τ)
 *    of saturation: k = Sh·D/d (film mass transfer, Sh = 2, the stagnant
 *    sphere limit, a lower bound), a = 6 V_solid/(d V_r) the crystal surface
 *    per volume of pore liquid, τ = V_r/Q_w the wash's residence time in the
 *    cake at the final filtration rate Q_w, D the solute diffusivity by the
 *    Stokes–Einstein relation D = k_B T/(6π μ r), r the radius of a sphere of
 *    the solute's molar volume. The crystal size d is a parameter (100 µm
 *    assumed, with a warning, when not given). Loss = η · c_sat · V_p, at
 *    most the solid present; the result reports η per wash.
 *
 * Filtration time from the cake-filtration equation (Ruth; McCabe, Smith &
 * Harriott, Unit Operations of Chemical Engineering, filtration chapter):
 *   t = (μ α c / (2 A² ΔP)) V² + (μ R_m / (A ΔP)) V
 * t [s], μ liquor viscosity [Pa s], α specific cake resistance [m/kg],
 * c dry cake mass per filtrate volume [kg/m³], A filter area [m²],
 * ΔP pressure drop [Pa], R_m medium resistance [1/m], V filtrate volume [m³].
 * Each wash flows at the final filtration rate:
 *   Q_w = A ΔP / (μ_w (α c V / A + R_m)),  t_w = V_w / Q_w.
 * Liquor viscosity: ln μ_mix = Σ x_i ln μ_i (Arrhenius mixing rule) from the
 * library's 25 °C values, corrected to T by the Lewis–Squires chart
 * correlation μ^−0.2661 = μ_25^−0.2661 + (T − 298.15)/233 (μ in mPa s, T in
 * K; see lewisSquires for where it was read and what is recalled).
 * Validity: incompressible cake, constant pressure; α, R_m and A are
 * parameters with stated defaults.
 */
import type { ParamsOf, RouteStep } from '../document';
import { RANGES } from '../document';
import type { EvalContext } from '../route/context';
import {
  commonCautions,
  cToK,
  emptyStream,
  finishStream,
  method,
  solventKgFromVolume,
  streamVolume,
  volumeToM3,
  warn,
} from '../route/context';
import { StepError } from '../route/errors';
import type { EngineWarning, StepOutput, Stream } from '../route/types';
import { COMMON_PRACTICE_BASIS, COMMON_PRACTICE_HOURS, newResult, round } from './common';
import { solubilityIn } from './solubility-model';

/**
 * Viscosity of the liquid part of a stream at T: Arrhenius mixing of the
 * solvents' 25 °C viscosities (mole fractions), Lewis–Squires for T.
 *
 * @param ctx      evaluation context
 * @param kg       component masses [kg] (only solvents count)
 * @param T_K      temperature [K]
 * @param warnings receives a warning when Lewis–Squires is used below its range
 * @returns μ [Pa s], or null when the stream holds no solvent
 *
 * Formula: ln μ_mix = Σ x_i ln μ_i(T) over the solvents (mole fractions x_i),
 * μ_i(T) by lewisSquires from the library's 25 °C value.
 * Source: Arrhenius (log-mole-fraction) mixing rule (common practice; its
 * treatment in the liquid-viscosity chapter of Poling, Prausnitz & O'Connell,
 * The Properties of Gases and Liquids, is recalled, not read) and the
 * Lewis–Squires correction (see lewisSquires); 25 °C viscosities from the
 * solvent library (docs/data-sources.md).
 * Validity: non-associating mixtures are best served; for aqueous–alcohol
 * mixtures (viscosity maximum) the rule can be off by a factor of about 2;
 * temperatures where Lewis–Squires has a solution (a warning otherwise);
 * dissolved solutes do not raise the viscosity here.
 */
export function liquorViscosityPaS(
  ctx: EvalContext,
  kg: Record<string, number>,
  T_K: number,
  warnings?: EngineWarning[],
): number | null {
  let lnMu = 0;
  let n = 0;
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'solvent' || !(kg[id] > 0)) continue;
    const mol = kg[id] / c.molarMassKgMol;
    const ls = lewisSquires(c.solvent!.viscosityMPas25C.value, T_K);
    if (!ls.inRange && warnings)
      warn(
        warnings,
        'warning',
        'viscosity-extrapolated',
        `${c.name}: the Lewis–Squires viscosity correlation has no solution at ${(T_K - 273.15).toFixed(0)} °C; the viscosity at ${(ls.T_K - 273.15).toFixed(0)} °C, the lowest temperature it reaches, is used (filtration times too short).`,
      );
    lnMu += mol * Math.log(ls.muMPas);
    n += mol;
  }
  if (n === 0) return null;
  return Math.exp(lnMu / n) / 1000;
}

/**
 * Lewis–Squires temperature correction of a liquid viscosity:
 *   μ(T)^−0.2661 = μ_25^−0.2661 + (T − 298.15)/233   (μ in mPa s, T in K).
 *
 * @param mu25  viscosity at 25 °C [mPa s], > 0
 * @param T_K   temperature [K]
 * @returns μ at T [mPa s]; where the right-hand side is not positive (far
 *   below 25 °C) the correlation has no solution: inRange is false and μ is
 *   given at the temperature where μ reaches 1000 × μ_25 (T_K says which)
 *
 * Source: the Lewis–Squires generalised chart of liquid viscosity against
 * temperature (W. K. Lewis, L. Squires, 1934 — citation recalled), given as
 * Fig. 9-13 and Eq. (9-10.3) of Poling, Prausnitz & O'Connell, The Properties
 * of Gases and Liquids, 5th ed., McGraw-Hill, 2001 (figure and equation
 * numbers read in the documentation of the open propellant-property library
 * RocketProps, page "Models", section "Squires"; the book itself was not
 * read, so the constants 0.2661 and 233 K are recalled).
 * Validity: liquids below their normal boiling point, from one reference
 * value (a generalised chart: its error grows with the distance from 25 °C);
 * far below 25 °C the correlation has no solution (inRange false, μ capped
 * at 1000 μ_25).
 */
export function lewisSquires(
  mu25: number,
  T_K: number,
): { muMPas: number; inRange: boolean; T_K: number } {
  const base = mu25 ** -0.2661;
  const v = base + (T_K - 298.15) / 233;
  const vMin = base * 1000 ** -0.2661;
  if (v >= vMin) return { muMPas: v ** (-1 / 0.2661), inRange: true, T_K };
  return { muMPas: vMin ** (-1 / 0.2661), inRange: false, T_K: 298.15 + 233 * (vMin - base) };
}

/**
 * Cake-filtration time at constant pressure (Ruth equation; McCabe, Smith &
 * Harriott, filtration chapter):
 *   t = (μ α c / (2 A² ΔP)) V² + (μ R_m / (A ΔP)) V
 * @param i.muPaS        filtrate viscosity μ [Pa s]
 * @param i.alphaMPerKg  specific cake resistance α [m/kg]
 * @param i.cKgM3        dry cake mass per filtrate volume c [kg/m³]
 * @param i.areaM2       filter area A [m²]
 * @param i.dPPa         pressure drop ΔP [Pa]
 * @param i.RmPerM       medium resistance R_m [1/m]
 * @param i.VM3          filtrate volume V [m³]
 * @returns t [s]
 * Validity: incompressible cake, constant ΔP.
 * Source: Ruth 1935; McCabe, Smith & Harriott, Unit Operations of Chemical
 * Engineering, filtration chapter.
 */
export function cakeFiltrationTime(i: {
  muPaS: number;
  alphaMPerKg: number;
  cKgM3: number;
  areaM2: number;
  dPPa: number;
  RmPerM: number;
  VM3: number;
}): number {
  const { muPaS: mu, alphaMPerKg: a, cKgM3: c, areaM2: A, dPPa: dP, RmPerM: Rm, VM3: V } = i;
  return ((mu * a * c) / (2 * A * A * dP)) * V * V + ((mu * Rm) / (A * dP)) * V;
}

/** Crystal size assumed for the wash-dissolution rate when none is given [µm] (common practice for pharmaceutical crystals). */
export const DEFAULT_CRYSTAL_SIZE_UM = 100;

const BOLTZMANN_J_PER_K = 1.380649e-23;
const AVOGADRO_PER_MOL = 6.02214076e23;

/**
 * Fraction of the retained liquor a single wash cannot displace however large
 * it is, when the route gives none [–]: 0.05 (common practice — washing curves
 * of crystalline cakes flatten at a few per cent of the original solute per
 * wash; the value is stated from memory, not from a measured curve: enter the
 * measured one).
 */
export const DEFAULT_UNDISPLACED_FRACTION = 0.05;

/**
 * Fraction of a dissolved component of the retained cake liquor left after a
 * displacement wash of W retained volumes, with a stagnant part φ that the
 * wash does not reach:
 *   R(W) = φ + (1 − φ) · max(1 − W, (1 − E)^W)
 * The mobile liquor (1 − φ) follows the exponential washing curve (Choudhury
 * & Dahlstrom, AIChE J. 1957, 3, 433 — recalled) bounded below by plug flow;
 * the stagnant liquor φ (dead-end pores, the inside of agglomerates, particle
 * contacts, liquor bypassed by channelling) is left by the wash and mixes
 * with the cake liquor before the next wash — the two-region picture of
 * Rhodes, Ind. Eng. Chem. 1934, 26, 1331 (displacement followed by a slow
 * diffusion-controlled tail; citation from memory) and of the washing-curve
 * tail in Wakeman & Tarleton, Solid/Liquid Separation: Principles of
 * Industrial Filtration, 2005, cake-washing chapter (from memory), taken here
 * as a floor: however large the wash, R ≥ φ.
 * @param W    wash ratio V_wash/V_retained [–], ≥ 0
 * @param E    fraction of the mobile liquor displaced by one retained volume [–], 0 ≤ E ≤ 1
 * @param phi  fraction of the retained liquor one wash cannot displace [–], 0 ≤ φ < 1
 *   (default DEFAULT_UNDISPLACED_FRACTION)
 * @returns R [–], φ ≤ R ≤ 1 for W > 0; R(0) = 1, R(1) = φ + (1 − φ)(1 − E),
 *   R → φ as W → ∞ (continuous and non-increasing in W)
 * Source: as above; plug-flow bound 1 − W from the mass balance; the floor
 * value is common practice.
 * Validity: the wash miscible with the liquor; E and φ from a measured
 * washing curve. Successive washes multiply (n washes leave at least φ^n):
 * this assumes the stagnant liquor re-mixes with the fresh liquor between
 * washes (a soak); without one the tail is slower and the purge of many washes
 * is overstated. Liquor occluded inside crystals is not cake liquor: it
 * belongs to the crystallisation's incorporation factor.
 */
export function washRemainingFraction(
  W: number,
  E: number,
  phi: number = DEFAULT_UNDISPLACED_FRACTION,
): number {
  if (!(W > 0)) return 1;
  const f = Math.min(Math.max(phi, 0), 1);
  const mobile = !Number.isFinite(W) ? 0 : Math.min(1, Math.max(1 - W, E >= 1 ? 0 : (1 - E) ** W));
  return f + (1 - f) * mobile;
}

/**
 * Approach to saturation of a wash crossing a cake of crystals:
 *   η = 1 − exp(−k a τ),  k = Sh D/d (Sh = 2),  a = 6 V_s/(d V_r),
 *   D = k_B T/(6π μ r),  r = (3 V_m/(4π N_A))^(1/3)
 * (film mass transfer to a sphere in stagnant liquid, Sh = 2; Stokes–Einstein
 * diffusivity, Einstein 1905).
 * @param i.crystalSizeM         crystal diameter d [m]
 * @param i.solidVolumeM3        volume of the solid [m³]
 * @param i.poreVolumeM3         liquid held in the cake V_r [m³]
 * @param i.residenceTimeS       time the wash spends in the cake τ [s]
 * @param i.T_K                  temperature [K]
 * @param i.viscosityPaS         wash viscosity μ [Pa s]
 * @param i.soluteMolarVolumeM3  molar volume of the solute V_m [m³/mol]
 * @returns η [–], 0 ≤ η ≤ 1
 * Validity: dilute wash, isolated spherical crystals; Sh = 2 is a lower bound
 * of the transfer rate (flow raises it), so η is a lower bound too.
 * Source: film mass transfer to a sphere, Sh = 2 (the stagnant limit of the
 * Ranz–Marshall correlation, Chem. Eng. Prog. 1952, 48, 141 — from memory);
 * Stokes–Einstein diffusivity (Einstein, Ann. Phys. 1905); surface per volume
 * of spheres 6/d (geometry).
 */
export function approachToSaturation(i: {
  crystalSizeM: number;
  solidVolumeM3: number;
  poreVolumeM3: number;
  residenceTimeS: number;
  T_K: number;
  viscosityPaS: number;
  soluteMolarVolumeM3: number;
}): number {
  if (!(i.poreVolumeM3 > 0) || !(i.residenceTimeS > 0)) return 0;
  const r = Math.cbrt((3 * i.soluteMolarVolumeM3) / (4 * Math.PI * AVOGADRO_PER_MOL));
  const D = (BOLTZMANN_J_PER_K * i.T_K) / (6 * Math.PI * i.viscosityPaS * r);
  const k = (2 * D) / i.crystalSizeM;
  const a = (6 * i.solidVolumeM3) / (i.crystalSizeM * i.poreVolumeM3);
  return 1 - Math.exp(-k * a * i.residenceTimeS);
}

function emptyKg(ctx: EvalContext): Record<string, number> {
  const o: Record<string, number> = {};
  for (const id of ctx.ids) o[id] = 0;
  return o;
}

/**
 * Filtration step model: cake and filtrate from the slurry, the retained
 * liquor at the mother-liquor composition, the cake-filtration time, and each
 * cake wash by displacement (washRemainingFraction) with the dissolution of
 * the solid by the passing wash (approachToSaturation); formulae in the
 * module comment. The filtrate closes the mass balance by difference.
 *
 * Source: Ruth 1935 and McCabe, Smith & Harriott (filtration time);
 * Choudhury & Dahlstrom 1957 (washing curve, recalled) with the stagnant
 * floor of Rhodes 1934 (recalled); Ranz & Marshall
 * Sh = 2 and Stokes–Einstein (dissolution rate); solubility-model.ts
 * (solubility in the wash); retained liquor 0.5 L/kg, E = 0.8, φ = 0.05 and
 * crystal size 100 µm as defaults are common practice.
 * Validity: incompressible cake at constant pressure; α, R_m, A and the
 * retained liquor are parameters (defaults stated); the wash loss is a lower
 * bound (Sh = 2); as the solubility model for the wash.
 * @param inputs  the slurry on port 'slurry'
 * @param params  the step's parameters (retainedLiquorLPerKg [L/kg], specificCakeResistanceMPerKg [m/kg], mediumResistancePerM [1/m], filterAreaM2 [m²], pressureDropBar [bar], cakeWash with volume, temperatureC [°C], displacementEfficiency [–], undisplacedFraction [–], crystalSizeUm [µm])
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the cake and the filtrate with the step result (times [h], wash records, wet-cake LOD [%])
 */
export function filtration(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'filtration'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const slurry = inputs.slurry!;
  const T = slurry.temperatureK;
  const result = newResult(step, { hours: 0, basis: COMMON_PRACTICE_BASIS });
  const W = result.warnings;
  const M = result.methods;
  const r = ctx.num(params.retainedLiquorLPerKg, 0, 10) / 1000; // m³/kg
  const alpha = ctx.num(params.specificCakeResistanceMPerKg, 1e6, 1e15);
  const Rm = ctx.num(params.mediumResistancePerM, 0, 1e14);
  const A = ctx.num(params.filterAreaM2, 1e-4, 100);
  const dP = ctx.num(params.pressureDropBar, 0.01, 20) * 1e5;
  method(
    M,
    'retained liquor',
    `${(r * 1000).toFixed(2)} L per kg solid`,
    params.retainedLiquorLPerKg === 0.5 ? 'default, common practice' : 'route document',
  );
  const solid: Record<string, number> = {};
  const liquor: Record<string, number> = {};
  let Ms = 0;
  for (const id of ctx.ids) {
    solid[id] = slurry.solidKg[id];
    liquor[id] = slurry.kg[id] - slurry.solidKg[id];
    Ms += solid[id];
  }
  if (Ms <= 0)
    warn(W, 'warning', 'no-solid', 'The slurry holds no solid: everything passes to the filtrate.');
  const VL = streamVolume(ctx, liquor, T);
  let Vr = r * Ms;
  if (Vr > VL) {
    warn(
      W,
      'warning',
      'wet-cake',
      'The cake would retain more liquor than the slurry has: all the liquor stays in the cake (a paste, not a filterable slurry).',
    );
    Vr = VL;
  }
  const f = VL > 0 ? Vr / VL : 0;
  const cakeLiq: Record<string, number> = {};
  const filtrate = emptyStream(ctx, 'liquid', T);
  for (const id of ctx.ids) {
    cakeLiq[id] = liquor[id] * f;
    filtrate.kg[id] = liquor[id] - cakeLiq[id];
  }
  const Vf = VL - Vr;
  const mu = liquorViscosityPaS(ctx, liquor, T, W);
  const c = Vf > 0 ? Ms / Vf : 0;
  let tFilt = 0;
  if (mu !== null && Vf > 0) {
    tFilt = cakeFiltrationTime({
      muPaS: mu,
      alphaMPerKg: alpha,
      cKgM3: c,
      areaM2: A,
      dPPa: dP,
      RmPerM: Rm,
      VM3: Vf,
    });
    method(
      M,
      'filtration time',
      'cake-filtration equation t = (μαc/2A²ΔP)V² + (μR_m/AΔP)V',
      'Ruth 1935; McCabe, Smith & Harriott, Unit Operations of Chemical Engineering, filtration chapter',
    );
    method(
      M,
      'liquor viscosity',
      'Arrhenius mixing rule; Lewis–Squires temperature correction',
      'library 25 °C viscosities; Lewis–Squires chart as Eq. 9-10.3 of Poling, Prausnitz & O’Connell 5th ed. (constants recalled)',
    );
  }
  const washRecords: Array<{
    wash: number;
    washRatio: number;
    displacedPct: number;
    passingL: number;
    approachToSaturationPct: number;
    dissolvedKg: Record<string, number>;
    timeH: number;
  }> = [];
  let tWash = 0;
  if (params.cakeWash) {
    const cw = params.cakeWash;
    const ws = ctx.comps.get(cw.solventId)!;
    if (ws.kind !== 'solvent')
      throw new StepError(
        'params.cakeWash.solventId',
        'The cake-wash liquid must be a solvent component.',
      );
    const Tw =
      cw.temperatureC !== undefined ? cToK(ctx.num(cw.temperatureC, ...RANGES.temperatureC)) : T;
    const Vw = volumeToM3(ctx, cw.volume);
    const eps = ctx.num(cw.displacementEfficiency, 0, 1);
    const phi =
      cw.undisplacedFraction !== undefined
        ? ctx.num(cw.undisplacedFraction, 0, 0.5)
        : DEFAULT_UNDISPLACED_FRACTION;
    if (cw.undisplacedFraction === undefined)
      warn(
        W,
        'info',
        'wash-floor-assumed',
        `No value given for the liquor a cake wash cannot displace: ${DEFAULT_UNDISPLACED_FRACTION * 100} % of the retained liquor assumed (common practice), so no wash leaves less than that of each dissolved impurity; enter the value from a measured washing curve.`,
      );
    const wKg = solventKgFromVolume(ctx, cw.solventId, Vw, Tw);
    const muW = liquorViscosityPaS(ctx, { ...emptyKg(ctx), [cw.solventId]: 1 }, Tw, W)!;
    let dUm: number;
    if (cw.crystalSizeUm !== undefined) dUm = ctx.num(cw.crystalSizeUm, 1, 5000);
    else {
      dUm = DEFAULT_CRYSTAL_SIZE_UM;
      warn(
        W,
        'warning',
        'crystal-size-assumed',
        `No crystal size given for the cake wash: ${DEFAULT_CRYSTAL_SIZE_UM} µm assumed (common practice) for the rate at which the wash dissolves the solid; enter the measured size.`,
      );
    }
    method(
      M,
      'cake wash',
      `displacement R = φ + (1 − φ) max(1 − W, (1 − E)^W) with E = ${eps} per retained volume and φ = ${phi} of the liquor no wash displaces${cw.undisplacedFraction === undefined ? ' (assumed, common practice)' : ''}; the passing wash dissolves the solid at the film rate (Sh = 2, Stokes–Einstein diffusivity, ${dUm} µm crystals)`,
      cw.displacementEfficiency === 0.8
        ? 'Choudhury & Dahlstrom 1957 (recalled); Rhodes 1934 two-region wash (recalled); default efficiency, common practice'
        : 'Choudhury & Dahlstrom 1957 (recalled); Rhodes 1934 two-region wash (recalled); efficiency from the route document',
    );
    // Wash flow at the final cake (Ruth): Q_w = A ΔP / (μ_w (α c V_f / A + R_m)) [m³/s].
    const resistance = (alpha * c * Vf) / A + Rm;
    const Qw = resistance > 0 ? (A * dP) / (muW * resistance) : Infinity;
    for (let k = 0; k < cw.washes; k++) {
      result.addedKg[cw.solventId] = (result.addedKg[cw.solventId] ?? 0) + wKg;
      result.addedVolumeM3 += Vw;
      const Wr = Vr > 0 ? Vw / Vr : Infinity;
      const remaining = Vr > 0 ? washRemainingFraction(Wr, eps, phi) : 0;
      const d = 1 - remaining;
      // Displaced liquor to the filtrate; the same volume of wash solvent stays in the cake.
      for (const id of ctx.ids) {
        const moved = cakeLiq[id] * d;
        cakeLiq[id] -= moved;
        filtrate.kg[id] += moved;
      }
      const keptM3 = Math.min(Vw, d * Vr);
      const keptKg = keptM3 / ws.specificVolume(Tw);
      cakeLiq[cw.solventId] += keptKg;
      const passingKg = wKg - keptKg;
      filtrate.kg[cw.solventId] += passingKg;
      const passingM3 = passingKg * ws.specificVolume(Tw);
      // Dissolution of the solid by the passing wash (its own composition: the wash solvent).
      const dissolved: Record<string, number> = {};
      let etaReport = 0;
      const tauS = Vr > 0 && Number.isFinite(Qw) ? Vr / Qw : 0;
      for (const id of ctx.ids) {
        const cc = ctx.comps.get(id)!;
        if (!(solid[id] > 0) || cc.kind !== 'compound' || !(passingKg > 0)) continue;
        const sat = solubilityIn(ctx, id, { [cw.solventId]: passingKg }, Tw, W, M);
        if (!sat) {
          warn(
            W,
            'warning',
            'wash-loss-not-estimated',
            `${cc.name}: no solubility data in ${ws.name}, so what the cake wash dissolves of it is not estimated (taken as none).`,
          );
          continue;
        }
        const eta = approachToSaturation({
          crystalSizeM: dUm * 1e-6,
          solidVolumeM3: solid[id] * cc.specificVolume(Tw),
          poreVolumeM3: Vr,
          residenceTimeS: tauS,
          T_K: Tw,
          viscosityPaS: muW,
          soluteMolarVolumeM3: cc.molarMassKgMol * cc.specificVolume(Tw),
        });
        etaReport = Math.max(etaReport, eta);
        const loss = Math.min(solid[id], eta * sat.capacityKg);
        if (loss > 0) {
          solid[id] -= loss;
          filtrate.kg[id] += loss;
          dissolved[id] = round(loss, 6);
        }
      }
      const tw = Number.isFinite(Qw) ? Vw / Qw : 0;
      tWash += tw;
      washRecords.push({
        wash: k + 1,
        washRatio: round(Wr, 4),
        displacedPct: round(100 * d, 2),
        passingL: round(passingM3 * 1000, 4),
        approachToSaturationPct: round(100 * etaReport, 2),
        dissolvedKg: dissolved,
        timeH: round(tw / 3600, 4),
      });
    }
  }
  const cake = emptyStream(ctx, 'solid', T);
  for (const id of ctx.ids) {
    cake.kg[id] = solid[id] + cakeLiq[id];
    cake.solidKg[id] = solid[id];
  }
  // Mass balance by difference keeps the closure exact.
  for (const id of ctx.ids)
    filtrate.kg[id] = slurry.kg[id] + (result.addedKg[id] ?? 0) - cake.kg[id];
  finishStream(ctx, cake);
  finishStream(ctx, filtrate);
  const cakeTotal = Object.values(cake.kg).reduce((a, b) => a + b, 0);
  const solidTotal = Object.values(solid).reduce((a, b) => a + b, 0);
  const lod = cakeTotal > 0 ? (100 * (cakeTotal - solidTotal)) / cakeTotal : 0;
  const pid = ctx.productId;
  if (pid && slurry.kg[pid] > 0) {
    result.summary['product to cake %'] = round((100 * solid[pid]) / slurry.kg[pid], 2);
  }
  result.summary['filtration h'] = round(tFilt / 3600, 3);
  result.summary['wet-cake LOD %'] = round(lod, 2);
  result.peakVolumeM3 = slurry.volumeM3;
  result.duration = {
    hours:
      COMMON_PRACTICE_HOURS.filtrationSetup +
      (tFilt + tWash) / 3600 +
      (params.cakeWash ? params.cakeWash.washes * COMMON_PRACTICE_HOURS.cakeWash : 0),
    basis: `${COMMON_PRACTICE_BASIS} plus the cake-filtration equation`,
  };
  result.details = {
    retainedLiquorL: Vr * 1000,
    filtrateVolumeL: Vf * 1000,
    cakeConcentrationKgM3: c,
    liquorViscosityMPas: mu === null ? null : mu * 1000,
    filtrationTimeH: tFilt / 3600,
    washTimeH: tWash / 3600,
    washes: washRecords,
    wetCakeLodWtPct: lod,
    parameters: {
      specificCakeResistanceMPerKg: alpha,
      mediumResistancePerM: Rm,
      filterAreaM2: A,
      pressureDropBar: dP / 1e5,
    },
  };
  commonCautions(ctx, liquor, T, W, { transfer: true });
  return { outputs: { cake, filtrate }, result };
}
