/**
 * Drying of a wet cake to a loss-on-drying (LOD) or a residual-solvent target.
 *
 * Model: the liquid in the cake evaporates with rates proportional to the
 * partial pressures of an ideal liquid, dn_i ∝ x_i P_i^sat(T), which
 * integrates to n_i = n_i,0 exp(−P_i^sat θ) for a common drying progress θ
 * (so less volatile solvents are enriched in what remains). θ is found by
 * bisection so that the target is met:
 *   LOD target:       Σ_volatiles m_i / m_total = LOD / 100
 *   residual target:  Σ_organic solvents m_i / m_total = ppm / 1e6 (water excluded)
 * Dissolved solutes in the retained liquor deposit on the solid. Vapour
 * pressures from the Antoine constants of the library (Clausius–Clapeyron
 * outside the range, with a warning). Units: T [K], P [Pa], m [kg].
 * Not modelled: solvates, occluded solvent, drying kinetics; the dryer
 * pressure is recorded but the end point does not depend on it.
 * Each residual solvent is compared with its ICH Q3C (R9) concentration
 * limit (Option 1, ppm) from the solvent library.
 */
import type { ParamsOf, RouteStep } from '../document';
import { RANGES } from '../document';
import { solventVapourPressureData, vapourPressure } from '../thermo/antoine';
import type { EvalContext } from '../route/context';
import { commonCautions, cToK, emptyStream, finishStream, method, warn } from '../route/context';
import type { EngineWarning, StepOutput, Stream } from '../route/types';
import { COMMON_PRACTICE_BASIS, COMMON_PRACTICE_HOURS, newResult, round } from './common';

export interface IchFlag {
  componentId: string;
  name: string;
  /** Residual solvent in the dried solid [ppm by mass]. */
  ppm: number;
  ichClass: 1 | 2 | 3 | null;
  /** ICH Q3C Option 1 concentration limit [ppm]; null where none is held. */
  limitPpm: number | null;
  exceeds: boolean;
  /**
   * Where the class and limit come from: a published reproduction of the
   * guideline's tables ('reproduced-table'), no entry confirmed
   * ('not-confirmed'), Q3C Table 4 without a PDE ('no-pde'), or not a
   * residual solvent in Q3C's sense ('not-listed').
   */
  basis: 'reproduced-table' | 'not-confirmed' | 'no-pde' | 'not-listed';
}

/**
 * Compare residual solvents in a solid with their ICH Q3C limits.
 * `kg`: component masses of the dried solid [kg]. Returns one flag per
 * solvent present and adds a warning (class 1: hazard) per exceedance.
 */
export function ichResidualSolventFlags(
  ctx: EvalContext,
  kg: Record<string, number>,
  warnings: EngineWarning[],
): IchFlag[] {
  let total = 0;
  for (const id of ctx.ids) total += kg[id];
  const flags: IchFlag[] = [];
  if (!(total > 0)) return flags;
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'solvent' || c.isWater || !(kg[id] > 0)) continue;
    const ppm = (kg[id] / total) * 1e6;
    const ich = c.solvent!.ich.value;
    const status = c.solvent!.ich.source.status;
    const exceeds = ich.limitPpm !== null && ppm > ich.limitPpm;
    const basis: IchFlag['basis'] =
      status === 'not-confirmed'
        ? 'not-confirmed'
        : ich.table === 'Table 4'
          ? 'no-pde'
          : ich.class === null
            ? 'not-listed'
            : 'reproduced-table';
    flags.push({
      componentId: id,
      name: c.name,
      ppm,
      ichClass: ich.class,
      limitPpm: ich.limitPpm,
      exceeds,
      basis,
    });
    if (basis === 'not-confirmed')
      warn(
        warnings,
        'warning',
        'ich-limit-not-confirmed',
        `No ICH Q3C class or limit of ${c.name} is confirmed in the library: compare the residual ${ppm.toPrecision(3)} ppm with ICH Q3C(R9) Tables 1–3 yourself.`,
      );
    if (basis === 'no-pde')
      warn(
        warnings,
        'advisory',
        'ich-no-pde',
        `${c.name} is among the ICH Q3C solvents without adequate toxicological data (Table 4, no PDE): its residual ${ppm.toPrecision(3)} ppm must be justified.`,
      );
    if (basis === 'reproduced-table')
      warn(
        warnings,
        'info',
        'ich-limit-source',
        'ICH Q3C classes and limits in the library were read in published reproductions of the guideline tables, not in the guideline itself: confirm them against ICH Q3C(R9) before they enter a regulated record.',
      );
    if (exceeds) {
      warnings.push({
        severity: ich.class === 1 ? 'hazard' : 'warning',
        code: 'ich-limit-exceeded',
        message: `Residual ${c.name} ${ppm.toFixed(0)} ppm exceeds its ICH Q3C class ${ich.class} limit of ${ich.limitPpm} ppm.`,
      });
    }
    if (ich.class === 1)
      warn(warnings, 'hazard', 'ich-class-1', `${c.name} is an ICH Q3C class 1 solvent.`);
  }
  return flags;
}

export function drying(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'drying'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const wet = inputs.wet!;
  const T = cToK(ctx.num(params.temperatureC, ...RANGES.temperatureC));
  const P = ctx.num(params.pressureMbar, ...RANGES.pressureMbar) * 100;
  const result = newResult(step, {
    hours: COMMON_PRACTICE_HOURS.drying,
    basis: `${COMMON_PRACTICE_BASIS}: 12 h in the dryer`,
  });
  const W = result.warnings;
  const vol = ctx.ids.filter((id) => ctx.comps.get(id)!.kind === 'solvent' && wet.kg[id] > 0);
  const psat: number[] = vol.map((id) => {
    const s = ctx.comps.get(id)!.solvent!;
    const vp = solventVapourPressureData(s);
    const r = vapourPressure(vp.sets, T, vp.extra);
    for (const w of r.warnings) warn(W, 'info', 'vapour-pressure', `${s.name}: ${w}`);
    return r.pressurePa;
  });
  method(
    result.methods,
    'drying end point',
    'ideal evaporation, n_i = n_i0 exp(−P_i^sat θ), θ by bisection to the target',
    'Antoine constants from the solvent library',
  );
  let fixed = 0;
  for (const id of ctx.ids) if (!vol.includes(id)) fixed += wet.kg[id];
  const counted = vol.map((id) =>
    params.target.kind === 'lod' ? true : !ctx.comps.get(id)!.isWater,
  );
  const target =
    params.target.kind === 'lod'
      ? ctx.num(params.target.lodWtPct, 0, 50) / 100
      : ctx.num(params.target.residualPpm, 0, 1e6) / 1e6;
  const pmax = Math.max(1, ...psat);
  const scaled = psat.map((p) => p / pmax);
  const left = (theta: number) => vol.map((id, i) => wet.kg[id] * Math.exp(-scaled[i] * theta));
  const frac = (m: number[]) => {
    let c = 0;
    let all = fixed;
    m.forEach((x, i) => {
      all += x;
      if (counted[i]) c += x;
    });
    return all > 0 ? c / all : 0;
  };
  let theta = 0;
  if (frac(left(0)) > target) {
    let lo = 0;
    let hi = 1;
    while (frac(left(hi)) > target && hi < 1e6) hi *= 2;
    for (let k = 0; k < 100; k++) {
      const mid = 0.5 * (lo + hi);
      if (frac(left(mid)) > target) lo = mid;
      else hi = mid;
    }
    theta = hi;
  }
  const remaining = left(theta);
  const dry = emptyStream(ctx, 'solid', T);
  const vapour = emptyStream(ctx, 'vapour', T);
  for (const id of ctx.ids) {
    const i = vol.indexOf(id);
    if (i >= 0) {
      dry.kg[id] = Math.min(wet.kg[id], remaining[i]);
      vapour.kg[id] = wet.kg[id] - dry.kg[id];
    } else {
      dry.kg[id] = wet.kg[id];
      dry.solidKg[id] = wet.kg[id];
    }
  }
  finishStream(ctx, dry);
  finishStream(ctx, vapour);
  const flags = ichResidualSolventFlags(ctx, dry.kg, W);
  const pid = ctx.productId;
  if (pid) {
    const mp = ctx.comps.get(pid)!.compound!.meltingPointC;
    if (mp !== undefined && T - 273.15 > mp - 20)
      W.push({
        severity: 'warning',
        code: 'dryer-near-melting',
        message: `Dryer temperature is within 20 K of the product's melting point (${mp} °C): sintering or melting (common practice margin).`,
      });
  }
  const total = Object.values(dry.kg).reduce((a, b) => a + b, 0);
  const liquid = vol.reduce((a, id) => a + dry.kg[id], 0);
  const lod = total > 0 ? (100 * liquid) / total : 0;
  result.summary = {
    'LOD %': round(lod, 3),
    'dry kg': round(total, 4),
    'ICH exceedances': flags.filter((f) => f.exceeds).length,
  };
  result.peakVolumeM3 = wet.volumeM3;
  commonCautions(ctx, wet.kg, T, W);
  result.details = {
    lodWtPct: lod,
    residualSolventsPpm: flags,
    pressureMbar: P / 100,
    temperatureC: T - 273.15,
  };
  return { outputs: { dry, vapour }, result };
}
