/**
 * Drying of a solvent-wet cake as a model that can fail: the evaporation of
 * each solvent is driven by its equilibrium vapour pressure over the cake at
 * the drying temperature against its partial pressure in the dryer gas at the
 * dryer pressure; the solvent content falls at a constant rate while free
 * liquid remains and at a falling rate below a critical content; the step
 * reports the time to the target, or the content reached when the time allowed
 * runs out or the equilibrium stops the drying.
 *
 * Model (per kg of dry solid; n_i mol of solvent i, X kg solvent per kg solid):
 *
 *   equilibrium over the cake   p_i* = y_i P_b(x, T) · φ(X),   φ = min(1, X/X_c)
 *   dryer gas (well mixed)      p_i  = P · E_i / (G + Σ_j E_j)
 *   evaporation                 E_i  = k_d · (p_i* − p_i) / P
 *   balance                     dn_i/dt = −E_i
 *
 * P_b and y_i are the bubble pressure and vapour composition of the cake
 * liquid at T by modified Raoult's law with UNIFAC (thermo/vle bubblePressure);
 * φ is the linear falling-rate period below the critical content X_c (the
 * constant-rate / falling-rate drying curve: McCabe, Smith & Harriott, Unit
 * Operations of Chemical Engineering, drying chapter; Geankoplis, Transport
 * Processes, §9.7 — both recalled); G is the inert gas (nitrogen bleed or
 * sweep) through the dryer and k_d a drying coefficient. The gas balance and
 * the rate law are stated here, not taken from a source. Eliminating p_i:
 *
 *   with a_i = p_i* / P, A = Σ a_i, S = Σ E_i:
 *   S² + S (G + k_d (1 − A)) − k_d A G = 0,   E_i = k_d a_i (G + S)/(G + S + k_d).
 *
 * Equilibrium limit: with no inert gas (G = 0), S = k_d (A − 1) when A > 1 and
 * nothing evaporates when A ≤ 1: the cake cannot dry below the content where
 * its equilibrium vapour pressure equals the dryer pressure,
 * X* = X_c · P / P_b(T) (or not at all when P_b(T) ≤ P). With inert gas the
 * solvent's partial pressure in the dryer gas, not the total pressure, limits
 * the rate; at a low temperature and a high pressure (−10 °C at 4 bar) the
 * driving force p* / P is a few parts per thousand and the cake barely dries.
 *
 * Units: t [h], n [mol], X [kg/kg], P [Pa], T [K], G and E [mol/h per kg of
 * dry solid], k_d [mol/(kg h)].
 * Validity: isothermal cake at the drying temperature (heat supply not
 * limiting), solvates and occluded solvent not modelled, a linear falling-rate
 * period. The parameters k_d and X_c are properties of the product and the
 * dryer: fit them to a measured drying curve.
 */
import { dormandPrince } from '../numerics';
import { bubblePressure, bubblePressureAtFixedT, type VleSystem } from '../thermo/vle';

/** The inputs of a drying integration. */
export interface DryingProblem {
  /** VLE system of the volatile solvents (thermo/vle createVleSystem). */
  sys: VleSystem;
  /** Molar masses of the solvents [kg/mol], in sys order. */
  molarMassKgMol: readonly number[];
  /** Solvent in the wet cake per kg of dry solid [mol/kg], in sys order. */
  n0: readonly number[];
  /** Drying temperature [K]. */
  T_K: number;
  /** Dryer pressure [Pa]. */
  P_Pa: number;
  /** Drying coefficient k_d [mol/(kg h)], > 0. */
  dryingCoefficient: number;
  /** Critical solvent content X_c [kg/kg], > 0. */
  criticalContent: number;
  /** Inert gas through the dryer G [mol/(kg h)], ≥ 0. */
  inertGas: number;
  /** Time allowed [h]. */
  maxHours: number;
  /** The target: drying stops when this returns true for the solvent left [mol/kg]. */
  reached: (n: Float64Array) => boolean;
}

/** The result of a drying integration. */
export interface DryingResult {
  /** Solvent left per kg of dry solid [mol/kg], in sys order. */
  n: number[];
  /** Time spent [h]. */
  hours: number;
  /** How it ended. */
  outcome: 'target-reached' | 'time-limit' | 'equilibrium-limit' | 'no-evaporation';
  /** Equilibrium solvent content with no inert gas, X* = X_c P / P_b [kg/kg] (null with inert gas). */
  equilibriumContentKgPerKg: number | null;
  /** True when the integration met its tolerance. */
  converged: boolean;
  /** Bubble pressure of the wet cake's liquid at T [Pa]. */
  bubblePressurePa: number;
}

/**
 * Bubble-pressure evaluators of the drying problems at each problem's cake temperature (with the
 * system and temperature they were made for, so a changed problem gets a new one).
 */
const bubbleAtDryingT = new WeakMap<
  DryingProblem,
  {
    sys: VleSystem;
    T_K: number;
    at: ReturnType<typeof bubblePressureAtFixedT>;
    /** Scratch of the rates (liquid x, vapour y and a_i), one set per problem, not per call. */
    x: Float64Array;
    y: Float64Array;
    a: Float64Array;
  }
>();

/**
 * Evaporation rates E_i [mol/(kg h)] at the state n [mol/kg] (see the module
 * comment for the equations).
 * @param p     the drying problem
 * @param n     solvent left per kg of dry solid [mol/kg]
 * @param out   receives E_i [mol/(kg h)]
 *
 * Source: the module comment (constant-rate / falling-rate drying curve as in
 * McCabe, Smith & Harriott and Geankoplis §9.7, recalled; the gas balance and
 * rate law are stated in this module, not taken from a source).
 * Validity: as the module comment (isothermal cake, linear falling rate, well-mixed dryer gas).
 */
export function evaporationRates(p: DryingProblem, n: ArrayLike<number>, out: Float64Array): void {
  const m = n.length;
  let nTot = 0;
  let X = 0;
  for (let i = 0; i < m; i++) {
    const ni = Math.max(0, n[i]);
    nTot += ni;
    X += ni * p.molarMassKgMol[i];
  }
  if (!(nTot > 0)) {
    out.fill(0);
    return;
  }
  // The cake is isothermal: one bubble-pressure evaluator per problem (vapour pressures once).
  let bubble = bubbleAtDryingT.get(p);
  if (!bubble || bubble.sys !== p.sys || bubble.T_K !== p.T_K || bubble.x.length !== m) {
    bubble = {
      sys: p.sys,
      T_K: p.T_K,
      at: bubblePressureAtFixedT(p.sys, p.T_K),
      x: new Float64Array(m),
      y: new Float64Array(m),
      a: new Float64Array(m),
    };
    bubbleAtDryingT.set(p, bubble);
  }
  const { x, y, a } = bubble;
  for (let i = 0; i < m; i++) x[i] = Math.max(0, n[i]) / nTot;
  const P_Pa = bubble.at(x, y);
  const phi = Math.min(1, X / p.criticalContent);
  let A = 0;
  for (let i = 0; i < m; i++) {
    a[i] = (y[i] * P_Pa * phi) / p.P_Pa;
    A += a[i];
  }
  const k = p.dryingCoefficient;
  const G = p.inertGas;
  const bq = G + k * (1 - A);
  const c = k * A * G;
  // Root S ≥ 0 of S² + bq S − c = 0, in the form that does not cancel.
  let S: number;
  if (c > 0)
    S =
      bq >= 0
        ? (2 * c) / (bq + Math.sqrt(bq * bq + 4 * c))
        : (-bq + Math.sqrt(bq * bq + 4 * c)) / 2;
  else S = Math.max(0, -bq);
  const factor = G + S > 0 ? (G + S) / (G + S + k) : 0;
  for (let i = 0; i < m; i++) out[i] = n[i] > 0 ? k * a[i] * factor : 0;
}

/**
 * Integrates the drying model until the target is reached, the time runs out,
 * or evaporation stops, with the Dormand–Prince 5(4) pair of the numerics
 * module (relative tolerance 1e−8); the moment the target is met is then
 * located by bisection in time (to 1e−9 h relative) on the integrator's
 * continuous extension over the step that met it (dense output, order 4), with
 * no further evaluation of the rates.
 *
 * @param p  the drying problem (units in DryingProblem)
 * @returns solvent left, time, outcome and the equilibrium content
 *
 * Source: the module comment for the model; Dormand & Prince 1980 and
 * Shampine 1986 (numerics/ode.ts: the integration and its dense output) for
 * the integration and the location of the end point.
 * Validity: as the module comment (isothermal cake, linear falling rate,
 * well-mixed dryer gas); time up to p.maxHours.
 */
export function integrateDrying(p: DryingProblem): DryingResult {
  const m = p.n0.length;
  const x0 = p.n0.map((v, i, arr) => v / arr.reduce((s, w) => s + w, 0));
  const b0 = m > 0 && p.n0.some((v) => v > 0) ? bubblePressure(p.sys, x0, p.T_K).P_Pa : 0;
  const equilibrium =
    p.inertGas > 0 ? null : b0 > p.P_Pa ? (p.criticalContent * p.P_Pa) / b0 : null;
  const start = Float64Array.from(p.n0);
  if (p.reached(start))
    return {
      n: Array.from(start),
      hours: 0,
      outcome: 'target-reached',
      equilibriumContentKgPerKg: equilibrium,
      converged: true,
      bubblePressurePa: b0,
    };
  const rhs = (_t: number, y: Float64Array, dy: Float64Array) => {
    evaporationRates(p, y, dy);
    for (let i = 0; i < m; i++) dy[i] = -dy[i];
  };
  const scale = Math.max(...p.n0, 1e-12);
  const r = dormandPrince(rhs, 0, start, p.maxHours, {
    rtol: 1e-8,
    atol: scale * 1e-12,
    stop: (_t, y) => p.reached(y),
  });
  let n = Array.from(r.y, (v) => Math.max(0, v));
  let hours = r.t;
  let converged = r.converged;
  if (r.reason === 'stopped' && r.lastStep) {
    // Locate the crossing within the step that met the target (it began before the target was
    // met: the integration stops at the first step that meets it), on its continuous extension.
    const step = r.lastStep;
    let lo = step.t0;
    let hi = step.t1;
    const yMid = new Float64Array(m);
    const yHi = Float64Array.from(r.y);
    for (let k = 0; k < 60 && hi - lo > 1e-9 * Math.max(1, hi); k++) {
      const mid = 0.5 * (lo + hi);
      step.at(mid, yMid);
      if (p.reached(yMid)) {
        hi = mid;
        yHi.set(yMid);
      } else lo = mid;
    }
    n = Array.from(yHi, (v) => Math.max(0, v));
    hours = hi;
    return {
      n,
      hours,
      outcome: 'target-reached',
      equilibriumContentKgPerKg: equilibrium,
      converged,
      bubblePressurePa: b0,
    };
  }
  const rates = new Float64Array(m);
  evaporationRates(p, n, rates);
  const rate = rates.reduce((s, v) => s + v, 0);
  const total0 = p.n0.reduce((s, v) => s + v, 0);
  const left = n.reduce((s, v) => s + v, 0);
  let X = 0;
  for (let i = 0; i < m; i++) X += n[i] * p.molarMassKgMol[i];
  let outcome: DryingResult['outcome'] = 'time-limit';
  if (left >= total0 * (1 - 1e-9)) outcome = 'no-evaporation';
  else if (
    p.inertGas === 0 &&
    (rate <= 1e-12 * total0 || (equilibrium !== null && X <= equilibrium * (1 + 1e-3)))
  )
    outcome = 'equilibrium-limit';
  if (!r.converged && r.reason !== 'converged') converged = false;
  return {
    n,
    hours,
    outcome,
    equilibriumContentKgPerKg: equilibrium,
    converged,
    bubblePressurePa: b0,
  };
}
