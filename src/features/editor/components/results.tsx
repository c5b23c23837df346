import { useEffect, useMemo, useRef, useState, memo } from 'react';
import { useReactFlow } from '@xyflow/react';
import { PROCESS_SAFETY_NOTE } from '@shared/engine/route/safety-note';
import { useEditorStore } from '@/stores/editor-store';
import { useEvaluation } from '../evaluation';
import { keyOf } from '../document';
import { streamsCsv, type StreamRow } from '../streams-csv';
import { componentLabel } from './fields';
import { SEVERITY_ORDER, SeverityChip, PHASES } from './phase';
import { Button } from '@/components/button';
import { fieldInWords } from '@shared/engine/route/field-words';
import { listInWords } from '@shared/engine/route/step-words';
import { groupProblems } from '../problems';
import { formatLevel, formatPurity, LimitMark } from './purge-view';
import { formatSignificant } from '@/lib/format';

const NO_ISSUES: never[] = [];
const n = (v: number | null | undefined, d = 1) =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(d);

type Totals = NonNullable<ReturnType<typeof useEvaluation.getState>['result']>['totals'];

/** A change since the previous result, with enough digits to see it ("▲ 1.6", "▼ 0.0021"). */
function Delta({
  now,
  before,
  name,
  unit,
}: {
  now: number | null | undefined;
  before: number | null | undefined;
  name: string;
  unit: string;
}) {
  if (now === null || now === undefined || before === null || before === undefined) return null;
  const d = now - before;
  if (!Number.isFinite(d) || Math.abs(d) < 1e-9 * Math.max(1, Math.abs(now))) return null;
  const size = Math.abs(d);
  const text = size >= 0.1 && size < 1e5 ? size.toFixed(1) : formatSignificant(size, 2);
  return (
    <span
      className="ml-1 text-caption font-normal text-ink-muted"
      data-delta={name}
      title={`Changed by ${d > 0 ? '+' : '−'}${text}${unit} with the last edit`}
    >
      <span aria-hidden="true">{d > 0 ? '▲' : '▼'}</span>
      <span className="sr-only">{d > 0 ? 'up' : 'down'}</span> {text}
    </span>
  );
}

const sameTotals = (a: Totals, b: Totals) =>
  a.yieldPct === b.yieldPct &&
  a.purityWtPct === b.purityWtPct &&
  a.pmi === b.pmi &&
  a.solventUseLPerKg === b.solventUseLPerKg;

/** Yield, purity, PMI and solvent use of the whole route, each with its change since the previous result. */
function TotalsCardImpl() {
  const totals = useEvaluation((s) => s.result?.totals);
  const components = useEditorStore((s) => s.doc.components);
  const impurityName = (id: string) => {
    const c = components.find((x) => keyOf(x) === id);
    return c?.kind === 'compound' ? c.name : id;
  };
  const status = useEvaluation((s) => s.status);
  const ms = useEvaluation((s) => s.ms);
  const last = useRef<Totals | null>(null);
  const [before, setBefore] = useState<Totals | null>(null);
  useEffect(() => {
    if (!totals) return;
    // A result that repeats the last numbers (the saved draft's own evaluation after the
    // preview, a refetch) keeps the change the last edit made visible.
    if (last.current && !sameTotals(last.current, totals)) setBefore(last.current);
    last.current = totals;
  }, [totals]);
  const items = [
    {
      label: 'Isolated yield',
      value: totals ? n(totals.yieldPct) : '—',
      shownUnit: '%',
      raw: totals?.yieldPct,
      prev: before?.yieldPct,
      unit: ' %',
      key: 'yield',
    },
    {
      label: 'Purity, solvent-free',
      title:
        'Product over product plus organic impurities in the isolated solid: the basis of an HPLC area-% result',
      value: totals ? formatPurity(totals.solventFreePurityPct) : '—',
      shownUnit: '%',
      raw: totals?.solventFreePurityPct,
      prev: before?.solventFreePurityPct,
      unit: ' %',
      key: 'solvent-free-purity',
    },
    {
      label: 'Assay',
      title: 'Product in the isolated solid including residual solvents and water',
      value: totals ? n(totals.purityWtPct, 2) : '—',
      shownUnit: 'wt %',
      raw: totals?.purityWtPct,
      prev: before?.purityWtPct,
      unit: ' wt %',
      key: 'purity',
    },
    {
      label: 'PMI',
      value: totals ? n(totals.pmi, 0) : '—',
      shownUnit: '',
      raw: totals?.pmi,
      prev: before?.pmi,
      unit: '',
      key: 'pmi',
    },
  ];
  return (
    <section
      aria-label="Route totals"
      className="rounded-card border border-rule bg-paper-raised px-3 py-2 shadow-card"
    >
      <div className="flex items-center justify-between">
        <h2 className="text-small font-medium">Route totals</h2>
        <p className="text-caption text-ink-muted" role="status" aria-live="polite">
          {status === 'running'
            ? 'Updating…'
            : status === 'invalid'
              ? 'Needs input — showing the last complete result'
              : status === 'empty'
                ? 'Add a step to start'
                : `Updated${ms !== null ? ` in ${ms.toFixed(0)} ms` : ''}`}
        </p>
      </div>
      <dl className="mt-1 grid grid-cols-4 gap-2">
        {items.map((i) => (
          <div key={i.key}>
            <dt className="text-caption text-ink-muted" title={'title' in i ? i.title : undefined}>
              {i.label}
            </dt>
            <dd
              className="text-title font-medium tabular-nums whitespace-nowrap"
              data-total={i.key}
              data-value={i.raw ?? ''}
            >
              {i.value}
              {totals && i.shownUnit ? (
                <span className="ml-0.5 text-caption font-normal text-ink-muted">
                  {i.shownUnit}
                </span>
              ) : null}
            </dd>
            <dd className="h-4 leading-4">
              <Delta now={i.raw} before={i.prev} name={i.key} unit={i.unit} />
            </dd>
          </div>
        ))}
      </dl>
      {totals?.impurities.length ? (
        <ul
          aria-label="Impurities against their limits"
          className="mt-1 flex flex-wrap gap-x-3 gap-y-0.5"
        >
          {totals.impurities.map((i) => (
            <li
              key={i.componentId}
              className="flex items-center gap-1 text-caption"
              data-total-impurity={i.componentId}
            >
              <span className="text-ink-muted">{impurityName(i.componentId)}</span>
              <span className="whitespace-nowrap tabular-nums">{formatLevel(i.levelPct)} %</span>
              <LimitMark impurity={i} />
            </li>
          ))}
        </ul>
      ) : null}
      {totals ? (
        <p className="mt-1 text-caption text-ink-muted">
          Solvent {n(totals.solventUseLPerKg, 0)} L/kg · E-factor {n(totals.eFactor, 0)} (
          {n(totals.eFactorExcludingWater, 0)} without water) · cycle time ≈ {n(totals.cycleTimeH)}{' '}
          h (common-practice step durations)
        </p>
      ) : null}
    </section>
  );
}

type RouteWarning = NonNullable<
  ReturnType<typeof useEvaluation.getState>['result']
>['warnings'][number];

/** One entry of the caution list: a caution and every step it was raised on. */
export interface CautionGroup {
  key: string;
  severity: RouteWarning['severity'];
  code: string;
  message: string;
  /** Step ids in route order; null for a caution about the whole route. */
  steps: Array<string | null>;
}

/**
 * Identical cautions (same severity, code and message; only the step differs)
 * as one entry listing their steps; worst severity first, then the most widespread.
 */
export function groupCautions(warnings: readonly RouteWarning[]): CautionGroup[] {
  const groups = new Map<string, CautionGroup>();
  for (const w of warnings) {
    const key = `${w.severity}\u0000${w.code}\u0000${w.message}`;
    let g = groups.get(key);
    if (!g)
      groups.set(
        key,
        (g = { key, severity: w.severity, code: w.code, message: w.message, steps: [] }),
      );
    const stepId = w.stepId ?? null;
    if (!g.steps.includes(stepId)) g.steps.push(stepId);
  }
  return [...groups.values()].sort(
    (a, b) =>
      SEVERITY_ORDER.indexOf(a.severity) - SEVERITY_ORDER.indexOf(b.severity) ||
      b.steps.length - a.steps.length,
  );
}

/** Set while the caution list selects a step, so the panel stays on the list. */
export const cautionJump = { current: false };

/** Selects a step and brings it into view. */
function useJumpToStep() {
  const flow = useReactFlow();
  return (stepId: string | null) => {
    if (!stepId) return;
    const sel = useEditorStore.getState().selection.steps;
    if (!(sel.length === 1 && sel[0] === stepId)) cautionJump.current = true;
    useEditorStore.getState().select({ steps: [stepId], connections: [] });
    if (flow.getNode(stepId)) flow.fitView({ nodes: [{ id: stepId }], maxZoom: 1.1, duration: 0 });
  };
}

const STEPS_SHOWN = 6;

/** Every caution and problem, worst first, identical ones grouped; each step name jumps to its step. */
export function CautionList() {
  const result = useEvaluation((s) => s.result);
  const issues = useEvaluation((s) => (s.status === 'invalid' ? s.issues : NO_ISSUES));
  const steps = useEditorStore((s) => s.doc.steps);
  const jump = useJumpToStep();
  const nameOf = useMemo(() => new Map(steps.map((s) => [s.id, s.name])), [steps]);
  const groups = useMemo(() => groupCautions(result?.warnings ?? []), [result]);
  const problems = useMemo(() => groupProblems(issues), [issues]);
  const [open, setOpen] = useState<Record<string, boolean>>({});
  const total = result?.warnings.length ?? 0;
  return (
    <div className="space-y-2">
      {issues.length ? (
        <ul aria-label="Problems to fix" className="space-y-1">
          {problems.map((i, k) => (
            <li key={k} data-problem-steps={i.stepIds.length}>
              <button
                type="button"
                onClick={() => jump(i.stepIds[0] ?? null)}
                className="flex w-full items-start gap-2 rounded-control px-1 py-0.5 text-left text-small hover:bg-accent-soft"
              >
                <span className="inline-flex shrink-0 items-center gap-1 rounded-control bg-caution-hazard-soft px-1.5 py-0.5 text-caption font-medium text-caution-hazard-deep">
                  <span
                    aria-hidden="true"
                    className="inline-block size-2 rotate-45 bg-caution-hazard"
                  />
                  Needs input
                </span>
                <span>
                  <span className="font-medium">
                    {listInWords(i.stepIds.map((id) => (id ? (nameOf.get(id) ?? id) : 'Route')))}
                  </span>
                  {fieldInWords(i.field) ? ` · ${fieldInWords(i.field)}` : ''}: {i.message}
                </span>
              </button>
            </li>
          ))}
        </ul>
      ) : null}
      {groups.length ? (
        <>
          <p className="text-caption text-ink-muted">
            {total} caution{total === 1 ? '' : 's'}
            {groups.length < total ? `, ${groups.length} different` : ''} — worst first. Choose a
            step name to go to it.
          </p>
          <ul aria-label="Cautions" className="divide-y divide-rule">
            {groups.map((g) => {
              const many = g.steps.length > STEPS_SHOWN && !open[g.key];
              const shown = many ? g.steps.slice(0, STEPS_SHOWN) : g.steps;
              return (
                <li
                  key={g.key}
                  className="py-1.5 text-small"
                  data-caution={g.code}
                  data-steps={g.steps.length}
                >
                  <div className="flex items-start gap-2">
                    <SeverityChip severity={g.severity} />
                    <p className="min-w-0 flex-1">{g.message}</p>
                  </div>
                  <p className="mt-1 flex flex-wrap items-center gap-1 pl-1 text-caption text-ink-muted">
                    <span>{g.steps.length > 1 ? `On ${g.steps.length} steps:` : 'On'}</span>
                    {shown.map((id) =>
                      id ? (
                        <button
                          key={id}
                          type="button"
                          onClick={() => jump(id)}
                          className="rounded-control border border-rule bg-paper px-1.5 py-px text-caption text-accent hover:bg-accent-soft hover:text-accent-deep"
                          data-jump={id}
                        >
                          {nameOf.get(id) ?? id}
                        </button>
                      ) : (
                        <span key="route" className="px-1">
                          the whole route
                        </span>
                      ),
                    )}
                    {many ? (
                      <button
                        type="button"
                        onClick={() => setOpen((o) => ({ ...o, [g.key]: true }))}
                        className="px-1 text-caption text-accent underline-offset-2 hover:underline"
                      >
                        {g.steps.length - STEPS_SHOWN} more
                      </button>
                    ) : null}
                  </p>
                </li>
              );
            })}
          </ul>
        </>
      ) : !issues.length ? (
        <p className="text-small text-ink-muted">No cautions for this route as drawn.</p>
      ) : null}
      <p className="border-t border-rule pt-2 text-caption text-ink-muted" data-process-safety-note>
        {result?.processSafetyNote ?? PROCESS_SAFETY_NOTE}
      </p>
    </div>
  );
}

/** Every connection's stream: each component's mass, the volume and composition; downloadable as CSV. */
export function StreamTable() {
  const result = useEvaluation((s) => s.result);
  const doc = useEditorStore((s) => s.doc);
  const [onlyNonZero] = useState(true);
  const rows = useMemo(() => {
    if (!result) return [];
    const stepName = new Map(doc.steps.map((s) => [s.id, s.name]));
    const out: StreamRow[] = [];
    for (const c of doc.connections) {
      const s = result.streams[c.id];
      if (!s) continue;
      out.push({
        id: c.id,
        from: `${stepName.get(c.from.stepId)} · ${c.from.port}`,
        to: `${stepName.get(c.to.stepId)} · ${c.to.port}`,
        phase: s.phase,
        T: s.temperatureK - 273.15,
        L: s.volumeM3 * 1000,
        total: Object.values(s.kg).reduce((a, b) => a + b, 0),
        kg: s.kg,
      });
    }
    for (const t of result.terminals) {
      out.push({
        id: `${t.stepId}:${t.port}`,
        from: `${stepName.get(t.stepId)} · ${t.port}`,
        to: t.isolated ? 'Isolated product' : 'Leaves the route',
        phase: t.stream.phase,
        T: t.stream.temperatureK - 273.15,
        L: t.stream.volumeM3 * 1000,
        total: Object.values(t.stream.kg).reduce((a, b) => a + b, 0),
        kg: t.stream.kg,
      });
    }
    return out;
  }, [result, doc]);
  const comps = doc.components.filter(
    (c) => !onlyNonZero || rows.some((r) => (r.kg[keyOf(c)] ?? 0) > 0),
  );
  if (!result)
    return (
      <p className="text-small text-ink-muted">Streams appear once the route can be evaluated.</p>
    );
  const csv = () => {
    const text = streamsCsv(rows, comps);
    const url = URL.createObjectURL(new Blob([text], { type: 'text/csv' }));
    const a = document.createElement('a');
    a.href = url;
    a.download = `${(doc.name ?? 'route').replace(/[^\w-]+/g, '-')}-streams.csv`;
    a.click();
    URL.revokeObjectURL(url);
  };
  return (
    <div className="space-y-2">
      <div className="flex justify-end">
        <Button size="sm" variant="secondary" onClick={csv}>
          Download CSV
        </Button>
      </div>
      <div className="overflow-auto rounded-card border border-rule">
        <table className="w-full border-collapse text-left text-caption tabular-nums">
          <caption className="sr-only">Streams of the route</caption>
          <thead>
            <tr className="bg-paper-sunken text-ink-muted">
              {[
                'From',
                'To',
                'Phase',
                '°C',
                'L',
                'Total kg',
                ...comps.map((c) => `${componentLabel(c)} kg (wt %)`),
              ].map((h) => (
                <th key={h} scope="col" className="border-b border-rule px-2 py-1 font-medium">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className="border-b border-rule">
                <td className="px-2 py-1">{r.from}</td>
                <td className="px-2 py-1">{r.to}</td>
                <td className="px-2 py-1">
                  {PHASES[r.phase as keyof typeof PHASES]?.label ?? r.phase}
                </td>
                <td className="px-2 py-1">{r.T.toFixed(1)}</td>
                <td className="px-2 py-1">{formatSignificant(r.L, 3)}</td>
                <td className="px-2 py-1">{formatSignificant(r.total, 4)}</td>
                {comps.map((c) => {
                  const kg = r.kg[keyOf(c)] ?? 0;
                  return (
                    <td key={keyOf(c)} className="px-2 py-1">
                      {kg
                        ? `${formatSignificant(kg, 3)} (${((100 * kg) / (r.total || 1)).toFixed(1)})`
                        : '—'}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

/** Drawn again only when the totals or the evaluation status change, not with every edit. */
export const TotalsCard = memo(TotalsCardImpl);
