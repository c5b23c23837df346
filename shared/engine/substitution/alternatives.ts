/**
 * The solvent substitution advisor: for one step's solvent role, every
 * library solvent is tried in its place and the route is evaluated again by
 * the engine; the substitutes are ranked by PMI among those that keep the
 * isolated yield within YIELD_WINDOW_POINTS of the current route and the
 * solvent-free purity at least the current one, then the rest by PMI, then
 * those the engine could not evaluate.
 *
 * What it is not: a similarity score. Every number is an evaluation of the
 * whole route with the substitute in that one role (volumes, temperatures
 * and every other step unchanged); nothing is re-optimised for the new
 * solvent.
 */
import { SOLVENTS } from '../data';
import type { RouteDocument } from '../document';
import { createRandom } from '../random';
import {
  evaluatePrepared,
  evaluateRoute,
  parseRoute,
  prepareRoute,
  type PreparedRoute,
  type RouteTotals,
} from '../route/evaluate';
import { percentile, type Percentiles } from '../route/monte-carlo';
import { solventFacts, type SolventFacts } from './facts';
import { roleSolvent, substituteSolvent, type SubstitutionRole } from './roles';

import { PURITY_TOLERANCE_POINTS, YIELD_WINDOW_POINTS } from './keep-rule';

export { PURITY_TOLERANCE_POINTS, YIELD_WINDOW_POINTS };

export interface Deltas {
  yieldPct: number | null;
  solventFreePurityPct: number | null;
  pmi: number | null;
  solventUseLPerKg: number | null;
}

/** Monte Carlo spread (p5/p50/p95) of the constrained figures with the substitute. */
export interface SubstituteUncertainty {
  draws: number;
  seed: number;
  failedDraws: number;
  yieldPct: Percentiles;
  solventFreePurityPct: Percentiles;
  pmi: Percentiles;
}

export interface SolventAlternative extends Omit<SolventFacts, 'cautions'> {
  solventId: string;
  /** The engine's totals with the substitute; null when the route cannot be evaluated with it. */
  totals: RouteTotals | null;
  /** Substitute minus current (yield, purity, PMI, solvent use); null when not evaluated. */
  deltaVsCurrent: Deltas | null;
  /** Keeps the yield within YIELD_WINDOW_POINTS and the solvent-free purity at least the current. */
  keepsYieldAndPurity: boolean;
  uncertainty: SubstituteUncertainty | null;
  cautions: string[];
}

export interface AlternativesResult {
  current: { solventId: string; totals: RouteTotals };
  alternatives: SolventAlternative[];
}

export interface AlternativesOptions {
  /**
   * Monte Carlo spread for every suggestion the engine could evaluate, `draws`
   * draws each from the same seed (so the suggestions are compared on the same
   * draws); 0 or absent: none.
   */
  uncertainty?: { draws: number; seed: number };
}

const diff = (a: number | null, b: number | null) => (a === null || b === null ? null : a - b);

/**
 * Whether a substitute's totals keep the yield and the solvent-free purity of
 * the current route: y ≥ y₀ − YIELD_WINDOW_POINTS (2 percentage points) and
 * p ≥ p₀ − PURITY_TOLERANCE_POINTS (round-off only); false when either route
 * isolates nothing.
 * Source: this project's own rule (the window is common practice for a
 * screening comparison, not a published criterion).
 * Validity: totals of routes the engine evaluated with the same reference input.
 * @param current    totals of the current route (yield [%], solvent-free purity [%])
 * @param candidate  totals with the substitute (yield [%], solvent-free purity [%])
 * @returns true when both are kept
 */
export function keepsYieldAndPurity(current: RouteTotals, candidate: RouteTotals): boolean {
  const { yieldPct: y0, solventFreePurityPct: p0 } = current;
  const { yieldPct: y, solventFreePurityPct: p } = candidate;
  if (y0 === null || p0 === null || y === null || p === null) return false;
  return y >= y0 - YIELD_WINDOW_POINTS && p >= p0 - PURITY_TOLERANCE_POINTS;
}

/**
 * The advisor's order: substitutes that keep the yield and purity by PMI,
 * then the other evaluated ones by PMI, then those not evaluated; PMI ties
 * and missing PMI by solvent id.
 * Source: PMI after the ACS GCI Pharmaceutical Roundtable (kg of all input
 * per kg of product, as docs/methods.md); the order is this project's own.
 * Validity: totals of routes the engine evaluated with the same reference input.
 * @param current     totals of the current route (yield [%], purity [%], PMI [kg/kg])
 * @param candidates  the substitutes with their totals (null when not evaluated)
 * @returns the candidates in the advisor's order (a new array)
 */
export function rankAlternatives<T extends { solventId: string; totals: RouteTotals | null }>(
  current: RouteTotals,
  candidates: readonly T[],
): T[] {
  const group = (c: T) => (c.totals === null ? 2 : keepsYieldAndPurity(current, c.totals) ? 0 : 1);
  const pmi = (c: T) => c.totals?.pmi ?? Infinity;
  return [...candidates].sort(
    (a, b) =>
      group(a) - group(b) ||
      pmi(a) - pmi(b) ||
      (a.solventId < b.solventId ? -1 : a.solventId > b.solventId ? 1 : 0),
  );
}

/**
 * The library solvents the advisor tries in a role: every solvent but the
 * current one; for an extraction, only solvents that form a second liquid
 * phase with water (not water, not fully miscible ones: common practice).
 * Source: the solvent library's water miscibility (docs/data-sources.md).
 * Validity: any role and library solvent id.
 * @param role              which of the step's solvents is replaced
 * @param currentSolventId  library id of the solvent in that role now
 * @returns the library ids to try
 */
export function candidateSolventIds(role: SubstitutionRole, currentSolventId: string): string[] {
  return SOLVENTS.filter(
    (s) =>
      s.id !== currentSolventId &&
      !(role === 'extraction' && (s.id === 'water' || s.waterMiscibility === 'miscible')),
  ).map((s) => s.id);
}

/**
 * p5/p50/p95 of yield, solvent-free purity and PMI over `draws` seeded draws
 * of the document's ± ranges, reusing the prepared route (and its caches) of
 * the nominal evaluation.
 */
function spread(prepared: PreparedRoute, draws: number, seed: number): SubstituteUncertainty {
  const rng = createRandom(seed);
  const samples = {
    yieldPct: [] as number[],
    solventFreePurityPct: [] as number[],
    pmi: [] as number[],
  };
  let failedDraws = 0;
  for (let i = 0; i < draws; i++) {
    try {
      const t = evaluatePrepared(prepared, rng).totals;
      samples.yieldPct.push(t.yieldPct ?? NaN);
      samples.solventFreePurityPct.push(t.solventFreePurityPct ?? NaN);
      samples.pmi.push(t.pmi ?? NaN);
    } catch {
      failedDraws++;
    }
  }
  const summary = (v: number[]): Percentiles => {
    const s = v.filter((x) => !Number.isNaN(x)).sort((a, b) => a - b);
    return { p5: percentile(s, 0.05), p50: percentile(s, 0.5), p95: percentile(s, 0.95) };
  };
  return {
    draws,
    seed,
    failedDraws,
    yieldPct: summary(samples.yieldPct),
    solventFreePurityPct: summary(samples.solventFreePurityPct),
    pmi: summary(samples.pmi),
  };
}

/**
 * Rank the library's alternatives to the solvent of one step's role: each
 * candidate put in that role (substituteSolvent), the whole route evaluated
 * again by the engine, ranked by rankAlternatives, with the solvent's facts
 * and, for the first `top`, the Monte Carlo spread over the document's ±
 * ranges.
 * Source: the route engine (docs/methods.md) for every figure; ICH Q3C class
 * and limit, guide category and hazards from the solvent library
 * (docs/data-sources.md); Monte Carlo percentiles as route/monte-carlo.ts.
 * Validity: as the route engine for each substitute; volumes, temperatures
 * and every other step are unchanged (nothing is re-optimised for the new
 * solvent), so a substitute that needs other conditions ranks low.
 *
 * @param doc     a schema-valid route document
 * @param stepId  the step whose solvent is replaced
 * @param role    which of the step's solvents
 * @param options.uncertainty  spread for the first `top` suggestions [–], `draws` draws each [–], seeded by `seed` [–]
 * @returns the current solvent's totals and the ranked alternatives
 * @throws SubstitutionError (unknown step, role the step does not have); the
 *         engine's RouteValidationError / EngineError when the current route
 *         itself cannot be evaluated
 */
export function solventAlternatives(
  doc: RouteDocument,
  stepId: string,
  role: SubstitutionRole,
  options: AlternativesOptions = {},
): AlternativesResult {
  const current = roleSolvent(doc, stepId, role);
  const currentTotals = evaluateRoute(doc).totals;
  const evaluated = candidateSolventIds(role, current.solventId).map((solventId) => {
    const { cautions, ...facts } = solventFacts(solventId);
    const substituted = substituteSolvent(doc, stepId, role, solventId);
    let totals: RouteTotals | null = null;
    let prepared: PreparedRoute | null = null;
    const notes: string[] = [];
    try {
      prepared = prepareRoute(parseRoute(substituted));
      const result = evaluatePrepared(prepared, null);
      totals = result.totals;
      for (const w of result.warnings)
        if (w.stepId === stepId && (w.severity === 'hazard' || w.severity === 'warning'))
          if (!notes.includes(w.message)) notes.push(w.message);
    } catch (error) {
      notes.push(
        `The route cannot be evaluated with ${facts.name} in this role: ${error instanceof Error ? error.message : String(error)}`,
      );
    }
    const alternative: SolventAlternative = {
      solventId,
      ...facts,
      totals,
      deltaVsCurrent: totals
        ? {
            yieldPct: diff(totals.yieldPct, currentTotals.yieldPct),
            solventFreePurityPct: diff(
              totals.solventFreePurityPct,
              currentTotals.solventFreePurityPct,
            ),
            pmi: diff(totals.pmi, currentTotals.pmi),
            solventUseLPerKg: diff(totals.solventUseLPerKg, currentTotals.solventUseLPerKg),
          }
        : null,
      keepsYieldAndPurity: totals ? keepsYieldAndPurity(currentTotals, totals) : false,
      uncertainty: null,
      cautions: [...cautions, ...notes],
    };
    return { alternative, prepared };
  });
  const ranked = rankAlternatives(
    currentTotals,
    evaluated.map((e) => ({
      ...e,
      solventId: e.alternative.solventId,
      totals: e.alternative.totals,
    })),
  );
  const u = options.uncertainty;
  if (u && u.draws > 0)
    for (const entry of ranked)
      if (entry.alternative.totals && entry.prepared)
        entry.alternative.uncertainty = spread(entry.prepared, u.draws, u.seed);
  return {
    current: { solventId: current.solventId, totals: currentTotals },
    alternatives: ranked.map((e) => e.alternative),
  };
}
