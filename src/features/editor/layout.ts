import dagre from '@dagrejs/dagre';
import type { EditorDoc } from './document';

/**
 * The least zoom at which a card stays readable: its smallest text (the 12 px caption) is then
 * 11 px on screen.
 */
export const READABLE_ZOOM = 0.92;

const CARD = { width: 240, height: 200 };
const GAP_X = 70;
const GAP_Y = 24;
/** The share of the canvas a tidied route may fill, leaving a margin at its edges. */
export const FIT_MARGIN = 0.96;

type Size = { width: number; height: number };

/**
 * Tidy layout: the steps in flow order (dagre's left-to-right ranks, parallel steps stacked),
 * wrapped into rows like lines of text so that the route fits the canvas at the largest zoom.
 * `sizes` are the cards as drawn (else a usual card), `pane` the canvas in screen pixels.
 */
export function tidyLayout(
  doc: EditorDoc,
  opts: { sizes?: Record<string, Size>; pane?: Size } = {},
): Record<string, { x: number; y: number }> {
  const size = (id: string) => opts.sizes?.[id] ?? CARD;
  const g = new dagre.graphlib.Graph();
  g.setGraph({ rankdir: 'LR', nodesep: 40, ranksep: 80 });
  g.setDefaultEdgeLabel(() => ({}));
  // A fresh label per step: dagre writes the position into it.
  for (const s of doc.steps) g.setNode(s.id, { ...size(s.id) });
  for (const c of doc.connections) g.setEdge(c.from.stepId, c.to.stepId);
  dagre.layout(g);

  // Ranks in flow order; the steps of one rank top to bottom.
  const byX = new Map<number, Array<{ id: string; y: number }>>();
  for (const s of doc.steps) {
    const n = g.node(s.id);
    const x = Math.round(n.x);
    byX.set(x, [...(byX.get(x) ?? []), { id: s.id, y: n.y }]);
  }
  const ranks = [...byX.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([, list]) => list.sort((a, b) => a.y - b.y).map((n) => n.id));
  if (!ranks.length) return {};
  const colWidth = Math.max(...doc.steps.map((s) => size(s.id).width));
  const rankHeight = ranks.map(
    (ids) => ids.reduce((h, id) => h + size(id).height, 0) + (ids.length - 1) * GAP_Y,
  );
  const pane = opts.pane ?? { width: 800, height: 600 };

  // The number of ranks per row that lets the whole route be drawn largest, among those whose
  // rows fit the canvas's width at a readable zoom: a long route then runs on in further rows
  // (the canvas scrolls down, like a page) instead of shrinking its cards below readable.
  const rowWidth = (cols: number) => cols * colWidth + (cols - 1) * GAP_X;
  let widest = 1;
  while (widest < ranks.length && rowWidth(widest + 1) * READABLE_ZOOM <= pane.width * FIT_MARGIN)
    widest++;
  let best = { cols: 1, zoom: 0 };
  for (let cols = 1; cols <= widest; cols++) {
    const rows = Math.ceil(ranks.length / cols);
    let height = (rows - 1) * GAP_Y;
    for (let r = 0; r < rows; r++)
      height += Math.max(...rankHeight.slice(r * cols, (r + 1) * cols));
    const zoom = Math.min(pane.width / rowWidth(cols), pane.height / height);
    if (zoom > best.zoom + 1e-9) best = { cols, zoom };
  }

  const out: Record<string, { x: number; y: number }> = {};
  let top = 0;
  for (let r = 0; r * best.cols < ranks.length; r++) {
    const row = ranks.slice(r * best.cols, (r + 1) * best.cols);
    row.forEach((ids, c) => {
      let y = top;
      for (const id of ids) {
        out[id] = { x: c * (colWidth + GAP_X), y };
        y += size(id).height + GAP_Y;
      }
    });
    top += Math.max(...rankHeight.slice(r * best.cols, (r + 1) * best.cols)) + GAP_Y;
  }
  return out;
}
