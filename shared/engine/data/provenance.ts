/**
 * Provenance summaries of the curated data: how many values were read,
 * reproduced, estimated, taken as common practice, recalled, or are not
 * confirmed — the figures docs/data-sources.md states (a unit test keeps the
 * two in step).
 */
import type { Source } from './types';
import { SOLVENTS } from './solvents';
import { AQUEOUS_SOLUTES } from './aqueous';

/** One sourced value found in a record. */
export interface SourcedValueRef {
  /** Record id (solvent or aqueous solute). */
  record: string;
  /** Path of the field inside the record, e.g. 'antoine[1]' or 'ich'. */
  field: string;
  value: unknown;
  source: Source;
}

function collect(recordId: string, value: unknown, path: string, out: SourcedValueRef[]): void {
  if (Array.isArray(value)) {
    value.forEach((v, i) => collect(recordId, v, `${path}[${i}]`, out));
    return;
  }
  if (value === null || typeof value !== 'object') return;
  const obj = value as Record<string, unknown>;
  if ('source' in obj && obj.source && typeof obj.source === 'object') {
    const { source, ...rest } = obj;
    out.push({
      record: recordId,
      field: path,
      value: 'value' in rest ? rest.value : rest,
      source: source as Source,
    });
  }
  for (const [k, v] of Object.entries(obj))
    if (k !== 'source' && k !== 'value') collect(recordId, v, path ? `${path}.${k}` : k, out);
}

/**
 * Every sourced value of the solvent library (`which` = 'solvents') or of the
 * aqueous media ('aqueous'), with its record, field path and source.
 *
 * Source: the library itself (for docs/data-sources.md and the provenance tests).
 *
 * @param which  'solvents' or 'aqueous'
 * @returns one entry per sourced value: record id, field path, source
 *
 * Validity: the whole library.
 */
export function sourcedValues(which: 'solvents' | 'aqueous'): SourcedValueRef[] {
  const out: SourcedValueRef[] = [];
  for (const r of which === 'solvents' ? SOLVENTS : AQUEOUS_SOLUTES) collect(r.id, r, '', out);
  return out;
}

/**
 * Number of sourced values by status [count].
 *
 * Source: the library itself (docs/data-sources.md reports these counts).
 *
 * @param values  sourced values (sourcedValues)
 * @returns count per status [–]
 *
 * Validity: any list of sourced values.
 */
export function countByStatus(
  values: readonly SourcedValueRef[],
): Record<Source['status'], number> {
  const counts: Record<Source['status'], number> = {
    confirmed: 0,
    secondary: 0,
    'unverified-memory': 0,
    estimated: 0,
    'common-practice': 0,
    'not-confirmed': 0,
  };
  for (const v of values) counts[v.source.status]++;
  return counts;
}
