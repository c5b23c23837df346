import { memo, useLayoutEffect, useMemo, useRef, useState } from 'react';
import {
  BaseEdge,
  EdgeLabelRenderer,
  getBezierPath,
  useStore,
  type Edge,
  type EdgeProps,
} from '@xyflow/react';
import type { PortPhase } from '@shared/schemas/route';
import { useEvaluation } from '../evaluation';
import { PHASES } from './phase';
import { labelSpot, type Box } from '../label-spot';
import { formatSignificant } from '@/lib/format';

export type StreamEdgeData = {
  phase: PortPhase;
  productId: string | null;
  names: Record<string, { name: string; kind: string }>;
};
export type StreamEdgeType = Edge<StreamEdgeData, 'stream'>;

/** Below this zoom the labels would cover the cards: they show only for a hovered or selected connection. */
export const LABEL_ZOOM = 0.85;
/** Clearance between a label and the cards either side of it, and its narrowest width [px]. */
const LABEL_MARGIN = 6;
const LABEL_MIN_WIDTH = 56;
const zoomedIn = (s: { transform: [number, number, number] }) => s.transform[2] >= LABEL_ZOOM;

/**
 * A connection drawn in its phase's colour and dash, labelled at its midpoint
 * with the stream it carries: volume and product mass (stacked, to fit between cards) when zoomed in, the main
 * solvent too when hovered or selected.
 */
function StreamEdgeImpl({
  id,
  sourceX,
  sourceY,
  targetX,
  targetY,
  sourcePosition,
  targetPosition,
  data,
  selected,
}: EdgeProps<StreamEdgeType>) {
  const [path, labelX, labelY] = getBezierPath({
    sourceX,
    sourceY,
    targetX,
    targetY,
    sourcePosition,
    targetPosition,
  });
  // The label's words, not the stream object: a new result re-renders only the connections whose label changed.
  const text = useEvaluation((s) => streamLabel(s.result?.streams[id], data));
  const [label = null, product = null, detail = null] = text
    ? text.split('\u0000').map((x) => x || null)
    : [];
  const phase = PHASES[data?.phase ?? 'liquid'];
  // Room between the source's right edge and the target's left edge, less a margin each side.
  const gap =
    targetX > sourceX && Math.abs(targetY - sourceY) < 60
      ? Math.max(LABEL_MIN_WIDTH, targetX - sourceX - 2 * LABEL_MARGIN)
      : undefined;
  const readable = useStore(zoomedIn);
  const [hover, setHover] = useState(false);
  const full = hover || !!selected;
  // The label kept clear of the cards: measured once drawn, then slid along the curve if the
  // middle would put it over a card.
  const labelRef = useRef<HTMLDivElement>(null);
  const [size, setSize] = useState<{ width: number; height: number } | null>(null);
  const cards = useStore(cardBoxes);
  useLayoutEffect(() => {
    const el = labelRef.current;
    if (!el) return;
    const next = { width: el.offsetWidth, height: el.offsetHeight };
    setSize((old) => (old && old.width === next.width && old.height === next.height ? old : next));
  }, [text, readable, full]);
  const spot = useMemo(
    () => (size ? labelSpot(path, size, boxesOf(cards)) : null),
    [path, size, cards],
  );
  const labelAtX = spot?.x ?? labelX;
  const labelAtY = spot?.y ?? labelY;
  return (
    <g onMouseEnter={() => setHover(true)} onMouseLeave={() => setHover(false)}>
      <BaseEdge
        id={id}
        path={path}
        style={{ stroke: phase.stroke, strokeWidth: selected ? 3 : 2, strokeDasharray: phase.dash }}
      />
      {label && (readable || full) ? (
        <EdgeLabelRenderer>
          <div
            className={`nodrag nopan pointer-events-auto absolute rounded-control text-center border px-1.5 py-0.5 text-caption leading-4 tabular-nums ${full ? 'z-10 border-accent/50 bg-paper-raised text-ink shadow-card' : 'border-rule bg-paper-raised/95 text-ink-muted'}`}
            style={{
              transform: `translate(-50%, -50%) translate(${labelAtX}px, ${labelAtY}px)`,
              // Between two cards side by side the label fits the gap (its lines wrap) rather
              // than run under a card.
              maxWidth: gap,
            }}
            ref={labelRef}
            data-stream-label={id}
            onMouseEnter={() => setHover(true)}
            onMouseLeave={() => setHover(false)}
            title={[phase.label, label, product, detail].filter(Boolean).join(' · ')}
          >
            <span className={`mr-1 font-medium ${phase.text}`}>{phase.label}</span>
            {label}
            {product ? <span className="block">{product}</span> : null}
            {full && detail ? <span className="block max-w-40 truncate">{detail}</span> : null}
          </div>
        </EdgeLabelRenderer>
      ) : null}
    </g>
  );
}

/** Each state of the canvas's store, with its cards' boxes written out (computed once for all connections). */
const boxesOfState = new WeakMap<object, string>();

/**
 * Every card's box as numbers joined in one string, so a connection re-renders only when a card
 * moves or resizes; the same string for every connection of one state of the canvas.
 */
function cardBoxes(s: {
  nodeLookup: Map<
    string,
    {
      internals: { positionAbsolute: { x: number; y: number } };
      measured: { width?: number; height?: number };
    }
  >;
}): string {
  let key = boxesOfState.get(s);
  if (key === undefined) {
    const out: string[] = [];
    for (const n of s.nodeLookup.values())
      out.push(
        `${n.internals.positionAbsolute.x},${n.internals.positionAbsolute.y},${n.measured.width ?? 0},${n.measured.height ?? 0}`,
      );
    key = out.join(';');
    boxesOfState.set(s, key);
  }
  return key;
}

/** The boxes of the last string read (shared by every connection that reads the same one). */
let lastBoxes: { key: string; boxes: Box[] } = { key: '', boxes: [] };

function boxesOf(key: string): Box[] {
  if (lastBoxes.key !== key)
    lastBoxes = {
      key,
      boxes: key
        ? key.split(';').map((k) => {
            const [x, y, width, height] = k.split(',').map(Number);
            return { x, y, width, height };
          })
        : [],
    };
  return lastBoxes.boxes;
}

type StreamOf = NonNullable<ReturnType<typeof useEvaluation.getState>['result']>['streams'][string];

/** Volume, product mass and main solvent of a stream, joined by NUL (a string, so selectors compare by value). */
function streamLabel(
  stream: StreamOf | undefined,
  data: StreamEdgeData | undefined,
): string | null {
  if (!stream) return null;
  const L = stream.volumeM3 * 1000;
  const pid = data?.productId;
  const productKg = pid ? (stream.kg[pid] ?? 0) : null;
  let main = '';
  let best = 0;
  for (const [k, v] of Object.entries(stream.kg))
    if (k !== pid && v > best && data?.names[k]?.kind !== 'compound') {
      best = v;
      main = k;
    }
  return [
    `${L >= 10 && L < 1e5 ? L.toFixed(0) : formatSignificant(L, 2)} L`,
    productKg !== null ? `${formatSignificant(productKg, 3)} kg product` : '',
    main ? (data?.names[main]?.name ?? main) : '',
  ].join('\u0000');
}

export const StreamEdge = memo(StreamEdgeImpl);
