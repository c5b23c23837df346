/**
 * Solubility of a route compound in the current liquor (one solvent or a
 * blend) at a temperature, for crystallisation, distillation (crash-out
 * warnings), filtration (cake-wash losses).
 *
 * Evidence, best first, per neat solvent j:
 *  1. the user's measured points for that solvent: van 't Hoff fit
 *     ln x = a + b/T (≥ 2 temperatures); one point is extended with the
 *     ideal slope d ln x/d(1/T) = −ΔHfus/R when ΔHfus is known;
 *  2. UNIFAC activity-corrected solubility x γ(x,T) = x_ideal(T);
 *  3. ideal solubility ln x = −(ΔHfus/R)(1/T − 1/Tm).
 * Blends: log-linear Jouyban–Acree model without interaction terms,
 *   ln x_m = Σ f_j ln x_j   (f_j solute-free volume fractions),
 * Jouyban, J. Pharm. Pharm. Sci. 2008, 11, 32. Solvents below 1 % of the
 * blend by volume are left out (fractions renormalised).
 */
import {
  fitVantHoff,
  gramsPerLitreToMoleFraction,
  idealSolubility,
  jouybanAcree,
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
 * x with x γ(x) = x_ideal in a neat solvent (solute index 0 of a two-component
 * UNIFAC model). Root bracketed as in activityCorrectedSolubility
 * (properties/solubility.ts, which documents the method and its source): a
 * logarithmic scan from 1e-12 to the first sign change of
 * f(x) = ln x + ln γ(x) − ln x_ideal. The bracket is then refined by the
 * Illinois variant of regula falsi on ln x (f is nearly linear in ln x), to
 * |f| < 1e-13 or a bracket of 1e-14 in ln x — the same root as 60 bisections
 * to within about 1e-13 relative, in about a tenth of the γ evaluations.
 * @param xIdeal ideal solubility [-]; @param T_K [K]; returns x [-].
 */
function activitySolubility(model: UnifacModel, xIdeal: number, T_K: number): number {
  if (xIdeal >= 1) return 1;
  const buf = new Float64Array(2);
  const pair = new Float64Array(2);
  const lnXi = Math.log(xIdeal);
  const f = (x: number) => {
    pair[0] = x;
    pair[1] = 1 - x;
    return Math.log(x) + Math.log(model.gammas(pair, T_K, buf)[0]) - lnXi;
  };
  let lo = NaN;
  let hi = NaN;
  let fHi = NaN;
  let prevX = SCAN_GRID[0];
  let prevF = f(prevX);
  if (prevF >= 0) return prevX;
  let flo = NaN;
  for (let k = 1; k < SCAN_GRID.length && Number.isNaN(lo); k++) {
    const x = SCAN_GRID[k];
    const fx = f(x);
    if ((prevF < 0 && fx >= 0) || (prevF >= 0 && fx < 0)) {
      lo = prevX;
      flo = prevF;
      hi = x;
      fHi = fx;
    }
    prevX = x;
    prevF = fx;
  }
  if (Number.isNaN(lo)) {
    lo = SCAN_GRID[SCAN_GRID.length - 2];
    hi = 1;
    flo = f(lo);
    fHi = f(hi);
  }
  // Illinois regula falsi on u = ln x, keeping f(a) < 0 ≤ f(b).
  let a = Math.log(lo);
  let b = Math.log(hi);
  let fa = flo;
  let fb = fHi;
  let side = 0;
  let x = 0.5 * (lo + hi);
  for (let i = 0; i < 100; i++) {
    let c = b - (fb * (b - a)) / (fb - fa);
    if (!(c > a && c < b)) c = 0.5 * (a + b);
    x = Math.exp(c);
    const fc = f(x);
    if (Math.abs(fc) < 1e-13 || b - a < 1e-14) break;
    if (fc < 0) {
      a = c;
      fa = fc;
      if (side === -1) fb *= 0.5;
      side = -1;
    } else {
      b = c;
      fb = fc;
      if (side === 1) fa *= 0.5;
      side = 1;
    }
  }
  return x;
}

/** Logarithmic scan grid of activitySolubility: 10^(−12 … 0) in 48 steps, the last point 1 − 1e-9. */
const SCAN_GRID: readonly number[] = (() => {
  const grid: number[] = [];
  for (let k = 0; k <= 48; k++) grid.push(Math.pow(10, -12 + (12 * k) / 48));
  grid[grid.length - 1] = 1 - 1e-9;
  return grid;
})();

/** Solubility curve of a compound in one neat solvent, by the best evidence available. */
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
    if (c.unifac) {
      const groups = Object.fromEntries(Object.entries(c.unifac).map(([k, v]) => [Number(k), v]));
      try {
        // Invalid melting data or missing UNIFAC parameters fall through to the ideal model (building the
        // model is what throws for missing parameters; the melting data are checked as the ideal model does).
        idealSolubility({ meltingPointK: Tm, enthalpyFusionJmol: dH, T_K: 298.15 });
        // Same root as properties/solubility activityCorrectedSolubility (log scan from 1e-12, first
        // sign change; refined by regula falsi instead of bisection, see activitySolubility), with the
        // UNIFAC model built once per route (ctx.unifac) instead of once per γ evaluation, and memoised
        // by temperature.
        const model = ctx.unifac.model([groups, s.unifac.value]);
        const memo = new Map<number, number>();
        curve = {
          lnX: (T) => {
            const Tc = Math.min(T, Tm);
            let v = memo.get(Tc);
            if (v === undefined) {
              v = Math.log(
                activitySolubility(
                  model,
                  idealSolubility({ meltingPointK: Tm, enthalpyFusionJmol: dH, T_K: Tc })
                    .moleFraction,
                  Tc,
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
      } catch {
        curve = null;
      }
    }
    if (!curve) {
      curve = {
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

/**
 * Saturation capacity of the liquor's solvents for a compound at T: the
 * solvents dissolve n_s = x/(1 − x) · Σ n_solvents mol. Returns null when the
 * compound has no solubility evidence at all (treated as fully soluble by the
 * callers, with a warning).
 */
export function solubilityIn(
  ctx: EvalContext,
  compoundId: string,
  solventKg: Record<string, number>,
  T_K: number,
  warnings: EngineWarning[],
  methods: MethodUsed[],
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
  const used = ids.filter((_, i) => vol[i] / vTot >= 0.01);
  const usedVol = used.map((id) => vol[ids.indexOf(id)]);
  const usedTot = usedVol.reduce((a, b) => a + b, 0);
  const lnXs: number[] = [];
  const labels: string[] = [];
  for (const id of used) {
    const curve = neatSolventCurve(ctx, compoundId, id);
    if (!curve) {
      warn(
        warnings,
        'warning',
        'no-solubility-data',
        `${comp.name}: no solubility data in ${ctx.comps.get(id)!.name} and no melting data; treated as fully soluble.`,
      );
      return null;
    }
    if (curve.range && (T_K < curve.range[0] - 10 || T_K > curve.range[1] + 10)) {
      warn(
        warnings,
        'info',
        'solubility-extrapolated',
        `${comp.name} in ${ctx.comps.get(id)!.name}: solubility extrapolated to ${(T_K - 273.15).toFixed(0)} °C, outside the measured ${(curve.range[0] - 273.15).toFixed(0)}–${(curve.range[1] - 273.15).toFixed(0)} °C.`,
      );
    }
    method(
      methods,
      `solubility of ${comp.name} in ${ctx.comps.get(id)!.name}`,
      curve.method,
      curve.source,
    );
    lnXs.push(Math.min(0, curve.lnX(T_K)));
    labels.push(curve.method);
  }
  let lnX: number;
  if (used.length === 1) lnX = lnXs[0];
  else {
    lnX = jouybanAcree({ lnSolubilities: lnXs, fractions: usedVol.map((v) => v / usedTot), T_K });
    method(
      methods,
      `solubility of ${comp.name} in the solvent blend`,
      'Jouyban–Acree log-linear model on solute-free volume fractions (no interaction terms)',
      'Jouyban, J. Pharm. Pharm. Sci. 2008, 11, 32',
    );
  }
  const x = Math.min(Math.exp(lnX), 0.999);
  let nSolv = 0;
  for (const id of ids) nSolv += solventKg[id] / ctx.comps.get(id)!.molarMassKgMol;
  const capacityKg = (x / (1 - x)) * nSolv * comp.molarMassKgMol;
  return { x, capacityKg, method: used.length === 1 ? labels[0] : 'Jouyban–Acree (log-linear)' };
}
