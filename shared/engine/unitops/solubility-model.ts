/**
 * Solubility of a route compound in the current liquor (one solvent or a
 * blend) at a temperature, for crystallisation, distillation (crash-out
 * warnings), filtration (cake-wash losses).
 *
 * Evidence, best first, per neat solvent j:
 *  1. the user's measured points for that solvent: van 't Hoff fit
 *     ln x = a + b/T (≥ 2 temperatures); one point is extended with the
 *     ideal slope d ln x/d(1/T) = −ΔHfus/R when ΔHfus is known;
 *  2. UNIFAC activity-corrected solubility x γ(x,T) = x_ideal(T), solved by
 *     the same routine as the calculation API
 *     (properties/solubility.solveActivitySolubility; a new temperature
 *     starts from the nearest one solved for the same liquid, the same
 *     answer: createActivitySolubilitySolver);
 *  3. ideal solubility ln x = −(ΔHfus/R)(1/T − 1/Tm).
 * Blends: Jouyban–Acree (Jouyban, J. Pharm. Pharm. Sci. 2008, 11, 32),
 *   ln x_m = Σ f_j ln x_j + Σ_pairs (f_i f_j/T) Σ_k J_k (f_i − f_j)^k,
 * with the compound's own J terms where the chemist gives them (on their
 * fraction basis), else the log-linear form on solute-free volume fractions.
 * Solvents below 1 % of the blend by volume are left out (fractions
 * renormalised). A solvent with no solubility evidence at all is assumed to
 * dissolve the compound per litre like the rest of the blend (it is left out
 * of the average and adds capacity in proportion to its volume) — stated in a
 * warning, never a silent collapse to "fully soluble".
 */
import {
  fitVantHoff,
  gramsPerLitreToMoleFraction,
  idealSolubility,
  jouybanAcree,
  createActivitySolubilitySolver,
  type ActivitySolubilitySolver,
  type JouybanPair,
} from '../properties/solubility';
import type { UnifacModel } from '../thermo/unifac';
import type { EvalContext } from '../route/context';
import { method, solventDensityGmL, warn } from '../route/context';
import type { EngineWarning, MethodUsed } from '../route/types';
import { R_J_PER_MOL_K } from '../units';
import type { CompoundSnapshot } from '../document';
import type { SolventRecord } from '../data/types';

type Curve = {
  lnX(T_K: number): number;
  method: string;
  source: string;
  range?: [number, number];
  /** Why a better method could not be used (shown as a warning). */
  note?: string;
} | null;

function pointToMoleFraction(
  c: CompoundSnapshot,
  s: SolventRecord,
  p: NonNullable<CompoundSnapshot['solubility']>[number],
): number {
  const Ms = c.molarMassGmol;
  const Mv = s.molarMassGmol.value;
  switch (p.unit) {
    case 'mole-fraction':
      return p.value;
    case 'g/L':
    case 'mg/mL':
      return gramsPerLitreToMoleFraction({
        gramsPerLitre: p.value,
        soluteMolarMassGmol: Ms,
        solventMolarMassGmol: Mv,
        solventDensityGmL: solventDensityGmL(s, p.temperatureC + 273.15),
      });
    case 'wt%': {
      const w = p.value / 100;
      return w / Ms / (w / Ms + (1 - w) / Mv);
    }
  }
}

/**
 * Solver of x γ(x, T) = x_ideal(T) in a neat solvent (solute index 0 of a
 * two-component UNIFAC model), for many temperatures: the shared root of the
 * calculation API (properties/solubility.solveActivitySolubility), started
 * from the nearest temperature already solved for this liquid
 * (createActivitySolubilitySolver; the same x as the full scan).
 * @param model   UNIFAC model of [solute, solvent]
 * @returns the solver (solve(T [K], x_ideal [–]) → x [–])
 */
function activitySolubilitySolver(model: UnifacModel): ActivitySolubilitySolver {
  const pair = new Float64Array(2);
  const buf = new Float64Array(2);
  return createActivitySolubilitySolver((x, T_K) => {
    pair[0] = x;
    pair[1] = 1 - x;
    return model.lnGammas(pair, T_K, buf)[0];
  });
}

/**
 * Solubility curve ln x(T) of a compound in one neat solvent, by the best
 * evidence available (module comment, items 1–3): measured points with a
 * van 't Hoff fit ln x = a + b/T; one point with the ideal slope
 * −ΔHfus/R; UNIFAC activity-corrected x γ(x) = x_ideal(T); ideal solubility
 * ln x = −(ΔHfus/R)(1/T − 1/Tm). Memoised in the evaluation context.
 *
 * Source: van 't Hoff fit of the user's measured points; Schröder–van Laar
 * ideal solubility (Prausnitz, Lichtenthaler & de Azevedo, Molecular
 * Thermodynamics of Fluid-Phase Equilibria, solid–liquid equilibria chapter);
 * UNIFAC (Fredenslund et al. 1975; Hansen et al. 1991) via
 * properties/solubility.ts.
 * Validity: the fit over its measured temperature range (the curve's range;
 * callers warn outside it); UNIFAC and ideal models below the melting point
 * (T is capped at Tm), for a pure crystalline form without solvates.
 * @param ctx                 evaluation context (route components resolved against the library)
 * @param compoundId          the compound's component id
 * @param solventComponentId  the solvent's component id
 * @returns the curve (ln x as a function of T [K], method, source, fitted range [K]) or null when there is no evidence
 */
export function neatSolventCurve(
  ctx: EvalContext,
  compoundId: string,
  solventComponentId: string,
): Curve {
  const key = `sol:${compoundId}:${solventComponentId}`;
  if (ctx.cache.has(key)) return ctx.cache.get(key) as Curve;
  const c = ctx.comps.get(compoundId)!.compound!;
  const s = ctx.comps.get(solventComponentId)!.solvent!;
  let curve: Curve = null;
  const pts = (c.solubility ?? []).filter((p) => p.solventId === s.id);
  const Tm = c.meltingPointC !== undefined ? c.meltingPointC + 273.15 : undefined;
  const dH = c.enthalpyFusionKJmol !== undefined ? c.enthalpyFusionKJmol * 1000 : undefined;
  const src =
    pts
      .map((p) => p.source)
      .filter(Boolean)
      .join('; ') || 'user measured data';
  const temps = new Set(pts.map((p) => p.temperatureC));
  if (temps.size >= 2) {
    const fit = fitVantHoff(
      pts.map((p) => ({
        T_K: p.temperatureC + 273.15,
        moleFraction: pointToMoleFraction(c, s, p),
      })),
    );
    curve = {
      lnX: (T) => fit.a + fit.b / T,
      method: "measured points, van 't Hoff fit",
      source: src,
      range: [fit.TminK, fit.TmaxK],
    };
  } else if (pts.length >= 1) {
    const p = pts[0];
    const T0 = p.temperatureC + 273.15;
    const ln0 = Math.log(pointToMoleFraction(c, s, p));
    if (dH !== undefined)
      curve = {
        lnX: (T) => ln0 - (dH / R_J_PER_MOL_K) * (1 / T - 1 / T0),
        method: "one measured point with the ideal van 't Hoff slope (ΔHfus)",
        source: src,
        range: [T0, T0],
      };
    else
      curve = {
        lnX: () => ln0,
        method: 'one measured point, no temperature dependence',
        source: src,
        range: [T0, T0],
      };
  } else if (Tm !== undefined && dH !== undefined) {
    let fallbackNote: string | undefined;
    if (c.unifac) {
      const groups = Object.fromEntries(Object.entries(c.unifac).map(([k, v]) => [Number(k), v]));
      try {
        // Invalid melting data or missing UNIFAC parameters fall through to the ideal model (building the
        // model is what throws for missing parameters; the melting data are checked as the ideal model does).
        idealSolubility({ meltingPointK: Tm, enthalpyFusionJmol: dH, T_K: 298.15 });
        // The calculation API's root (solveActivitySolubility), with the UNIFAC model built once per
        // route (ctx.unifac), a new temperature started from the nearest one solved (the same x; a
        // Monte Carlo draw of the end temperature meets a new one each draw) and the result memoised
        // by temperature.
        const model = ctx.unifac.model([groups, s.unifac.value]);
        const solver = activitySolubilitySolver(model);
        const memo = new Map<number, number>();
        curve = {
          lnX: (T) => {
            const Tc = Math.min(T, Tm);
            let v = memo.get(Tc);
            if (v === undefined) {
              v = Math.log(
                solver.solve(
                  Tc,
                  idealSolubility({ meltingPointK: Tm, enthalpyFusionJmol: dH, T_K: Tc })
                    .moleFraction,
                ),
              );
              if (memo.size > 64) memo.clear();
              memo.set(Tc, v);
            }
            return v;
          },
          method: 'UNIFAC activity-corrected solubility',
          source:
            'Fredenslund et al. 1975 / Hansen et al. 1991 UNIFAC; melting data from the compound record',
        };
      } catch (e) {
        fallbackNote = `UNIFAC could not be used (${(e as Error).message}); ideal solubility instead`;
        curve = null;
      }
    } else {
      fallbackNote = 'no UNIFAC groups for the compound; ideal solubility (γ = 1) instead';
    }
    if (!curve) {
      curve = {
        note: fallbackNote,
        lnX: (T) =>
          Math.log(
            idealSolubility({ meltingPointK: Tm, enthalpyFusionJmol: dH, T_K: Math.min(T, Tm) })
              .moleFraction,
          ),
        method: 'ideal solubility (Schröder–van Laar)',
        source: 'melting point and ΔHfus from the compound record',
      };
    }
  }
  ctx.cache.set(key, curve);
  return curve;
}

export interface SolubilityAt {
  /** Mole fraction of the solute at saturation [-]. */
  x: number;
  /** kg of solute that the given solvents dissolve at saturation [kg]. */
  capacityKg: number;
  method: string;
}

const MINOR_BLEND_FRACTION = 0.01;

/**
 * Saturation capacity of the liquor's solvents for a compound at T: the
 * solvents dissolve n_s = x/(1 − x) · Σ n_solvents mol, x from the best
 * evidence per solvent (see the module comment) and Jouyban–Acree for blends.
 *
 * @param ctx        evaluation context
 * @param compoundId the compound
 * @param solventKg  kg of each component in the liquor (only solvents count) [kg]
 * @param T_K        temperature [K]
 * @param warnings   receives the warnings (missing data, assumptions, extrapolation); null: none kept
 * @param methods    receives the methods used; null: none kept
 * @returns x [–], the capacity [kg] and the method; null when no solvent of
 *   the liquor has any solubility evidence (the callers then keep the
 *   compound dissolved and say so)
 *
 * Source: neatSolventCurve per solvent; blends by Jouyban–Acree (Jouyban,
 * J. Pharm. Pharm. Sci. 2008, 11, 32); the per-litre assumption for a
 * solvent without evidence is this project's own (stated in a warning).
 * Validity: as neatSolventCurve for each solvent; log-linear blending without
 * J terms is a first estimate (cosolvency maxima are missed); solvents under
 * 1 vol % of the blend are left out.
 */
export function solubilityIn(
  ctx: EvalContext,
  compoundId: string,
  solventKg: Record<string, number>,
  T_K: number,
  warnings: EngineWarning[] | null,
  methods: MethodUsed[] | null,
): SolubilityAt | null {
  const comp = ctx.comps.get(compoundId)!;
  const ids = ctx.ids.filter((id) => ctx.comps.get(id)!.kind === 'solvent' && solventKg[id] > 0);
  if (ids.length === 0) return { x: 0, capacityKg: 0, method: 'no solvent' };
  let vTot = 0;
  const vol = ids.map((id) => {
    const v = solventKg[id] * ctx.comps.get(id)!.specificVolume(T_K);
    vTot += v;
    return v;
  });
  const present = ids.filter((_, i) => vol[i] / vTot >= MINOR_BLEND_FRACTION);
  const curves = new Map<string, NonNullable<Curve>>();
  const missing: string[] = [];
  for (const id of present) {
    const curve = neatSolventCurve(ctx, compoundId, id);
    if (curve) curves.set(id, curve);
    else missing.push(id);
  }
  const used = present.filter((id) => curves.has(id));
  if (used.length === 0) {
    if (warnings)
      warn(
        warnings,
        'warning',
        'no-solubility-data',
        `${comp.name}: no solubility data in ${present.map((id) => ctx.comps.get(id)!.name).join(', ')} and no melting data; its solubility cannot be estimated.`,
      );
    return null;
  }
  if (missing.length > 0 && warnings) {
    const share = missing.reduce((a, id) => a + vol[ids.indexOf(id)], 0) / vTot;
    warn(
      warnings,
      'warning',
      'solubility-solvent-assumed',
      `${comp.name}: no solubility data in ${missing.map((id) => ctx.comps.get(id)!.name).join(', ')} (${(100 * share).toFixed(1)} vol % of the solvents); assumed to dissolve it per litre like the rest of the liquor (${used.map((id) => ctx.comps.get(id)!.name).join(', ')}). Enter a measured point to replace the assumption.`,
    );
  }
  const lnXs: number[] = [];
  for (const id of used) {
    const curve = curves.get(id)!;
    if (warnings && curve.range && (T_K < curve.range[0] - 10 || T_K > curve.range[1] + 10)) {
      warn(
        warnings,
        'info',
        'solubility-extrapolated',
        `${comp.name} in ${ctx.comps.get(id)!.name}: solubility extrapolated to ${(T_K - 273.15).toFixed(0)} °C, outside the measured ${(curve.range[0] - 273.15).toFixed(0)}–${(curve.range[1] - 273.15).toFixed(0)} °C.`,
      );
    }
    if (methods)
      method(
        methods,
        `solubility of ${comp.name} in ${ctx.comps.get(id)!.name}`,
        curve.method,
        curve.source,
      );
    if (curve.note && warnings)
      warn(
        warnings,
        'info',
        'solubility-method-fallback',
        `${comp.name}, in the solvents without measured points: ${curve.note}.`,
      );
    lnXs.push(Math.min(0, curve.lnX(T_K)));
  }
  let lnX: number;
  let label: string;
  if (used.length === 1) {
    lnX = lnXs[0];
    label = curves.get(used[0])!.method;
  } else {
    const blend = blendSolubility(ctx, comp.compound!, used, solventKg, T_K, lnXs);
    lnX = blend.lnX;
    label = blend.label;
    if (methods)
      method(methods, `solubility of ${comp.name} in the solvent blend`, blend.label, blend.source);
  }
  const x = Math.min(Math.exp(lnX), 0.999);
  // Capacity of the solvents the mole fraction describes; a solvent without data adds capacity in
  // proportion to its volume (it dissolves per litre like the rest of the liquor).
  let nSolv = 0;
  let vKnown = 0;
  ids.forEach((id, i) => {
    if (missing.includes(id)) return;
    nSolv += solventKg[id] / ctx.comps.get(id)!.molarMassKgMol;
    vKnown += vol[i];
  });
  const capacityKg = (x / (1 - x)) * nSolv * comp.molarMassKgMol * (vTot / vKnown);
  return { x, capacityKg, method: label };
}

/**
 * ln x of a compound in a blend of solvents with data: Jouyban–Acree with the
 * compound's J terms for the pairs present (fractions on the basis they were
 * fitted on; the pairs must share one basis), else the log-linear form on
 * solute-free volume fractions.
 */
function blendSolubility(
  ctx: EvalContext,
  compound: CompoundSnapshot,
  used: string[],
  solventKg: Record<string, number>,
  T_K: number,
  lnXs: number[],
): { lnX: number; label: string; source: string } {
  const libraryId = (id: string) => ctx.comps.get(id)!.solvent!.id;
  const pairs: JouybanPair[] = [];
  let basis: 'volume' | 'mass' | 'mole' = 'volume';
  const sources: string[] = [];
  for (const c of compound.cosolvency ?? []) {
    const i = used.findIndex((id) => libraryId(id) === c.solventIds[0]);
    const j = used.findIndex((id) => libraryId(id) === c.solventIds[1]);
    if (i < 0 || j < 0) continue;
    if (pairs.length > 0 && c.basis !== basis) continue;
    basis = c.basis;
    pairs.push({ i, j, J0: c.J0, J1: c.J1 ?? 0, J2: c.J2 ?? 0 });
    sources.push(c.source ?? 'J terms from the compound record');
  }
  const amount = used.map((id) => {
    const comp = ctx.comps.get(id)!;
    const kg = solventKg[id];
    return basis === 'mass'
      ? kg
      : basis === 'mole'
        ? kg / comp.molarMassKgMol
        : kg * comp.specificVolume(T_K);
  });
  const total = amount.reduce((a, b) => a + b, 0);
  const fractions = amount.map((v) => v / total);
  const lnX = jouybanAcree({ lnSolubilities: lnXs, fractions, T_K, pairs });
  if (pairs.length > 0)
    return {
      lnX,
      label: `Jouyban–Acree with interaction terms (${basis} fractions)`,
      source: `Jouyban, J. Pharm. Pharm. Sci. 2008, 11, 32; J terms: ${sources.join('; ')}`,
    };
  return {
    lnX,
    label: 'Jouyban–Acree log-linear model on solute-free volume fractions (no interaction terms)',
    source: 'Jouyban, J. Pharm. Pharm. Sci. 2008, 11, 32',
  };
}
