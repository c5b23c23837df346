/**
 * Cautions as a chemist reads them: the same caution for the same cause once,
 * with the steps it applies to; and the route-level caution that a close
 * structural analogue of the product may co-crystallise.
 */
import type { RouteStep } from '../document';
import { DEFAULT_COMPOUND_DENSITY_GML, type EvalContext } from './context';
import type { EngineWarning, StepResult } from './types';
import { CLOSE_ANALOGUE_TANIMOTO, tanimotoHex } from '../properties/similarity';

export interface GroupedWarning extends EngineWarning {
  /** The steps it applies to, in route order (null: the route as a whole). */
  stepIds: Array<string | null>;
}

/**
 * Group warnings that say the same thing (severity, code and message) into
 * one entry listing the steps, keeping the order of first appearance.
 *
 * Example: the same static-accumulation advisory on four washes becomes one
 * entry with stepIds ['acid-wash', 'base-wash', 'brine-wash', 'filter'].
 *
 * Source: this project's own bookkeeping (no external source).
 * Validity: any list of warnings.
 * @param warnings  the route's warnings, each with its step (null: the route as a whole)
 * @returns one entry per distinct severity, code and message, with the steps it applies to
 */
export function groupWarnings(
  warnings: ReadonlyArray<EngineWarning & { stepId: string | null }>,
): GroupedWarning[] {
  const byKey = new Map<string, GroupedWarning>();
  for (const w of warnings) {
    const key = `${w.severity}\u0000${w.code}\u0000${w.message}`;
    const g = byKey.get(key);
    if (g) {
      if (!g.stepIds.includes(w.stepId)) g.stepIds.push(w.stepId);
    } else
      byKey.set(key, {
        severity: w.severity,
        code: w.code,
        message: w.message,
        stepIds: [w.stepId],
      });
  }
  return [...byKey.values()];
}

/**
 * A caution on each crystallisation an impurity reaches when it is a close
 * structural analogue of the product (Tanimoto of the structure fingerprints
 * ≥ CLOSE_ANALOGUE_TANIMOTO) and no incorporation into the crystals is set:
 * close analogues often form solid solutions or are included in the crystals,
 * which the solubility model alone does not see (common practice).
 *
 * Source: Tanimoto coefficient of structure fingerprints (Willett, Barnard &
 * Downs, J. Chem. Inf. Comput. Sci. 1998, 38, 983; properties/similarity.ts);
 * the 0.8 threshold and the co-crystallisation caution are common practice.
 * Validity: compounds with fingerprints; a caution, not a prediction — a
 * Tanimoto below the threshold does not rule out a solid solution.
 * @param ctx      evaluation context (route components resolved against the library)
 * @param order    step ids in topological order
 * @param steps    the route's steps by id
 * @param results  the step results by id (balance [kg] tells which crystallisations the impurity reaches)
 * @returns one caution per close analogue per crystallisation it reaches
 */
export function analogueCautions(
  ctx: EvalContext,
  order: readonly string[],
  steps: ReadonlyMap<string, RouteStep>,
  results: Record<string, StepResult>,
): Array<EngineWarning & { stepId: string | null }> {
  const out: Array<EngineWarning & { stepId: string | null }> = [];
  const pid = ctx.productId;
  const fp = pid ? ctx.comps.get(pid)?.compound?.fingerprint : undefined;
  if (!pid || !fp) return out;
  const product = ctx.comps.get(pid)!;
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!.compound;
    if (id === pid || !c?.fingerprint || c.solidIncorporation !== undefined) continue;
    const t = tanimotoHex(fp, c.fingerprint);
    if (t === null || t < CLOSE_ANALOGUE_TANIMOTO) continue;
    for (const sid of order) {
      if (steps.get(sid)?.kind !== 'crystallisation') continue;
      if (!((results[sid].balance?.[id]?.inKg ?? 0) > 0)) continue;
      out.push({
        severity: 'warning',
        code: 'close-analogue',
        message: `${c.name} is a close structural analogue of ${product.name} (Tanimoto ${t.toFixed(2)} on structure fingerprints, ≥ ${CLOSE_ANALOGUE_TANIMOTO.toFixed(2)}): close analogues often co-crystallise, so its purge here may be far too high. Enter its incorporation into the solid on the compound (a measured distribution coefficient), or 0 if none is found.`,
        stepId: sid,
      });
    }
  }
  return out;
}

/**
 * A note for each compound of the route whose density is not given: its
 * volume in every stream is computed with DEFAULT_COMPOUND_DENSITY_GML, so
 * slurry volumes, vessel fill and concentrations carry that assumption. A
 * default that stands in for missing data is never silent.
 *
 * Source: this project's own bookkeeping (no external source); the assumed
 * density is common practice (DEFAULT_COMPOUND_DENSITY_GML).
 * Validity: any route document the schema accepts.
 * @param ctx  evaluation context (route components resolved against the library)
 * @returns one information note per compound without a stated density
 */
export function assumedDataNotes(ctx: EvalContext): Array<EngineWarning & { stepId: null }> {
  const out: Array<EngineWarning & { stepId: null }> = [];
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'compound' || c.compound?.densityGmL !== undefined) continue;
    out.push({
      severity: 'info',
      code: 'density-assumed',
      message: `No density given for ${c.name}: ${DEFAULT_COMPOUND_DENSITY_GML} g/mL is assumed for its volume in the streams (common practice for organic solids, typically 1.1–1.4 g/mL). Enter the measured density on the compound to replace it.`,
      stepId: null,
    });
  }
  return out;
}

/**
 * A warning for each compound whose structure has more acidic (or basic) groups than it has
 * pKa values of that kind: those groups are treated as neutral, so a wash at any pH moves the
 * compound as the neutral form (an amine is not taken out by an acid wash, an acid not by a
 * base wash).
 * Source: this project's own bookkeeping (no external source); the groups come with the
 * compound from the structure reader (shared/chemistry/pka-estimate.ts).
 * Validity: any route document the schema accepts; compounds without groups are silent.
 * @param ctx  evaluation context (route components resolved against the library)
 * @returns one warning per compound and kind of group (acid, base) left without a pKa
 */
export function missingPkaWarnings(ctx: EvalContext): Array<EngineWarning & { stepId: null }> {
  const out: Array<EngineWarning & { stepId: null }> = [];
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    const groups = c.compound?.ionisableGroups ?? [];
    if (c.kind !== 'compound' || !groups.length) continue;
    for (const type of ['base', 'acid'] as const) {
      const found = groups.filter((g) => g.type === type);
      const given = (c.compound?.pKa ?? []).filter((p) => p.type === type).length;
      if (found.length <= given) continue;
      const names = [...new Set(found.map((g) => g.group))].join(', ');
      const effect =
        type === 'base'
          ? 'an acid wash will not take it into the water as it would a protonated base'
          : 'a basic wash will not take it into the water as it would a deprotonated acid';
      out.push({
        severity: 'warning',
        code: 'ionisable-group-without-pka',
        message: `${c.name} has ${found.length === 1 ? `a ${type === 'base' ? 'basic' : 'acidic'} group` : `${found.length} ${type === 'base' ? 'basic' : 'acidic'} groups`} in its structure (${names}) with no pKa, so every wash and pH adjustment treats it as neutral: ${effect}. Enter a measured pKa on the compound, or take the estimate its compound page shows (±1 unit).`,
        stepId: null,
      });
    }
  }
  return out;
}
