import { memo } from 'react';
import { Handle, Position, type Node, type NodeProps } from '@xyflow/react';
import { useShallow } from 'zustand/react/shallow';
import { PORTS, type StepKind } from '@shared/schemas/route';
import { handleId, type StepInput } from '../document';
import { KINDS, keyParams } from '../step-kinds';
import { useEvaluation } from '../evaluation';
import { useStepMarks } from '../marks';
import { PhaseMark, PHASES, SEVERITY_ORDER, SeverityChip, type Severity } from './phase';
import { KindGlyph } from './kind-glyph';
import { formatPurity } from './purge-view';
import { formatSignificant } from '@/lib/format';

/** Node data: the step itself (serialisable parameters only, nothing derived). */
export type StepNodeData = { step: StepInput };
export type StepNodeType = { [K in StepKind]: Node<StepNodeData, K> }[StepKind];

const NO_SUMMARY: Record<string, number | string | null> = {};
const fmt = (v: number | string | null) =>
  v === null
    ? '—'
    : typeof v === 'number'
      ? Math.abs(v) >= 100 && Math.abs(v) < 1e5
        ? v.toFixed(0)
        : formatSignificant(v, 3)
      : v;

function StepNodeImpl({ id, data, selected }: NodeProps<StepNodeType>) {
  const step = data.step;
  const ports = PORTS[step.kind];
  // Shallow: a new result re-renders only the cards whose numbers changed.
  const summary = useEvaluation(useShallow((s) => s.result?.steps[id]?.summary ?? NO_SUMMARY));
  const counts = useEvaluation(
    useShallow((s) => {
      const c: Record<Severity, number> = { hazard: 0, warning: 0, advisory: 0, info: 0 };
      for (const w of s.result?.warnings ?? []) if (w.stepId === id) c[w.severity]++;
      return c;
    }),
  );
  const errors = useEvaluation((s) =>
    s.status === 'invalid' ? s.issues.filter((i) => i.stepId === id).length : 0,
  );
  const mark = useStepMarks((s) => s.marks[id]);
  // The step whose output is the isolated solid shows the purity and the impurities against their limits.
  const isolation = useEvaluation(
    useShallow((s) => {
      const r = s.result;
      if (!r || !r.terminals.some((t) => t.isolated && t.stepId === id)) return null;
      const withLimit = r.totals.impurities.filter((i) => i.pass !== null);
      return {
        purity: r.totals.solventFreePurityPct,
        failed: withLimit.filter((i) => i.pass === false).length,
        judged: withLimit.length,
      };
    }),
  );
  const rows = Math.max(ports.inputs.length, ports.outputs.length);
  const changeRing =
    mark?.change === 'added'
      ? 'outline-3 outline-offset-2 outline-phase-aqueous'
      : mark?.change === 'changed'
        ? 'outline-3 outline-offset-2 outline-caution-warning'
        : '';
  return (
    <article
      aria-label={`${KINDS[step.kind].label}: ${step.name}`}
      data-step-id={id}
      data-change={mark?.change}
      className={`relative w-60 rounded-card border bg-paper-raised text-ink shadow-card ${changeRing} ${selected ? 'border-accent ring-2 ring-accent/40' : 'border-rule-strong'}`}
    >
      {mark?.comments ? (
        <span
          className="absolute -top-2.5 -right-2.5 z-10 flex h-5 min-w-5 items-center justify-center rounded-full bg-accent px-1 text-caption font-semibold text-white shadow-card"
          data-comment-marker={mark.comments}
          title={`${mark.comments} open comment${mark.comments === 1 ? '' : 's'}`}
        >
          <span aria-hidden="true">{mark.comments}</span>
          <span className="sr-only">
            {mark.comments} open comment{mark.comments === 1 ? '' : 's'}
          </span>
        </span>
      ) : null}
      {mark?.change ? (
        <span className="sr-only">{mark.change === 'added' ? 'Added step' : 'Changed step'}</span>
      ) : null}
      <header className="flex items-center gap-2 rounded-t-card border-b border-rule bg-paper-sunken px-2.5 py-1.5">
        <KindGlyph kind={step.kind} />
        <div className="min-w-0">
          <p className="text-caption uppercase tracking-wide text-ink-muted">
            {KINDS[step.kind].label}
          </p>
          <p className="truncate text-small font-medium">{step.name || 'Unnamed step'}</p>
        </div>
      </header>
      <div className="relative px-2.5 py-1.5" style={{ minHeight: rows * 20 + 8 }}>
        {ports.inputs.map((p, i) => (
          <div
            key={p.name}
            className="absolute left-0 flex items-center gap-1 pl-3 text-caption text-ink-muted"
            style={{ top: 4 + i * 20 }}
          >
            <Handle
              type="target"
              id={handleId('in', p.name)}
              position={Position.Left}
              className="pw-port"
              style={{ top: 8 }}
              aria-label={`${p.name} input (${PHASES[p.phase].label})`}
            >
              <PhaseMark phase={p.phase} size={12} />
            </Handle>
            <span>
              {p.name}
              {p.required ? '' : ' (optional)'}
            </span>
          </div>
        ))}
        {ports.outputs.map((p, i) => (
          <div
            key={p.name}
            className="absolute right-0 flex items-center gap-1 pr-3 text-caption text-ink-muted"
            style={{ top: 4 + i * 20 }}
          >
            <span className={PHASES[p.phase].text}>{p.name}</span>
            <Handle
              type="source"
              id={handleId('out', p.name)}
              position={Position.Right}
              className="pw-port"
              style={{ top: 8 }}
              aria-label={`${p.name} output (${PHASES[p.phase].label})`}
            >
              <PhaseMark phase={p.phase} size={12} />
            </Handle>
          </div>
        ))}
      </div>
      <div className="border-t border-rule px-2.5 py-1.5 text-caption text-ink-muted">
        {keyParams(step).map((l) => (
          <p key={l} className="truncate">
            {l}
          </p>
        ))}
      </div>
      {summary && Object.keys(summary).length ? (
        <dl
          className={`grid grid-cols-[1fr_auto] gap-x-2 border-t border-rule px-2.5 py-1.5 text-caption pw-results`}
          aria-label="Results"
        >
          {Object.entries(summary)
            .slice(0, 4)
            .map(([k, v]) => (
              <div key={k} className="contents">
                <dt className="truncate text-ink-muted">{k}</dt>
                <dd className="text-right font-medium tabular-nums text-ink" data-result={k}>
                  {fmt(v)}
                </dd>
              </div>
            ))}
        </dl>
      ) : null}
      {isolation ? (
        <p
          className="border-t border-rule px-2.5 py-1.5 text-caption"
          data-isolation-purity={isolation.purity ?? ''}
        >
          Purity {formatPurity(isolation.purity)} % solvent-free
          {isolation.judged ? (
            isolation.failed ? (
              <span className="ml-1 font-medium text-caution-hazard-deep">
                · <span aria-hidden="true">✗</span> {isolation.failed} above limit
              </span>
            ) : (
              <span className="ml-1 text-phase-aqueous-deep">
                · <span aria-hidden="true">✓</span> {isolation.judged} within limits
              </span>
            )
          ) : null}
        </p>
      ) : null}
      {errors || SEVERITY_ORDER.some((s) => counts[s]) ? (
        <footer className="flex flex-wrap gap-1 border-t border-rule px-2 py-1.5">
          {errors ? (
            <span className="inline-flex items-center gap-1 rounded-control bg-caution-hazard-soft px-1.5 py-0.5 text-caption font-medium text-caution-hazard-deep">
              <span
                aria-hidden="true"
                className="inline-block size-2 rotate-45 bg-caution-hazard"
              />
              Needs input {errors}
            </span>
          ) : null}
          {SEVERITY_ORDER.filter((s) => counts[s]).map((s) => (
            <SeverityChip key={s} severity={s} count={counts[s]} compact />
          ))}
        </footer>
      ) : null}
    </article>
  );
}

export const StepNode = memo(StepNodeImpl);
