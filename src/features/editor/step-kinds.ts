/**
 * What the editor knows about each step kind: its label, a one-line purpose,
 * the parameters a new step starts with (defaults from common practice, said
 * so in the form), and the components those defaults need in the route.
 */
import type { StepKind } from '@shared/schemas/route';
import type { ComponentInput, EditorDoc, StepInput } from './document';
import { keyOf } from './document';
import { aqueousSoluteById, solventById } from '@shared/engine/data';

export interface KindInfo {
  label: string;
  purpose: string;
  /** Palette order and grouping. */
  group: 'Start' | 'Separate' | 'Concentrate' | 'Isolate' | 'Treat' | 'Route';
}

export const KINDS: Record<StepKind, KindInfo> = {
  charge: {
    label: 'Charge',
    purpose: 'The crude input: product, impurities and solvent.',
    group: 'Start',
  },
  wash: {
    label: 'Wash',
    purpose: 'Wash the stream with water or an aqueous solution; split the layers.',
    group: 'Separate',
  },
  extraction: {
    label: 'Extraction',
    purpose: 'Extract with a solvent, cross- or counter-current stages.',
    group: 'Separate',
  },
  distillation: {
    label: 'Distillation',
    purpose: 'Concentrate, or swap solvent by put-and-take or constant volume.',
    group: 'Concentrate',
  },
  crystallisation: {
    label: 'Crystallisation',
    purpose: 'Cooling, antisolvent or evaporative; gives a slurry.',
    group: 'Isolate',
  },
  filtration: {
    label: 'Filtration',
    purpose: 'Separate cake and filtrate; optional cake washes.',
    group: 'Isolate',
  },
  drying: {
    label: 'Drying',
    purpose: 'Dry the cake to a loss on drying or residual solvent.',
    group: 'Isolate',
  },
  quench: {
    label: 'Quench',
    purpose: 'A reagent reacts by stoichiometry, in equiv.',
    group: 'Treat',
  },
  'ph-adjust': {
    label: 'pH adjustment',
    purpose: 'Add acid or base solution to a target pH.',
    group: 'Treat',
  },
  'carbon-treatment': {
    label: 'Carbon treatment',
    purpose: 'Remove a fraction of chosen components on carbon.',
    group: 'Treat',
  },
  'polish-filtration': {
    label: 'Polish filtration',
    purpose: 'Remove particles or a fraction of chosen components.',
    group: 'Treat',
  },
  split: { label: 'Split', purpose: 'Divide a stream into two parts.', group: 'Route' },
  merge: { label: 'Merge', purpose: 'Combine up to three streams.', group: 'Route' },
};

export const KIND_ORDER: StepKind[] = [
  'charge',
  'wash',
  'extraction',
  'distillation',
  'crystallisation',
  'filtration',
  'drying',
  'quench',
  'ph-adjust',
  'carbon-treatment',
  'polish-filtration',
  'split',
  'merge',
];

const solvent = (id: string): ComponentInput => ({ kind: 'solvent', id, solventId: id });
const solute = (id: string): ComponentInput => ({ kind: 'aqueous-solute', id, soluteId: id });

/** The first organic solvent already in the route, else ethyl acetate. */
function mainSolvent(doc: EditorDoc): string {
  const s = doc.components.find((c) => c.kind === 'solvent' && c.solventId !== 'water');
  return s ? keyOf(s) : 'ethyl-acetate';
}

export function defaultParams(
  kind: StepKind,
  doc: EditorDoc,
): { params: StepInput['params']; needs: ComponentInput[] } {
  const product = doc.components.find((c) => c.kind === 'compound' && c.role === 'product');
  const org = mainSolvent(doc);
  switch (kind) {
    case 'charge':
      return {
        params: {
          temperatureC: 20,
          contents: [
            ...(product
              ? [
                  {
                    kind: 'component' as const,
                    componentId: keyOf(product),
                    amount: doc.referenceInput.massKg,
                    unit: 'kg' as const,
                  },
                ]
              : []),
            { kind: 'component' as const, componentId: org, amount: 10, unit: 'vol' as const },
          ],
        },
        needs: [solvent(org)],
      };
    case 'wash':
      return {
        params: {
          addedLiquid: { kind: 'solvent', solventId: 'water', volume: { value: 5, unit: 'vol' } },
          stages: 1,
          mode: 'cross-current',
          temperatureC: 20,
          keep: 'organic',
        },
        needs: [solvent('water')],
      };
    case 'extraction':
      return {
        params: {
          addedLiquid: { kind: 'solvent', solventId: org, volume: { value: 5, unit: 'vol' } },
          stages: 2,
          mode: 'cross-current',
          temperatureC: 20,
          keep: 'organic',
        },
        needs: [solvent(org)],
      };
    case 'distillation':
      return {
        params: {
          mode: { kind: 'concentrate', targetVolume: { value: 3, unit: 'vol' } },
          condition: { kind: 'pressure', pressureMbar: 200 },
        },
        needs: [],
      };
    case 'crystallisation':
      return {
        params: { mode: { kind: 'cooling', startC: 60, endC: 5 }, seeded: false },
        needs: [],
      };
    case 'filtration':
      return { params: {}, needs: [] };
    case 'drying':
      return {
        params: { target: { kind: 'lod', lodWtPct: 0.5 }, temperatureC: 45, pressureMbar: 50 },
        needs: [],
      };
    case 'quench': {
      const reagent = doc.components.find((c) => c.kind === 'compound' && c.role === 'reagent');
      const target = doc.components.find((c) => c.kind === 'compound' && c.role === 'impurity');
      return {
        params: {
          reagentId: reagent ? keyOf(reagent) : 'naoh',
          equiv: 1.1,
          reactsWith: target ? keyOf(target) : product ? keyOf(product) : '',
          temperatureC: 20,
        },
        needs: reagent ? [] : [solute('naoh'), solvent('water')],
      };
    }
    case 'ph-adjust':
      return {
        params: { reagentSoluteId: 'naoh', wtPct: 10, targetPH: 8, temperatureC: 20 },
        needs: [solute('naoh'), solvent('water')],
      };
    case 'carbon-treatment':
      return { params: { carbonWtPct: 5, removals: [], temperatureC: 40 }, needs: [] };
    case 'polish-filtration':
      return { params: { removals: [] }, needs: [] };
    case 'split':
      return { params: { fractionToA: 0.5 }, needs: [] };
    case 'merge':
      return { params: {}, needs: [] };
  }
}

const removed = (n: number) =>
  n ? `removes ${n} component${n === 1 ? '' : 's'}` : 'removes nothing yet';

/** Short lines of the step's main settings for its card. */
export function keyParams(step: StepInput): string[] {
  const v = (x: unknown) =>
    typeof x === 'number'
      ? x
      : x && typeof x === 'object' && 'value' in x
        ? (x as { value: number }).value
        : '?';
  const vol = (x: { value: unknown; unit: string } | undefined) =>
    x ? `${v(x.value)} ${x.unit}` : '';
  const p = step.params as Record<string, unknown>;
  switch (step.kind) {
    case 'charge':
      return [
        `${step.params.contents.length} item${step.params.contents.length === 1 ? '' : 's'} at ${v(step.params.temperatureC)} °C`,
      ];
    case 'wash':
    case 'extraction': {
      const l = step.params.addedLiquid;
      const what =
        l.kind === 'solvent'
          ? (solventById(l.solventId)?.name ?? l.solventId)
          : `${v(l.wtPct)} % ${aqueousSoluteById(l.soluteId)?.formula ?? l.soluteId}`;
      return [
        `${vol(l.volume)} ${what}`,
        `${step.params.stages ?? 1} × ${step.params.mode ?? 'cross-current'}`,
      ];
    }
    case 'distillation': {
      const m = step.params.mode;
      const cond =
        step.params.condition.kind === 'pressure'
          ? `${v(step.params.condition.pressureMbar)} mbar`
          : `pot ${v(step.params.condition.potTemperatureC)} °C`;
      if (m.kind === 'concentrate') return [`to ${vol(m.targetVolume)}`, cond];
      const added = solventById(
        m.kind === 'put-and-take' || m.kind === 'constant-volume' ? m.addSolventId : '',
      )?.name;
      if (m.kind === 'put-and-take')
        return [
          `${m.cycles} × to ${vol(m.targetVolume)}, + ${vol(m.addVolume)} ${added ?? m.addSolventId}`,
          cond,
        ];
      return [`swap to ${added ?? m.addSolventId}, ${vol(m.addVolume)}`, cond];
    }
    case 'crystallisation': {
      const m = step.params.mode;
      if (m.kind === 'cooling')
        return [
          `cool ${v(m.startC)} → ${v(m.endC)} °C`,
          step.params.seeded ? 'seeded' : 'unseeded',
        ];
      if (m.kind === 'antisolvent')
        return [
          `${vol(m.volume)} ${solventById(m.antisolventId)?.name ?? m.antisolventId} at ${v(m.temperatureC)} °C`,
          step.params.seeded ? 'seeded' : 'unseeded',
        ];
      return [`evaporate to ${vol(m.targetVolume)}`];
    }
    case 'filtration':
      return [
        step.params.cakeWash
          ? `${step.params.cakeWash.washes} × ${vol(step.params.cakeWash.volume)} ${solventById(step.params.cakeWash.solventId)?.name ?? step.params.cakeWash.solventId} wash`
          : 'no cake wash',
      ];
    case 'drying':
      return [
        step.params.target.kind === 'lod'
          ? `to LOD ${v(step.params.target.lodWtPct)} %`
          : `to ${v(step.params.target.residualPpm)} ppm`,
        `${v(step.params.temperatureC)} °C, ${v(step.params.pressureMbar)} mbar`,
      ];
    case 'quench':
      return [`${v(step.params.equiv)} equiv ${step.params.reagentId}`];
    case 'ph-adjust':
      return [
        `to pH ${v(step.params.targetPH)} with ${v(step.params.wtPct)} % ${step.params.reagentSoluteId}`,
      ];
    case 'carbon-treatment':
      return [`${v(step.params.carbonWtPct)} wt % carbon`, removed(step.params.removals.length)];
    case 'polish-filtration':
      return [removed(step.params.removals.length)];
    case 'split':
      return [`${Math.round(100 * Number(v(p.fractionToA)))} % to a`];
    default:
      return [];
  }
}
