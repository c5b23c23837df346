/**
 * Crystallisation: cooling, antisolvent addition, or evaporation.
 *
 * Model: equilibrium at the end conditions. Each compound dissolves up to its
 * saturation capacity in the liquor's solvents at the end temperature
 * (solubility-model.ts: measured van 't Hoff fits first, then UNIFAC or
 * ideal solubility; blends by the log-linear Jouyban–Acree model); the
 * excess is solid. So the product comes out to its solubility, and an
 * impurity stays in the liquor below its own solubility, else it
 * co-precipitates (as a separate solid). An impurity the chemist marks as
 * incorporated (solidIncorporation K) goes into the product's crystals in
 * proportion to its ratio to the product in the liquor (see
 * incorporateImpurities); otherwise solid solutions and inclusions are not
 * modelled, and close analogues of the product get a caution. Aqueous solutes (salts) dissolve in the water present up to
 * their saturation wt %; without water they are solid.
 *   yield = m_solid,product / (m_product,in + m_seed)
 * Seeding is recorded (seed mass = seedWtPct % of the product in the feed,
 * charged as solid product). Evaporative mode distils first (distillation.ts,
 * Rayleigh with UNIFAC) and crystallises at the final pot temperature.
 * Units: T [K], masses [kg], volumes [m³]. Kinetics (metastable zone,
 * growth, agglomeration) are not modelled: the result is an end-point bound.
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
import type { EngineWarning, MethodUsed, StepOutput, Stream } from '../route/types';
import { COMMON_PRACTICE_BASIS, COMMON_PRACTICE_HOURS, newResult, round } from './common';
import {
  distilLeg,
  DISTILLATION_TOLERANCE_X,
  newDistilState,
  VOLUME_REFERENCE_K,
} from './distillation';
import { solubilityIn } from './solubility-model';
import {
  idealSolubility,
  liquidPhaseSeparation,
  oilingOutWarnings,
  type OilingOutTest,
} from '../properties/solubility';

/**
 * Most of a compound without any solubility evidence that a liquor is assumed
 * to hold, per kg of its solvents [kg/kg]: 1, i.e. up to 50 wt % (this
 * project's own bound, stated in the step's warning; a liquor richer than
 * that is a paste, not a solution).
 */
export const NO_DATA_MAX_KG_PER_KG_SOLVENT = 1;

/**
 * Mass of the solvents (library solvent components) in a mixture, Σ m_j.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any stream the route produces.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param kg   mass of each component [kg]
 * @returns the solvents' mass [kg]
 */
export function liquorSolventKg(ctx: EvalContext, kg: Record<string, number>): number {
  let total = 0;
  for (const id of ctx.ids)
    if (ctx.comps.get(id)!.kind === 'solvent' && kg[id] > 0) total += kg[id];
  return total;
}

export interface Precipitation {
  solidKg: Record<string, number>;
  saturationKg: Record<string, number | null>;
}

/**
 * Solid formed from a liquid of total composition kg at T (equilibrium end
 * point): each compound dissolves up to its saturation capacity c_sat(T) in
 * the liquor's solvents and the excess is solid, m_solid = max(0, m − c_sat);
 * an aqueous solute dissolves in the water up to its saturation wt %,
 * c_sat = m_water · w/(100 − w), and is insoluble in organic solvents. A
 * compound without solubility evidence in any solvent of the liquor is
 * assumed dissolved up to NO_DATA_MAX_KG_PER_KG_SOLVENT times the solvents'
 * mass (so it comes out smoothly as the liquor goes to dryness); its
 * saturation is reported as null and the step warns.
 *
 * Source: solubility-model.ts solubilityIn (van 't Hoff fits, UNIFAC or
 * Schröder–van Laar ideal solubility, Jouyban–Acree blends); saturation wt %
 * of aqueous solutes from the aqueous-media library (docs/data-sources.md).
 * Validity: thermodynamic end point only (no metastable zone, kinetics or
 * solvates); each compound treated independently (no common-ion or solid
 * solution effects other than incorporateImpurities); as solubilityIn.
 * @param ctx       evaluation context (route components resolved against the library)
 * @param kg        total mass of each component in the vessel [kg]
 * @param T_K       temperature of the end point [K]
 * @param warnings  receives the warnings of the solubility model (null: none kept)
 * @param methods   receives the methods used (null: none kept)
 * @returns solid kg of each component [kg] and its saturation capacity [kg] (null without evidence)
 */
export function precipitate(
  ctx: EvalContext,
  kg: Record<string, number>,
  T_K: number,
  warnings: EngineWarning[] | null,
  methods: MethodUsed[] | null,
): Precipitation {
  const solidKg: Record<string, number> = {};
  const saturationKg: Record<string, number | null> = {};
  const waterKg = ctx.waterId ? kg[ctx.waterId] : 0;
  for (const id of ctx.ids) {
    solidKg[id] = 0;
    const c = ctx.comps.get(id)!;
    if (!(kg[id] > 0) || c.kind === 'solvent') continue;
    if (c.kind === 'aqueous-solute') {
      const max = c.aqueous!.maxWtPct;
      const cap = waterKg > 0 ? (waterKg * max) / (100 - max) : 0;
      saturationKg[id] = cap;
      solidKg[id] = Math.max(0, kg[id] - cap);
      if (solidKg[id] > 0 && methods)
        method(
          methods,
          `solubility of ${c.name}`,
          'saturation wt % in the water present; insoluble in organic solvents (assumed)',
          'aqueous-media library (maxWtPct)',
        );
      continue;
    }
    const s = solubilityIn(ctx, id, kg, T_K, warnings, methods);
    if (!s) {
      // No evidence in any solvent of the liquor: assumed dissolved, but a liquor cannot hold more
      // than NO_DATA_MAX_KG_PER_KG_SOLVENT of it, so the answer goes smoothly to "all solid" as
      // the liquor goes to nothing (an evaporation near dryness) instead of jumping there.
      saturationKg[id] = null;
      solidKg[id] = Math.max(0, kg[id] - NO_DATA_MAX_KG_PER_KG_SOLVENT * liquorSolventKg(ctx, kg));
      continue;
    }
    saturationKg[id] = s.capacityKg;
    solidKg[id] = Math.max(0, kg[id] - s.capacityKg);
  }
  return { solidKg, saturationKg };
}

/**
 * Oiling-out test of a compound in the liquor at T by the liquid–liquid split
 * of its subcooled liquid with the solvents (properties/solubility
 * liquidPhaseSeparation, UNIFAC). A split below the solid's solubility
 * ('stable') is a warning whatever the route; one in the supersaturated region
 * ('metastable') is a warning when the liquor, with all the compound
 * dissolved, would pass the solvent-rich binodal (an advisory when seeded).
 * Without UNIFAC groups and melting data the test cannot be made: an info
 * says so.
 *
 * @param ctx  evaluation context
 * @param id   the compound
 * @param kg   the liquor (all components) [kg]
 * @param T_K  temperature of the test [K]
 * @param seeded  whether the crystallisation is seeded
 * @param W  receives the warnings of the step
 * @param M  receives the methods used
 *
 * Source: properties/solubility liquidPhaseSeparation: tangent-plane
 * stability (Michelsen, Fluid Phase Equilib. 1982, 9, 1) of the subcooled
 * liquid solute with UNIFAC (Fredenslund et al. 1975; Hansen et al. 1991).
 * Validity: as liquidPhaseSeparation (UNIFAC's liquid–liquid predictions are
 * qualitative; the binodal's position can be off by tens of %); below the
 * melting point.
 */
export function oilingOutCheck(
  ctx: EvalContext,
  id: string,
  kg: Record<string, number>,
  T_K: number,
  seeded: boolean,
  W: EngineWarning[],
  M: MethodUsed[],
): void {
  const comp = ctx.comps.get(id)!;
  const cp = comp.compound!;
  if (!cp.unifac || cp.meltingPointC === undefined || cp.enthalpyFusionKJmol === undefined) {
    warn(
      W,
      'info',
      'oiling-out-not-tested',
      `${comp.name}: no liquid–liquid split test for oiling out (it needs UNIFAC groups, a melting point and an enthalpy of fusion); only the melting-point margin is checked.`,
    );
    return;
  }
  const solvents = ctx.ids.filter((s) => ctx.comps.get(s)!.kind === 'solvent' && kg[s] > 0);
  if (solvents.length === 0) return;
  const mol = solvents.map((s) => kg[s] / ctx.comps.get(s)!.molarMassKgMol);
  const nSolv = mol.reduce((a, b) => a + b, 0);
  const Tm = cp.meltingPointC + 273.15;
  if (T_K >= Tm) return;
  const xIdeal = idealSolubility({
    meltingPointK: Tm,
    enthalpyFusionJmol: cp.enthalpyFusionKJmol * 1000,
    T_K,
  }).moleFraction;
  const key = `oil:${id}:${T_K.toFixed(3)}:${mol.map((m) => (m / nSolv).toFixed(4)).join(',')}:${solvents.join(',')}`;
  let test = ctx.scratch.get(key) as OilingOutTest | undefined;
  if (!test) {
    // In a Monte Carlo draw (whose warnings no summary reads) the liquid–liquid flash starts from the
    // two liquids of the last split of this compound with these solvents (each draw's end
    // temperature and liquor are new); a nominal evaluation always runs the full method.
    const startKey = `oil-start:${id}:${solvents.join(',')}`;
    const start = ctx.rng
      ? (ctx.cache.get(startKey) as [number[], number[]] | undefined)
      : undefined;
    test = liquidPhaseSeparation({
      soluteGroups: Object.fromEntries(Object.entries(cp.unifac).map(([k, v]) => [Number(k), v])),
      solventGroups: solvents.map((s) => ctx.comps.get(s)!.solvent!.unifac.value),
      solventMoleFractions: mol.map((m) => m / nSolv),
      T_K,
      xIdeal,
      models: ctx.unifac,
      start,
      onSplit: ctx.rng ? (phases) => ctx.cache.set(startKey, phases) : undefined,
    });
    ctx.scratch.set(key, test);
  }
  method(
    M,
    `oiling out of ${comp.name}`,
    'liquid–liquid split of the subcooled liquid with the solvents (UNIFAC, tangent-plane test)',
    'Michelsen, Fluid Phase Equilib. 1982, 9, 1; UNIFAC (Hansen et al. 1991)',
  );
  const nSolute = kg[id] / comp.molarMassKgMol;
  const xTotal = nSolute / (nSolute + nSolv);
  if (test.kind === 'stable') {
    warn(W, 'warning', 'oiling-out', oilingOutWarnings(test, comp.name)[0]);
  } else if (test.kind === 'metastable' && xTotal > test.solventRichX!) {
    warn(
      W,
      seeded ? 'advisory' : 'warning',
      'oiling-out',
      `${oilingOutWarnings(test, comp.name)[0]} The liquor holds x = ${xTotal.toPrecision(3)} in all, beyond that point${seeded ? ' (seeded: the seed should take up the supersaturation first)' : ''}.`,
    );
  } else if (test.kind === 'not-tested') {
    warn(
      W,
      'info',
      'oiling-out-not-tested',
      `${comp.name}: the liquid–liquid split test for oiling out could not be made (${test.warnings.join('; ')}).`,
    );
  }
}

/**
 * Incorporation of impurities into the product's crystals (solid solution,
 * inclusion), by a constant distribution coefficient K (the "effective
 * distribution coefficient" of crystallisation from solution; Mullin,
 * Crystallization, 4th ed. 2001, §6.1 and §7.3 on impurities):
 *   (m_i,solid / m_P,solid) = K · (m_i,liquor / m_P,liquor).
 * With the dissolved impurity L_i = m_i − s_i (s_i: its own precipitate)
 * shared between liquor and crystals and the product's solid S_P and
 * dissolved L_P fixed by the solubility model, mass conservation gives
 *   m_i,incorporated = K · S_P · L_i / (L_P + K · S_P).
 * K = 0 (the default, "none") changes nothing; K = 1 crystallises the
 * impurity at its liquor ratio, i.e. no purification.
 * Returns the incorporated mass of each impurity [kg] and adds it to the slurry's solid.
 *
 * Source: Mullin, Crystallization, 4th ed. 2001, §6.1 and §7.3 (effective
 * distribution coefficient); the mass balance above is derived here.
 * Validity: K constant over the crystallisation (entered per impurity from
 * the chemist's own data); 0 ≤ K; equilibrium end point, no growth-rate
 * dependence of K.
 * @param ctx      evaluation context (route components resolved against the library)
 * @param slurry   the crystallised slurry (kg and solidKg [kg]; solidKg modified)
 * @param methods  receives the method used
 * @returns incorporated mass of each impurity [kg]
 */
export function incorporateImpurities(
  ctx: EvalContext,
  slurry: Stream,
  methods: MethodUsed[],
): Record<string, number> {
  const pid = ctx.productId;
  const out: Record<string, number> = {};
  if (!pid) return out;
  const S_P = slurry.solidKg[pid];
  const L_P = slurry.kg[pid] - S_P;
  if (!(S_P > 0)) return out;
  for (const id of ctx.ids) {
    const K = ctx.comps.get(id)!.compound?.solidIncorporation;
    if (id === pid || !K || !(K > 0)) continue;
    const L_i = slurry.kg[id] - slurry.solidKg[id];
    if (!(L_i > 0)) continue;
    const m = (K * S_P * L_i) / (Math.max(L_P, 0) + K * S_P);
    slurry.solidKg[id] += m;
    out[id] = m;
    method(
      methods,
      'impurity incorporation',
      'constant distribution coefficient K between crystals and liquor (entered per impurity)',
      'Mullin, Crystallization, 4th ed., Butterworth-Heinemann 2001, §6.1',
    );
  }
  return out;
}

/**
 * Crystallisation step model (cooling, antisolvent, evaporative): the
 * equilibrium end point of the module comment, yield
 * = m_solid,product / (m_product,in + m_seed), with oiling-out checks and
 * impurity incorporation; evaporative mode distils first (distilLeg) and
 * crystallises at the final pot temperature. Duration: ageing plus cooling at
 * a common-practice rate.
 *
 * Source: precipitate (solubility-model.ts), oilingOutCheck,
 * incorporateImpurities (Mullin, Crystallization, 4th ed. 2001), distilLeg
 * (Rayleigh 1902) in evaporative mode; durations common practice.
 * Validity: end-point bound only — metastable zone width, growth,
 * agglomeration and polymorphs are not modelled; as the solubility model.
 * @param inputs  the liquor on port 'feed'
 * @param params  the step's parameters (mode with temperatures [°C], antisolvent volume, evaporation; seeded, seedWtPct [%])
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the slurry and the distillate (empty unless evaporative) with the step result (yield [–], solid kg [kg])
 */
export function crystallisation(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'crystallisation'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const feed = inputs.feed!;
  const result = newResult(step, { hours: 0, basis: COMMON_PRACTICE_BASIS });
  const W = result.warnings;
  const M = result.methods;
  const mix: Record<string, number> = { ...feed.kg };
  const pid = ctx.productId;
  const distillate = emptyStream(ctx, 'liquid', VOLUME_REFERENCE_K);
  let T_end: number;
  let T_start: number;
  let hours = COMMON_PRACTICE_HOURS.crystallisationAge;
  const mode = params.mode;
  let peak = streamVolume(ctx, mix, feed.temperatureK);
  if (mode.kind === 'cooling') {
    T_start = cToK(ctx.num(mode.startC, ...RANGES.temperatureC));
    T_end = cToK(ctx.num(mode.endC, ...RANGES.temperatureC));
    if (T_end > T_start)
      warn(W, 'warning', 'not-cooling', 'The end temperature is above the start temperature.');
    hours += Math.abs(T_start - T_end) / COMMON_PRACTICE_HOURS.coolingKPerHour;
  } else if (mode.kind === 'antisolvent') {
    T_end = cToK(ctx.num(mode.temperatureC, ...RANGES.temperatureC));
    T_start = T_end;
    const c = ctx.comps.get(mode.antisolventId)!;
    if (c.kind !== 'solvent')
      throw new StepError(
        'params.mode.antisolventId',
        'The antisolvent must be a solvent component.',
      );
    const V = volumeToM3(ctx, mode.volume);
    const kg = solventKgFromVolume(ctx, mode.antisolventId, V, T_end);
    mix[mode.antisolventId] += kg;
    result.addedKg[mode.antisolventId] = kg;
    result.addedVolumeM3 = V;
    hours += COMMON_PRACTICE_HOURS.antisolventAddition;
    peak = streamVolume(ctx, mix, T_end);
  } else {
    const P = ctx.num(mode.pressureMbar, ...RANGES.pressureMbar) * 100;
    const st = newDistilState(ctx, feed, Math.max(feed.temperatureK, 300), null);
    distilLeg(
      ctx,
      st,
      volumeToM3(ctx, mode.targetVolume),
      { kind: 'pressure', P_Pa: P },
      DISTILLATION_TOLERANCE_X,
      W,
      M,
    );
    for (const id of ctx.ids) {
      mix[id] = st.pot[id];
      distillate.kg[id] = st.distillate[id];
    }
    T_end = st.lastT_K;
    T_start = st.maxT_K || T_end;
    hours +=
      COMMON_PRACTICE_HOURS.distillationSetup +
      (st.distillateM3 * 1000) /
        Math.max(1e-9, COMMON_PRACTICE_HOURS.distillateVolumesPerHour * peak * 1000);
    result.details.profile = st.profile;
  }
  finishStream(ctx, distillate);

  // Seeds: solid product charged with the feed.
  let seedKg = 0;
  if (params.seeded && pid && params.seedWtPct !== undefined) {
    seedKg = (ctx.num(params.seedWtPct, 0, 20) / 100) * feed.kg[pid];
    mix[pid] += seedKg;
    result.addedKg[pid] = (result.addedKg[pid] ?? 0) + seedKg;
  }

  // Dissolved at the start?
  if (
    pid &&
    mode.kind === 'cooling' &&
    feed.kg[pid] > 0 &&
    !ctx.ids.some((id) => feed.solidKg[id] > 0)
  ) {
    const start = precipitate(ctx, feed.kg, T_start, null, null);
    if (start.solidKg[pid] > 1e-6 * feed.kg[pid])
      warn(
        W,
        'warning',
        'not-dissolved-at-start',
        `${ctx.comps.get(pid)!.name} is not fully dissolved at the start temperature (${(T_start - 273.15).toFixed(0)} °C): ${((100 * start.solidKg[pid]) / feed.kg[pid]).toFixed(1)} % undissolved; heat higher or add solvent for a clean crystallisation.`,
      );
  }

  const end = precipitate(ctx, mix, T_end, W, M);
  const slurry = emptyStream(ctx, 'slurry', T_end);
  for (const id of ctx.ids) {
    slurry.kg[id] = mix[id];
    slurry.solidKg[id] = Math.min(mix[id], end.solidKg[id]);
  }
  const incorporated = incorporateImpurities(ctx, slurry, M);
  finishStream(ctx, slurry);
  peak = Math.max(peak, slurry.volumeM3);

  const details: Record<string, unknown> = {
    ...result.details,
    mode: mode.kind,
    seeded: params.seeded,
    seedKg,
    endTemperatureC: T_end - 273.15,
    startTemperatureC: T_start - 273.15,
    incorporatedKg: incorporated,
  };
  const saturation: Record<string, number | null> = {};
  for (const id of ctx.ids)
    if (end.saturationKg[id] !== undefined) saturation[id] = end.saturationKg[id];
  details.saturationKg = saturation;
  if (pid && mix[pid] > 0) {
    const cp = ctx.comps.get(pid)!.compound!;
    const yieldFrac = slurry.solidKg[pid] / mix[pid];
    result.summary['yield %'] = round(100 * yieldFrac, 2);
    details.yieldPct = 100 * yieldFrac;
    if (
      cp.meltingPointC !== undefined &&
      Math.max(T_start, T_end) - 273.15 > cp.meltingPointC - 10
    ) {
      W.push({
        severity: 'warning',
        code: 'oiling-out',
        message: `The crystallisation runs within 10 K of the product's melting point (${cp.meltingPointC} °C): it may separate as an oil.`,
      });
    }
    oilingOutCheck(ctx, pid, mix, T_end, params.seeded, W, M);
    const sat = end.saturationKg[pid];
    if (!params.seeded && sat && sat > 0 && mix[pid] / sat > 2) {
      W.push({
        severity: 'advisory',
        code: 'unseeded',
        message: `Unseeded, with the product ${(mix[pid] / sat).toFixed(1)}× its end-point solubility: uncontrolled nucleation or oiling out is likely (common practice: seed within the metastable zone).`,
      });
    }
    if (mode.kind === 'cooling') {
      const curve: Array<{ endC: number; yieldPct: number }> = [];
      const t0 = T_start;
      for (let k = 0; k <= 5; k++) {
        const T = t0 + ((T_end - t0) * k) / 5;
        const p = precipitate(ctx, mix, T, null, null);
        curve.push({
          endC: round(T - 273.15, 2),
          yieldPct: round((100 * p.solidKg[pid]) / mix[pid], 3),
        });
      }
      details.yieldVsEndTemperature = curve;
    }
  } else if (pid) {
    warn(W, 'info', 'no-product', 'No product reaches this crystallisation.');
  }
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (id !== pid && c.kind === 'compound' && end.solidKg[id] > 0) {
      W.push({
        severity: 'warning',
        code: 'co-precipitation',
        message: `${c.name} exceeds its solubility at the end point: ${((100 * end.solidKg[id]) / mix[id]).toFixed(1)} % of it comes out with the product.`,
      });
    }
    if (c.kind === 'compound' && end.saturationKg[id] === null && mix[id] > 0) {
      warn(
        W,
        'warning',
        'no-solubility-data',
        end.solidKg[id] > 0
          ? `${c.name}: no solubility data; assumed to stay dissolved up to its own mass of the liquor's solvents (50 wt %), so ${((100 * end.solidKg[id]) / mix[id]).toFixed(1)} % of it comes out as solid at this little liquor. Enter a measured solubility to replace the assumption.`
          : `${c.name}: no solubility data; assumed to stay dissolved. Enter a measured solubility to replace the assumption.`,
      );
    }
  }
  result.peakVolumeM3 = peak;
  result.duration = { hours, basis: `${COMMON_PRACTICE_BASIS}: cooling 10 K/h, 2 h age` };
  result.details = details;
  commonCautions(ctx, mix, Math.max(T_start, T_end), W);
  return { outputs: { slurry, distillate }, result };
}
