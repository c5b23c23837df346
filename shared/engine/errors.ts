/**
 * Errors raised by the calculation engine.
 *
 * Every engine error carries a stable `code` meant for programs (the API maps
 * it to a response; the UI picks a message), a plain-sentence `message` for
 * people, and optional structured `details` (which components, which groups,
 * which temperature). Callers branch on `code` or on the class, never on the
 * message text.
 *
 * Codes in use:
 *  - 'no-vapour-pressure-data'     no Antoine set and no (Tb, ΔHvap) fallback
 *  - 'unifac-missing-parameters'   main-group pair without a_mn, or unknown subgroup
 *  - 'invalid-input'               composition, temperature or pressure out of domain
 *  - 'no-convergence'              an iterative solver did not converge
 */
export class EngineError extends Error {
  constructor(
    public code: string,
    message: string,
    public details?: unknown,
  ) {
    super(message);
    this.name = 'EngineError';
  }
}

/** Details of a UNIFAC parameter gap: the main-group pairs (numbers and
 * names) that have no interaction parameter, and subgroup numbers that are
 * not in the table. */
export interface UnifacParameterGap {
  missingPairs: Array<{ mainGroupA: number; mainGroupB: number; names: [string, string] }>;
  unknownSubgroups: number[];
}

/**
 * UNIFAC cannot be evaluated for the given components: a pair of main groups
 * has no published interaction parameter ('n/a' in the table), or a subgroup
 * number is not known. Code 'unifac-missing-parameters'.
 */
export class UnifacParameterError extends EngineError {
  constructor(
    message: string,
    public gap: UnifacParameterGap,
  ) {
    super('unifac-missing-parameters', message, gap);
    this.name = 'UnifacParameterError';
  }
}
