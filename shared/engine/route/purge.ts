/**
 * The purge argument of a route, per impurity per step: the amount entering
 * each step, the amount leaving it with the product, the step's purge factor
 * (in / out) and the cumulative purge factor, taken as the product of the
 * step factors along the route (the usual way a purge argument multiplies
 * step purges; e.g. Teasdale et al., Org. Process Res. Dev. 2013, 17, 221).
 * A step factor of null means none of the impurity leaves with the product:
 * the purge is complete there, and so is every cumulative factor after it.
 */
import type { RouteResult } from './evaluate';

export interface PurgeCascadeRow {
  stepId: string;
  inKg: number;
  outKg: number;
  /** in / out at this step; null: none leaves with the product (complete). */
  stepFactor: number | null;
  /** Product of the step factors so far; null once a step purged it completely. */
  cumulativeFactor: number | null;
}

export interface PurgeCascade {
  componentId: string;
  rows: PurgeCascadeRow[];
  /** The step that removes the most of it from the product line (largest in − out); null when none removes any. */
  mainStepId: string | null;
}

/**
 * One cascade per impurity charged, in the order of result.totals.impurities:
 * per step the step factor f_k = in/out and the cumulative factor Π f_k
 * (null from the first complete purge on); the main step is the one with the
 * largest in − out.
 *
 * Source: the multiplication of step purge factors of a purge argument
 * (Teasdale et al., Org. Process Res. Dev. 2013, 17, 221).
 * Validity: the step factors of this evaluation; multiplying them assumes
 * each step's purge is independent of the amount entering (dilute impurity).
 * @param result  the route result (step order, per-step purge entries [kg], totals)
 * @returns one cascade per impurity (rows with in and out [kg], step and cumulative factors [–])
 */
export function purgeCascades(
  result: Pick<RouteResult, 'order' | 'steps' | 'totals'>,
): PurgeCascade[] {
  const ids = result.totals.impurities.map((i) => i.componentId);
  for (const id of Object.keys(result.totals.purge)) if (!ids.includes(id)) ids.push(id);
  return ids.map((componentId) => {
    const rows: PurgeCascadeRow[] = [];
    let cumulative: number | null = 1;
    let main: { stepId: string; removedKg: number } | null = null;
    for (const stepId of result.order) {
      const e = result.steps[stepId]?.purge?.[componentId];
      if (!e) continue;
      cumulative =
        cumulative === null || e.purgeFactor === null ? null : cumulative * e.purgeFactor;
      rows.push({
        stepId,
        inKg: e.inKg,
        outKg: e.outKg,
        stepFactor: e.purgeFactor,
        cumulativeFactor: cumulative,
      });
      const removedKg = e.inKg - e.outKg;
      if (removedKg > 0 && (!main || removedKg > main.removedKg)) main = { stepId, removedKg };
    }
    return { componentId, rows, mainStepId: main?.stepId ?? null };
  });
}
