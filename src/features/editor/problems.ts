import type { RouteIssue } from '@shared/engine/route/errors';

/** A problem as the list shows it: said once, with every step it is reported on. */
export interface ProblemGroup {
  field: string;
  message: string;
  /** The steps it is reported on, in the order first reported (null: the route as a whole). */
  stepIds: Array<string | null>;
}

/**
 * Problems with the same field and wording grouped into one (a loop is reported on every step it
 * stops, with one message), in the order they were first reported.
 */
export function groupProblems(issues: readonly RouteIssue[]): ProblemGroup[] {
  const groups = new Map<string, ProblemGroup>();
  for (const i of issues) {
    const key = `${i.field}\u0000${i.message}`;
    const g = groups.get(key);
    if (!g) groups.set(key, { field: i.field, message: i.message, stepIds: [i.stepId] });
    else if (!g.stepIds.includes(i.stepId)) g.stepIds.push(i.stepId);
  }
  return [...groups.values()];
}
