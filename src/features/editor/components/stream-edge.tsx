import { memo } from 'react';
import { BaseEdge, EdgeLabelRenderer, getBezierPath, type Edge, type EdgeProps } from '@xyflow/react';
import type { PortPhase } from '@shared/schemas/route';
import { useEvaluation } from '../evaluation';
import { PHASES } from './phase';

export type StreamEdgeData = { phase: PortPhase; productId: string | null; names: Record<string, { name: string; kind: string }> };
export type StreamEdgeType = Edge<StreamEdgeData, 'stream'>;

/** A connection drawn in its phase's colour and dash, labelled with the stream it carries. */
function StreamEdgeImpl({ id, sourceX, sourceY, targetX, targetY, sourcePosition, targetPosition, data, selected }: EdgeProps<StreamEdgeType>) {
  const [path, labelX, labelY] = getBezierPath({ sourceX, sourceY, targetX, targetY, sourcePosition, targetPosition });
  const stream = useEvaluation((s) => s.result?.streams[id]);
  const phase = PHASES[data?.phase ?? 'liquid'];
  let label: string | null = null;
  if (stream) {
    const L = stream.volumeM3 * 1000;
    const pid = data?.productId;
    const productKg = pid ? stream.kg[pid] ?? 0 : null;
    let main = '';
    let best = 0;
    for (const [k, v] of Object.entries(stream.kg)) if (k !== pid && v > best && data?.names[k]?.kind !== 'compound') { best = v; main = k; }
    label = [`${L >= 10 ? L.toFixed(0) : L.toPrecision(2)} L`, productKg !== null ? `${productKg.toPrecision(3)} kg product` : null, main ? data?.names[main]?.name ?? main : null].filter(Boolean).join(' · ');
  }
  return (
    <>
      <BaseEdge id={id} path={path} style={{ stroke: phase.stroke, strokeWidth: selected ? 3 : 2, strokeDasharray: phase.dash }} />
      {label ? (
        <EdgeLabelRenderer>
          <div
            className="nodrag nopan pointer-events-auto absolute rounded-control border border-rule bg-paper-raised/95 px-1.5 py-0.5 text-caption text-ink-muted tabular-nums"
            style={{ transform: `translate(-50%, -50%) translate(${labelX}px, ${labelY}px)` }}
            data-stream-label={id}
          >
            <span className={`mr-1 font-medium ${phase.text}`}>{phase.label}</span>
            {label}
          </div>
        </EdgeLabelRenderer>
      ) : null}
    </>
  );
}

export const StreamEdge = memo(StreamEdgeImpl);
