/**
 * The simple steps: quench or neutralisation by stoichiometry, pH
 * adjustment, carbon treatment, polish filtration, split and merge.
 */
import type { ParamsOf, RouteStep } from '../document';
import { RANGES } from '../document';
import type { EvalContext } from '../route/context';
import {
  aqueousMediumKg,
  cloneStream,
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
import { aqueousPH } from './equilibria';
import { R_J_PER_MOL_K, STANDARD_ATMOSPHERE_PA } from '../units';

/** Adiabatic temperature rise above which a quench is flagged, K (after Stoessel, Thermal Safety of Chemical Processes: Risk Assessment and Process Design, Wiley-VCH, Weinheim, 2008 — title read in a reference list; the 50 K severity threshold is recalled, not read). */
export const ADIABATIC_RISE_FLAG_K = 50;

function isCarbonate(ctx: EvalContext, id: string): boolean {
  const a = ctx.comps.get(id)?.aqueous;
  return !!a && /CO3/.test(a.formula);
}

function co2Hazard(W: EngineWarning[], mol: number, T_K: number, what: string) {
  const litres = ((mol * R_J_PER_MOL_K * T_K) / STANDARD_ATMOSPHERE_PA) * 1000;
  W.push({
    severity: 'hazard',
    code: 'gas-evolution',
    message: `${what}: ${mol.toFixed(2)} mol CO₂ (≈ ${litres.toFixed(0)} L at 1 atm) is released. Dose slowly with venting; never in a closed vessel; watch for foaming.`,
  });
}

/**
 * Quench or neutralisation: reagent R reacts with substrate S,
 *   ν_R R + ν_S S → Σ ν_P P,   extent ξ = min(n_R/ν_R, n_S/ν_S) [mol],
 * consumed ν ξ, formed ν_P ξ (complete reaction, limiting reagent).
 * The reagent is charged as equiv (mol per mol of the reference input), with
 * an optional carrier liquid. With a reaction enthalpy ΔH_r [kJ per mol S]
 * and a heat capacity c_p [kJ/(kg K)] the adiabatic rise is
 *   ΔT_ad = −ΔH_r ξ / (m c_p).
 * A carbonate reagent or substrate releases ν ξ mol CO₂ (a hazard with its
 * volume at 1 atm, ideal gas).
 *
 * Source: stoichiometry and mass balance (no external source); adiabatic
 * temperature rise as in Stoessel, Thermal Safety of Chemical Processes: Risk
 * Assessment and Process Design, Wiley-VCH, Weinheim, 2008 (citation read in a
 * reference list; the 50 K flag threshold is recalled, not read).
 * Validity: complete reaction of the limiting reagent, no side reactions,
 * equilibria or kinetics; ΔT_ad with constant c_p and no heat loss (an upper
 * bound for a batch quench); the declared products only are counted.
 * @param inputs  the stream to quench on port 'feed'
 * @param params  the step's parameters (reagentId, equiv [mol/mol of the reference], stoichiometry [–], products [mol/mol], temperatureC [°C], reactionEnthalpyKJmol [kJ/mol], heatCapacityKJkgK [kJ/(kg K)], carrier volume)
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the quenched stream 'out' with the step result (extent [mol], ΔT_ad [K], consumed and generated kg [kg])
 */
export function quench(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'quench'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const feed = inputs.feed!;
  const T = cToK(ctx.num(params.temperatureC, ...RANGES.temperatureC));
  const result = newResult(step, {
    hours: COMMON_PRACTICE_HOURS.quench,
    basis: COMMON_PRACTICE_BASIS,
  });
  const W = result.warnings;
  const out = cloneStream(feed);
  out.temperatureK = T;
  const reagent = ctx.comps.get(params.reagentId)!;
  const nR0 = ctx.num(params.equiv, ...RANGES.equiv) * ctx.referenceMol;
  const kgR = nR0 * reagent.molarMassKgMol;
  result.addedKg[params.reagentId] = kgR;
  if (params.carrier) {
    const V = volumeToM3(ctx, params.carrier.volume);
    const kg = solventKgFromVolume(ctx, params.carrier.solventId, V, T);
    result.addedKg[params.carrier.solventId] = (result.addedKg[params.carrier.solventId] ?? 0) + kg;
    result.addedVolumeM3 += V;
  }
  for (const id in result.addedKg) out.kg[id] += result.addedKg[id];
  const sub = ctx.comps.get(params.reactsWith)!;
  const nuR = params.stoichiometry.reagent;
  const nuS = params.stoichiometry.substrate;
  const nR = out.kg[params.reagentId] / reagent.molarMassKgMol;
  const nS = out.kg[params.reactsWith] / sub.molarMassKgMol;
  const xi = Math.min(nR / nuR, nS / nuS);
  const consumed: Record<string, number> = {};
  consumed[params.reagentId] = Math.min(
    out.kg[params.reagentId],
    nuR * xi * reagent.molarMassKgMol,
  );
  consumed[params.reactsWith] =
    (consumed[params.reactsWith] ?? 0) +
    Math.min(out.kg[params.reactsWith], nuS * xi * sub.molarMassKgMol);
  const generated: Record<string, number> = {};
  for (const p of params.products)
    generated[p.componentId] =
      (generated[p.componentId] ?? 0) +
      p.molPerMolSubstrate * nuS * xi * ctx.comps.get(p.componentId)!.molarMassKgMol;
  for (const id in consumed) out.kg[id] -= consumed[id];
  for (const id in generated) out.kg[id] += generated[id];
  for (const id of ctx.ids) {
    if (out.kg[id] < 0) out.kg[id] = 0;
    out.solidKg[id] = Math.min(out.solidKg[id], out.kg[id]);
  }
  result.consumedKg = consumed;
  result.generatedKg = generated;
  const mc = Object.values(consumed).reduce((a, b) => a + b, 0);
  const mg = Object.values(generated).reduce((a, b) => a + b, 0);
  if (Math.abs(mc - mg) > 1e-6 * Math.max(mc, 1e-12)) {
    W.push({
      severity: 'info',
      code: 'reaction-mass-imbalance',
      message: `The declared products (${mg.toPrecision(4)} kg) do not match the reactants consumed (${mc.toPrecision(4)} kg): a product (water, CO₂, a salt) is not declared; the totals count only declared components.`,
    });
  }
  method(
    result.methods,
    'reaction',
    'stoichiometry, complete reaction of the limiting reagent',
    'route document',
  );
  if (nR / nuR < nS / nuS)
    warn(
      W,
      'warning',
      'substrate-left',
      `${reagent.name} is limiting: ${(100 * (1 - (nuS * xi) / nS)).toFixed(1)} % of ${sub.name} remains.`,
    );
  finishStream(ctx, out);
  const m = Object.values(out.kg).reduce((a, b) => a + b, 0);
  let dTad: number | null = null;
  if (
    params.reactionEnthalpyKJmol !== undefined &&
    params.heatCapacityKJkgK !== undefined &&
    m > 0
  ) {
    dTad = (-params.reactionEnthalpyKJmol * nuS * xi) / (m * params.heatCapacityKJkgK);
    method(
      result.methods,
      'adiabatic temperature rise',
      'ΔT_ad = −ΔH_r ξ / (m c_p)',
      'reaction enthalpy and heat capacity from the route document',
    );
    if (dTad > ADIABATIC_RISE_FLAG_K)
      W.push({
        severity: 'hazard',
        code: 'exotherm',
        message: `Adiabatic temperature rise ${dTad.toFixed(0)} K: dose-controlled addition with cooling capacity is required; confirm by calorimetry.`,
      });
  }
  W.push({
    severity: 'advisory',
    code: 'quench-exotherm',
    message:
      'Quenches and neutralisations release heat: add under temperature control, dose-limited, and confirm the heat of reaction by calorimetry.',
  });
  if (isCarbonate(ctx, params.reagentId) || isCarbonate(ctx, params.reactsWith)) {
    const carb = isCarbonate(ctx, params.reagentId) ? nuR * xi : nuS * xi;
    co2Hazard(W, carb, T, 'Carbonate neutralisation');
  }
  result.peakVolumeM3 = out.volumeM3;
  result.summary = { 'extent mol': round(xi, 6), 'ΔT_ad K': dTad === null ? null : round(dTad, 1) };
  result.details = {
    extentMol: xi,
    adiabaticRiseK: dTad,
    consumedKg: consumed,
    generatedKg: generated,
  };
  commonCautions(ctx, out.kg, T, W);
  return { outputs: { out }, result };
}

/**
 * pH adjustment: the amount of an aqueous acid or base medium that brings
 * the aqueous part of the feed to the target pH, by charge balance
 * (equilibria.aqueousPH, including the compounds' own pKa values) and
 * bisection on the charged mass.
 * Formula: find m with pH(m) = pH_target, where pH(m) solves the charge
 * balance of the aqueous part with m kg of medium at w wt % added.
 *
 * Source: charge balance with Henderson–Hasselbalch fractions
 * (equilibria.aqueousPH; Harris, Quantitative Chemical Analysis, cited from
 * memory); pKa values from the aqueous-media library and the compound
 * records; bisection: this project's own root bracket (no external source).
 * Validity: as aqueousPH — ideal dilute solution (activities =
 * concentrations), 25 °C constants, pH −2 … 16; organic solvents left out of
 * the aqueous phase; reagent mass found to 2⁻⁴⁰ of the bracket.
 * @param inputs  the stream to adjust on port 'feed'
 * @param params  the step's parameters (reagentSoluteId, wtPct [%], targetPH [–], temperatureC [°C])
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the adjusted stream 'out' with the step result (start and final pH [–], reagent kg [kg])
 */
export function phAdjust(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'ph-adjust'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const feed = inputs.feed!;
  const T = cToK(ctx.num(params.temperatureC, ...RANGES.temperatureC));
  const result = newResult(step, {
    hours: COMMON_PRACTICE_HOURS.phAdjust,
    basis: COMMON_PRACTICE_BASIS,
  });
  const W = result.warnings;
  if (!ctx.waterId || !(feed.kg[ctx.waterId] > 0))
    throw new StepError('params', 'pH adjustment needs water in the feed.');
  const target = ctx.num(params.targetPH, -1, 15);
  const wt = ctx.num(params.wtPct, 0.1, 60);
  const aqOnly = (kg: Record<string, number>) => {
    const a: Record<string, number> = {};
    for (const id of ctx.ids) {
      const c = ctx.comps.get(id)!;
      a[id] = c.isWater || c.kind === 'aqueous-solute' ? kg[id] : 0;
    }
    return a;
  };
  const pHWith = (mediumKg: number) => {
    const kg = { ...feed.kg };
    kg[ctx.waterId!] += mediumKg * (1 - wt / 100);
    kg[params.reagentSoluteId] += (mediumKg * wt) / 100;
    const aq = aqOnly(kg);
    const all = { ...kg };
    for (const id of ctx.ids)
      if (ctx.comps.get(id)!.kind === 'solvent' && !ctx.comps.get(id)!.isWater) all[id] = 0;
    return aqueousPH(ctx, { volumeM3: streamVolume(ctx, aq, T), kg: all, includeCompounds: true })!;
  };
  const pH0 = pHWith(0);
  const up = pHWith(feed.kg[ctx.waterId] * 0.01) > pH0;
  let medium = 0;
  if ((up && target < pH0) || (!up && target > pH0)) {
    W.push({
      severity: 'warning',
      code: 'wrong-direction',
      message: `The reagent moves the pH away from the target (now ${pH0.toFixed(2)}, target ${target}); nothing is added.`,
    });
  } else {
    let lo = 0;
    let hi = Math.max(1e-6, feed.kg[ctx.waterId] * 1e-3);
    const beyond = (m: number) => (up ? pHWith(m) >= target : pHWith(m) <= target);
    let k = 0;
    while (!beyond(hi) && k++ < 40) hi *= 2;
    if (!beyond(hi))
      W.push({
        severity: 'warning',
        code: 'target-unreachable',
        message: 'The target pH cannot be reached with this reagent.',
      });
    for (let i = 0; i < 40; i++) {
      const mid = 0.5 * (lo + hi);
      if (beyond(mid)) hi = mid;
      else lo = mid;
    }
    medium = hi;
  }
  result.addedKg[ctx.waterId] = medium * (1 - wt / 100);
  result.addedKg[params.reagentSoluteId] = (medium * wt) / 100;
  const { waterKg, soluteKg } = aqueousMediumKg(ctx, params.reagentSoluteId, wt, 1, T);
  result.addedVolumeM3 = medium / (waterKg + soluteKg);
  const out = cloneStream(feed);
  out.temperatureK = T;
  for (const id in result.addedKg) out.kg[id] += result.addedKg[id];
  finishStream(ctx, out);
  method(
    result.methods,
    'pH',
    'charge balance with the pKa values of the aqueous solutes and compounds (ideal solution, pKw 14); bisection on the charged mass',
    'aqueous-media library; compound records',
  );
  W.push({
    severity: 'advisory',
    code: 'neutralisation-exotherm',
    message: 'Neutralisation releases heat: dose under temperature control.',
  });
  if (isCarbonate(ctx, params.reagentSoluteId) && pH0 < 6.4)
    co2Hazard(
      W,
      result.addedKg[params.reagentSoluteId] /
        ctx.comps.get(params.reagentSoluteId)!.molarMassKgMol,
      T,
      'Carbonate added to an acidic aqueous phase',
    );
  result.peakVolumeM3 = out.volumeM3;
  result.summary = {
    'start pH': round(pH0, 2),
    'reagent kg': round(medium, 5),
    'final pH': round(pHWith(medium), 2),
  };
  result.details = {
    startPH: pH0,
    targetPH: target,
    finalPH: pHWith(medium),
    reagentMediumKg: medium,
  };
  commonCautions(ctx, out.kg, T, W);
  return { outputs: { out }, result };
}

function removeFractions(
  ctx: EvalContext,
  feed: Stream,
  removals: ParamsOf<'carbon-treatment'>['removals'],
  T: number,
  removedPhase: 'solid',
) {
  const out = cloneStream(feed);
  out.temperatureK = T;
  const removed = emptyStream(ctx, removedPhase, T);
  for (const r of removals) {
    const f = ctx.num(r.fractionRemoved, 0, 1);
    const m = feed.kg[r.componentId] * f;
    removed.kg[r.componentId] += m;
    removed.solidKg[r.componentId] += m;
    out.kg[r.componentId] -= m;
    out.solidKg[r.componentId] = Math.min(out.solidKg[r.componentId], out.kg[r.componentId]);
  }
  finishStream(ctx, out);
  finishStream(ctx, removed);
  return { out, removed };
}

/**
 * Carbon treatment: the stated fraction of each chosen component is adsorbed
 * and leaves with the spent carbon (user data; no adsorption isotherm).
 * Carbon charge = carbonWtPct % of the dissolved compounds, counted in PMI
 * as an auxiliary material. Liquor held up on the carbon is not modelled.
 * Formula: m_removed,i = f_i m_i;  m_carbon = (carbonWtPct/100) Σ m_compounds.
 *
 * Source: user data (the fractions removed) and mass balance; the handling
 * caution is common practice.
 * Validity: the fractions the chemist states for this carbon, load and
 * contact time (no isotherm: the removal does not scale with the charge).
 * @param inputs  the stream to treat on port 'feed'
 * @param params  the step's parameters (removals with fractionRemoved [–], carbonWtPct [%], temperatureC [°C])
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the treated stream 'out' and the spent carbon's load 'spent' with the step result (carbon kg [kg])
 */
export function carbonTreatment(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'carbon-treatment'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const feed = inputs.feed!;
  const T = cToK(ctx.num(params.temperatureC, ...RANGES.temperatureC));
  const result = newResult(step, {
    hours: COMMON_PRACTICE_HOURS.carbonTreatment,
    basis: COMMON_PRACTICE_BASIS,
  });
  const { out, removed } = removeFractions(ctx, feed, params.removals, T, 'solid');
  let solutes = 0;
  for (const id of ctx.ids) if (ctx.comps.get(id)!.kind === 'compound') solutes += feed.kg[id];
  result.auxiliaryKg = (ctx.num(params.carbonWtPct, 0, 100) / 100) * solutes;
  method(
    result.methods,
    'adsorption',
    'fraction removed per component (user data)',
    'route document',
  );
  const pid = ctx.productId;
  if (pid && feed.kg[pid] > 0)
    result.summary['product loss %'] = round((100 * removed.kg[pid]) / feed.kg[pid], 3);
  result.summary['carbon kg'] = round(result.auxiliaryKg, 4);
  result.peakVolumeM3 = feed.volumeM3;
  result.details = { carbonKg: result.auxiliaryKg, removedKg: removed.kg };
  commonCautions(ctx, out.kg, T, result.warnings, { transfer: true });
  result.warnings.push({
    severity: 'advisory',
    code: 'carbon-handling',
    message:
      'Dry activated carbon is a dust and can self-heat with solvents: charge it wetted, and filter under inert gas (common practice).',
  });
  return { outputs: { out, spent: removed }, result };
}

/**
 * Polish filtration: the stated fraction of each chosen component
 * (particulates, insolubles) is retained on the filter, m_retained,i = f_i m_i;
 * undissolved solids are retained in full.
 *
 * Source: user data (the fractions retained) and mass balance (no external source).
 * Validity: the fractions the chemist states; liquor held up on the filter
 * and filter aid are not modelled.
 * @param inputs  the stream to filter on port 'feed'
 * @param params  the step's parameters (removals with fractionRemoved [–], temperatureC [°C])
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the filtrate 'out' and what the filter retains 'retained' with the step result
 */
export function polishFiltration(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'polish-filtration'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const feed = inputs.feed!;
  const T =
    params.temperatureC !== undefined
      ? cToK(ctx.num(params.temperatureC, ...RANGES.temperatureC))
      : feed.temperatureK;
  const result = newResult(step, {
    hours: COMMON_PRACTICE_HOURS.polishFiltration,
    basis: COMMON_PRACTICE_BASIS,
  });
  const { out, removed } = removeFractions(ctx, feed, params.removals, T, 'solid');
  // Solids not listed pass a polish filter only if dissolved: undissolved solids are retained.
  for (const id of ctx.ids) {
    const s = out.solidKg[id];
    if (s > 0) {
      out.kg[id] -= s;
      out.solidKg[id] = 0;
      removed.kg[id] += s;
      removed.solidKg[id] += s;
    }
  }
  finishStream(ctx, out);
  finishStream(ctx, removed);
  method(
    result.methods,
    'retention',
    'fraction removed per component (user data); undissolved solids retained',
    'route document',
  );
  result.peakVolumeM3 = feed.volumeM3;
  result.details = { retainedKg: removed.kg };
  commonCautions(ctx, out.kg, T, result.warnings, { transfer: true });
  return { outputs: { out, retained: removed }, result };
}

/**
 * Split a stream in two by a fraction (same composition): a = f · feed,
 * b = feed − a, component by component, solids alike.
 *
 * Source: this project's own bookkeeping (no external source).
 * Validity: any fraction 0 ≤ f ≤ 1; a well-mixed feed (solids split like the liquid).
 * @param inputs  the stream to split on port 'feed'
 * @param params  the step's parameters (fractionToA [–])
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the two streams 'a' and 'b' with the step result
 */
export function split(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'split'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const feed = inputs.feed!;
  const f = ctx.num(params.fractionToA, 0, 1);
  const result = newResult(step, {
    hours: COMMON_PRACTICE_HOURS.transfer,
    basis: COMMON_PRACTICE_BASIS,
  });
  const a = cloneStream(feed);
  const b = cloneStream(feed);
  for (const id of ctx.ids) {
    a.kg[id] = feed.kg[id] * f;
    a.solidKg[id] = feed.solidKg[id] * f;
    b.kg[id] = feed.kg[id] - a.kg[id];
    b.solidKg[id] = feed.solidKg[id] - a.solidKg[id];
  }
  finishStream(ctx, a);
  finishStream(ctx, b);
  result.peakVolumeM3 = feed.volumeM3;
  result.summary = { 'fraction to a': round(f, 4) };
  return { outputs: { a, b }, result };
}

/**
 * Merge streams; temperature is the mass-weighted mean (equal heat
 * capacities, no heat of mixing): T = Σ m_s T_s / Σ m_s.
 *
 * Source: this project's own bookkeeping (no external source); the mixing
 * temperature is an energy balance with equal c_p.
 * Validity: streams of similar heat capacity without a heat of mixing
 * (acid or alcohol with water mix exothermically; not modelled).
 * @param inputs   the streams on ports 'a', 'b' and 'c' (any may be absent)
 * @param _params  the step's parameters (none)
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the merged stream 'out' with the step result
 */
export function merge(
  inputs: Record<string, Stream | undefined>,
  _params: ParamsOf<'merge'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const ins = (['a', 'b', 'c'] as const).map((p) => inputs[p]).filter((s): s is Stream => !!s);
  const result = newResult(step, {
    hours: COMMON_PRACTICE_HOURS.transfer,
    basis: COMMON_PRACTICE_BASIS,
  });
  let mT = 0;
  let m = 0;
  const out = emptyStream(ctx, 'liquid', 298.15);
  for (const s of ins) {
    let ms = 0;
    for (const id of ctx.ids) {
      out.kg[id] += s.kg[id];
      out.solidKg[id] += s.solidKg[id];
      ms += s.kg[id];
    }
    mT += ms * s.temperatureK;
    m += ms;
  }
  out.temperatureK = m > 0 ? mT / m : 298.15;
  finishStream(ctx, out);
  result.peakVolumeM3 = out.volumeM3;
  return { outputs: { out }, result };
}
