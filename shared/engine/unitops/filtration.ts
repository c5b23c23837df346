/**
 * Filtration and cake wash.
 *
 * Retained liquor: the cake holds r L of liquor per kg of solid (default
 * 0.5 L/kg, common practice for crystalline pharmaceutical cakes), of the
 * mother-liquor composition. Cake wash: each wash of volume V_w displaces a
 * fraction ε·min(1, V_w/V_r) of the retained liquor (ε the displacement
 * efficiency, default 0.8, common practice), replaced by wash solvent; the
 * rest of the wash passes to the filtrate. The wash is taken to leave
 * saturated with each solid it meets (an upper bound on wash losses).
 *
 * Filtration time from the cake-filtration equation (Ruth; McCabe, Smith &
 * Harriott, Unit Operations of Chemical Engineering, filtration chapter):
 *   t = (μ α c / (2 A² ΔP)) V² + (μ R_m / (A ΔP)) V
 * t [s], μ liquor viscosity [Pa s], α specific cake resistance [m/kg],
 * c dry cake mass per filtrate volume [kg/m³], A filter area [m²],
 * ΔP pressure drop [Pa], R_m medium resistance [1/m], V filtrate volume [m³].
 * Each wash flows at the final filtration rate:
 *   t_w = V_w μ_w (α c V / A + R_m) / (A ΔP).
 * Liquor viscosity: ln μ_mix = Σ x_i ln μ_i (Arrhenius mixing rule) from the
 * library's 25 °C values, corrected to T by the Lewis–Squires chart
 * correlation μ^−0.2661 = μ_25^−0.2661 + (T − 298.15)/233 (μ in mPa s, T in
 * K; Reid, Prausnitz & Poling, Properties of Gases and Liquids 4th ed.,
 * liquid viscosity chapter — cited from memory).
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
import type { StepOutput, Stream } from '../route/types';
import { COMMON_PRACTICE_BASIS, COMMON_PRACTICE_HOURS, newResult, round } from './common';
import { solubilityIn } from './solubility-model';

/**
 * Viscosity of the liquid part of a stream [Pa s] at T [K]: Arrhenius mixing
 * of the solvents' 25 °C viscosities (mole fractions), Lewis–Squires for T.
 */
export function liquorViscosityPaS(
  ctx: EvalContext,
  kg: Record<string, number>,
  T_K: number,
): number | null {
  let lnMu = 0;
  let n = 0;
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'solvent' || !(kg[id] > 0)) continue;
    const mol = kg[id] / c.molarMassKgMol;
    lnMu += mol * Math.log(lewisSquires(c.solvent!.viscosityMPas25C.value, T_K));
    n += mol;
  }
  if (n === 0) return null;
  return Math.exp(lnMu / n) / 1000;
}

/** Lewis–Squires: μ(T) [mPa s] from μ at 25 °C [mPa s]; T [K]. */
export function lewisSquires(mu25: number, T_K: number): number {
  const v = mu25 ** -0.2661 + (T_K - 298.15) / 233;
  return v > 0 ? v ** (-1 / 0.2661) : mu25 * 50;
}

/** Cake-filtration time t [s] for filtrate volume V [m³] (Ruth equation, constant ΔP). */
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
  const mu = liquorViscosityPaS(ctx, liquor, T);
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
      'library 25 °C viscosities; Reid, Prausnitz & Poling 4th ed. (from memory)',
    );
  }
  const washRecords: Array<{
    wash: number;
    displacedPct: number;
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
    const wKg = solventKgFromVolume(ctx, cw.solventId, Vw, Tw);
    const muW = liquorViscosityPaS(ctx, { [cw.solventId]: 1 }, Tw) ?? 0.001;
    method(
      M,
      'cake wash',
      `displacement, efficiency ${eps} per retained volume; wash leaves saturated (upper bound on losses)`,
      cw.displacementEfficiency === 0.8 ? 'default efficiency, common practice' : 'route document',
    );
    for (let k = 0; k < cw.washes; k++) {
      result.addedKg[cw.solventId] = (result.addedKg[cw.solventId] ?? 0) + wKg;
      result.addedVolumeM3 += Vw;
      const d = Vr > 0 ? eps * Math.min(1, Vw / Vr) : 0;
      const kept = Math.min(wKg, (d * Vr) / ws.specificVolume(Tw));
      const passing = wKg - kept;
      for (const id of ctx.ids) {
        const moved = cakeLiq[id] * d;
        cakeLiq[id] -= moved;
        filtrate.kg[id] += moved;
      }
      cakeLiq[cw.solventId] += kept;
      filtrate.kg[cw.solventId] += passing;
      // Dissolution of solids by the wash (saturation upper bound).
      const dissolved: Record<string, number> = {};
      for (const id of ctx.ids) {
        const cc = ctx.comps.get(id)!;
        if (!(solid[id] > 0) || cc.kind !== 'compound') continue;
        const s = solubilityIn(ctx, id, { [cw.solventId]: wKg }, Tw, W, M);
        const cap = s ? s.capacityKg : 0;
        const loss = Math.min(solid[id], cap);
        if (loss > 0) {
          solid[id] -= loss;
          filtrate.kg[id] += loss;
          dissolved[id] = round(loss, 6);
        }
      }
      const tw = mu !== null && A > 0 ? (Vw * muW * ((alpha * c * Vf) / A + Rm)) / (A * dP) : 0;
      tWash += tw;
      washRecords.push({
        wash: k + 1,
        displacedPct: round(100 * d, 2),
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
