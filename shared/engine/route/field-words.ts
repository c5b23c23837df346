/**
 * Problems in a route document said in the chemist's words: the field by the label the step's
 * settings show (never a path such as "params.mode.volume.value"), and the schema's default
 * messages ("Too big: expected number to be <=1000000") as what to enter instead.
 * Source: this project's own wording (no external source); labels as in the step panel.
 * Validity: any field path the route schema or the route validation reports.
 */
import { portWords } from './step-words';

/** Labels of step settings by their path below `params` (as the step panel shows them). */
const STEP_FIELDS: Record<string, string> = {
  temperatureC: 'Temperature',
  pressureMbar: 'Pressure',
  crudeMassKg: 'Crude mass (for wt %)',
  contents: 'Contents',
  'addedLiquid.wtPct': 'Strength',
  'addedLiquid.solventId': 'Solvent',
  'addedLiquid.soluteId': 'Added liquid',
  'addedLiquid.volume': 'Volume',
  stages: 'Stages',
  'mode.targetVolume': 'Target volume',
  'mode.cycles': 'Cycles',
  'mode.addSolventId': 'New solvent',
  'mode.addVolume': 'Volume added',
  'condition.pressureMbar': 'Pressure',
  'condition.potTemperatureC': 'Pot temperature',
  'mode.startC': 'Start temperature',
  'mode.endC': 'End temperature',
  'mode.antisolventId': 'Antisolvent',
  'mode.volume': 'Antisolvent volume',
  'mode.temperatureC': 'Temperature',
  'mode.pressureMbar': 'Pressure',
  seedWtPct: 'Seed charge',
  'cakeWash.solventId': 'Wash solvent',
  'cakeWash.volume': 'Volume of each wash',
  'cakeWash.washes': 'Number of washes',
  'cakeWash.crystalSizeUm': 'Crystal size (µm)',
  'cakeWash.displacementEfficiency': 'Displacement efficiency',
  'cakeWash.undisplacedFraction': 'Undisplaced fraction',
  mediumResistancePerM: 'Filter-medium resistance (1/m)',
  specificCakeResistanceMPerKg: 'Specific cake resistance (m/kg)',
  filterAreaM2: 'Filter area (m²)',
  pressureDropBar: 'Pressure drop (bar)',
  retainedLiquorLPerKg: 'Retained liquor (L/kg)',
  'target.lodWtPct': 'Loss on drying',
  'target.residualPpm': 'Residual solvent (ppm)',
  maxHours: 'Time allowed (h)',
  inertGasNLPerMinPerKg: 'Nitrogen (NL/min per kg solid)',
  equiv: 'Amount',
  wtPct: 'Strength',
  targetPH: 'Target pH',
  carbonWtPct: 'Carbon charge (wt % of dissolved solids)',
  fractionToA: 'Fraction to output a',
  reagentId: 'Reagent',
  reagentSoluteId: 'Reagent',
  organicSolventId: 'Organic solvent',
  solventId: 'Solvent',
};

/** Labels of the document's own fields (outside any step). */
const DOCUMENT_FIELDS: Record<string, string> = {
  'referenceInput.componentId': 'Reference compound (yields are per kg of it)',
  'referenceInput.massKg': 'Reference mass',
  components: 'Compounds of the route',
  connections: 'Connections',
  steps: 'Steps',
  name: 'Route name',
};

/** Labels of an item of a charge's contents. */
const CONTENT_FIELDS: Record<string, string> = {
  componentId: 'compound',
  soluteId: 'aqueous solute',
  amount: 'amount',
  unit: 'unit',
  wtPct: 'strength',
};

const humanise = (key: string) =>
  key
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/^./, (c) => c.toUpperCase())
    .replace(/ ([A-Z])(?=[a-z])/g, (_m, c: string) => ` ${c.toLowerCase()}`);

/**
 * The field a problem is about, as the chemist knows it: "Antisolvent volume",
 * "Item 2 of Contents: amount", "Reference compound (yields are per kg of it)".
 * Accepts "a.b.0.c" and "a.b[0].c"; a path inside a step may keep its "steps.N." prefix.
 * Source: this project's own wording (no external source): the step panel's labels.
 * Validity: any path; one not in the tables is said by its last key in words.
 * @param field  the path the schema or the validation reported
 * @returns the label, or '' when the problem is about the step or document as a whole
 */
export function fieldInWords(field: string): string {
  const parts = field
    .replace(/\[(\d+)\]/g, '.$1')
    .split('.')
    .filter(Boolean);
  if (parts[0] === 'steps' && /^\d+$/.test(parts[1] ?? '')) parts.splice(0, 2);
  if (!parts.length) return '';
  if (parts[0] !== 'params') {
    const key = parts.join('.');
    if (DOCUMENT_FIELDS[key]) return DOCUMENT_FIELDS[key];
    // A stream between steps, or a step's input, as the canvas shows them.
    if (parts[0] === 'connections') return DOCUMENT_FIELDS.connections;
    if (parts[0] === 'inputs' && parts[1]) return `Input: ${portWords(parts[1])}`;
    if (parts[0] === 'components' && parts.length > 2)
      return `Compound ${Number(parts[1]) + 1}: ${humanise(parts[2]).toLowerCase()}`;
    if (parts[0] === 'name') return 'Step name';
    if (parts[0] === 'position') return 'Place on the canvas';
    return humanise(parts.at(-1)!);
  }
  const rest = parts.slice(1);
  // An uncertain number (value ± plusMinus) is one field on the form.
  const spread = rest.at(-1) === 'plusMinus';
  if (rest.at(-1) === 'value' || spread) rest.pop();
  if (rest[0] === 'contents' && /^\d+$/.test(rest[1] ?? '')) {
    const what = rest[2] ? (CONTENT_FIELDS[rest[2]] ?? humanise(rest[2]).toLowerCase()) : '';
    return `Item ${Number(rest[1]) + 1} of Contents${what ? `: ${what}` : ''}`;
  }
  for (let n = rest.length; n > 0; n--) {
    const label = STEP_FIELDS[rest.slice(rest.length - n).join('.')];
    if (label) return spread ? `${label} (the ± part)` : label;
  }
  const label = humanise(rest.at(-1) ?? 'params');
  return spread ? `${label} (the ± part)` : label;
}

/** A number in a message: plain up to 10⁴, else engineering notation ("1 × 10⁶"). */
function plainNumber(n: number | bigint): string {
  const v = Number(n);
  if (!Number.isFinite(v)) return String(v);
  const abs = Math.abs(v);
  if (abs === 0 || (abs >= 1e-3 && abs < 1e4)) return String(Number(v.toPrecision(6)));
  const exponent = Math.floor(Math.log10(abs) / 3) * 3;
  const mantissa = Number((v / 10 ** exponent).toPrecision(4));
  const sup = String(exponent).replace(/./g, (c) => '⁻⁰¹²³⁴⁵⁶⁷⁸⁹'['-0123456789'.indexOf(c)]);
  return `${mantissa} × 10${sup}`;
}

/** What a schema issue carries that the wording needs (a zod issue has these fields). */
export interface SchemaIssueLike {
  code?: string;
  message: string;
  minimum?: number | bigint;
  maximum?: number | bigint;
  inclusive?: boolean;
  origin?: string;
  expected?: string;
}

/** The schema's own default messages begin so; a message written for the schema is kept as is. */
const DEFAULT_MESSAGE =
  /^(Too big|Too small|Invalid input|Invalid option|Invalid|Required|Unrecognized key)/;

/**
 * A schema problem as what to enter: "Enter at most 1 × 10⁶.", "Enter a number.", "Choose one
 * of the options.". A message the schema itself words (custom) is returned unchanged.
 * Source: this project's own wording (no external source) of the schema library's issue codes.
 * Validity: any issue; an unknown code is said as "Check this value.".
 * @param issue  a zod issue (or anything with its code, message and limits)
 * @returns one sentence for the chemist
 */
export function messageInWords(issue: SchemaIssueLike): string {
  if (!DEFAULT_MESSAGE.test(issue.message)) return issue.message;
  const text = issue.origin === 'string';
  const list = issue.origin === 'array' || issue.origin === 'set';
  switch (issue.code) {
    case 'too_big':
      if (text) return `Use at most ${plainNumber(issue.maximum ?? 0)} characters.`;
      if (list) return `Use at most ${plainNumber(issue.maximum ?? 0)} entries.`;
      return issue.inclusive === false
        ? `Enter less than ${plainNumber(issue.maximum ?? 0)}.`
        : `Enter at most ${plainNumber(issue.maximum ?? 0)}.`;
    case 'too_small':
      if (text)
        return Number(issue.minimum) <= 1
          ? 'Enter a value.'
          : `Use at least ${plainNumber(issue.minimum ?? 0)} characters.`;
      if (list) return `Add at least ${plainNumber(issue.minimum ?? 0)}.`;
      if (issue.inclusive === false && Number(issue.minimum) === 0) return 'Enter more than zero.';
      return issue.inclusive === false
        ? `Enter more than ${plainNumber(issue.minimum ?? 0)}.`
        : `Enter at least ${plainNumber(issue.minimum ?? 0)}.`;
    case 'invalid_type':
      if (/received undefined/.test(issue.message)) return 'Enter a value.';
      if (issue.expected === 'int') return 'Enter a whole number.';
      if (issue.expected === 'number') return 'Enter a number.';
      if (issue.expected === 'string') return 'Enter a value.';
      return 'Enter a value of the right kind.';
    case 'invalid_value':
    case 'invalid_union':
      return 'Choose one of the options.';
    case 'not_multiple_of':
      return 'Enter a whole number.';
    case 'unrecognized_keys':
      return 'This setting is not one the step has; remove it.';
    default:
      return 'Check this value.';
  }
}
