/**
 * Wash and extraction: a feed liquid contacted with an added liquid (an
 * aqueous medium or a solvent) in one or more stages; the two liquid phases
 * are separated. The same model serves 'wash' (impurities are meant to leave
 * the kept phase) and 'extraction' (the product is meant to move).
 *
 * Per stage the solvents split by their mutual solubility (equilibria.ts:
 * tabulated mutual solubilities, else UNIFAC LLE); each compound distributes
 * by its distribution ratio D = c_org/c_aq (measured, UNIFAC or Collander,
 * with Henderson–Hasselbalch pH dependence and Setschenow salting-out);
 * aqueous solutes (salts, acids, bases) stay in the aqueous phase.
 *
 * Cross-current (fresh added liquid each stage), fraction of a solute left in
 * the feed phase after n equal stages (IUPAC Recommendations 1993, Pure Appl.
 * Chem. 65, 2373, "fraction extracted"):   q^n,  q = V_f / (V_f + K V_a)
 * where K is the distribution ratio toward the added phase. Simulated stage
 * by stage, so the mutual saturation and pH are recomputed every stage.
 *
 * Counter-current (N stages, total added liquid), Kremser equation with the
 * extraction factor E = K V_a/V_f toward the added phase:
 *   fraction left in the feed phase φ = (E − 1)/(E^{N+1} − 1),  φ = 1/(N+1) at E = 1
 * (Kremser 1930; Seader, Henley & Roper, Separation Process Principles,
 * chapter on liquid–liquid extraction). Phase volumes and pH from a single
 * equilibrium stage of feed + all added liquid (constant-flow assumption).
 *
 * Units: volumes [m³], masses [kg], T [K], D [-] (molar concentration
 * ratio). Validity: dilute solutes (phase volumes from the solvents only),
 * 0–80 °C.
 *
 * Organic–organic washes (no water, e.g. heptane against acetonitrile): the
 * solvents split by the UNIFAC liquid–liquid flash; the 'aqueous' port
 * carries the more polar phase (equilibria.ts, by the γ∞ of water), the
 * 'organic' port the less polar one; each compound distributes by the ratio
 * of its UNIFAC activity coefficients at infinite dilution in the two phases
 * (equilibria.organicOrganicDistribution). A compound without UNIFAC groups
 * or parameters stays in the feed phase, with a warning; aqueous solutes
 * stay in the feed phase.
 */
import type { ParamsOf, RouteStep } from '../document';
import { RANGES } from '../document';
import type { EvalContext } from '../route/context';
import type { AqueousSoluteRecord } from '../data/types';
import { neutralFraction, type PKa } from '../properties/partition';
import {
  aqueousMediumKg,
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
import { AQUEOUS_NEEDS_WATER } from '../route/step-words';
import type { EngineWarning, MethodUsed, StepOutput, Stream } from '../route/types';
import { COMMON_PRACTICE_BASIS, COMMON_PRACTICE_HOURS, newResult, round } from './common';
import {
  aqueousPH,
  compoundDistribution,
  neutralPartitionCoefficient,
  organicOrganicDistribution,
  splitLiquid,
  type LiquidSplitStart,
} from './equilibria';
import { R_J_PER_MOL_K, STANDARD_ATMOSPHERE_PA } from '../units';

/** Density difference below which phases separate poorly, g/mL (issue 4; common practice). */
export const MIN_DENSITY_DIFFERENCE_GML = 0.03;

export interface PhaseState {
  organic: Record<string, number>;
  aqueous: Record<string, number>;
  split: boolean;
  pH: number | null;
  volumes: { organicM3: number; aqueousM3: number };
  D: Record<string, { D: number; method: string; source: string }>;
}

/** Main organic solvent (largest mass) of a set of solvent masses. */
function mainOrganic(ctx: EvalContext, kg: Record<string, number>): string | null {
  let best: string | null = null;
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'solvent' || c.isWater || !(kg[id] > 0)) continue;
    if (best === null || kg[id] > kg[best]) best = id;
  }
  return best;
}

function solventsOnly(ctx: EvalContext, kg: Record<string, number>): Record<string, number> {
  const o: Record<string, number> = {};
  for (const id of ctx.ids) if (ctx.comps.get(id)!.kind === 'solvent') o[id] = kg[id];
  return o;
}

/**
 * One equilibrium contact of a liquid mixture: solvent split, pH of the
 * aqueous phase, and the distribution ratio of each compound.
 *
 * Source: splitLiquid, aqueousPH and compoundDistribution (equilibria.ts).
 * Validity: dilute solutes; 0–80 °C; as the methods used.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param mix  kg of every component in the contact [kg]
 * @param T_K  temperature [K]
 * @param pHOverride  stated pH of the medium [-], or undefined to compute it
 * @param warnings  receives the warnings
 * @param methods  receives the methods used
 * @param feedIsPolar  whether the feed is the more polar phase (organic–organic washes)
 * @param start  the stage's liquids from an earlier pass of this step (a warm start of the
 *               liquid–liquid flash; the same split to its tolerance), or undefined
 * @returns the two phases [kg], pH [-], volumes [m³], distribution ratios [-], the fraction of each compound to the organic phase [-] and the CO₂ formed [mol]
 */
export function equilibrate(
  ctx: EvalContext,
  mix: Record<string, number>,
  T_K: number,
  pHOverride: number | undefined,
  warnings: EngineWarning[],
  methods: MethodUsed[],
  feedIsPolar = false,
  start?: LiquidSplitStart,
): PhaseState & { toOrganic: Record<string, number>; co2Mol: number } {
  const sp = splitLiquid(ctx, solventsOnly(ctx, mix), T_K, warnings, methods, start);
  const organic: Record<string, number> = {};
  const aqueous: Record<string, number> = {};
  for (const id of ctx.ids) {
    organic[id] = sp.organicKg[id] ?? 0;
    aqueous[id] = sp.aqueousKg[id] ?? 0;
  }
  const Vo = streamVolume(ctx, organic, T_K);
  const Va = streamVolume(ctx, aqueous, T_K);
  const hasAq = Va > 0 && ctx.waterId !== null && aqueous[ctx.waterId] > 0;
  // Aqueous solutes go to the aqueous phase (or stay with the only liquid).
  let saltNum = 0;
  let saltMolar = 0;
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'aqueous-solute') continue;
    if (hasAq) aqueous[id] = mix[id];
    else if (sp.split && feedIsPolar) aqueous[id] = mix[id];
    else organic[id] = mix[id];
    if (hasAq && c.aqueous!.setschenowKs && mix[id] > 0) {
      const molar = mix[id] / c.molarMassKgMol / (Va * 1000);
      saltNum += c.aqueous!.setschenowKs.value * molar;
      saltMolar += molar;
    }
  }
  const salt = saltMolar > 0 ? { ks_Lmol: saltNum / saltMolar, molar: saltMolar } : undefined;
  const main = mainOrganic(ctx, organic);
  const phaseKg = { organicKg: sp.organicKg, aqueousKg: sp.aqueousKg };
  let pH: number | null = null;
  // Acids and bases among the solvents (acetic acid, pyridine): their neutral molecule is split by
  // the liquid–liquid flash, which gives its partition coefficient K = (n_org/V_org)/(n_aq/V_aq);
  // in water they ionise and take part in the charge balance like the compounds the feed carries.
  const ionisingSolvents: Array<{ id: string; mol: number; pKa: readonly PKa[]; K: number }> = [];
  if (hasAq) {
    for (const id of ctx.ids) {
      const c = ctx.comps.get(id)!;
      const sites = c.kind === 'solvent' ? c.solvent?.pKa?.value : undefined;
      if (!sites?.length || !(mix[id] > 0)) continue;
      const nO = organic[id] / c.molarMassKgMol;
      const nA = aqueous[id] / c.molarMassKgMol;
      const K = nA > 0 ? (Vo > 0 ? nO / Vo / (nA / Va) : 0) : Infinity;
      if (!Number.isFinite(K)) continue;
      ionisingSolvents.push({ id, mol: nO + nA, pKa: sites, K });
    }
  }
  if (hasAq && pHOverride !== undefined) {
    pH = pHOverride;
    method(methods, 'aqueous pH', 'stated pH of the medium', 'route document');
  } else if (hasAq) {
    // Acids and bases carried by the feed (compounds with pKa) take part in the charge balance;
    // their neutral forms partition into the organic phase.
    const carried: Array<{ mol: number; pKa: readonly PKa[]; K: number }> = [];
    for (const id of ctx.ids) {
      const cp = ctx.comps.get(id)!.compound;
      if (!cp?.pKa?.length || !(mix[id] > 0)) continue;
      const K =
        sp.split && Vo > 0 && main !== null
          ? neutralPartitionCoefficient(ctx, id, main, salt, T_K, phaseKg)
          : 0;
      if (!Number.isFinite(K)) continue;
      carried.push({ mol: mix[id] / (cp.molarMassGmol / 1000), pKa: cp.pKa, K });
    }
    for (const sv of ionisingSolvents) carried.push({ mol: sv.mol, pKa: sv.pKa, K: sv.K });
    // aqueousPH ignores solvents among `kg`: their amounts enter through `carried`.
    pH = aqueousPH(ctx, {
      volumeM3: Va,
      kg: aqueous,
      includeCompounds: false,
      carried: { organicVolumeM3: Vo, compounds: carried },
    });
    method(
      methods,
      'aqueous pH',
      carried.length
        ? 'charge balance of the aqueous solutes and of the acids and bases carried by the feed or present as solvents (their neutral forms partitioning into the organic phase; ideal solution, pKw 14)'
        : 'charge balance of the aqueous solutes (ideal solution, pKw 14)',
      'pKa values from the aqueous-media and solvent libraries and the route compounds',
    );
  }
  if (pH !== null) {
    // Ionised solvent stays in the water: n_aq = n V_aq / (V_aq + K f_n V_org).
    for (const sv of ionisingSolvents) {
      const M = ctx.comps.get(sv.id)!.molarMassKgMol;
      const fn = neutralFraction(sv.pKa as PKa[], pH);
      const nAq = (sv.mol * Va) / (Va + sv.K * fn * Vo);
      aqueous[sv.id] = Math.min(mix[sv.id], nAq * M);
      organic[sv.id] = mix[sv.id] - aqueous[sv.id];
    }
  }
  // CO₂ formed from carbonate and bicarbonate: the carbonic-acid share of the carbonate in the
  // aqueous phase at its pH (closed system: it stays dissolved as H2CO3* in the balance above).
  let co2Mol = 0;
  if (pH !== null) {
    for (const id of ctx.ids) {
      const c = ctx.comps.get(id)!;
      if (!c.aqueous || !(aqueous[id] > 0) || !isCarbonate(c.aqueous)) continue;
      co2Mol += (aqueous[id] / c.molarMassKgMol) * carbonicAcidFraction(c.aqueous, pH);
    }
  }
  const D: PhaseState['D'] = {};
  const toOrganic: Record<string, number> = {};
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'compound') continue;
    if (!(mix[id] > 0)) {
      toOrganic[id] = 1;
      continue;
    }
    if (sp.split && !hasAq && Vo > 0 && Va > 0) {
      // Two organic liquid phases: UNIFAC activity-coefficient ratio at infinite dilution.
      const d = organicOrganicDistribution(ctx, id, sp.organicKg, sp.aqueousKg, T_K, warnings);
      if (d) {
        D[id] = d;
        method(methods, `distribution of ${c.name}`, d.method, d.source);
        toOrganic[id] = (d.D * Vo) / (d.D * Vo + Va);
      } else {
        toOrganic[id] = feedIsPolar ? 0 : 1;
      }
      continue;
    }
    if (!sp.split || !hasAq || Vo <= 0 || main === null) {
      toOrganic[id] = Vo > 0 || !hasAq ? 1 : 0;
      continue;
    }
    const d = compoundDistribution(ctx, id, main, pH, salt, T_K, warnings, phaseKg);
    D[id] = d;
    method(methods, `distribution of ${c.name}`, d.method, d.source);
    toOrganic[id] = d.D === Infinity ? 1 : (d.D * Vo) / (d.D * Vo + Va);
  }
  return {
    organic,
    aqueous,
    split: sp.split,
    pH,
    volumes: { organicM3: Vo, aqueousM3: Va },
    D,
    toOrganic,
    co2Mol,
  };
}

/** A carbonate or bicarbonate medium (carbonic acid pKa system). */
function isCarbonate(a: AqueousSoluteRecord | undefined): boolean {
  return (
    !!a &&
    /CO3/.test(a.formula) &&
    (a.acidBase.kind === 'amphoteric-salt' || a.acidBase.kind === 'weak-base')
  );
}

/**
 * Fraction of a carbonate system present as carbonic acid (H2CO3*, i.e.
 * dissolved CO₂) at pH: α0 = 1/(1 + 10^(pH − pKa1) + 10^(2pH − pKa1 − pKa2)).
 */
function carbonicAcidFraction(a: AqueousSoluteRecord, pH: number): number {
  if (a.acidBase.kind !== 'amphoteric-salt' && a.acidBase.kind !== 'weak-base') return 0;
  const [k1, k2] = a.acidBase.pKa.value;
  return 1 / (1 + 10 ** (pH - k1) + (k2 === undefined ? 0 : 10 ** (2 * pH - k1 - k2)));
}

/**
 * The wash and extraction step model (see the module comment): the added
 * liquid contacts the feed in cross-current or counter-current stages.
 *
 * Source: see the module comment (IUPAC 1993; Kremser 1930; Seader, Henley & Roper).
 * Validity: dilute solutes, 0–80 °C, equilibrium stages.
 *
 * @param inputs  the feed stream [kg per component]
 * @param params  the step parameters (volumes in the chemist's units, temperature in °C)
 * @param ctx     evaluation context
 * @param step    the route step
 * @returns the organic and aqueous outputs [kg] and the step result
 */
export function washOrExtraction(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'wash'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const feed = inputs.feed!;
  const T = cToK(ctx.num(params.temperatureC, ...RANGES.temperatureC));
  const N = params.stages;
  const result = newResult(step, {
    hours: N * COMMON_PRACTICE_HOURS.washStage,
    basis: COMMON_PRACTICE_BASIS,
  });
  const W = result.warnings;
  const M = result.methods;
  const liq = params.addedLiquid;

  // The added liquid, per stage (cross-current) or in total (counter-current).
  const V = volumeToM3(ctx, liq.volume);
  const added: Record<string, number> = {};
  let pHOverride: number | undefined;
  if (liq.kind === 'aqueous') {
    if (!ctx.waterId) throw new StepError('params.addedLiquid', AQUEOUS_NEEDS_WATER);
    const wt = ctx.num(liq.wtPct, 0, 60);
    const { waterKg, soluteKg } = aqueousMediumKg(ctx, liq.soluteId, wt, V, T);
    added[ctx.waterId] = waterKg;
    added[liq.soluteId] = soluteKg;
    pHOverride = liq.pH;
  } else {
    added[liq.solventId] = solventKgFromVolume(ctx, liq.solventId, V, T);
  }
  const perStage = params.mode === 'cross-current';
  for (const id in added) result.addedKg[id] = perStage ? added[id] * N : added[id];
  result.addedVolumeM3 = perStage ? V * N : V;

  const feedPhaseIsOrganic =
    liq.kind === 'aqueous' || (liq.kind === 'solvent' && ctx.comps.get(liq.solventId)!.isWater);
  if (liq.kind === 'solvent' && !feedPhaseIsOrganic) {
    // An organic solvent added: the feed is aqueous unless it holds no water.
    const fw = ctx.waterId ? feed.kg[ctx.waterId] : 0;
    if (!(fw > 0))
      W.push({
        severity: 'warning',
        code: 'no-aqueous-feed',
        message:
          'An organic solvent is added to a feed without water: an organic–organic split is assumed.',
      });
  }
  if (ctx.ids.some((id) => feed.solidKg[id] > 0))
    warn(
      W,
      'warning',
      'solids-in-wash',
      'The feed carries solids: they stay with the feed phase and may gather at the interface (rag layer).',
    );

  const organicOut = emptyStream(ctx, 'organic', T);
  const aqueousOut = emptyStream(ctx, 'aqueous', T);
  const perComponent: Record<
    string,
    { D: number | null; method: string; source: string; toOrganicPct: number }
  > = {};
  let last: ReturnType<typeof equilibrate> | null = null;
  let peak = 0;
  const stagePH: Array<number | null> = [];
  let co2Leaving = 0;

  // Which phase carries on: the feed phase is the one the feed's main liquid lands in.
  let feedIsAqueous = !feedPhaseIsOrganic && !!ctx.waterId && feed.kg[ctx.waterId] > 0;
  if (liq.kind === 'solvent' && !feedPhaseIsOrganic && !feedIsAqueous) {
    // Organic–organic: the feed phase is the one that takes most of the feed's main solvent.
    const mainFeed = mainOrganic(ctx, feed.kg);
    if (mainFeed) {
      const probe = { ...feed.kg };
      for (const id in added) probe[id] += added[id];
      const sp = splitLiquid(ctx, solventsOnly(ctx, probe), T, [], []);
      feedIsAqueous = sp.split && (sp.aqueousKg[mainFeed] ?? 0) > (sp.organicKg[mainFeed] ?? 0);
    }
  }

  if (perStage) {
    method(
      M,
      'stages',
      'cross-current: fresh liquid each stage, equilibrium stages simulated in turn',
      'IUPAC 1993, Pure Appl. Chem. 65, 2373: fraction extracted (fraction remaining q^n)',
    );
    let carry: Record<string, number> = { ...feed.kg };
    const collected: Record<string, number> = {};
    for (const id of ctx.ids) collected[id] = 0;
    // Each stage's liquid–liquid flash starts from the stage before's liquids.
    const start: LiquidSplitStart = {};
    for (let s = 0; s < N; s++) {
      const mix: Record<string, number> = { ...carry };
      for (const id in added) mix[id] += added[id];
      peak = Math.max(peak, streamVolume(ctx, mix, T));
      const eq = equilibrate(ctx, mix, T, pHOverride, W, M, feedIsAqueous, start);
      last = eq;
      stagePH.push(eq.pH);
      if (!feedIsAqueous || s === N - 1) co2Leaving += eq.co2Mol;
      const next: Record<string, number> = {};
      for (const id of ctx.ids) {
        const c = ctx.comps.get(id)!;
        let toFeedPhase: number;
        if (c.kind === 'compound') {
          const fo = eq.toOrganic[id];
          const org = mix[id] * fo;
          toFeedPhase = feedIsAqueous ? mix[id] - org : org;
        } else {
          toFeedPhase = feedIsAqueous ? eq.aqueous[id] : eq.organic[id];
        }
        if (toFeedPhase > mix[id]) toFeedPhase = mix[id];
        if (!(toFeedPhase > 0)) toFeedPhase = 0;
        next[id] = toFeedPhase;
        collected[id] += mix[id] - toFeedPhase;
      }
      carry = next;
    }
    const feedOut = feedIsAqueous ? aqueousOut : organicOut;
    const addOut = feedIsAqueous ? organicOut : aqueousOut;
    for (const id of ctx.ids) {
      feedOut.kg[id] = carry[id];
      addOut.kg[id] = collected[id];
    }
  } else {
    method(
      M,
      'stages',
      'counter-current cascade solved stage by stage: every stage its own liquid–liquid split, pH and distribution ratios; for the current stage splits the component balances of the cascade are solved exactly (tridiagonal), repeated until no split changes by more than 1e-9',
      'balance and equilibrium stages as in Seader, Henley & Roper, Separation Process Principles, liquid–liquid extraction chapter; reduces to the Kremser equation (Kremser 1930) for a constant distribution ratio and immiscible liquids (reference test)',
    );
    // Each stage's liquid–liquid flash starts from its liquids of the pass before.
    const starts: LiquidSplitStart[] = Array.from({ length: N }, () => ({}));
    const coldStage = coldStageMemo(ctx, (mix, w, m, n) =>
      equilibrate(ctx, mix, T, pHOverride, w, m, feedIsAqueous, starts[n]),
    );
    const cc = counterCurrentCascade(ctx, feed.kg, added, N, feedIsAqueous, (mix, w, m, n) =>
      coldStage(mix, w, m, starts[n], n),
    );
    if (!cc.converged)
      warn(
        W,
        'warning',
        'cascade-not-converged',
        `The ${N} counter-current stages did not settle to a steady state within ${COUNTER_CURRENT_MAX_SWEEPS} passes (largest remaining change ${cc.change.toExponential(1)}): the amounts in the two outlets are approximate.`,
      );
    // The final pass gives the warnings and methods of every stage at the steady state.
    const finals = cc.mixes.map((mix, n) => {
      peak = Math.max(peak, streamVolume(ctx, mix, T));
      return equilibrate(ctx, mix, T, pHOverride, W, M, feedIsAqueous, starts[n]);
    });
    last = finals[N - 1];
    stagePH.push(...finals.map((e) => e.pH));
    co2Leaving = feedIsAqueous ? finals[N - 1].co2Mol : finals[0].co2Mol;
    const feedOutC = feedIsAqueous ? aqueousOut : organicOut;
    const addOutC = feedIsAqueous ? organicOut : aqueousOut;
    for (const id of ctx.ids) {
      feedOutC.kg[id] = cc.feedPhaseOut[id];
      addOutC.kg[id] = cc.addedPhaseOut[id];
    }
  }
  // Solids stay with the feed phase.
  const feedOut = feedIsAqueous ? aqueousOut : organicOut;
  for (const id of ctx.ids) {
    const sol = feed.solidKg[id];
    if (sol > 0) feedOut.solidKg[id] = Math.min(sol, feedOut.kg[id]);
  }
  finishStream(ctx, organicOut);
  finishStream(ctx, aqueousOut);

  // Per-component recovery.
  const totalIn: Record<string, number> = {};
  for (const id of ctx.ids) totalIn[id] = feed.kg[id] + (result.addedKg[id] ?? 0);
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'compound' || !(totalIn[id] > 0)) continue;
    const d = last?.D[id];
    perComponent[id] = {
      D: d ? d.D : null,
      method: d?.method ?? 'not distributed (single phase or no data)',
      source: d?.source ?? '',
      toOrganicPct: round((100 * organicOut.kg[id]) / totalIn[id], 3),
    };
  }

  // Densities and top phase.
  const mO = Object.values(organicOut.kg).reduce((a, b) => a + b, 0);
  const mA = Object.values(aqueousOut.kg).reduce((a, b) => a + b, 0);
  const rhoO = organicOut.volumeM3 > 0 ? mO / organicOut.volumeM3 / 1000 : null;
  const rhoA = aqueousOut.volumeM3 > 0 ? mA / aqueousOut.volumeM3 / 1000 : null;
  let top: 'organic' | 'aqueous' | null = null;
  if (rhoO !== null && rhoA !== null) {
    top = rhoO < rhoA ? 'organic' : 'aqueous';
    const dRho = Math.abs(rhoO - rhoA);
    if (dRho < MIN_DENSITY_DIFFERENCE_GML) {
      W.push({
        severity: 'warning',
        code: 'near-equal-densities',
        message: `Phase densities differ by only ${dRho.toFixed(3)} g/mL (organic ${rhoO.toFixed(3)}, aqueous ${rhoA.toFixed(3)}): slow or no separation, risk of phase inversion; consider brine or more solvent.`,
      });
    }
    method(
      M,
      'top phase',
      'phase densities by ideal mixing of component volumes',
      'densities from the solvent and aqueous-media library',
    );
  }

  // Emulsion-prone conditions (common practice).
  const pH = last?.pH ?? null;
  if (last?.split) emulsionChecks(ctx, organicOut, pH, rhoO, rhoA, W);
  // Gas evolution: carbonate or bicarbonate meeting acid.
  if (liq.kind === 'aqueous')
    gasEvolutionCheck(ctx, liq.soluteId, result.addedKg, co2Leaving, T, W, result);
  buffercapacityCheck(ctx, feed, result.addedKg, pH, T, W);

  // Product loss to the discarded phase.
  const pid = ctx.productId;
  if (pid && totalIn[pid] > 0) {
    const kept = params.keep === 'organic' ? organicOut.kg[pid] : aqueousOut.kg[pid];
    const recovery = kept / totalIn[pid];
    result.summary['product recovery %'] = round(recovery * 100, 2);
    if (step.kind === 'wash' && recovery < 0.98)
      W.push({
        severity: 'warning',
        code: 'product-loss',
        message: `${(100 * (1 - recovery)).toFixed(1)} % of the product leaves with the ${params.keep === 'organic' ? 'aqueous' : 'organic'} phase.`,
      });
    if (step.kind === 'extraction' && recovery < 0.9)
      W.push({
        severity: 'warning',
        code: 'incomplete-extraction',
        message: `Only ${(100 * recovery).toFixed(1)} % of the product reaches the ${params.keep} phase; consider more stages or volume.`,
      });
  }
  if (!last?.split) result.summary['phases'] = 'one';
  result.summary['pH'] = pH === null ? null : round(pH, 2);
  result.summary['top'] = top;
  result.peakVolumeM3 = peak;
  commonCautions(ctx, organicOut.kg, T, W, { transfer: true });
  result.details = {
    mode: params.mode,
    stages: N,
    aqueousPH: pH,
    stagePH,
    topPhase: top,
    densitiesGmL: { organic: rhoO, aqueous: rhoA },
    phaseVolumesL: { organic: organicOut.volumeM3 * 1000, aqueous: aqueousOut.volumeM3 * 1000 },
    components: perComponent,
  };
  return { outputs: { organic: organicOut, aqueous: aqueousOut }, result };
}

/** Largest number of passes of the counter-current cascade solution. */
export const COUNTER_CURRENT_MAX_SWEEPS = 200;

/**
 * A counter-current cascade's stage equilibrium with its first pass shared: the first pass gives
 * every stage the same liquid (the whole feed and added liquid) and no warm start, so a stage whose
 * liquid holds the same amounts (compared exactly) as the last stage equilibrated without a warm
 * start takes that stage's result and liquids to start from, instead of the same flash, pH and
 * distributions again. The same answers to the bit: equilibrate without a warm start is a function
 * of the amounts. Later passes (warm-started) are always equilibrated.
 *
 * Source: none needed (bookkeeping; equilibrate is unchanged).
 * Validity: the first pass of a counter-current cascade (every stage given the same liquid).
 * @param ctx    evaluation context (its component ids)
 * @param stage  equilibrate for one stage, filling that stage's warm start
 * @returns the stage function of counterCurrentCascade, given the stage's warm start as well
 */
export function coldStageMemo(
  ctx: EvalContext,
  stage: (
    mix: Record<string, number>,
    warnings: EngineWarning[],
    methods: MethodUsed[],
    stage: number,
  ) => ReturnType<typeof equilibrate>,
): (
  mix: Record<string, number>,
  warnings: EngineWarning[],
  methods: MethodUsed[],
  start: LiquidSplitStart,
  stage: number,
) => ReturnType<typeof equilibrate> {
  let kept: {
    amounts: number[];
    eq: ReturnType<typeof equilibrate>;
    key: string | undefined;
    phases: [number[], number[]] | undefined;
  } | null = null;
  return (mix, warnings, methods, start, n) => {
    const cold = start.key === undefined;
    if (cold && kept && ctx.ids.every((id, i) => Object.is(mix[id], kept!.amounts[i]))) {
      start.key = kept.key;
      start.phases = kept.phases && [kept.phases[0].slice(), kept.phases[1].slice()];
      return kept.eq;
    }
    const eq = stage(mix, warnings, methods, n);
    if (cold)
      kept = {
        amounts: ctx.ids.map((id) => mix[id]),
        eq,
        key: start.key,
        phases: start.phases && [start.phases[0].slice(), start.phases[1].slice()],
      };
    return eq;
  };
}

/**
 * Steady state of N ideal counter-current stages: the feed enters stage 1 and
 * its phase moves toward stage N; the added liquid enters stage N and its
 * phase moves toward stage 1. Each stage is an equilibrium contact of what
 * enters it (`stage`: split, pH, distribution), which gives for every
 * component i the fraction φ_n,i of stage n's content leaving in the feed
 * phase. For given φ the component balances
 *   T_n − φ_{n−1} T_{n−1} − (1 − φ_{n+1}) T_{n+1} = s_n
 * (T_n the amount in stage n; s_1 the feed, s_N the added liquid) are linear
 * and tridiagonal, solved exactly (Thomas algorithm); the stage contents are
 * then re-equilibrated and the whole repeated until no φ changes by more than
 * 1e-9 (from the 20th pass on the contents are relaxed by one half). With a
 * constant φ (constant distribution ratio, immiscible liquids) this is the
 * Kremser solution in one pass.
 *
 * @param feedKg   feed [kg per component]
 * @param addedKg  added liquid, in total [kg per component]
 * @param N        number of stages [-], ≥ 1
 * @param feedIsAqueous  whether the feed phase is the aqueous one
 * @param stage    equilibrium of one stage's content (warnings and methods go to the given lists;
 *                 the stage's number, 0-based, last)
 * @returns the stage contents [kg], the two outlets [kg], whether it converged and the last change [-]
 *
 * Source: stage balances as in Seader, Henley & Roper, Separation Process
 * Principles (liquid–liquid extraction chapter); Thomas algorithm (any
 * numerical-analysis text). Validity: equilibrium stages, no entrainment.
 *
 * @param ctx  evaluation context (route components resolved against the library)
 */
export function counterCurrentCascade(
  ctx: EvalContext,
  feedKg: Record<string, number>,
  addedKg: Record<string, number>,
  N: number,
  feedIsAqueous: boolean,
  stage: (
    mix: Record<string, number>,
    warnings: EngineWarning[],
    methods: MethodUsed[],
    stage: number,
  ) => ReturnType<typeof equilibrate>,
): {
  mixes: Array<Record<string, number>>;
  feedPhaseOut: Record<string, number>;
  addedPhaseOut: Record<string, number>;
  converged: boolean;
  change: number;
} {
  const ids = ctx.ids;
  const src = (n: number, id: string) =>
    (n === 0 ? (feedKg[id] ?? 0) : 0) + (n === N - 1 ? (addedKg[id] ?? 0) : 0);
  // First guess: every stage holds the whole feed and the whole added liquid.
  let mixes = Array.from({ length: N }, () => {
    const m: Record<string, number> = {};
    for (const id of ids) m[id] = (feedKg[id] ?? 0) + (addedKg[id] ?? 0);
    return m;
  });
  let phi: Array<Record<string, number>> | null = null;
  let balanced = mixes;
  let converged = false;
  let change = Infinity;
  for (let sweep = 0; sweep < COUNTER_CURRENT_MAX_SWEEPS; sweep++) {
    const next = mixes.map((mix, n) => {
      const eq = stage(mix, [], [], n);
      const f: Record<string, number> = {};
      for (const id of ids) {
        const c = ctx.comps.get(id)!;
        if (!(mix[id] > 0)) {
          f[id] = 1;
          continue;
        }
        let inFeedPhase: number;
        if (c.kind === 'compound') {
          const org = eq.toOrganic[id];
          inFeedPhase = feedIsAqueous ? 1 - org : org;
        } else {
          inFeedPhase = (feedIsAqueous ? eq.aqueous[id] : eq.organic[id]) / mix[id];
        }
        f[id] = Math.min(1, Math.max(0, inFeedPhase));
      }
      return f;
    });
    change = 0;
    if (phi)
      for (let n = 0; n < N; n++)
        for (const id of ids) change = Math.max(change, Math.abs(next[n][id] - phi[n][id]));
    phi = next;
    // Component balances for the current splits (Thomas algorithm).
    const solved = Array.from({ length: N }, () => ({}) as Record<string, number>);
    for (const id of ids) {
      const cp = new Float64Array(N);
      const dp = new Float64Array(N);
      for (let n = 0; n < N; n++) {
        const a = n > 0 ? -phi[n - 1][id] : 0;
        const c = n < N - 1 ? -(1 - phi[n + 1][id]) : 0;
        const den = 1 - a * (n > 0 ? cp[n - 1] : 0);
        cp[n] = c / den;
        dp[n] = (src(n, id) - a * (n > 0 ? dp[n - 1] : 0)) / den;
      }
      const T = new Float64Array(N);
      for (let n = N - 1; n >= 0; n--) T[n] = dp[n] - (n < N - 1 ? cp[n] * T[n + 1] : 0);
      for (let n = 0; n < N; n++) solved[n][id] = Math.max(0, T[n]);
    }
    balanced = solved;
    mixes =
      sweep >= 20
        ? solved.map((m, n) => {
            const r: Record<string, number> = {};
            for (const id of ids) r[id] = 0.5 * (m[id] + mixes[n][id]);
            return r;
          })
        : solved;
    if (sweep > 0 && change < 1e-9) {
      converged = true;
      break;
    }
  }
  const feedPhaseOut: Record<string, number> = {};
  const addedPhaseOut: Record<string, number> = {};
  // Outlets from the last exactly balanced solution (the balances close for any φ).
  for (const id of ids) {
    feedPhaseOut[id] = phi![N - 1][id] * balanced[N - 1][id];
    addedPhaseOut[id] = (1 - phi![0][id]) * balanced[0][id];
  }
  return { mixes: balanced, feedPhaseOut, addedPhaseOut, converged, change };
}

/**
 * Kremser equation: fraction of a solute left in the feed phase after N
 * ideal counter-current stages with extraction factor E toward the solvent.
 *   φ = (E − 1)/(E^{N+1} − 1),   φ = 1/(N + 1) for E = 1.
 * E [-] ≥ 0, N [-] ≥ 1 integer. Returns φ in [0, 1].
 *
 * Source: A. Kremser, Natl. Petrol. News 1930, 22(21), 42; Seader, Henley & Roper, Separation Process Principles.
 * Validity: ideal stages, constant E and immiscible liquids.
 * @param E  extraction factor toward the added phase [-], ≥ 0
 * @param N  number of stages [-], integer ≥ 1
 */
export function kremserFractionRemaining(E: number, N: number): number {
  if (!(E >= 0)) return 1;
  if (E === Infinity) return 0;
  if (Math.abs(E - 1) < 1e-9) return 1 / (N + 1);
  if (E > 1) {
    // Divide through by E^{N+1} to avoid overflow.
    const inv = 1 / E;
    return (inv ** N - inv ** (N + 1)) / (1 - inv ** (N + 1));
  }
  return (1 - E) / (1 - E ** (N + 1));
}

/** Cross-current: fraction left after n stages, q^n with q = 1/(1 + E). *
 * Source: IUPAC Recommendations 1993, "Nomenclature for liquid–liquid distribution (solvent
 * extraction)", Pure Appl. Chem. 65, 2373 (p. 2384), term "fraction extracted": after n
 * successive portions at phase ratio r, E_n = 1 − (rD + 1)^−n (read in the IUPAC Gold Book,
 * doi 10.1351/goldbook.F02503); here E = rD, so the fraction left is (1 + E)^−n.
 * Validity: equal stages, constant E, immiscible liquids.
 * @param E  extraction factor of one stage [-], ≥ 0
 * @param n  number of stages [-]
 * @returns fraction left in the feed phase [-]
 */
export function crossCurrentFractionRemaining(E: number, n: number): number {
  return (1 / (1 + E)) ** n;
}

function emulsionChecks(
  ctx: EvalContext,
  organic: Stream,
  pH: number | null,
  rhoO: number | null,
  rhoA: number | null,
  W: EngineWarning[],
) {
  const reasons: string[] = [];
  if (rhoO !== null && rhoA !== null && Math.abs(rhoO - rhoA) < MIN_DENSITY_DIFFERENCE_GML)
    reasons.push('very small density difference');
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (
      c.solvent &&
      c.solvent.id === 'dichloromethane' &&
      organic.kg[id] > 0 &&
      pH !== null &&
      pH > 9
    )
      reasons.push('dichloromethane against a basic aqueous phase');
    const cp = c.compound;
    if (
      cp &&
      pH !== null &&
      cp.logP !== undefined &&
      cp.logP >= 2 &&
      cp.pKa?.some((p) => Math.abs(p.value - pH) < 1)
    ) {
      reasons.push(
        `${cp.name} is partly ionised at pH ${pH.toFixed(1)} with logP ${cp.logP} (surfactant-like)`,
      );
    }
  }
  if (reasons.length)
    W.push({
      severity: 'advisory',
      code: 'emulsion-risk',
      message: `Emulsion-prone conditions (common practice): ${reasons.join('; ')}. Allow settling time; brine or filtration through a filter aid may help.`,
    });
}

/**
 * CO₂ from a carbonate or bicarbonate wash: the carbonic acid (dissolved CO₂)
 * in the aqueous phase(s) leaving the step at their pH, less what the medium
 * alone holds at its own pH, is what can leave as gas (closed-system charge
 * balance, so an upper bound for what degassing releases). Counts every acid
 * that met the carbonate: strong and weak acids, acidic compounds and acidic
 * solvents such as acetic acid. Reported in mol and L at 1 atm (ideal gas).
 */
function gasEvolutionCheck(
  ctx: EvalContext,
  soluteId: string,
  addedKg: Record<string, number>,
  co2Leaving: number,
  T_K: number,
  W: EngineWarning[],
  result: ReturnType<typeof newResult>,
) {
  const a = ctx.comps.get(soluteId)!.aqueous!;
  const soluteKg = addedKg[soluteId] ?? 0;
  if (!isCarbonate(a) || !(soluteKg > 0)) return;
  const medium: Record<string, number> = {};
  for (const id of ctx.ids) medium[id] = addedKg[id] ?? 0;
  const nCarb = soluteKg / ctx.comps.get(soluteId)!.molarMassKgMol;
  const mediumPH = aqueousPH(ctx, {
    volumeM3: streamVolume(ctx, medium, T_K),
    kg: medium,
    includeCompounds: false,
  });
  const baseline = mediumPH === null ? 0 : nCarb * carbonicAcidFraction(a, mediumPH);
  const nCO2 = co2Leaving - baseline;
  if (!(nCO2 > 1e-6 * nCarb)) return;
  result.summary['CO₂ released mol'] = round(nCO2, 4);
  const litres = ((nCO2 * R_J_PER_MOL_K * T_K) / STANDARD_ATMOSPHERE_PA) * 1000;
  W.push({
    severity: 'hazard',
    code: 'gas-evolution',
    message: `${a.name} neutralises acid: up to ${nCO2.toFixed(2)} mol CO₂ (≈ ${litres.toFixed(0)} L at 1 atm) is formed and can be released. Add slowly with venting and stirring; never in a closed vessel; watch for foaming.`,
  });
}

/**
 * Acid–base capacity of the wash against the acids and bases the feed carries.
 * Acids counted: strong and weak acids among the feed's aqueous solutes, and
 * compound acid sites with pKa below the pH of the medium alone (those the
 * medium would neutralise); bases likewise (conjugate-acid pKa above it).
 * Capacity of the wash: mol H⁺ (strong acid protons, weak acid sites) or mol
 * base (hydroxide, carbonate or bicarbonate as one equivalent each, common
 * practice for a wash that should not be driven to CO₂ by carbonate's second
 * equivalent). Below 1 equiv: a warning with the equivalents and the pH the
 * charge balance gives; 1–2 equiv: an advisory (little margin).
 */
function buffercapacityCheck(
  ctx: EvalContext,
  feed: Stream,
  added: Record<string, number>,
  pH: number | null,
  T_K: number,
  W: EngineWarning[],
) {
  if (pH === null) return;
  let acidCap = 0;
  let baseCap = 0;
  const medium: Record<string, number> = {};
  for (const id of ctx.ids) medium[id] = 0;
  for (const id in added) {
    const c = ctx.comps.get(id)!;
    medium[id] = added[id];
    if (!c.aqueous) continue;
    const n = added[id] / c.molarMassKgMol;
    const ab = c.aqueous.acidBase;
    if (ab.kind === 'strong-acid') acidCap += n * ab.protons;
    else if (ab.kind === 'weak-acid') acidCap += n * ab.pKa.value.length;
    else if (ab.kind === 'strong-base') baseCap += n * ab.hydroxides;
    else if (ab.kind === 'weak-base' || ab.kind === 'amphoteric-salt') baseCap += n;
  }
  if (!(acidCap > 0) && !(baseCap > 0)) return;
  const mediumPH =
    aqueousPH(ctx, {
      volumeM3: streamVolume(ctx, medium, T_K),
      kg: medium,
      includeCompounds: false,
    }) ?? pH;
  let needAcid = 0;
  let needBase = 0;
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (!(feed.kg[id] > 0)) continue;
    const n = feed.kg[id] / c.molarMassKgMol;
    const ab = c.aqueous?.acidBase;
    if (ab?.kind === 'strong-acid') needBase += n * ab.protons;
    else if (ab?.kind === 'weak-acid')
      needBase += n * ab.pKa.value.filter((k) => k < mediumPH).length;
    else if (ab?.kind === 'strong-base') needAcid += n * ab.hydroxides;
    else if (ab?.kind === 'weak-base' || ab?.kind === 'amphoteric-salt') needAcid += n;
    for (const p of [...(c.compound?.pKa ?? []), ...(c.solvent?.pKa?.value ?? [])]) {
      if (p.type === 'base' && p.value > mediumPH) needAcid += n;
      if (p.type === 'acid' && p.value < mediumPH) needBase += n;
    }
  }
  const check = (cap: number, need: number, what: 'acid' | 'base', carried: 'bases' | 'acids') => {
    if (!(cap > 0) || !(need > 0)) return;
    const equiv = cap / need;
    if (equiv < 1) {
      W.push({
        severity: 'warning',
        code: `${what}-insufficient`,
        message: `The wash carries ${cap.toPrecision(3)} mol ${what} for ${need.toPrecision(3)} mol ${carried} in the feed (${equiv.toFixed(2)} equiv): the aqueous pH ends at ${pH.toFixed(2)} instead of ${mediumPH.toFixed(2)} for the medium alone, and the ${carried} are purged less. Use more than 1 equiv of ${what}.`,
      });
    } else if (equiv < 2) {
      W.push({
        severity: 'advisory',
        code: 'buffer-capacity',
        message: `The wash carries ${equiv.toFixed(2)} equiv of ${what} for the ${carried} in the feed (${cap.toPrecision(3)} vs ${need.toPrecision(3)} mol): the pH (${pH.toFixed(2)}, medium alone ${mediumPH.toFixed(2)}) has little margin.`,
      });
    }
  };
  check(baseCap, needBase, 'base', 'acids');
  check(acidCap, needAcid, 'acid', 'bases');
}
