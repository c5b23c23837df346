import { useEffect, useMemo, useRef, useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import type { RouteDocument } from '@shared/schemas/route';
import {
  MAX_FREE_PARAMS,
  OBJECTIVES,
  optimiseRequestSchema,
  type OptimiseRequestInput,
} from '@shared/schemas/optimise';
import type { OptimiseJob } from '@shared/schemas/jobs';
import {
  defaultEvaluations,
  freeParamChoices,
  withParams,
  type FreeParamChoice,
} from '@shared/engine/optimise';
import { isApiError } from '@/api/client';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { Select } from '@/components/select';
import { Loading } from '@/components/spinner';
import { FieldError, TextField } from '@/components/text-field';
import { issuesToErrors, type FieldErrors } from '@/lib/use-form';
import { paths } from '@/paths';
import { useCancelOptimise, useOptimiseJob, useStartOptimise } from '../api/optimise';
import { useTryInCopy } from '../api/advisor-try-copy';
import { OptimiseResultView } from './optimise-result';

export const OBJECTIVE_LABELS: Record<(typeof OBJECTIVES)[number], string> = {
  pmi: 'Least PMI (kg of material per kg of product)',
  solventLPerKg: 'Least solvent (L per kg of product)',
  cycleTimeH: 'Shortest cycle time (h)',
};
const OBJECTIVE_SHORT: Record<(typeof OBJECTIVES)[number], string> = {
  pmi: 'least PMI',
  solventLPerKg: 'least solvent',
  cycleTimeH: 'shortest cycle time',
};

const keyOf = (c: { stepId: string; param: string }) => `${c.stepId}|${c.param}`;
const round = (v: number, digits = 2) => String(Number(v.toFixed(digits)));

/** Bounds a freed parameter starts with: the chemist edits them. */
function defaultBounds(c: FreeParamChoice): { min: string; max: string } {
  if (c.integer) {
    const v = Math.round(c.value);
    return { min: String(Math.max(1, v - 2)), max: String(v + 2) };
  }
  if (c.unit === '°C') return { min: round(c.value - 10, 1), max: round(c.value + 10, 1) };
  if (c.unit === 'mbar') return { min: round(c.value * 0.5, 0), max: round(c.value * 1.5, 0) };
  if (c.param.endsWith('pH')) return { min: round(c.value - 1, 1), max: round(c.value + 1, 1) };
  if (c.value <= 0) return { min: '0', max: '1' };
  return { min: round(c.value * 0.5), max: round(c.value * 1.5) };
}

interface Row {
  choice: FreeParamChoice;
  min: string;
  max: string;
}

/** A number typed by the chemist: empty is "not given", anything else must read as a number. */
const num = (s: string): number | undefined => (s.trim() === '' ? undefined : Number(s.trim()));

/**
 * The route optimiser: the chemist frees parameters of the route with
 * bounds, chooses what to minimise and the constraints, starts a seeded run
 * in the background and sees the answer as a trade-off picture; the chosen
 * candidate opens as a new route, the original untouched.
 */
export function Optimiser({
  workspaceId,
  routeName,
  projectName,
  document,
}: {
  workspaceId: string;
  routeName: string;
  projectName?: string;
  document: RouteDocument;
}) {
  const choices = useMemo(() => freeParamChoices(document), [document]);
  const steps = useMemo(
    () =>
      choices
        .map((c) => ({ value: c.stepId, label: c.stepName }))
        .filter((s, i, all) => all.findIndex((t) => t.value === s.value) === i),
    [choices],
  );
  const impurities = useMemo(
    () =>
      document.components.flatMap((c) =>
        c.kind === 'compound' && c.role === 'impurity' ? [{ id: c.id, name: c.name }] : [],
      ),
    [document],
  );

  const [stepId, setStepId] = useState(steps[0]?.value ?? '');
  const paramsOfStep = choices.filter((c) => c.stepId === stepId);
  const [param, setParam] = useState('');
  const chosenParam = paramsOfStep.find((c) => c.param === param) ?? paramsOfStep[0];

  const [rows, setRows] = useState<Row[]>([]);
  const [objective, setObjective] = useState<(typeof OBJECTIVES)[number]>('pmi');
  const [minPurity, setMinPurity] = useState('');
  const [minYield, setMinYield] = useState('');
  const [maxVolume, setMaxVolume] = useState('');
  const [ich, setIch] = useState(false);
  const [impurityMax, setImpurityMax] = useState<Record<string, string>>({});
  const [seed, setSeed] = useState('1');
  const [evaluations, setEvaluations] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const start = useStartOptimise();
  const [run, setRun] = useState<{ jobId: string; request: OptimiseRequestInput } | null>(null);
  const job = useOptimiseJob(run?.jobId ?? null);
  // The run's progress and answer appear below the form: bring them into view when a run
  // starts, so the chemist does not look at a greyed-out button and wonder what happened.
  const runHeading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    if (run) runHeading.current?.scrollIntoView({ block: 'start' });
  }, [run?.jobId]); // eslint-disable-line react-hooks/exhaustive-deps
  const cancel = useCancelOptimise();
  const copy = useTryInCopy(workspaceId);
  const navigate = useNavigate();

  if (choices.length === 0)
    return (
      <EmptyState title="Nothing to optimise yet">
        This route has no step with a volume, number of washes, cycles, temperature or other
        parameter the optimiser can vary. Add wash, distillation, crystallisation or filtration
        steps in the editor first.
      </EmptyState>
    );

  const addRow = () => {
    if (!chosenParam || rows.some((r) => keyOf(r.choice) === keyOf(chosenParam))) return;
    setRows((rs) => [...rs, { choice: chosenParam, ...defaultBounds(chosenParam) }]);
  };
  const setRow = (i: number, patch: Partial<Row>) => {
    setRows((rs) => rs.map((r, j) => (j === i ? { ...r, ...patch } : r)));
    setErrors({});
  };
  const removeRow = (i: number) => {
    setRows((rs) => rs.filter((_, j) => j !== i));
    setErrors({});
  };

  const request = (): OptimiseRequestInput => {
    const maxImpurityPct = Object.fromEntries(
      Object.entries(impurityMax).flatMap(([id, v]) => {
        const n = num(v);
        return n === undefined ? [] : [[id, n]];
      }),
    );
    const budget = num(evaluations);
    return {
      document,
      free: rows.map((r) => ({
        stepId: r.choice.stepId,
        param: r.choice.param,
        min: num(r.min) ?? Number.NaN,
        max: num(r.max) ?? Number.NaN,
        ...(r.choice.integer ? { integer: true } : {}),
      })),
      objective,
      constraints: {
        ...(num(minPurity) !== undefined ? { minSolventFreePurityPct: num(minPurity) } : {}),
        ...(Object.keys(maxImpurityPct).length ? { maxImpurityPct } : {}),
        ...(num(minYield) !== undefined ? { minYieldPct: num(minYield) } : {}),
        ...(ich ? { ichResidualSolvents: true as const } : {}),
        ...(num(maxVolume) !== undefined ? { maxVolumeL: num(maxVolume) } : {}),
      },
      seed: num(seed) ?? Number.NaN,
      ...(budget !== undefined ? { budget: { evaluations: budget } } : {}),
    };
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setFormError(null);
    const body = request();
    const checked = optimiseRequestSchema.safeParse(body);
    if (!checked.success) {
      setErrors(issuesToErrors(checked.error.issues));
      return;
    }
    setErrors({});
    start.mutate(body, {
      onSuccess: ({ jobId }) => setRun({ jobId, request: body }),
      onError: (error) => {
        if (isApiError(error)) {
          const fields = error.fieldErrors();
          setErrors(fields);
          const placed = (k: string) => k in fields && k !== '' && placedKeys.has(k);
          const unplaced = Object.entries(fields).filter(([k]) => !placed(k));
          setFormError(
            unplaced.length
              ? unplaced.map(([, m]) => m).join(' ')
              : Object.keys(fields).length
                ? 'Some settings need attention; see the marked fields.'
                : error.message,
          );
        } else setFormError('The run could not be started. Try again.');
      },
    });
  };

  // Fields this form shows a message beside; any other problem is listed above the button.
  const placedKeys = new Set([
    ...rows.flatMap((_, i) => ['min', 'max', 'param', 'stepId'].map((f) => `free.${i}.${f}`)),
    'free',
    'constraints.minSolventFreePurityPct',
    'constraints.minYieldPct',
    'constraints.maxVolumeL',
    ...impurities.map((m) => `constraints.maxImpurityPct.${m.id}`),
    'seed',
    'budget.evaluations',
  ]);

  const data: OptimiseJob | undefined = job.data;
  const running = run !== null && (!data || data.status === 'queued' || data.status === 'running');
  const progress = Math.round((data?.progress ?? 0) * 100);

  const openCopy = () => {
    const result = data?.result;
    if (!result || !run) return;
    const name = `${routeName} — optimised for ${OBJECTIVE_SHORT[result.objective]}`.slice(0, 200);
    // Nobody charges 3.344396 vol: the copy takes the chosen values to two decimals.
    const rounded = withParams(
      result.best.document,
      run.request.free.map((f) => ({
        stepId: f.stepId,
        param: f.param,
        value: Number((result.best.params[`${f.stepId}.${f.param}`] ?? f.min).toFixed(2)),
      })),
    );
    copy.mutate(
      { name, projectName, document: rounded },
      { onSuccess: (route) => navigate(paths.workspace.route.to(workspaceId, route.id)) },
    );
  };

  return (
    <div className="space-y-6">
      <form
        onSubmit={submit}
        noValidate
        aria-labelledby="optimiser-settings"
        className="space-y-5 rounded-card border border-rule bg-paper-raised p-4 shadow-card"
      >
        <h2 id="optimiser-settings" className="text-title font-medium">
          What may change, what to minimise, what must hold
        </h2>

        <fieldset className="space-y-3">
          <legend className="text-body font-medium">Free parameters</legend>
          <p className="text-caption text-ink-muted">
            Pick a step and one of its parameters, then give the range the optimiser may search, in
            the unit the route gives it. Washes, stages, cycles and cake washes are whole numbers.
          </p>
          <div className="flex flex-wrap items-end gap-2">
            <Select
              label="Step"
              value={stepId}
              onValueChange={(v) => {
                setStepId(v);
                setParam('');
              }}
              options={steps}
              className="min-w-56"
            />
            <Select
              label="Parameter"
              value={chosenParam?.param ?? ''}
              onValueChange={setParam}
              options={paramsOfStep.map((c) => ({
                value: c.param,
                label: `${c.label} (now ${round(c.value)}${c.unit ? ` ${c.unit}` : ''})`,
              }))}
              className="min-w-56"
            />
            <Button
              type="button"
              size="sm"
              variant="secondary"
              onClick={addRow}
              disabled={
                !chosenParam ||
                rows.length >= MAX_FREE_PARAMS ||
                rows.some((r) => keyOf(r.choice) === keyOf(chosenParam))
              }
            >
              Free this parameter
            </Button>
          </div>
          {errors.free ? <FieldError>{errors.free}</FieldError> : null}
          {rows.length === 0 ? (
            <p className="text-small text-ink-muted">
              No parameter is free yet: free at least one for the optimiser to vary.
            </p>
          ) : (
            <table
              className="w-full border-collapse text-left text-small"
              aria-label="Free parameters"
            >
              <thead>
                <tr className="border-b border-rule text-caption text-ink-muted">
                  <th className="py-1 pr-2 font-medium">Parameter</th>
                  <th className="py-1 pr-2 font-medium">Now</th>
                  <th className="py-1 pr-2 font-medium">From</th>
                  <th className="py-1 pr-2 font-medium">To</th>
                  <th className="py-1 font-medium">
                    <span className="sr-only">Remove</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r, i) => {
                  const name = `${r.choice.label} of ${r.choice.stepName}`;
                  const unit = r.choice.unit ? ` (${r.choice.unit})` : '';
                  const rowError = errors[`free.${i}.param`] ?? errors[`free.${i}.stepId`];
                  return (
                    <tr key={keyOf(r.choice)} className="border-b border-rule align-top">
                      <td className="py-1.5 pr-2">
                        {name}
                        {r.choice.integer ? (
                          <span className="text-caption text-ink-muted"> · whole number</span>
                        ) : null}
                        {rowError ? <FieldError>{rowError}</FieldError> : null}
                      </td>
                      <td className="py-1.5 pr-2 tabular-nums">
                        {round(r.choice.value)}
                        {r.choice.unit ? ` ${r.choice.unit}` : ''}
                      </td>
                      <td className="py-1.5 pr-2">
                        <NumberCell
                          label={`From: ${name}${unit}`}
                          value={r.min}
                          onChange={(v) => setRow(i, { min: v })}
                          error={errors[`free.${i}.min`]}
                        />
                      </td>
                      <td className="py-1.5 pr-2">
                        <NumberCell
                          label={`To: ${name}${unit}`}
                          value={r.max}
                          onChange={(v) => setRow(i, { max: v })}
                          error={errors[`free.${i}.max`]}
                        />
                      </td>
                      <td className="py-1.5">
                        <Button
                          type="button"
                          size="sm"
                          variant="quiet"
                          onClick={() => removeRow(i)}
                          aria-label={`Keep the ${name} fixed`}
                        >
                          Remove
                        </Button>
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          )}
        </fieldset>

        <div className="grid gap-4 md:grid-cols-2">
          <fieldset className="space-y-3">
            <legend className="text-body font-medium">Minimise</legend>
            <Select
              label="Objective"
              value={objective}
              onValueChange={(v) => setObjective(v as (typeof OBJECTIVES)[number])}
              options={OBJECTIVES.map((o) => ({ value: o, label: OBJECTIVE_LABELS[o] }))}
            />
            <div className="grid grid-cols-2 gap-3">
              <TextField
                label="Seed"
                inputMode="numeric"
                value={seed}
                onValueChange={setSeed}
                error={errors.seed}
                hint="The same seed gives the same answer."
              />
              <TextField
                label="Evaluations"
                inputMode="numeric"
                value={evaluations}
                onValueChange={setEvaluations}
                error={errors['budget.evaluations']}
                placeholder={String(defaultEvaluations(Math.max(1, rows.length)))}
                hint="Leave empty for the default; fewer is quicker, more searches further."
              />
            </div>
          </fieldset>
          <fieldset className="space-y-3">
            <legend className="text-body font-medium">Constraints (leave empty for none)</legend>
            <div className="grid grid-cols-2 gap-3">
              <TextField
                label="Least solvent-free purity (%)"
                inputMode="decimal"
                value={minPurity}
                onValueChange={setMinPurity}
                error={errors['constraints.minSolventFreePurityPct']}
              />
              <TextField
                label="Least yield (%)"
                inputMode="decimal"
                value={minYield}
                onValueChange={setMinYield}
                error={errors['constraints.minYieldPct']}
              />
              <TextField
                label="Largest volume in the vessel (L)"
                inputMode="decimal"
                value={maxVolume}
                onValueChange={setMaxVolume}
                error={errors['constraints.maxVolumeL']}
                hint="The working volume of the vessel."
              />
              {impurities.map((m) => (
                <TextField
                  key={m.id}
                  label={`Most ${m.name} (%)`}
                  inputMode="decimal"
                  value={impurityMax[m.id] ?? ''}
                  onValueChange={(v) => setImpurityMax((s) => ({ ...s, [m.id]: v }))}
                  error={errors[`constraints.maxImpurityPct.${m.id}`]}
                  hint="In the isolated solid, solvent-free."
                />
              ))}
            </div>
            <label className="flex items-center gap-2 text-small">
              <input type="checkbox" checked={ich} onChange={(e) => setIch(e.target.checked)} />
              Every residual solvent within its ICH Q3C limit
            </label>
          </fieldset>
        </div>

        {formError ? <FieldError>{formError}</FieldError> : null}
        <div className="flex items-center gap-2">
          <Button type="submit" disabled={start.isPending || running} busy={start.isPending}>
            Start optimising
          </Button>
          <p className="text-caption text-ink-muted">
            Runs in the background on the server; you can leave the page open and watch it.
          </p>
        </div>
      </form>

      {run ? (
        <section aria-labelledby="optimiser-run" className="space-y-3">
          <h2 id="optimiser-run" ref={runHeading} className="text-title font-medium">
            Run
          </h2>
          {job.isPending ? (
            <Loading label="Starting the run…" />
          ) : job.isError ? (
            <ErrorState
              title="The run’s progress could not be read"
              error={job.error}
              onRetry={() => job.refetch()}
            />
          ) : data ? (
            <>
              <div className="flex items-center gap-3">
                <div className="flex-1 space-y-1">
                  <div className="flex justify-between text-caption text-ink-muted">
                    <span data-testid="optimiser-status">{STATUS_WORDS[data.status]}</span>
                    <span className="tabular-nums">{progress} %</span>
                  </div>
                  <div
                    role="progressbar"
                    aria-label="Optimisation progress"
                    aria-valuemin={0}
                    aria-valuemax={100}
                    aria-valuenow={progress}
                    aria-valuetext={`${STATUS_WORDS[data.status]}, ${progress} %`}
                    data-status={data.status}
                    className="h-2 overflow-hidden rounded-full bg-paper-sunken"
                  >
                    <div
                      className={`h-full ${data.status === 'failed' ? 'bg-caution-hazard' : 'bg-accent'}`}
                      style={{ width: `${progress}%` }}
                    />
                  </div>
                </div>
                {running ? (
                  <Button
                    size="sm"
                    variant="secondary"
                    onClick={() => cancel.mutate(run.jobId)}
                    disabled={cancel.isPending}
                  >
                    Cancel the run
                  </Button>
                ) : null}
              </div>
              {cancel.isError && !(isApiError(cancel.error) && cancel.error.status === 409) ? (
                <ErrorState title="The run was not cancelled" error={cancel.error} />
              ) : null}
              {data.status === 'failed' ? (
                <ErrorState title="The run failed">
                  <p className="mt-0.5 text-body">
                    {data.error?.message ?? 'No reason was given.'}
                  </p>
                </ErrorState>
              ) : data.status === 'cancelled' ? (
                <p className="text-small text-ink-muted">
                  The run was cancelled; nothing was changed. Start it again when ready.
                </p>
              ) : data.status === 'done' && data.result ? (
                <OptimiseResultView
                  result={data.result}
                  request={run.request}
                  original={document}
                  onOpenCopy={openCopy}
                  opening={copy.isPending}
                />
              ) : null}
              {copy.isError ? (
                <ErrorState title="The copy was not saved" error={copy.error} />
              ) : null}
            </>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}

const STATUS_WORDS: Record<OptimiseJob['status'], string> = {
  queued: 'Waiting for a free worker',
  running: 'Searching',
  done: 'Done',
  failed: 'Failed',
  cancelled: 'Cancelled',
};

function NumberCell({
  label,
  value,
  onChange,
  error,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
}) {
  return (
    <div className="w-24">
      <input
        aria-label={label}
        inputMode="decimal"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        className={`block h-8 w-full rounded-control border bg-paper-raised px-2 text-body tabular-nums focus-visible:outline-2 focus-visible:outline-accent ${error ? 'border-caution-hazard' : 'border-rule-strong'}`}
      />
      {error ? <FieldError>{error}</FieldError> : null}
    </div>
  );
}
