/**
 * Steps, their inputs and outputs, and the streams between them said as the
 * chemist sees them on the canvas: "the wash “Acid wash”", "its organic
 * layer", "a slurry or a solution" — never a step's id or a port's name.
 * Shared by the route validation (engine) and the editor's connection checks.
 * Source: this project's own wording (no external source): the step cards' labels.
 * Validity: every step kind and port of the route document (document.ts PORTS).
 */
import type { PortPhase, StepKind } from '../document';

/** What a chemist calls each step kind in a sentence ("a filtration's cake"). */
export const KIND_NOUN: Record<StepKind, string> = {
  charge: 'charge',
  wash: 'wash',
  extraction: 'extraction',
  distillation: 'distillation',
  crystallisation: 'crystallisation',
  filtration: 'filtration',
  drying: 'drying',
  quench: 'quench',
  'ph-adjust': 'pH adjustment',
  'carbon-treatment': 'carbon treatment',
  'polish-filtration': 'polish filtration',
  split: 'split',
  merge: 'merge',
};

/** What each phase of stream is, in words. */
export const PHASE_WORDS: Record<PortPhase, string> = {
  liquid: 'a solution',
  organic: 'an organic layer',
  aqueous: 'an aqueous layer',
  slurry: 'a slurry or a solution',
  solid: 'a solid (a cake or a slurry)',
  vapour: 'a vapour',
};

/** What an input or output carries, as a chemist names it. */
export const PORT_WORDS: Record<string, string> = {
  out: 'output',
  organic: 'organic layer',
  aqueous: 'aqueous layer',
  pot: 'pot contents',
  distillate: 'distillate',
  slurry: 'slurry',
  cake: 'cake',
  filtrate: 'filtrate',
  dry: 'dried solid',
  vapour: 'vapour',
  spent: 'spent carbon',
  retained: 'retained solids',
  feed: 'feed',
  wet: 'wet cake',
  a: 'first stream',
  b: 'second stream',
  c: 'third stream',
};

/** Said wherever an aqueous solution is used on a route without water among its compounds. */
export const AQUEOUS_NEEDS_WATER =
  "An aqueous solution needs water among the route's compounds: add water to the route's solvents.";

/**
 * "a" or "an" before a word (by its first letter).
 * Source: this project's own wording (no external source).
 * Validity: any word; spelling, not pronunciation, decides.
 * @param word  the word that follows
 * @returns "a" or "an"
 */
export const article = (word: string) => (/^[aeiou]/i.test(word) ? 'an' : 'a');

/**
 * The text with its first letter upper case.
 * Source: this project's own wording (no external source).
 * Validity: any text, empty included.
 * @param s  the text
 * @returns the text, first letter upper case
 */
export const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * An input or output in words ("organic layer"); a port not in the table as "stream".
 * Source: this project's own wording (no external source).
 * Validity: any port name.
 * @param port  the input or output as the route document names it
 * @returns the words a card shows for it
 */
export const portWords = (port: string): string =>
  Object.prototype.hasOwnProperty.call(PORT_WORDS, port) ? PORT_WORDS[port] : 'stream';

/**
 * A step by its type and name: "the wash “Acid wash”", or "an unnamed wash".
 * Source: this project's own wording (no external source).
 * Validity: any step (the name may be empty).
 * @param step  the step's kind and name
 * @returns the step in words, lower case at the start
 */
export function stepInWords(step: { kind: StepKind; name?: string }): string {
  const noun = KIND_NOUN[step.kind] ?? 'step';
  const name = step.name?.trim();
  return name ? `the ${noun} “${name}”` : `an unnamed ${noun}`;
}

/**
 * A list in words: "a", "a and b", "a, b and c".
 * Source: this project's own wording (no external source).
 * Validity: any list, empty included (gives "").
 * @param items  the words
 * @returns the joined list
 */
export function listInWords(items: string[]): string {
  if (items.length <= 1) return items[0] ?? '';
  return `${items.slice(0, -1).join(', ')} and ${items.at(-1)}`;
}
