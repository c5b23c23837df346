import { useMemo } from 'react';
import { useShallow } from 'zustand/react/shallow';
import { stepSchema, PORTS, type StepKind } from '@shared/schemas/route';
import type { Compound } from '@shared/schemas/compounds';
import { fieldInWords, messageInWords } from '@shared/engine/route/field-words';
import { Button } from '@/components/button';
import { useEditorStore } from '@/stores/editor-store';
import { useEvaluation } from '../evaluation';
import { checkConnection, getIn, setIn, type StepInput } from '../document';
import { KINDS } from '../step-kinds';
import { ChoiceField, ComponentPicker, QuantityField, TextInputField } from './fields';
import { PhaseMark } from './phase';

type Path = ReadonlyArray<string | number>;
const NONE: never[] = [];
/** The parts of one quantity field below its path: a volume's value and unit, a value's ±. */
const QUANTITY_PART = /^(\.(value|plusMinus|unit))+$/;

/** The selected step's parameters as a form; every field checked by the shared schema, engine problems placed on their field. */
export function StepPanel({ step, compounds }: { step: StepInput; compounds?: Compound[] }) {
  const updateStep = useEditorStore((s) => s.updateStep);
  const engineIssues = useEvaluation(
    useShallow((s) =>
      s.status === 'invalid' ? s.issues.filter((i) => i.stepId === step.id) : NONE,
    ),
  );
  const schemaErrors = useMemo(() => {
    const r = stepSchema.safeParse(step);
    const out: Record<string, string> = {};
    // One message per field: the form's own check and the engine's say the same problem once.
    if (!r.success)
      for (const i of r.error.issues) out[i.path.map(String).join('.')] ??= messageInWords(i);
    for (const i of engineIssues) out[i.field.replace(/\[(\d+)\]/g, '.$1')] ??= i.message;
    return out;
  }, [step, engineIssues]);
  // A typed value the step's schema refuses (out of range, say) is not put into the route: the
  // field says why and the draft keeps its last good value, so it still saves. Returns the problem.
  const set = (path: Path, value: unknown): string | undefined => {
    const checked = stepSchema.safeParse(setIn(step, path, value));
    if (!checked.success) {
      const key = path.join('.');
      const own = checked.error.issues.find((i) => {
        const k = i.path.map(String).join('.');
        return k === key || (k.startsWith(`${key}.`) && QUANTITY_PART.test(k.slice(key.length)));
      });
      if (own && value !== undefined) return messageInWords(own);
    }
    updateStep(step.id, path, value);
    return undefined;
  };
  const val = (path: Path) => getIn(step, path);

  return (
    <div className="space-y-3" aria-label={`Settings of ${step.name}`} role="form">
      <TextInputField
        label="Step name"
        value={step.name}
        onCommit={(v) => useEditorStore.getState().renameStep(step.id, v)}
      />
      <KindForm kind={step.kind} errors={schemaErrors} set={set} val={val} compounds={compounds} />
      <Inputs step={step} />
    </div>
  );
}

/**
 * The kind's fields, each with its own problem beside it; problems that belong
 * to no field on the form are listed above the fields. Which fields the form
 * shows is collected while this component builds its own elements (a local set,
 * nothing outside it is touched), so the list is exactly the remainder.
 */
function KindForm({
  kind,
  errors,
  set,
  val,
  compounds,
}: Omit<Ctx, 'err' | 'claim'> & { errors: Record<string, string> }) {
  const placed = new Set<string>();
  const claimed: string[] = [];
  // A field takes its own problem and those of its parts (the value, the ± or the unit of a
  // quantity), so no problem of a field is listed apart from it.
  const under = (p: Path) => {
    const key = p.join('.');
    return Object.keys(errors).filter(
      (k) => k === key || (k.startsWith(`${key}.`) && QUANTITY_PART.test(k.slice(key.length))),
    );
  };
  const lookup = (p: Path) => under(p).map((k) => errors[k])[0];
  const err = (p: Path) => {
    for (const k of under(p)) placed.add(k);
    return lookup(p);
  };
  // A sub-form (a component of its own) takes every problem under its path.
  const claim = (prefix: Path) => {
    claimed.push(prefix.join('.'));
    return lookup;
  };
  const fields = kindFields({ kind, set, err, val, compounds, claim });
  const unplaced = Object.entries(errors).filter(
    ([k]) => !placed.has(k) && !claimed.some((c) => k === c || k.startsWith(`${c}.`)),
  );
  return (
    <>
      {unplaced.length ? (
        <ul
          className="space-y-1 rounded-control border border-caution-hazard/40 bg-caution-hazard-soft px-2 py-1.5 text-caption text-caution-hazard-deep"
          role="alert"
        >
          {unplaced.map(([k, m]) => (
            <li key={k} className="flex gap-1">
              <span
                aria-hidden="true"
                className="mt-1 inline-block size-2 shrink-0 rotate-45 bg-caution-hazard"
              />
              {fieldInWords(k) ? `${fieldInWords(k)}: ` : ''}
              {m}
            </li>
          ))}
        </ul>
      ) : null}
      {fields}
    </>
  );
}

type Ctx = {
  kind: StepKind;
  set: (p: Path, v: unknown) => string | undefined;
  err: (p: Path) => string | undefined;
  val: (p: Path) => unknown;
  compounds?: Compound[];
  claim: (prefix: Path) => (p: Path) => string | undefined;
};

/** The fields of one step kind: a plain builder of elements (no hooks), used by KindForm only. */
function kindFields({ kind, set, err, val, compounds, claim }: Ctx) {
  const q = (
    label: string,
    qk: Parameters<typeof QuantityField>[0]['kind'],
    path: Path,
    extra: { hint?: string; common?: boolean; fallback?: unknown } = {},
  ) => (
    <QuantityField
      key={path.join('.')}
      label={label}
      kind={qk}
      value={val(path) ?? extra.fallback}
      onCommit={(v) => set(path, v)}
      error={err(path)}
      hint={extra.hint}
      common={extra.common && val(path) === undefined}
    />
  );
  const solventPick = (label: string, path: Path) => (
    <ComponentPicker
      key={path.join('.')}
      label={label}
      filter="solvent"
      value={String(val(path) ?? '')}
      onChange={(v) => set(path, v)}
      error={err(path)}
    />
  );
  switch (kind) {
    case 'charge': {
      const contents = (val(['params', 'contents']) as Array<Record<string, unknown>>) ?? [];
      return (
        <>
          {q('Temperature', 'temperature', ['params', 'temperatureC'])}
          {q('Crude mass (for wt %)', 'mass', ['params', 'crudeMassKg'], {
            hint: 'Only needed when an amount is given in wt %.',
          })}
          <fieldset className="space-y-2 rounded-control border border-rule p-2">
            <legend className="px-1 text-small font-medium">Contents</legend>
            {contents.map((c, i) =>
              c.kind === 'component' ? (
                <div
                  key={i}
                  className="grid grid-cols-[1fr_6rem] gap-2 border-b border-rule pb-2 last:border-0"
                >
                  <ComponentPicker
                    label={`Item ${i + 1}`}
                    compounds={compounds}
                    value={String(c.componentId)}
                    onChange={(v) => set(['params', 'contents', i, 'componentId'], v)}
                    error={err(['params', 'contents', i, 'componentId'])}
                  />
                  <ChoiceField
                    label="Given as"
                    value={String(c.unit)}
                    onChange={(v) => set(['params', 'contents', i, 'unit'], v)}
                    options={['kg', 'wt%', 'L', 'vol', 'equiv'].map((u) => ({
                      value: u,
                      label: u,
                    }))}
                  />
                  <QuantityField
                    label={`Amount of item ${i + 1} (${String(c.unit)})`}
                    kind="number"
                    value={c.amount}
                    onCommit={(v) => set(['params', 'contents', i, 'amount'], v)}
                    error={err(['params', 'contents', i, 'amount'])}
                  />
                  <div className="flex items-end pb-0.5">
                    <Button
                      size="sm"
                      variant="quiet"
                      onClick={() => set(['params', 'contents', i], undefined)}
                      aria-label={`Remove item ${i + 1}`}
                    >
                      Remove
                    </Button>
                  </div>
                </div>
              ) : (
                <div
                  key={i}
                  className="grid grid-cols-2 gap-2 border-b border-rule pb-2 last:border-0"
                  data-aqueous-entry={i}
                >
                  <div className="col-span-2">
                    <ComponentPicker
                      label={`Item ${i + 1}: aqueous solution of`}
                      filter="solute"
                      value={String(c.soluteId ?? '')}
                      onChange={(v) => {
                        set(['params', 'contents', i, 'soluteId'], v);
                        ensureWater();
                      }}
                      error={err(['params', 'contents', i, 'soluteId'])}
                    />
                  </div>
                  {q(`Strength of item ${i + 1}`, 'percent', ['params', 'contents', i, 'wtPct'], {
                    hint: 'wt % of the solution.',
                  })}
                  {q(`Volume of item ${i + 1}`, 'volume', ['params', 'contents', i, 'volume'])}
                  <div className="col-span-2 flex justify-end">
                    <Button
                      size="sm"
                      variant="quiet"
                      onClick={() => set(['params', 'contents', i], undefined)}
                      aria-label={`Remove item ${i + 1}`}
                    >
                      Remove
                    </Button>
                  </div>
                </div>
              ),
            )}
            <div className="flex flex-wrap gap-2">
              <Button
                size="sm"
                variant="secondary"
                onClick={() =>
                  set(['params', 'contents', contents.length], {
                    kind: 'component',
                    componentId: '',
                    amount: 1,
                    unit: 'kg',
                  })
                }
              >
                Add an item
              </Button>
              <Button
                size="sm"
                variant="secondary"
                onClick={() => {
                  set(['params', 'contents', contents.length], {
                    kind: 'aqueous',
                    soluteId: 'nacl',
                    wtPct: 10,
                    volume: { value: 2, unit: 'vol' },
                  });
                  ensureAqueous('nacl');
                }}
              >
                Add an aqueous solution
              </Button>
            </div>
          </fieldset>
        </>
      );
    }
    case 'wash':
    case 'extraction': {
      const liquid = val(['params', 'addedLiquid']) as { kind: string } | undefined;
      return (
        <>
          <ChoiceField
            label="Added liquid"
            value={liquid?.kind ?? 'solvent'}
            onChange={(v) =>
              set(
                ['params', 'addedLiquid'],
                v === 'solvent'
                  ? { kind: 'solvent', solventId: 'water', volume: { value: 5, unit: 'vol' } }
                  : {
                      kind: 'aqueous',
                      soluteId: 'nacl',
                      wtPct: 10,
                      volume: { value: 5, unit: 'vol' },
                    },
              )
            }
            options={[
              { value: 'solvent', label: 'A solvent (or plain water)' },
              { value: 'aqueous', label: 'An aqueous solution' },
            ]}
          />
          {liquid?.kind === 'aqueous' ? (
            <>
              <ComponentPicker
                label="Dissolved in the water"
                filter="solute"
                value={String(val(['params', 'addedLiquid', 'soluteId']) ?? '')}
                onChange={(v) => {
                  set(['params', 'addedLiquid', 'soluteId'], v);
                  if (
                    !useEditorStore
                      .getState()
                      .doc.components.some((c) => c.kind === 'solvent' && c.solventId === 'water')
                  )
                    useEditorStore
                      .getState()
                      .addComponent({ kind: 'solvent', id: 'water', solventId: 'water' });
                }}
                error={err(['params', 'addedLiquid', 'soluteId'])}
              />
              {q('Strength', 'percent', ['params', 'addedLiquid', 'wtPct'], {
                hint: 'wt % of the solution.',
              })}
            </>
          ) : (
            solventPick('Solvent', ['params', 'addedLiquid', 'solventId'])
          )}
          {q('Volume', 'volume', ['params', 'addedLiquid', 'volume'], {
            hint: '“250 mL”, “2 L” or “5 vol” (L per kg of the reference input).',
          })}
          {q('Stages', 'count', ['params', 'stages'])}
          <ChoiceField
            label="Mode"
            value={String(val(['params', 'mode']) ?? 'cross-current')}
            onChange={(v) => set(['params', 'mode'], v)}
            options={[
              { value: 'cross-current', label: 'Cross-current (fresh liquid each stage)' },
              { value: 'counter-current', label: 'Counter-current (volume is the total)' },
            ]}
          />
          {q('Temperature', 'temperature', ['params', 'temperatureC'])}
          <ChoiceField
            label="The route carries on with"
            value={String(val(['params', 'keep']) ?? 'organic')}
            onChange={(v) => set(['params', 'keep'], v)}
            options={[
              { value: 'organic', label: 'The organic layer' },
              { value: 'aqueous', label: 'The aqueous layer' },
            ]}
          />
        </>
      );
    }
    case 'distillation': {
      const mode = val(['params', 'mode', 'kind']) as string;
      const cond = val(['params', 'condition', 'kind']) as string;
      return (
        <>
          <ChoiceField
            label="What the distillation does"
            value={mode}
            onChange={(v) =>
              set(
                ['params', 'mode'],
                v === 'concentrate'
                  ? { kind: 'concentrate', targetVolume: { value: 3, unit: 'vol' } }
                  : v === 'put-and-take'
                    ? {
                        kind: 'put-and-take',
                        cycles: 3,
                        targetVolume: { value: 3, unit: 'vol' },
                        addSolventId: 'toluene',
                        addVolume: { value: 5, unit: 'vol' },
                      }
                    : {
                        kind: 'constant-volume',
                        addSolventId: 'toluene',
                        addVolume: { value: 10, unit: 'vol' },
                      },
              )
            }
            options={[
              { value: 'concentrate', label: 'Concentrate to a volume' },
              { value: 'put-and-take', label: 'Solvent swap: put and take' },
              { value: 'constant-volume', label: 'Solvent swap: constant volume' },
            ]}
          />
          {mode !== 'constant-volume'
            ? q('Target volume', 'volume', ['params', 'mode', 'targetVolume'])
            : null}
          {mode === 'put-and-take' ? q('Cycles', 'count', ['params', 'mode', 'cycles']) : null}
          {mode !== 'concentrate'
            ? solventPick('New solvent', ['params', 'mode', 'addSolventId'])
            : null}
          {mode !== 'concentrate'
            ? q(
                mode === 'put-and-take' ? 'Added each cycle' : 'New solvent fed in total',
                'volume',
                ['params', 'mode', 'addVolume'],
              )
            : null}
          <ChoiceField
            label="Held at"
            value={cond}
            onChange={(v) =>
              set(
                ['params', 'condition'],
                v === 'pressure'
                  ? { kind: 'pressure', pressureMbar: 200 }
                  : { kind: 'pot-temperature', potTemperatureC: 50 },
              )
            }
            options={[
              { value: 'pressure', label: 'A set pressure' },
              { value: 'pot-temperature', label: 'A set pot temperature' },
            ]}
          />
          {cond === 'pressure'
            ? q('Pressure', 'pressure', ['params', 'condition', 'pressureMbar'])
            : q('Pot temperature', 'temperature', ['params', 'condition', 'potTemperatureC'])}
          <ChoiceField
            label="Decanter (Dean–Stark trap)"
            value={val(['params', 'decanter']) ? 'yes' : 'no'}
            onChange={(v) => set(['params', 'decanter'], v === 'yes')}
            options={[
              { value: 'no', label: 'No: the whole condensate is taken off' },
              {
                value: 'yes',
                label: 'Yes: the water layer is taken off, the organic layer returns',
              },
            ]}
          />
        </>
      );
    }
    case 'crystallisation': {
      const mode = val(['params', 'mode', 'kind']) as string;
      return (
        <>
          <ChoiceField
            label="How it crystallises"
            value={mode}
            onChange={(v) =>
              set(
                ['params', 'mode'],
                v === 'cooling'
                  ? { kind: 'cooling', startC: 60, endC: 5 }
                  : v === 'antisolvent'
                    ? {
                        kind: 'antisolvent',
                        antisolventId: 'n-heptane',
                        volume: { value: 10, unit: 'vol' },
                        temperatureC: 20,
                      }
                    : {
                        kind: 'evaporative',
                        targetVolume: { value: 3, unit: 'vol' },
                        pressureMbar: 200,
                      },
              )
            }
            options={[
              { value: 'cooling', label: 'Cooling' },
              { value: 'antisolvent', label: 'Antisolvent addition' },
              { value: 'evaporative', label: 'Evaporative' },
            ]}
          />
          {mode === 'cooling' ? (
            <>
              {q('Start temperature', 'temperature', ['params', 'mode', 'startC'])}
              {q('End temperature', 'temperature', ['params', 'mode', 'endC'])}
            </>
          ) : null}
          {mode === 'antisolvent' ? (
            <>
              {solventPick('Antisolvent', ['params', 'mode', 'antisolventId'])}
              {q('Antisolvent volume', 'volume', ['params', 'mode', 'volume'])}
              {q('Temperature', 'temperature', ['params', 'mode', 'temperatureC'])}
            </>
          ) : null}
          {mode === 'evaporative' ? (
            <>
              {q('Target volume', 'volume', ['params', 'mode', 'targetVolume'])}
              {q('Pressure', 'pressure', ['params', 'mode', 'pressureMbar'])}
            </>
          ) : null}
          <ChoiceField
            label="Seeded"
            value={val(['params', 'seeded']) ? 'yes' : 'no'}
            onChange={(v) => set(['params', 'seeded'], v === 'yes')}
            options={[
              { value: 'no', label: 'No' },
              { value: 'yes', label: 'Yes' },
            ]}
          />
          {val(['params', 'seeded'])
            ? q('Seed charge', 'percent', ['params', 'seedWtPct'], {
                hint: 'wt % of the product in the feed.',
              })
            : null}
        </>
      );
    }
    case 'filtration': {
      const wash = val(['params', 'cakeWash']);
      return (
        <>
          {q(
            'Liquor held by the cake (L per kg solid)',
            'number',
            ['params', 'retainedLiquorLPerKg'],
            { common: true, fallback: 0.5 },
          )}
          <ChoiceField
            label="Cake wash"
            value={wash ? 'yes' : 'no'}
            onChange={(v) =>
              set(
                ['params', 'cakeWash'],
                v === 'yes'
                  ? { solventId: 'n-heptane', volume: { value: 2, unit: 'vol' }, washes: 2 }
                  : undefined,
              )
            }
            options={[
              { value: 'no', label: 'None' },
              { value: 'yes', label: 'Wash the cake' },
            ]}
          />
          {wash ? (
            <>
              {solventPick('Wash solvent', ['params', 'cakeWash', 'solventId'])}
              {q('Volume of each wash', 'volume', ['params', 'cakeWash', 'volume'])}
              {q('Number of washes', 'count', ['params', 'cakeWash', 'washes'])}
              {q(
                'Displacement efficiency',
                'fraction',
                ['params', 'cakeWash', 'displacementEfficiency'],
                { common: true, fallback: 0.8 },
              )}
              {q(
                'Liquor a wash cannot displace (fraction)',
                'fraction',
                ['params', 'cakeWash', 'undisplacedFraction'],
                {
                  common: true,
                  fallback: 0.05,
                  hint: 'Liquor in pores, agglomerates and channels: the least each wash leaves.',
                },
              )}
              {q('Crystal size (µm)', 'number', ['params', 'cakeWash', 'crystalSizeUm'], {
                common: true,
                fallback: 100,
                hint: 'Sets how fast the wash dissolves the cake.',
              })}
            </>
          ) : null}
          {q(
            'Specific cake resistance (m/kg)',
            'number',
            ['params', 'specificCakeResistanceMPerKg'],
            { common: true, fallback: 1e10 },
          )}
          {q('Filter-medium resistance (1/m)', 'number', ['params', 'mediumResistancePerM'], {
            common: true,
            fallback: 1e10,
          })}
          {q('Filter area (m²)', 'number', ['params', 'filterAreaM2'], {
            common: true,
            fallback: 0.1,
          })}
          {q('Pressure drop (bar)', 'number', ['params', 'pressureDropBar'], {
            common: true,
            fallback: 0.8,
            hint: 'Vacuum filtration.',
          })}
        </>
      );
    }
    case 'drying': {
      const t = val(['params', 'target', 'kind']) as string;
      return (
        <>
          <ChoiceField
            label="Dry to"
            value={t}
            onChange={(v) =>
              set(
                ['params', 'target'],
                v === 'lod'
                  ? { kind: 'lod', lodWtPct: 0.5 }
                  : { kind: 'residual', residualPpm: 1000 },
              )
            }
            options={[
              { value: 'lod', label: 'A loss on drying' },
              { value: 'residual', label: 'A residual solvent level' },
            ]}
          />
          {t === 'lod'
            ? q('Loss on drying', 'percent', ['params', 'target', 'lodWtPct'])
            : q('Residual solvent (ppm)', 'number', ['params', 'target', 'residualPpm'])}
          {q('Temperature', 'temperature', ['params', 'temperatureC'])}
          {q('Pressure', 'pressure', ['params', 'pressureMbar'])}
          {q('Time allowed (h)', 'number', ['params', 'maxHours'], {
            common: true,
            fallback: 12,
            hint: 'Drying stops at the target or at this time.',
          })}
          {q('Nitrogen (NL/min per kg solid)', 'number', ['params', 'inertGasNLPerMinPerKg'], {
            common: true,
            fallback: 0.2,
            hint: '0 for a closed vacuum dryer.',
          })}
          {q(
            'Drying coefficient (mol per kg solid per h)',
            'number',
            ['params', 'dryingCoefficient'],
            { common: true, fallback: 0.5, hint: 'Fit it to a measured drying curve.' },
          )}
          {q(
            'Critical solvent content (kg per kg solid)',
            'number',
            ['params', 'criticalContentKgPerKg'],
            { common: true, fallback: 0.05, hint: 'Where the falling-rate period begins.' },
          )}
        </>
      );
    }
    case 'quench':
      return (
        <>
          <ComponentPicker
            label="Reagent"
            compounds={compounds}
            value={String(val(['params', 'reagentId']) ?? '')}
            onChange={(v) => set(['params', 'reagentId'], v)}
            error={err(['params', 'reagentId'])}
          />
          {q('Amount', 'equiv', ['params', 'equiv'])}
          <ComponentPicker
            label="Reacts with"
            compounds={compounds}
            filter="compound"
            value={String(val(['params', 'reactsWith']) ?? '')}
            onChange={(v) => set(['params', 'reactsWith'], v)}
            error={err(['params', 'reactsWith'])}
          />
          {q('Temperature', 'temperature', ['params', 'temperatureC'])}
          {q(
            'Reaction enthalpy (kJ/mol, negative = heat released)',
            'number',
            ['params', 'reactionEnthalpyKJmol'],
            {
              hint: 'Enter it to see the adiabatic temperature rise; confirm exotherms by calorimetry.',
            },
          )}
        </>
      );
    case 'ph-adjust':
      return (
        <>
          <ComponentPicker
            label="Acid or base solution"
            filter="solute"
            value={String(val(['params', 'reagentSoluteId']) ?? '')}
            onChange={(v) => set(['params', 'reagentSoluteId'], v)}
            error={err(['params', 'reagentSoluteId'])}
          />
          {q('Strength', 'percent', ['params', 'wtPct'])}
          {q('Target pH', 'number', ['params', 'targetPH'])}
          {q('Temperature', 'temperature', ['params', 'temperatureC'])}
        </>
      );
    case 'carbon-treatment':
      return (
        <>
          {q('Carbon charge (wt % of dissolved solids)', 'percent', ['params', 'carbonWtPct'])}
          {q('Temperature', 'temperature', ['params', 'temperatureC'])}
          <Removals set={set} err={claim(['params', 'removals'])} val={val} compounds={compounds} />
        </>
      );
    case 'polish-filtration':
      return (
        <>
          <Removals set={set} err={claim(['params', 'removals'])} val={val} compounds={compounds} />
          {q('Temperature (optional)', 'temperature', ['params', 'temperatureC'])}
        </>
      );
    case 'split':
      return q('Fraction to output a', 'fraction', ['params', 'fractionToA']);
    default:
      return null;
  }
}

/** Water in the route, for an aqueous medium. */
function ensureWater() {
  const st = useEditorStore.getState();
  if (!st.doc.components.some((c) => c.kind === 'solvent' && c.solventId === 'water'))
    st.addComponent({ kind: 'solvent', id: 'water', solventId: 'water' });
}

/** An aqueous solute (and water) in the route. */
function ensureAqueous(soluteId: string) {
  const st = useEditorStore.getState();
  if (!st.doc.components.some((c) => c.kind === 'aqueous-solute' && c.soluteId === soluteId))
    st.addComponent({ kind: 'aqueous-solute', id: soluteId, soluteId });
  ensureWater();
}

/** What a treatment takes out: a component and the fraction of it removed, one row each. */
function Removals({ set, err, val, compounds }: Omit<Ctx, 'kind' | 'claim'>) {
  const removals =
    (val(['params', 'removals']) as
      Array<{ componentId: string; fractionRemoved: unknown }> | undefined) ?? [];
  return (
    <fieldset
      className="space-y-2 rounded-control border border-rule p-2"
      aria-label="Removed by this step"
    >
      <legend className="px-1 text-small font-medium">Removed by this step</legend>
      {err(['params', 'removals']) ? (
        <p className="text-caption text-caution-hazard-deep" role="alert">
          {err(['params', 'removals'])}
        </p>
      ) : null}
      {removals.length ? null : (
        <p className="text-caption text-ink-muted">
          Nothing removed yet. Add the components this step takes out, with the fraction of each
          (from a use test or a supplier’s data).
        </p>
      )}
      {removals.map((r, i) => (
        <div
          key={i}
          className="grid grid-cols-[1fr_6.5rem] gap-2 border-b border-rule pb-2 last:border-0"
        >
          <ComponentPicker
            label={`Removed component ${i + 1}`}
            compounds={compounds}
            value={String(r.componentId ?? '')}
            onChange={(v) => set(['params', 'removals', i, 'componentId'], v)}
            error={err(['params', 'removals', i, 'componentId'])}
          />
          <QuantityField
            label={`Fraction removed ${i + 1}`}
            kind="fraction"
            value={r.fractionRemoved}
            onCommit={(v) => set(['params', 'removals', i, 'fractionRemoved'], v)}
            error={err(['params', 'removals', i, 'fractionRemoved'])}
          />
          <div className="col-span-2 flex justify-end">
            <Button
              size="sm"
              variant="quiet"
              onClick={() => set(['params', 'removals', i], undefined)}
              aria-label={`Remove removal ${i + 1}`}
            >
              Remove
            </Button>
          </div>
        </div>
      ))}
      <Button
        size="sm"
        variant="secondary"
        onClick={() =>
          set(['params', 'removals', removals.length], { componentId: '', fractionRemoved: 0.5 })
        }
      >
        Add a removed component
      </Button>
    </fieldset>
  );
}

/** Where each input comes from, so connections can be made from the keyboard too. */
function Inputs({ step }: { step: StepInput }) {
  const doc = useEditorStore((s) => s.doc);
  const ports = PORTS[step.kind].inputs;
  if (!ports.length) return null;
  return (
    <fieldset className="space-y-2 rounded-control border border-rule p-2">
      <legend className="px-1 text-small font-medium">Inputs</legend>
      {ports.map((p) => {
        const current = doc.connections.find(
          (c) => c.to.stepId === step.id && c.to.port === p.name,
        );
        const options = [
          { value: '', label: p.required ? 'Not connected (required)' : 'Not connected' },
        ];
        for (const s of doc.steps) {
          if (s.id === step.id) continue;
          for (const o of PORTS[s.kind].outputs) {
            const taken = current && current.from.stepId === s.id && current.from.port === o.name;
            const fits =
              taken ||
              checkConnection(
                { ...doc, connections: doc.connections.filter((c) => c !== current) },
                { stepId: s.id, port: o.name },
                { stepId: step.id, port: p.name },
              ).ok;
            if (fits) options.push({ value: `${s.id}|${o.name}`, label: `${s.name} → ${o.name}` });
          }
        }
        return (
          <div key={p.name} className="flex items-end gap-2">
            <span className="pb-2">
              <PhaseMark phase={p.phase} size={12} />
            </span>
            <div className="flex-1">
              <ChoiceField
                label={`${p.name} (${p.phase}) comes from`}
                value={current ? `${current.from.stepId}|${current.from.port}` : ''}
                options={options}
                onChange={(v) => {
                  const st = useEditorStore.getState();
                  if (current) st.disconnect(current.id);
                  if (v) {
                    const [stepId, port] = v.split('|');
                    st.connect({ stepId, port }, { stepId: step.id, port: p.name });
                  }
                }}
              />
            </div>
          </div>
        );
      })}
    </fieldset>
  );
}

export function KindTitle({ kind }: { kind: StepKind }) {
  return <span>{KINDS[kind].label}</span>;
}
