import type { PortPhase } from '@shared/schemas/route';

/** Each phase: its colour token, a shape (so ports read without colour) and a word. */
export const PHASES: Record<
  PortPhase,
  {
    label: string;
    fill: string;
    text: string;
    stroke: string;
    dash?: string;
    shape: 'circle' | 'ring' | 'diamond' | 'square' | 'square-open' | 'triangle';
  }
> = {
  liquid: {
    label: 'liquid',
    fill: '#585E67',
    text: 'text-ink-muted',
    stroke: '#585E67',
    shape: 'ring',
  },
  organic: {
    label: 'organic',
    fill: '#B48424',
    text: 'text-phase-organic-deep',
    stroke: '#B48424',
    shape: 'circle',
  },
  aqueous: {
    label: 'aqueous',
    fill: '#2C8797',
    text: 'text-phase-aqueous-deep',
    stroke: '#2C8797',
    dash: '7 4',
    shape: 'diamond',
  },
  slurry: {
    label: 'slurry',
    fill: '#7B6450',
    text: 'text-phase-solid-deep',
    stroke: '#7B6450',
    dash: '2 3',
    shape: 'square-open',
  },
  solid: {
    label: 'solid',
    fill: '#7B6450',
    text: 'text-phase-solid-deep',
    stroke: '#7B6450',
    dash: '1 4',
    shape: 'square',
  },
  vapour: {
    label: 'vapour',
    fill: '#8F86B3',
    text: 'text-phase-vapour-deep',
    stroke: '#8F86B3',
    dash: '8 3 2 3',
    shape: 'triangle',
  },
};

/** The port mark: a small shape in the phase colour. */
export function PhaseMark({ phase, size = 10 }: { phase: PortPhase; size?: number }) {
  const p = PHASES[phase];
  const s = size;
  const h = s / 2;
  return (
    <svg width={s} height={s} viewBox={`0 0 ${s} ${s}`} aria-hidden="true" className="block">
      {p.shape === 'circle' ? <circle cx={h} cy={h} r={h - 1} fill={p.fill} /> : null}
      {p.shape === 'ring' ? (
        <circle cx={h} cy={h} r={h - 1.5} fill="#FFFFFF" stroke={p.fill} strokeWidth={2} />
      ) : null}
      {p.shape === 'diamond' ? (
        <path d={`M${h} 0.5 L${s - 0.5} ${h} L${h} ${s - 0.5} L0.5 ${h} Z`} fill={p.fill} />
      ) : null}
      {p.shape === 'square' ? (
        <rect x={1} y={1} width={s - 2} height={s - 2} fill={p.fill} />
      ) : null}
      {p.shape === 'square-open' ? (
        <rect
          x={1.5}
          y={1.5}
          width={s - 3}
          height={s - 3}
          fill="#FFFFFF"
          stroke={p.fill}
          strokeWidth={2}
        />
      ) : null}
      {p.shape === 'triangle' ? (
        <path d={`M${h} 0.5 L${s - 0.5} ${s - 0.5} L0.5 ${s - 0.5} Z`} fill={p.fill} />
      ) : null}
    </svg>
  );
}

const SEVERITY = {
  info: {
    label: 'Info',
    cls: 'bg-caution-info-soft text-caution-info-deep',
    mark: 'rounded-full bg-caution-info',
  },
  advisory: {
    label: 'Advisory',
    cls: 'bg-caution-advisory-soft text-caution-advisory-deep',
    mark: 'bg-caution-advisory',
  },
  warning: {
    label: 'Warning',
    cls: 'bg-caution-warning-soft text-caution-warning-deep',
    mark: 'triangle',
  },
  hazard: {
    label: 'Hazard',
    cls: 'bg-caution-hazard-soft text-caution-hazard-deep',
    mark: 'rotate-45 bg-caution-hazard',
  },
} as const;
export type Severity = keyof typeof SEVERITY;
export const SEVERITY_ORDER: Severity[] = ['hazard', 'warning', 'advisory', 'info'];
export const SEVERITY_LABEL: Record<Severity, string> = {
  hazard: 'Hazard',
  warning: 'Warning',
  advisory: 'Advisory',
  info: 'Info',
};

/** Severity word with its shape: circle (info), square (advisory), triangle (warning), diamond (hazard). */
export function SeverityMark({ severity }: { severity: Severity }) {
  if (severity === 'warning') {
    return (
      <svg width="10" height="10" viewBox="0 0 10 10" aria-hidden="true" className="shrink-0">
        <path d="M5 0.5 L9.5 9.5 L0.5 9.5 Z" fill="#C4631D" />
      </svg>
    );
  }
  return (
    <span
      aria-hidden="true"
      className={`inline-block size-2 shrink-0 ${SEVERITY[severity].mark}`}
    />
  );
}

export function SeverityChip({
  severity,
  count,
  compact = false,
}: {
  severity: Severity;
  count?: number;
  /** Shape and count only (the word stays the accessible name and the tooltip): for the cards. */
  compact?: boolean;
}) {
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-control px-1.5 py-0.5 text-caption font-medium ${SEVERITY[severity].cls}`}
      title={
        compact ? `${SEVERITY[severity].label}${count !== undefined ? ` ${count}` : ''}` : undefined
      }
    >
      <SeverityMark severity={severity} />
      <span className={compact ? 'sr-only' : undefined}>{`${SEVERITY[severity].label} `}</span>
      {count !== undefined ? <span className="tabular-nums">{count}</span> : null}
    </span>
  );
}
