/**
 * Small constructors that keep the solvent tables readable. The status of a
 * value is in the function name: `read` (found in the named source),
 * `recalled` (from memory, unverified), `derived` (computed here or assigned
 * by rule), `practice` (common-practice list).
 */
import type { AntoineSet, Source, Sourced } from '../types';
import type { SourceId } from '../sources';

function source(ref: SourceId, status: Source['status'], note?: string): Source {
  return note === undefined ? { ref, status } : { ref, status, note };
}

/**
 * A library value read from its source (status 'confirmed' in docs/data-sources.md).
 * Source: this project's own bookkeeping (no external source); `ref` names the value's source.
 * Validity: any source listed in data/sources.ts.
 * @param ref the source the value comes from
 * @param note what was read, or why the value stands in
 * @returns the value's source record
 */
export function read(ref: SourceId, note?: string): Source {
  return source(ref, 'confirmed', note);
}

/**
 * A library value recalled from memory, not yet read from its source (status 'unverified-memory' in docs/data-sources.md).
 * Source: this project's own bookkeeping (no external source); `ref` names the value's source.
 * Validity: any source listed in data/sources.ts.
 * @param ref the source the value comes from
 * @param note what was read, or why the value stands in
 * @returns the value's source record
 */
export function recalled(ref: SourceId, note?: string): Source {
  return source(ref, 'unverified-memory', note);
}

/**
 * A library value read in a published reproduction of its primary table, not in the primary itself (status 'secondary' in docs/data-sources.md).
 * Source: this project's own bookkeeping (no external source); `ref` names the reproduction read.
 * Validity: any source listed in data/sources.ts.
 * @param ref the reproduction the value was read in
 * @param note what was read, or why the value stands in
 * @returns the value's source record
 */
export function reproduced(ref: SourceId, note?: string): Source {
  return source(ref, 'secondary', note);
}

/**
 * A library value derived from other values of the source (status 'estimated' in docs/data-sources.md).
 * Source: this project's own bookkeeping (no external source); `ref` names the value's source.
 * Validity: any source listed in data/sources.ts.
 * @param ref the source the value comes from
 * @param note what was read, or why the value stands in
 * @returns the value's source record
 */
export function derived(ref: SourceId, note?: string): Source {
  return source(ref, 'estimated', note);
}

/**
 * A library value that is common practice with no published source (status 'common-practice' in docs/data-sources.md).
 * Source: this project's own bookkeeping (no external source); `ref` names the value's source.
 * Validity: any source listed in data/sources.ts.
 * @param ref the source the value comes from
 * @param note what was read, or why the value stands in
 * @returns the value's source record
 */
export function practice(ref: SourceId, note?: string): Source {
  return source(ref, 'common-practice', note);
}

/**
 * A value with its source, as every library field is stored.
 *
 * Source: the library convention (DEVELOPERS.md, "Every number has a source").
 *
 * @param value  the value, in the unit its field states
 * @param src    its source
 * @returns the sourced value
 *
 * Validity: any value.
 */
export function sv<T>(value: T, src: Source): Sourced<T> {
  return { value, source: src };
}

/**
 * An Antoine set exactly as published; validity range in kelvin.
 *
 * Source: the publication given in `src`. Formula: log10 P = A − B/(T + C),
 * with P in bar and T in °C ('log10-bar-degC') or K ('log10-bar-K').
 *
 * @param form   which of the two published forms
 * @param A      constant A [–] (log10 of bar)
 * @param B      constant B [°C or K, as the form]
 * @param C      constant C [°C or K, as the form]
 * @param TminK  lower end of the fitted range [K]
 * @param TmaxK  upper end of the fitted range [K]
 * @param src    the publication
 * @returns the set
 *
 * Validity: TminK to TmaxK, as published (thermo/antoine.ts extrapolates outside with a warning).
 */
export function antoine(
  form: AntoineSet['form'],
  A: number,
  B: number,
  C: number,
  TminK: number,
  TmaxK: number,
  src: Source,
): AntoineSet {
  return { form, A, B, C, TminK, TmaxK, source: src };
}

/** Group assignment made by applying the original UNIFAC subgroup definitions. */
export const ASSIGNED: Source = derived(
  'unifac-groups',
  'assigned by applying the original UNIFAC subgroup definitions; not compared one by one with the DDBST assignment list',
);

/** A recalled 25 °C viscosity (no table read for it, or the tables read disagree). */
export const VISCOSITY: Source = recalled('crc-viscosity-liquids');
