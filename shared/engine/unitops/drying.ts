/**
 * Drying of a wet cake to a loss-on-drying (LOD) or a residual-solvent
 * target, as a model that can fail (drying-model.ts): evaporation driven by
 * the cake's equilibrium vapour pressure at the drying temperature against the
 * solvent's partial pressure in the dryer gas at the dryer pressure, a
 * constant-rate then a linear falling-rate period, integrated in time. The
 * step ends when the target is met, when the time allowed runs out, or when
 * the equilibrium with the dryer atmosphere stops the drying; the result gives
 * the time and the LOD and residual solvents reached, and says which.
 *   LOD target:       Σ_volatiles m_i / m_total = LOD / 100
 *   residual target:  Σ_organic solvents m_i / m_total = ppm / 1e6 (water excluded)
 * Dissolved solutes in the retained liquor deposit on the solid.
 * Each residual solvent is compared with its ICH Q3C concentration limit
 * (Option 1, ppm) from the library; the flag carries the number reached.
 * Units: T [K], P [Pa], m [kg], t [h].
 */
import type { ParamsOf, RouteStep } from '../document';
import { RANGES } from '../document';
import type { EvalContext } from '../route/context';
import { commonCautions, cToK, emptyStream, finishStream, method, warn } from '../route/context';
import type { EngineWarning, StepOutput, Stream } from '../route/types';
import { newResult, round } from './common';
import { integrateDrying } from './drying-model';
import { solventVle } from './equilibria';

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
 * Formula: ppm_i = 10⁶ · m_i / Σ m (water excluded from the flags, counted in
 * the total); exceeds when ppm_i > the Option 1 limit.
 *
 * Source: ICH Q3C(R9) (2024), Option 1 concentration limits of Tables 1–3 and
 * the Table 4 list, as held per solvent in data/ich-q3c.ts with each entry's
 * provenance (docs/data-sources.md; several entries read in published
 * reproductions of the tables, which the flag's basis says).
 * Validity: Option 1 only (daily dose ≤ 10 g); Option 2 (PDE with the actual
 * dose) is not computed.
 * @param ctx       evaluation context (route components resolved against the library)
 * @param kg        component masses of the dried solid [kg]
 * @param warnings  receives the exceedance, class 1 and source notes
 * @returns one flag per organic solvent present: ppm [ppm by mass], class, limit [ppm], basis
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

/** Time allowed in the dryer when none is given [h] (common practice, one working day). */
export const DEFAULT_DRYING_HOURS = 12;
/** Drying coefficient assumed when none is given [mol/(kg h)]: a solvent-wet cake (0.3 kg/kg) under vacuum at 40–50 °C loses its free liquid in a few hours (common-practice order of magnitude). */
export const DEFAULT_DRYING_COEFFICIENT = 0.5;
/** Critical solvent content assumed when none is given [kg/kg] (common-practice order of magnitude for crystalline cakes). */
export const DEFAULT_CRITICAL_CONTENT = 0.05;
/** Inert gas (nitrogen bleed) assumed when none is given [normal L/min per kg of dry solid] (common practice). */
export const DEFAULT_INERT_GAS_NL_MIN_KG = 0.2;
/** Molar volume of an ideal gas at 0 °C and 1 atm [L/mol] (normal litres). */
const NORMAL_LITRES_PER_MOL = 22.414;

/**
 * Drying step model: integrates drying-model.ts for the volatile solvents of
 * the wet cake at the drying temperature and pressure until the LOD or
 * residual-solvent target (module comment), the time allowed, or the
 * equilibrium limit; then flags residual solvents against ICH Q3C.
 * Inert gas: G [mol/(h kg)] = 60 · NL/min per kg / 22.414 L/mol.
 *
 * Source: drying-model.ts (constant-rate / falling-rate drying curve, McCabe,
 * Smith & Harriott, recalled; vapour pressures and UNIFAC from the library);
 * ICH Q3C(R9) via ichResidualSolventFlags; default drying parameters and the
 * 20 K melting-point margin are common practice.
 * Validity: as drying-model.ts (isothermal cake, linear falling rate, no
 * solvates); the defaults are orders of magnitude only — fit k_d and X_c to a
 * measured drying curve.
 * @param inputs  the wet cake on port 'wet'
 * @param params  the step's parameters (temperatureC [°C], pressureMbar [mbar], target, maxHours [h], dryingCoefficient [mol/(kg h)], criticalContentKgPerKg [kg/kg], inertGasNLPerMinPerKg [NL/(min kg)])
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the dried solid 'dry' and the vapour 'vapour', with the step result (time [h], LOD [%], ICH flags)
 */
export function drying(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'drying'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const wet = inputs.wet!;
  const T = cToK(ctx.num(params.temperatureC, ...RANGES.temperatureC));
  const P = ctx.num(params.pressureMbar, ...RANGES.pressureMbar) * 100;
  const result = newResult(step, { hours: 0, basis: 'drying model (drying-model.ts)' });
  const W = result.warnings;
  const M = result.methods;
  const assumed: string[] = [];
  const maxHours =
    params.maxHours !== undefined ? ctx.num(params.maxHours, 0.1, 1000) : DEFAULT_DRYING_HOURS;
  if (params.maxHours === undefined)
    warn(
      W,
      'info',
      'drying-time-assumed',
      `No drying time given: at most ${DEFAULT_DRYING_HOURS} h in the dryer (common practice).`,
    );
  let kd = DEFAULT_DRYING_COEFFICIENT;
  if (params.dryingCoefficient !== undefined) kd = ctx.num(params.dryingCoefficient, 1e-4, 1e4);
  else assumed.push(`drying coefficient ${DEFAULT_DRYING_COEFFICIENT} mol/(kg·h)`);
  let Xc = DEFAULT_CRITICAL_CONTENT;
  if (params.criticalContentKgPerKg !== undefined)
    Xc = ctx.num(params.criticalContentKgPerKg, 1e-4, 5);
  else assumed.push(`critical solvent content ${DEFAULT_CRITICAL_CONTENT} kg/kg`);
  let gasNL = DEFAULT_INERT_GAS_NL_MIN_KG;
  if (params.inertGasNLPerMinPerKg !== undefined)
    gasNL = ctx.num(params.inertGasNLPerMinPerKg, 0, 1000);
  else assumed.push(`nitrogen ${DEFAULT_INERT_GAS_NL_MIN_KG} NL/min per kg of dry solid`);
  if (assumed.length)
    warn(
      W,
      'warning',
      'drying-parameters-assumed',
      `Drying parameters not given, assumed (common-practice orders of magnitude): ${assumed.join(', ')}. Fit them to a measured drying curve; the drying time and the residual reached depend on them.`,
    );
  const vol = ctx.ids.filter((id) => ctx.comps.get(id)!.kind === 'solvent' && wet.kg[id] > 0);
  let solidKg = 0;
  for (const id of ctx.ids) if (!vol.includes(id)) solidKg += wet.kg[id];
  const counted = vol.map((id) => params.target.kind === 'lod' || !ctx.comps.get(id)!.isWater);
  const target =
    params.target.kind === 'lod'
      ? ctx.num(params.target.lodWtPct, 0, 50) / 100
      : ctx.num(params.target.residualPpm, 0, 1e6) / 1e6;
  const dry = emptyStream(ctx, 'solid', T);
  const vapour = emptyStream(ctx, 'vapour', T);
  method(
    M,
    'drying',
    'evaporation against the dryer gas, E_i = k_d (p_i* − p_i)/P with p_i* = y_i P_bubble(T) min(1, X/X_c), p_i = P E_i/(G + ΣE); constant-rate then linear falling-rate period; Dormand–Prince integration to the target or the time allowed',
    'drying curve: McCabe, Smith & Harriott, drying chapter (recalled); vapour pressures and UNIFAC activity coefficients from the solvent library',
  );
  let outcome: string = 'target-reached';
  let hours = 0;
  let equilibrium: number | null = null;
  let bubbleMbar: number | null = null;
  if (vol.length > 0 && solidKg > 0) {
    const { sys } = solventVle(ctx, vol);
    const molar = vol.map((id) => ctx.comps.get(id)!.molarMassKgMol);
    const n0 = vol.map((id, i) => wet.kg[id] / molar[i] / solidKg);
    const frac = (n: ArrayLike<number>) => {
      let c = 0;
      let all = 1;
      for (let i = 0; i < vol.length; i++) {
        const m = Math.max(0, n[i]) * molar[i];
        all += m;
        if (counted[i]) c += m;
      }
      return c / all;
    };
    const r = integrateDrying({
      sys,
      molarMassKgMol: molar,
      n0,
      T_K: T,
      P_Pa: P,
      dryingCoefficient: kd,
      criticalContent: Xc,
      inertGas: (gasNL * 60) / NORMAL_LITRES_PER_MOL,
      maxHours,
      reached: (n) => frac(n) <= target,
    });
    outcome = r.outcome;
    hours = r.hours;
    equilibrium = r.equilibriumContentKgPerKg;
    bubbleMbar = r.bubblePressurePa / 100;
    if (!r.converged)
      warn(
        W,
        'warning',
        'drying-not-converged',
        'The drying integration did not meet its tolerance.',
      );
    vol.forEach((id, i) => {
      dry.kg[id] = Math.min(wet.kg[id], r.n[i] * molar[i] * solidKg);
      vapour.kg[id] = wet.kg[id] - dry.kg[id];
    });
  } else if (vol.length > 0) {
    warn(W, 'warning', 'no-solid', 'The drying step receives no solid: all the liquid evaporates.');
    for (const id of vol) vapour.kg[id] = wet.kg[id];
  }
  for (const id of ctx.ids) {
    if (vol.includes(id)) continue;
    dry.kg[id] = wet.kg[id];
    dry.solidKg[id] = wet.kg[id];
  }
  finishStream(ctx, dry);
  finishStream(ctx, vapour);
  const flags = ichResidualSolventFlags(ctx, dry.kg, W);
  const total = Object.values(dry.kg).reduce((a, b) => a + b, 0);
  const liquid = vol.reduce((a, id) => a + dry.kg[id], 0);
  const lod = total > 0 ? (100 * liquid) / total : 0;
  const reachedText =
    params.target.kind === 'lod'
      ? `LOD ${lod.toPrecision(3)} % (target ${(target * 100).toPrecision(3)} %)`
      : `residual solvent ${flags
          .reduce((a, f) => a + f.ppm, 0)
          .toPrecision(3)} ppm (target ${(target * 1e6).toPrecision(3)} ppm)`;
  if (outcome !== 'target-reached') {
    const why =
      outcome === 'no-evaporation'
        ? `nothing evaporates: at ${(T - 273.15).toFixed(0)} °C the cake liquid's vapour pressure (${bubbleMbar!.toPrecision(3)} mbar) does not exceed the dryer pressure (${(P / 100).toPrecision(4)} mbar) and no inert gas carries vapour away`
        : outcome === 'equilibrium-limit'
          ? `the cake is in equilibrium with the dryer vacuum: with no inert gas it cannot dry below ${((equilibrium ?? 0) * 100).toPrecision(3)} wt % solvent on solid at ${(T - 273.15).toFixed(0)} °C and ${(P / 100).toPrecision(4)} mbar`
          : `the time allowed (${maxHours} h) runs out first; the driving force at ${(T - 273.15).toFixed(0)} °C and ${(P / 100).toPrecision(4)} mbar is too small`;
    W.push({
      severity: 'warning',
      code: 'drying-target-not-reached',
      message: `The drying target is not reached: ${reachedText} after ${hours.toPrecision(3)} h — ${why}. Dry warmer, at a lower pressure, with more nitrogen or for longer.`,
    });
  }
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
  result.summary = {
    'LOD %': round(lod, 3),
    'dry kg': round(total, 4),
    'drying h': round(hours, 2),
    'target reached': outcome === 'target-reached' ? 'yes' : 'no',
    'ICH exceedances': flags.filter((f) => f.exceeds).length,
  };
  result.duration = { hours, basis: 'drying model: time to the target or the time allowed' };
  result.peakVolumeM3 = wet.volumeM3;
  commonCautions(ctx, wet.kg, T, W);
  result.details = {
    lodWtPct: lod,
    residualSolventsPpm: flags,
    pressureMbar: P / 100,
    temperatureC: T - 273.15,
    outcome,
    dryingHours: hours,
    maxHours,
    equilibriumSolventContentKgPerKg: equilibrium,
    wetCakeBubblePressureMbar: bubbleMbar,
    parameters: {
      dryingCoefficientMolPerKgH: kd,
      criticalContentKgPerKg: Xc,
      inertGasNLPerMinPerKg: gasNL,
      assumed,
    },
  };
  return { outputs: { dry, vapour }, result };
}
