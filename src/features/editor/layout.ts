import dagre from '@dagrejs/dagre';
import type { EditorDoc } from './document';

/** Left-to-right layered layout of the steps (dagre); card size as drawn. */
export function autoLayout(doc: EditorDoc): Record<string, { x: number; y: number }> {
  const g = new dagre.graphlib.Graph();
  g.setGraph({ rankdir: 'LR', nodesep: 40, ranksep: 80 });
  g.setDefaultEdgeLabel(() => ({}));
  for (const s of doc.steps) g.setNode(s.id, { width: 240, height: 200 });
  for (const c of doc.connections) g.setEdge(c.from.stepId, c.to.stepId);
  dagre.layout(g);
  const out: Record<string, { x: number; y: number }> = {};
  for (const s of doc.steps) {
    const n = g.node(s.id);
    out[s.id] = { x: Math.round(n.x - 120), y: Math.round(n.y - 100) };
  }
  return out;
}
