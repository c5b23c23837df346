/**
 * The plant step list: a route document (already scaled to the batch) and
 * its evaluation turned into numbered operations in the plant's words, with
 * the charges, temperatures, pressures and times, the volume in the
 * equipment after each operation, IPC sampling points with their acceptance
 * criteria, the cautions of the operation they concern, and a check of
 * every operation against the equipment chosen for its step.
 *
 * Pure: no I/O. The numbers come from the evaluation (the engine's streams
 * and step records); the times not computed by a model are the engine's
 * common-practice durations (shared/engine/unitops/common.ts).
 */
import type { EngineWarning, RouteDocument, RouteStep, StepOf } from '../engine/document';
import type { RouteResult } from '../engine/route/evaluate';
import type { Stream } from '../engine/route/types';
import { aqueousMediumKg, buildContext, type EvalContext } from '../engine/route/context';
import { COMMON_PRACTICE_HOURS } from '../engine/unitops/common';
import type { Equipment } from '../schemas/equipment';
import type { StepListCharge, StepListOperation, VesselCheck } from '../schemas/step-list';
import * as f from './format';

/** Margin on a computed concentration for an IPC limit (common practice default; the site sets its own). */
export const IPC_MARGIN = 0.2;
/** A temperature change smaller than this needs no heating or cooling operation, K. */
const TEMPERATURE_STEP_K = 2;

/** Engine warnings that are cautions for the plant (the rest are notes on the models). */
const PLANT_CAUTIONS = new Set([
  'flammable-above-flash-point',
  'flash-point-not-confirmed',
  'static-accumulation',
  'ich-class-1',
  'ich-limit-exceeded',
  'peroxide-concentration',
  'gas-evolution',
  'quench-exotherm',
  'neutralisation-exotherm',
  'exotherm',
  'near-equal-densities',
  'emulsion-risk',
  'oiling-out',
  'dryer-near-melting',
  'drying-target-not-reached',
  'carbon-handling',
  'co-precipitation',
  'buffer-capacity',
  'target-unreachable',
]);

/** What an operation does, for placing cautions and judging the equipment. */
type Role =
  | 'charge'
  | 'temperature'
  | 'stir'
  | 'settle'
  | 'separate'
  | 'distil'
  | 'seed'
  | 'crystallise'
  | 'age'
  | 'filter'
  | 'wash'
  | 'deliquor'
  | 'dry'
  | 'discharge'
  | 'ipc'
  | 'transfer';

/** Which operation of a step a warning concerns, by its code (the first role present wins). */
const CAUTION_ROLES: Record<string, Role[]> = {
  'gas-evolution': ['charge'],
  'quench-exotherm': ['charge'],
  'neutralisation-exotherm': ['charge'],
  exotherm: ['charge'],
  'buffer-capacity': ['charge'],
  'carbon-handling': ['charge'],
  'ich-class-1': ['charge', 'distil'],
  'static-accumulation': ['filter', 'charge', 'transfer'],
  'peroxide-concentration': ['distil'],
  'near-equal-densities': ['settle', 'separate'],
  'emulsion-risk': ['settle', 'separate'],
  'oiling-out': ['crystallise', 'charge'],
  'co-precipitation': ['crystallise', 'age'],
  'ich-limit-exceeded': ['dry'],
  'dryer-near-melting': ['dry'],
  'drying-target-not-reached': ['dry'],
  'target-unreachable': ['distil', 'crystallise'],
  'flammable-above-flash-point': ['temperature', 'distil', 'crystallise', 'dry', 'charge'],
  'flash-point-not-confirmed': ['charge', 'temperature', 'distil', 'filter'],
};

interface Draft {
  stepId: string;
  role: Role;
  text: string;
  charges: StepListCharge[];
  temperatureC?: number;
  pressureMbar?: number;
  durationH?: number;
  volumeAfterL: number;
  /** Smallest and largest volume held during the operation, L. */
  minL: number;
  maxL: number;
  cautions: string[];
}

export interface StepListInput {
  /** The route document as scaled to the batch (scaleDocument). */
  document: RouteDocument;
  /** Its evaluation. */
  result: RouteResult;
  /** step id → the equipment chosen for it. */
  assignments: Record<string, Equipment>;
  /** Every piece of equipment of the workspace, for suggestions. */
  available: Equipment[];
}

export interface BuiltStepList {
  operations: StepListOperation[];
  /** Step ids of the assignments that name no step of the route. */
  unknownSteps: string[];
}

const toC = (K: number) => K - 273.15;

export function buildStepList(input: StepListInput): BuiltStepList {
  const { document, result } = input;
  const { ctx } = buildContext(document);
  const stepById = new Map(document.steps.map((s) => [s.id, s]));
  const drafts: Draft[] = [];
  const name = (id: string) => ctx.comps.get(id)?.name ?? id;

  for (const stepId of result.order) {
    const step = stepById.get(stepId)!;
    const record = result.steps[stepId];
    const incoming = document.connections
      .filter((c) => c.to.stepId === stepId)
      .map((c) => result.streams[c.id])
      .filter((s): s is Stream => s !== undefined);
    const outputs = outputStreams(document, result, stepId);
    const feedL = incoming.reduce((sum, s) => sum + s.volumeM3 * 1000, 0);
    const feedC = incoming.length > 0 ? toC(incoming[0].temperatureK) : null;
    const ops: Draft[] = [];
    const op = (draft: Omit<Draft, 'stepId' | 'cautions' | 'charges'> & Partial<Draft>) => {
      const full: Draft = { stepId, cautions: [], charges: [], ...draft };
      ops.push(full);
      return full;
    };
    const adjustTemperature = (fromC: number | null, toCelsius: number, volumeL: number) => {
      if (fromC === null || Math.abs(toCelsius - fromC) < TEMPERATURE_STEP_K) return;
      const hours = Math.abs(toCelsius - fromC) / COMMON_PRACTICE_HOURS.coolingKPerHour;
      op({
        role: 'temperature',
        text: `${toCelsius > fromC ? 'Heat' : 'Cool'} the contents to ${f.celsius(toCelsius)} over ${f.duration(hours)}.`,
        temperatureC: toCelsius,
        durationH: hours,
        volumeAfterL: volumeL,
        minL: volumeL,
        maxL: volumeL,
      });
    };
    const context: KindContext = {
      ctx,
      step,
      record,
      incoming,
      outputs,
      feedL,
      feedC,
      op,
      adjustTemperature,
      name,
      document,
      result,
    };
    KIND_BUILDERS[step.kind](context as never);
    if (ops.length === 0)
      op({
        role: 'transfer',
        text: `${step.name || step.kind}: no operation.`,
        volumeAfterL: feedL,
        minL: feedL,
        maxL: feedL,
      });
    placeCautions(ops, record.warnings);
    drafts.push(...ops);
  }

  const operations = drafts.map((d, i) => finish(d, i + 1));
  judgeEquipment(drafts, operations, input.assignments, input.available, stepById);
  return {
    operations,
    unknownSteps: Object.keys(input.assignments).filter((id) => !stepById.has(id)),
  };
}

function finish(d: Draft, number: number): StepListOperation {
  const out: StepListOperation = {
    number,
    stepId: d.stepId,
    text: d.text,
    charges: d.charges,
    volumeAfterL: d.volumeAfterL,
    cautions: d.cautions,
  };
  if (d.temperatureC !== undefined) out.temperatureC = d.temperatureC;
  if (d.pressureMbar !== undefined) out.pressureMbar = d.pressureMbar;
  if (d.durationH !== undefined) out.durationH = d.durationH;
  return out;
}

/** The step's output streams by port: connected ones from the connections, the rest from the terminals. */
function outputStreams(
  document: RouteDocument,
  result: RouteResult,
  stepId: string,
): Record<string, Stream> {
  const out: Record<string, Stream> = {};
  for (const c of document.connections)
    if (c.from.stepId === stepId && result.streams[c.id]) out[c.from.port] = result.streams[c.id];
  for (const t of result.terminals) if (t.stepId === stepId) out[t.port] = t.stream;
  return out;
}

function placeCautions(ops: Draft[], warnings: EngineWarning[]) {
  for (const warning of warnings) {
    if (!PLANT_CAUTIONS.has(warning.code) && warning.severity !== 'hazard') continue;
    const roles = CAUTION_ROLES[warning.code] ?? [];
    const target =
      roles.map((role) => ops.find((o) => o.role === role)).find((o) => o !== undefined) ??
      ops.find((o) => o.role !== 'ipc') ??
      ops[0];
    if (!target.cautions.includes(warning.message)) target.cautions.push(warning.message);
  }
}

// ------------------------------------------------------------------ per kind

interface KindContext<K extends RouteStep['kind'] = RouteStep['kind']> {
  ctx: EvalContext;
  step: StepOf<K>;
  record: RouteResult['steps'][string];
  incoming: Stream[];
  outputs: Record<string, Stream>;
  feedL: number;
  feedC: number | null;
  op: (draft: Omit<Draft, 'stepId' | 'cautions' | 'charges'> & Partial<Draft>) => Draft;
  adjustTemperature: (fromC: number | null, toC: number, volumeL: number) => void;
  name: (id: string) => string;
  document: RouteDocument;
  result: RouteResult;
}

const nominal = (u: number | { value: number }) => (typeof u === 'number' ? u : u.value);
const litresOf = (
  volume: { value: number | { value: number }; unit: 'L' | 'vol' },
  document: RouteDocument,
) =>
  volume.unit === 'L'
    ? nominal(volume.value)
    : nominal(volume.value) * document.referenceInput.massKg;
const volumeL = (s: Stream | undefined) => (s ? s.volumeM3 * 1000 : 0);
const sumKg = (kg: Record<string, number>) => Object.values(kg).reduce((a, b) => a + b, 0);

/** A liquid's litres from its kilograms at a temperature (the engine's densities). */
function liquidLitres(ctx: EvalContext, id: string, kgValue: number, temperatureC: number) {
  const c = ctx.comps.get(id);
  if (!c) return 0;
  return kgValue * c.specificVolume(temperatureC + 273.15) * 1000;
}

/** ICH class and peroxide-former notes for a solvent being charged (from the curated tables). */
function solventNotes(ctx: EvalContext, id: string): string[] {
  const s = ctx.comps.get(id)?.solvent;
  if (!s) return [];
  const notes: string[] = [];
  const ich = s.ich.value;
  if ((ich.class === 1 || ich.class === 2) && ich.limitPpm !== null)
    notes.push(
      `${s.name} is an ICH Q3C class ${ich.class} solvent: limit ${ich.limitPpm} ppm in the product; confirm its removal by the residual-solvent IPC.`,
    );
  if (s.peroxideFormer.value)
    notes.push(
      `${s.name} forms peroxides: use stabilised or freshly tested solvent and test for peroxides before concentrating (common practice).`,
    );
  return notes;
}

function mediumName(
  ctx: EvalContext,
  liquid: StepOf<'wash'>['params']['addedLiquid'],
  name: (id: string) => string,
): string {
  if (liquid.kind === 'solvent') return name(liquid.solventId);
  return `${f.amount(nominal(liquid.wtPct))} wt % aqueous ${name(liquid.soluteId)}`;
}

type Builders = { [K in RouteStep['kind']]: (c: KindContext<K>) => void };

const KIND_BUILDERS: Builders = {
  charge: (c) => {
    const T = nominal(c.step.params.temperatureC);
    c.adjustTemperature(c.feedC, T, c.feedL);
    const charged = (c.record.details.chargedKg ?? c.record.addedKg) as Record<string, number>;
    const seen = new Map<string, number>();
    for (const entry of c.step.params.contents)
      if (entry.kind === 'component')
        seen.set(entry.componentId, (seen.get(entry.componentId) ?? 0) + 1);
    let volume = c.feedL;
    for (const entry of c.step.params.contents) {
      if (entry.kind === 'component') {
        const id = entry.componentId;
        const kgValue = (charged[id] ?? 0) / (seen.get(id) ?? 1);
        const liquid = c.ctx.comps.get(id)?.kind === 'solvent';
        const L = liquidLitres(c.ctx, id, kgValue, T);
        const before = volume;
        volume += L;
        c.op({
          role: 'charge',
          text: liquid
            ? `Charge ${f.kg(kgValue)} (${f.litres(L)}) of ${c.name(id)} at ${f.celsius(T)}.`
            : `Charge ${f.kg(kgValue)} of ${c.name(id)} at ${f.celsius(T)}.`,
          charges: [{ name: c.name(id), kg: kgValue, L: liquid ? L : null }],
          temperatureC: T,
          volumeAfterL: volume,
          minL: before,
          maxL: volume,
          cautions: liquid ? solventNotes(c.ctx, id) : [],
        });
      } else {
        const L = litresOf(entry.volume, c.document);
        const label = `${f.amount(nominal(entry.wtPct))} wt % aqueous ${c.name(entry.soluteId)}`;
        const medium = c.ctx.waterId
          ? aqueousMediumKg(c.ctx, entry.soluteId, nominal(entry.wtPct), L / 1000, T + 273.15)
          : { waterKg: 0, soluteKg: 0 };
        const kgValue = medium.waterKg + medium.soluteKg;
        const before = volume;
        volume += L;
        c.op({
          role: 'charge',
          text: `Charge ${f.litres(L)} (${f.kg(kgValue)}) of ${label} at ${f.celsius(T)}.`,
          charges: [{ name: label, kg: kgValue, L }],
          temperatureC: T,
          volumeAfterL: volume,
          minL: before,
          maxL: volume,
        });
      }
    }
  },

  wash: (c) => washOrExtraction(c as KindContext<'wash'>),
  extraction: (c) => washOrExtraction(c as unknown as KindContext<'wash'>),

  distillation: (c) => {
    const params = c.step.params;
    const details = c.record.details as {
      maxPotTemperatureC?: number;
      profile?: Array<{ potVolumeL: number; potTemperatureC: number; newSolventAddedL: number }>;
      residualOriginalSolventWtPct?: number;
      newSolventAddedL?: number;
    };
    const potC = details.maxPotTemperatureC ?? toC(c.outputs.pot?.temperatureK ?? 298.15);
    const pressure =
      params.condition.kind === 'pressure' ? nominal(params.condition.pressureMbar) : undefined;
    const under =
      pressure !== undefined
        ? `under ${f.mbar(pressure)} (pot up to ${f.celsius(potC)})`
        : `at a pot temperature of ${f.celsius(potC)}, with the vacuum needed`;
    const potL = volumeL(c.outputs.pot);
    const hours = c.record.duration.hours;
    const mode = params.mode;
    if (mode.kind === 'concentrate') {
      c.op({
        role: 'distil',
        // A pot already at or below the target distils nothing (the engine gives no distillate).
        text:
          volumeL(c.outputs.distillate) > 0
            ? `Distil ${under} down to ${f.litres(potL)}; about ${f.litres(volumeL(c.outputs.distillate))} of distillate.`
            : `Nothing to distil: the pot holds ${f.litres(potL)}, no more than the target volume.`,
        temperatureC: potC,
        pressureMbar: pressure,
        durationH: hours,
        volumeAfterL: potL,
        minL: potL,
        maxL: Math.max(c.feedL, potL),
      });
      return;
    }
    const solvent = mode.addSolventId;
    const addedKg = c.record.addedKg[solvent] ?? 0;
    if (mode.kind === 'constant-volume') {
      const addL = litresOf(mode.addVolume, c.document);
      c.op({
        role: 'distil',
        text: `Distil ${under}, feeding ${c.name(solvent)} at the rate the distillate comes over to hold the volume at ${f.litres(c.feedL)}, until ${f.litres(addL)} (${f.kg(addedKg)}) has been added.`,
        charges: [{ name: c.name(solvent), kg: addedKg, L: addL }],
        temperatureC: potC,
        pressureMbar: pressure,
        durationH: hours,
        volumeAfterL: potL,
        minL: Math.min(c.feedL, potL),
        maxL: Math.max(c.feedL, potL),
        cautions: solventNotes(c.ctx, solvent),
      });
    } else {
      const addL = litresOf(mode.addVolume, c.document);
      const target = litresOf(mode.targetVolume, c.document);
      const perCycleKg = addedKg / mode.cycles;
      // The pot temperature at the end of each swap: the profile point before the next charge, and the last.
      const profile = details.profile ?? [];
      const cycleEnds = profile
        .filter(
          (point, i) =>
            point.newSolventAddedL > 0 &&
            (i === profile.length - 1 || profile[i + 1].newSolventAddedL > point.newSolventAddedL),
        )
        .map((point) => point.potTemperatureC);
      let volume = c.feedL;
      for (let cycle = 1; cycle <= mode.cycles; cycle++) {
        const before = volume;
        volume += addL;
        c.op({
          role: 'charge',
          text: `Charge ${f.litres(addL)} (${f.kg(perCycleKg)}) of ${c.name(solvent)} (swap ${cycle} of ${mode.cycles}).`,
          charges: [{ name: c.name(solvent), kg: perCycleKg, L: addL }],
          volumeAfterL: volume,
          minL: before,
          maxL: volume,
          cautions: cycle === 1 ? solventNotes(c.ctx, solvent) : [],
        });
        const end = cycle === mode.cycles ? potL : target;
        const cycleC = cycleEnds[cycle - 1] ?? potC;
        c.op({
          role: 'distil',
          text: `Distil ${pressure !== undefined ? `under ${f.mbar(pressure)} (pot up to ${f.celsius(cycleC)})` : under} down to ${f.litres(end)}.`,
          temperatureC: cycleC,
          pressureMbar: pressure,
          durationH: hours / mode.cycles,
          volumeAfterL: end,
          minL: Math.min(end, volume),
          maxL: volume,
        });
        volume = end;
      }
    }
    const residual = details.residualOriginalSolventWtPct;
    if (residual !== undefined) {
      const original = originalSolvent(c, solvent);
      const limit = Math.max(0.1, Math.ceil(residual * (1 + IPC_MARGIN) * 10) / 10);
      c.op({
        role: 'ipc',
        text: `IPC: sample the pot and measure ${original ? c.name(original) : 'the original solvent'} by GC. Expected ${f.pct(residual, 2)} w/w; accept at most ${f.pct(limit)} w/w, otherwise distil a further portion of ${c.name(solvent)}.`,
        volumeAfterL: potL,
        minL: potL,
        maxL: potL,
      });
    }
  },

  crystallisation: (c) => {
    const params = c.step.params;
    const details = c.record.details as {
      seedKg?: number;
      startTemperatureC?: number;
      endTemperatureC?: number;
    };
    const productId = c.ctx.productId;
    const slurry = c.outputs.slurry;
    const slurryL = volumeL(slurry);
    const seed = (atC: number, volume: number) => {
      if (!params.seeded || !productId || !(details.seedKg && details.seedKg > 0)) return;
      c.op({
        role: 'seed',
        text: `Seed with ${f.kg(details.seedKg)} of ${c.name(productId)} at ${f.celsius(atC)}; stir for 30 min and check the seed holds.`,
        charges: [{ name: `${c.name(productId)} (seed)`, kg: details.seedKg, L: null }],
        temperatureC: atC,
        durationH: 0.5,
        volumeAfterL: volume,
        minL: volume,
        maxL: volume,
      });
    };
    const age = (atC: number) =>
      c.op({
        role: 'age',
        text: `Age for ${f.duration(COMMON_PRACTICE_HOURS.crystallisationAge)} at ${f.celsius(atC)} with stirring.`,
        temperatureC: atC,
        durationH: COMMON_PRACTICE_HOURS.crystallisationAge,
        volumeAfterL: slurryL,
        minL: slurryL,
        maxL: slurryL,
      });
    const mode = params.mode;
    let endC: number;
    if (mode.kind === 'cooling') {
      const startC = nominal(mode.startC);
      endC = nominal(mode.endC);
      c.adjustTemperature(c.feedC, startC, c.feedL);
      seed(startC, c.feedL);
      const hours = Math.abs(startC - endC) / COMMON_PRACTICE_HOURS.coolingKPerHour;
      c.op({
        role: 'crystallise',
        text: `Cool from ${f.celsius(startC)} to ${f.celsius(endC)} over ${f.duration(hours)} (${COMMON_PRACTICE_HOURS.coolingKPerHour} K/h, linear).`,
        temperatureC: endC,
        durationH: hours,
        volumeAfterL: slurryL,
        minL: Math.min(c.feedL, slurryL),
        maxL: Math.max(c.feedL, slurryL),
      });
      age(endC);
    } else if (mode.kind === 'antisolvent') {
      endC = nominal(mode.temperatureC);
      c.adjustTemperature(c.feedC, endC, c.feedL);
      seed(endC, c.feedL);
      const addL = litresOf(mode.volume, c.document);
      const addedKg = c.record.addedKg[mode.antisolventId] ?? 0;
      const hours = COMMON_PRACTICE_HOURS.antisolventAddition;
      c.op({
        role: 'crystallise',
        text: `Add ${f.litres(addL)} (${f.kg(addedKg)}) of ${c.name(mode.antisolventId)} over ${f.duration(hours)} at ${f.celsius(endC)}.`,
        charges: [{ name: c.name(mode.antisolventId), kg: addedKg, L: addL }],
        temperatureC: endC,
        durationH: hours,
        volumeAfterL: slurryL,
        minL: c.feedL,
        maxL: Math.max(c.feedL + addL, slurryL),
        cautions: solventNotes(c.ctx, mode.antisolventId),
      });
      age(endC);
    } else {
      endC = details.endTemperatureC ?? toC(slurry?.temperatureK ?? 298.15);
      const pressure = nominal(mode.pressureMbar);
      c.op({
        role: 'crystallise',
        text: `Distil under ${f.mbar(pressure)} down to ${f.litres(slurryL)}; the product crystallises as the solvent is removed.`,
        temperatureC: endC,
        pressureMbar: pressure,
        durationH: c.record.duration.hours,
        volumeAfterL: slurryL,
        minL: slurryL,
        maxL: Math.max(c.feedL, slurryL),
      });
      age(endC);
    }
    if (productId && slurry) {
      const dissolvedKg = (slurry.kg[productId] ?? 0) - (slurry.solidKg[productId] ?? 0);
      let solidL = 0;
      for (const [id, kgSolid] of Object.entries(slurry.solidKg))
        solidL += liquidLitres(c.ctx, id, kgSolid, toC(slurry.temperatureK));
      const liquorL = Math.max(slurryL - solidL, 1e-9);
      const gPerL = (dissolvedKg * 1000) / liquorL;
      c.op({
        role: 'ipc',
        text: `IPC: sample the mother liquor and measure ${c.name(productId)} by HPLC. Expected ${f.amount(gPerL)} g/L (the computed solubility at ${f.celsius(endC)}); accept at most ${f.amount(gPerL * (1 + IPC_MARGIN))} g/L, otherwise age longer.`,
        temperatureC: endC,
        volumeAfterL: slurryL,
        minL: slurryL,
        maxL: slurryL,
      });
    }
  },

  filtration: (c) => {
    const params = c.step.params;
    const details = c.record.details as {
      filtrationTimeH?: number;
      filtrateVolumeL?: number;
      wetCakeLodWtPct?: number;
      washes?: Array<{ timeH?: number }>;
    };
    const cake = c.outputs.cake;
    const cakeL = volumeL(cake);
    const cakeKg = cake ? sumKg(cake.kg) : 0;
    const slurryC = c.feedC ?? 20;
    c.op({
      role: 'filter',
      text: `Filter the slurry (${f.litres(c.feedL)}); collect about ${f.litres(details.filtrateVolumeL ?? volumeL(c.outputs.filtrate))} of mother liquor.`,
      temperatureC: slurryC,
      durationH: COMMON_PRACTICE_HOURS.filtrationSetup + (details.filtrationTimeH ?? 0),
      volumeAfterL: cakeL,
      minL: cakeL,
      maxL: cakeL,
    });
    const wash = params.cakeWash;
    if (wash) {
      const eachL = litresOf(wash.volume, c.document);
      const totalKg = c.record.addedKg[wash.solventId] ?? 0;
      const washC = wash.temperatureC !== undefined ? nominal(wash.temperatureC) : slurryC;
      for (let i = 1; i <= wash.washes; i++)
        c.op({
          role: 'wash',
          text: `Wash the cake with ${f.litres(eachL)} (${f.kg(totalKg / wash.washes)}) of ${c.name(wash.solventId)} at ${f.celsius(washC)}${wash.washes > 1 ? ` (wash ${i} of ${wash.washes})` : ''}; displace, do not reslurry.`,
          charges: [{ name: c.name(wash.solventId), kg: totalKg / wash.washes, L: eachL }],
          temperatureC: washC,
          durationH: COMMON_PRACTICE_HOURS.cakeWash / wash.washes,
          volumeAfterL: cakeL,
          minL: cakeL,
          maxL: cakeL,
          cautions: i === 1 ? solventNotes(c.ctx, wash.solventId) : [],
        });
    }
    c.op({
      role: 'deliquor',
      text: `Pull the cake as dry as the filter allows: about ${f.kg(cakeKg)} of wet cake${details.wetCakeLodWtPct !== undefined ? ` (LOD about ${f.pct(details.wetCakeLodWtPct, 0)})` : ''}.`,
      volumeAfterL: cakeL,
      minL: cakeL,
      maxL: cakeL,
    });
  },

  drying: (c) => {
    const params = c.step.params;
    const details = c.record.details as {
      dryingHours?: number;
      outcome?: string;
      residualSolventsPpm?: Array<{
        name: string;
        ppm: number;
        ichClass: number | null;
        limitPpm: number | null;
      }>;
    };
    const T = nominal(params.temperatureC);
    const P = nominal(params.pressureMbar);
    const dry = c.outputs.dry;
    const dryL = volumeL(dry);
    const dryKg = dry ? sumKg(dry.kg) : 0;
    const target =
      params.target.kind === 'lod'
        ? `the LOD is at most ${f.pct(nominal(params.target.lodWtPct), 2)}`
        : `the residual solvent is at most ${f.amount(nominal(params.target.residualPpm))} ppm`;
    c.op({
      role: 'transfer',
      text: `Charge the wet cake (${f.kg(c.incoming.reduce((s, x) => s + sumKg(x.kg), 0))}) to the dryer.`,
      volumeAfterL: c.feedL,
      minL: c.feedL,
      maxL: c.feedL,
    });
    c.op({
      role: 'dry',
      text: `Dry at ${f.celsius(T)} under ${f.mbar(P)} until ${target}${details.dryingHours !== undefined ? `; expected about ${f.duration(details.dryingHours)}` : ''}.`,
      temperatureC: T,
      pressureMbar: P,
      durationH: details.dryingHours,
      volumeAfterL: dryL,
      minL: dryL,
      maxL: c.feedL,
    });
    const limits = (details.residualSolventsPpm ?? [])
      .filter((r) => r.limitPpm !== null)
      .map((r) => `${r.name} at most ${f.amount(r.limitPpm!)} ppm (ICH Q3C class ${r.ichClass})`);
    c.op({
      role: 'ipc',
      text:
        params.target.kind === 'lod'
          ? `IPC: sample the solid and measure the LOD. Accept at most ${f.pct(nominal(params.target.lodWtPct), 2)}, otherwise dry on.`
          : `IPC: sample the solid and measure the residual solvent by GC. Accept at most ${f.amount(nominal(params.target.residualPpm))} ppm, otherwise dry on.`,
      volumeAfterL: dryL,
      minL: dryL,
      maxL: dryL,
    });
    if (limits.length > 0)
      c.op({
        role: 'ipc',
        text: `IPC: residual solvents by GC. Accept ${limits.join('; ')}.`,
        volumeAfterL: dryL,
        minL: dryL,
        maxL: dryL,
      });
    const productId = c.ctx.productId;
    const purity =
      productId && dry && dryKg > 0 ? (100 * (dry.kg[productId] ?? 0)) / dryKg : undefined;
    c.op({
      role: 'discharge',
      text: `Discharge and weigh: about ${f.kg(dryKg)} of ${productId ? c.name(productId) : 'dry solid'}${purity !== undefined ? ` (computed purity ${f.pct(purity, 2)} w/w)` : ''}.`,
      volumeAfterL: 0,
      minL: 0,
      maxL: dryL,
    });
  },

  quench: (c) => {
    const params = c.step.params;
    const T = nominal(params.temperatureC);
    c.adjustTemperature(c.feedC, T, c.feedL);
    const reagentKg = c.record.addedKg[params.reagentId] ?? 0;
    const charges: StepListCharge[] = [];
    let addedL = 0;
    let carrierText = '';
    if (params.carrier) {
      const L = litresOf(params.carrier.volume, c.document);
      const carrierKg = c.record.addedKg[params.carrier.solventId] ?? 0;
      addedL += L;
      charges.push({ name: c.name(params.carrier.solventId), kg: carrierKg, L });
      carrierText = ` in ${f.litres(L)} of ${c.name(params.carrier.solventId)}`;
    }
    charges.unshift({ name: c.name(params.reagentId), kg: reagentKg, L: null });
    const out = volumeL(c.outputs.out);
    c.op({
      role: 'charge',
      text: `Add ${f.kg(reagentKg)} of ${c.name(params.reagentId)} (${f.amount(nominal(params.equiv))} equiv)${carrierText} over ${f.duration(COMMON_PRACTICE_HOURS.quench)}, keeping the contents at ${f.celsius(T)}.`,
      charges,
      temperatureC: T,
      durationH: COMMON_PRACTICE_HOURS.quench,
      volumeAfterL: out,
      minL: c.feedL,
      maxL: Math.max(out, c.feedL + addedL),
    });
    c.op({
      role: 'stir',
      text: `Stir for 30 min at ${f.celsius(T)}.`,
      temperatureC: T,
      durationH: 0.5,
      volumeAfterL: out,
      minL: out,
      maxL: out,
    });
  },

  'ph-adjust': (c) => {
    const params = c.step.params;
    const T = nominal(params.temperatureC);
    c.adjustTemperature(c.feedC, T, c.feedL);
    const added = sumKg(c.record.addedKg);
    const addedL = c.record.addedVolumeM3 * 1000;
    const label = `${f.amount(nominal(params.wtPct))} wt % aqueous ${c.name(params.reagentSoluteId)}`;
    const out = volumeL(c.outputs.out);
    const pH = nominal(params.targetPH);
    c.op({
      role: 'charge',
      text: `Adjust to pH ${f.ph(pH)} with ${f.litres(addedL)} (${f.kg(added)}) of ${label}, added over ${f.duration(COMMON_PRACTICE_HOURS.phAdjust)} at ${f.celsius(T)}.`,
      charges: [{ name: label, kg: added, L: addedL }],
      temperatureC: T,
      durationH: COMMON_PRACTICE_HOURS.phAdjust,
      volumeAfterL: out,
      minL: c.feedL,
      maxL: Math.max(out, c.feedL + addedL),
    });
    c.op({
      role: 'ipc',
      text: `IPC: measure the pH of the aqueous phase. Accept pH ${f.ph(pH - 0.5)} to ${f.ph(pH + 0.5)}, otherwise adjust further.`,
      temperatureC: T,
      volumeAfterL: out,
      minL: out,
      maxL: out,
    });
  },

  'carbon-treatment': (c) => {
    const params = c.step.params;
    const T = nominal(params.temperatureC);
    c.adjustTemperature(c.feedC, T, c.feedL);
    const out = volumeL(c.outputs.out);
    c.op({
      role: 'charge',
      text: `Charge ${f.kg(c.record.auxiliaryKg)} of activated carbon and stir for ${f.duration(COMMON_PRACTICE_HOURS.carbonTreatment)} at ${f.celsius(T)}.`,
      charges: [{ name: 'Activated carbon', kg: c.record.auxiliaryKg, L: null }],
      temperatureC: T,
      durationH: COMMON_PRACTICE_HOURS.carbonTreatment,
      volumeAfterL: c.feedL,
      minL: c.feedL,
      maxL: c.feedL,
    });
    c.op({
      role: 'filter',
      text: `Filter off the carbon through a polish filter into a clean vessel; about ${f.litres(out)} of filtrate.`,
      temperatureC: T,
      durationH: COMMON_PRACTICE_HOURS.polishFiltration,
      volumeAfterL: out,
      minL: out,
      maxL: c.feedL,
    });
  },

  'polish-filtration': (c) => {
    const out = volumeL(c.outputs.out);
    const T =
      c.step.params.temperatureC !== undefined ? nominal(c.step.params.temperatureC) : undefined;
    c.op({
      role: 'filter',
      text: `Polish-filter the solution into a clean vessel${T !== undefined ? ` at ${f.celsius(T)}` : ''}; about ${f.litres(out)}.`,
      temperatureC: T,
      durationH: COMMON_PRACTICE_HOURS.polishFiltration,
      volumeAfterL: out,
      minL: out,
      maxL: c.feedL,
    });
  },

  split: (c) => {
    const fraction = nominal(c.step.params.fractionToA);
    const a = volumeL(c.outputs.a);
    const b = volumeL(c.outputs.b);
    c.op({
      role: 'transfer',
      text: `Divide the batch: ${f.pct(fraction * 100)} (${f.litres(a)}) goes on by route A, the rest (${f.litres(b)}) by route B.`,
      durationH: COMMON_PRACTICE_HOURS.transfer,
      volumeAfterL: a,
      minL: a,
      maxL: c.feedL,
    });
  },

  merge: (c) => {
    const out = volumeL(c.outputs.out);
    c.op({
      role: 'transfer',
      text: `Combine the streams in one vessel: about ${f.litres(out)}.`,
      durationH: COMMON_PRACTICE_HOURS.transfer,
      volumeAfterL: out,
      minL: Math.min(...c.incoming.map((s) => s.volumeM3 * 1000), out),
      maxL: out,
    });
  },
};

/** The solvent in the distillation feed that the swap removes: the most abundant solvent other than the one added. */
function originalSolvent(c: KindContext<'distillation'>, added: string): string | null {
  let best: string | null = null;
  let bestKg = 0;
  for (const stream of c.incoming)
    for (const [id, kgValue] of Object.entries(stream.kg)) {
      const comp = c.ctx.comps.get(id);
      if (comp?.kind !== 'solvent' || comp.isWater || id === added) continue;
      if (kgValue > bestKg) {
        best = id;
        bestKg = kgValue;
      }
    }
  return best;
}

function washOrExtraction(c: KindContext<'wash'>) {
  const params = c.step.params;
  const details = c.record.details as {
    topPhase?: 'organic' | 'aqueous';
    densitiesGmL?: { organic: number; aqueous: number };
    phaseVolumesL?: { organic: number; aqueous: number };
    aqueousPH?: number;
  };
  const T = nominal(params.temperatureC);
  c.adjustTemperature(c.feedC, T, c.feedL);
  const keep = params.keep;
  const discard = keep === 'organic' ? 'aqueous' : 'organic';
  const keptL = volumeL(c.outputs[keep]) || details.phaseVolumesL?.[keep] || 0;
  const discardL = volumeL(c.outputs[discard]) || details.phaseVolumesL?.[discard] || 0;
  const medium = mediumName(c.ctx, params.addedLiquid, c.name);
  const totalKg = sumKg(c.record.addedKg);
  const totalL = c.record.addedVolumeM3 * 1000;
  const top = details.topPhase ?? 'organic';
  const position = (phase: 'organic' | 'aqueous') => (phase === top ? 'upper' : 'lower');
  const density = (phase: 'organic' | 'aqueous') =>
    details.densitiesGmL ? ` (${f.amount(details.densitiesGmL[phase])} g/mL)` : '';
  const separateText = (keptVolume: number, discardVolume: number) =>
    `Separate: keep the ${position(keep)} ${keep} phase${density(keep)}, about ${f.litres(keptVolume)}; run the ${position(discard)} ${discard} phase${density(discard)}, about ${f.litres(discardVolume)}, to ${params.keep === 'organic' ? 'waste' : 'the organic waste'}.`;
  const counter = params.mode === 'counter-current' && params.stages > 1;
  const stages = counter ? 1 : params.stages;
  const solventCharged =
    params.addedLiquid.kind === 'solvent' ? solventNotes(c.ctx, params.addedLiquid.solventId) : [];
  let volume = c.feedL;
  for (let stage = 1; stage <= stages; stage++) {
    const stageL = totalL / stages;
    const stageKg = totalKg / stages;
    const before = volume;
    volume += stageL;
    const label = stages > 1 ? ` (${c.step.kind} ${stage} of ${stages})` : '';
    c.op({
      role: 'charge',
      text: counter
        ? `Extract counter-currently in ${params.stages} stages with ${f.litres(totalL)} (${f.kg(totalKg)}) of ${medium} in all, at ${f.celsius(T)}.`
        : `Charge ${f.litres(stageL)} (${f.kg(stageKg)}) of ${medium} at ${f.celsius(T)}${label}.`,
      charges: [{ name: medium, kg: stageKg, L: stageL }],
      temperatureC: T,
      durationH: counter ? COMMON_PRACTICE_HOURS.washStage * params.stages : undefined,
      volumeAfterL: volume,
      minL: before,
      maxL: volume,
      cautions: stage === 1 ? solventCharged : [],
    });
    c.op({
      role: 'stir',
      text: `Stir for 30 min at ${f.celsius(T)}.`,
      temperatureC: T,
      durationH: 0.5,
      volumeAfterL: volume,
      minL: volume,
      maxL: volume,
    });
    c.op({
      role: 'settle',
      text: 'Stop the agitator and let the phases settle for 30 min.',
      temperatureC: T,
      durationH: 0.5,
      volumeAfterL: volume,
      minL: volume,
      maxL: volume,
    });
    const kept = stage === stages ? keptL : c.feedL + ((keptL - c.feedL) * stage) / stages;
    c.op({
      role: 'separate',
      text: separateText(kept, Math.max(0, volume - kept)),
      durationH: 0.5,
      volumeAfterL: kept,
      minL: kept,
      maxL: volume,
    });
    volume = kept;
  }
  void discardL;
  if (params.addedLiquid.kind === 'aqueous' && details.aqueousPH !== undefined) {
    const pH = details.aqueousPH;
    const acceptance =
      pH < 6
        ? `accept pH at most ${f.amount(Math.min(6, Math.ceil(pH) + 1))}`
        : pH > 8
          ? `accept pH at least ${f.amount(Math.max(8, Math.floor(pH) - 1))}`
          : `accept pH ${f.ph(pH - 1)} to ${f.ph(pH + 1)}`;
    c.op({
      role: 'ipc',
      text: `IPC: measure the pH of the ${stages > 1 ? 'last ' : ''}aqueous phase. Expected pH ${f.ph(pH)}; ${acceptance}, otherwise repeat the ${c.step.kind}.`,
      temperatureC: T,
      volumeAfterL: volume,
      minL: volume,
      maxL: volume,
    });
  }
}

// ------------------------------------------------------------------ equipment

/** Which kinds of equipment can take a step. */
function fits(step: RouteStep, item: Equipment): boolean {
  if (item.kind === 'vessel') return true;
  if (item.kind === 'filter') return step.kind === 'filtration';
  return step.kind === 'drying';
}

interface StepNeed {
  minL: number;
  maxL: number;
  minC: number | null;
  maxC: number | null;
  minMbar: number | null;
}

function needOf(ops: Draft[]): StepNeed {
  const temperatures = ops.map((o) => o.temperatureC).filter((t): t is number => t !== undefined);
  const pressures = ops.map((o) => o.pressureMbar).filter((p): p is number => p !== undefined);
  return {
    minL: Math.min(...ops.map((o) => o.minL)),
    maxL: Math.max(...ops.map((o) => o.maxL)),
    minC: temperatures.length ? Math.min(...temperatures) : null,
    maxC: temperatures.length ? Math.max(...temperatures) : null,
    minMbar: pressures.length ? Math.min(...pressures) : null,
  };
}

/** What is wrong with running these volumes, temperatures and pressures in this item (empty when nothing). */
function problemsWith(
  item: Equipment,
  need: { minL: number; maxL: number; temperatureC?: number; pressureMbar?: number },
): string[] {
  const problems: string[] = [];
  if (item.kind === 'vessel') {
    if (need.maxL > item.maxWorkingL)
      problems.push(
        `${f.litres(need.maxL)} is above its maximum working volume of ${f.litres(item.maxWorkingL)}`,
      );
    // A vessel being emptied (discharge, transfer out) may run below the agitator.
    if (need.minL < item.minStirrableL && need.minL > 0)
      problems.push(
        `${f.litres(need.minL)} is below its minimum stirrable volume of ${f.litres(item.minStirrableL)}`,
      );
    if (need.temperatureC !== undefined && need.temperatureC > item.maxC)
      problems.push(`${f.celsius(need.temperatureC)} is above its ${f.celsius(item.maxC)} limit`);
    if (need.temperatureC !== undefined && need.temperatureC < item.minC)
      problems.push(`${f.celsius(need.temperatureC)} is below its ${f.celsius(item.minC)} limit`);
    if (need.pressureMbar !== undefined && need.pressureMbar < item.minMbar)
      problems.push(
        `${f.mbar(need.pressureMbar)} is below the lowest pressure it takes, ${f.mbar(item.minMbar)}`,
      );
    if (need.pressureMbar !== undefined && need.pressureMbar > item.maxMbar)
      problems.push(
        `${f.mbar(need.pressureMbar)} is above its highest pressure, ${f.mbar(item.maxMbar)}`,
      );
  } else if (need.maxL > item.capacityL) {
    problems.push(
      `${f.litres(need.maxL)} is more than its capacity of ${f.litres(item.capacityL)}`,
    );
  }
  return problems;
}

function stepFits(item: Equipment, ops: Draft[]): boolean {
  return ops.every(
    (o) =>
      problemsWith(item, {
        minL: o.minL,
        maxL: o.maxL,
        temperatureC: o.temperatureC,
        pressureMbar: o.pressureMbar,
      }).length === 0,
  );
}

const sizeOf = (item: Equipment) => (item.kind === 'vessel' ? item.maxWorkingL : item.capacityL);

/** The smallest item of the workspace that takes every operation of the step. */
function suggest(
  step: RouteStep,
  ops: Draft[],
  available: Equipment[],
  current: Equipment,
): Equipment | null {
  const kind = current.kind === 'vessel' || fits(step, current) ? current.kind : 'vessel';
  return (
    available
      .filter((item) => item.id !== current.id && item.kind === kind && fits(step, item))
      .filter((item) => stepFits(item, ops))
      .sort((a, b) => sizeOf(a) - sizeOf(b))[0] ?? null
  );
}

function judgeEquipment(
  drafts: Draft[],
  operations: StepListOperation[],
  assignments: Record<string, Equipment>,
  available: Equipment[],
  stepById: Map<string, RouteStep>,
) {
  const byStep = new Map<string, number[]>();
  drafts.forEach((d, i) => byStep.set(d.stepId, [...(byStep.get(d.stepId) ?? []), i]));
  for (const [stepId, indexes] of byStep) {
    const item = assignments[stepId];
    const step = stepById.get(stepId);
    if (!item || !step) continue;
    const ops = indexes.map((i) => drafts[i]);
    if (!fits(step, item)) {
      const message = `${item.name} is a ${item.kind}: choose a vessel${step.kind === 'filtration' ? ' or a filter' : step.kind === 'drying' ? ' or a dryer' : ''} for this step.`;
      for (const i of indexes) operations[i].vesselCheck = { ok: false, message };
      continue;
    }
    let suggestion: Equipment | null | undefined;
    for (const i of indexes) {
      const o = drafts[i];
      const problems = problemsWith(item, {
        minL: o.minL,
        maxL: o.maxL,
        temperatureC: o.temperatureC,
        pressureMbar: o.pressureMbar,
      });
      let check: VesselCheck;
      if (problems.length === 0) {
        check = {
          ok: true,
          message:
            item.kind === 'vessel'
              ? `${item.name}: ${rangeText(o)} within ${f.litres(item.minStirrableL)} – ${f.litres(item.maxWorkingL)}.`
              : `${item.name}: ${f.litres(o.maxL)} within its capacity of ${f.litres(item.capacityL)}.`,
        };
      } else {
        if (suggestion === undefined) suggestion = suggest(step, ops, available, item);
        const need = needOf(ops);
        const advice = suggestion
          ? ` Suggested: ${suggestion.name}${suggestion.kind === 'vessel' ? ` (${f.litres(suggestion.minStirrableL)} – ${f.litres(suggestion.maxWorkingL)})` : ` (${f.litres(suggestion.capacityL)})`}, which takes the whole step.`
          : ` No ${item.kind} of this workspace takes the whole step (${f.litres(need.minL)} – ${f.litres(need.maxL)}): split the batch or the operation.`;
        check = {
          ok: false,
          message: `${item.name}: ${problems.join('; ')}.${advice}`,
        };
      }
      operations[i].vesselCheck = check;
    }
  }
}

const rangeText = (o: Draft) =>
  Math.abs(o.maxL - o.minL) < 1e-9 * Math.max(1, o.maxL)
    ? f.litres(o.maxL)
    : `${f.litres(o.minL)} – ${f.litres(o.maxL)}`;
