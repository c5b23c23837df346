import { useCallback, useMemo, useRef, type DragEvent, memo } from 'react';
import {
  Background,
  BackgroundVariant,
  Controls,
  MiniMap,
  ReactFlow,
  useReactFlow,
  type Connection,
  type EdgeChange,
  type IsValidConnection,
  type OnConnectEnd,
  type NodeChange,
  type NodeTypes,
  type EdgeTypes,
} from '@xyflow/react';
import { useShallow } from 'zustand/react/shallow';
import { PORTS, type PortPhase, type StepKind } from '@shared/schemas/route';
import { useEditorStore } from '@/stores/editor-store';
import {
  checkConnection,
  handleId,
  keyOf,
  portOfHandle,
  portPhase,
  type ConnectionInput,
  type StepInput,
} from '../document';
import { StepNode, type StepNodeType } from './step-node';
import { StreamEdge, type StreamEdgeData, type StreamEdgeType } from './stream-edge';
import { PHASES } from './phase';
import { KINDS } from '../step-kinds';
import { READABLE_ZOOM } from '../layout';

// Declared once: every step kind uses the same memoised card.
const nodeTypes = Object.fromEntries(Object.keys(PORTS).map((k) => [k, StepNode])) as NodeTypes;
const edgeTypes: EdgeTypes = { stream: StreamEdge };
export const PALETTE_MIME = 'application/x-phasewright-step';

function CanvasImpl() {
  const { steps, connections, components, selection } = useEditorStore(
    useShallow((s) => ({
      steps: s.doc.steps,
      connections: s.doc.connections,
      components: s.doc.components,
      selection: s.selection,
    })),
  );
  const actions = useEditorStore.getState();
  const readOnly = useEditorStore((s) => s.readOnly);
  const flow = useReactFlow();

  // A setting's edit changes one step: the other cards keep their node objects, so the canvas
  // library re-measures and re-renders only the changed card.
  const nodeCache = useRef(
    new Map<string, { step: StepInput; selected: boolean; i: number; node: StepNodeType }>(),
  );
  const nodes = useMemo<StepNodeType[]>(() => {
    const measuredSize = (id: string) => {
      const m = flow.getInternalNode(id)?.measured;
      return m?.width && m.height ? { width: m.width, height: m.height } : undefined;
    };
    const sel = new Set(selection.steps);
    const cache = nodeCache.current;
    const next = new Map<
      string,
      { step: StepInput; selected: boolean; i: number; node: StepNodeType }
    >();
    const out = steps.map((step, i) => {
      const selected = sel.has(step.id);
      const hit = cache.get(step.id);
      if (hit && hit.step === step && hit.selected === selected && (step.position || hit.i === i)) {
        next.set(step.id, hit);
        return hit.node;
      }
      // A changed card keeps the size the canvas measured (a node without one is measured
      // again, and every connection is redrawn twice on the way); the canvas still re-measures
      // it when its drawn size changes.
      const measured = hit && hit.step.kind === step.kind ? measuredSize(step.id) : undefined;
      const node = {
        id: step.id,
        type: step.kind,
        position: step.position ?? { x: 80 + i * 300, y: 120 },
        data: { step },
        // Spoken when the card takes focus: what the step is and its name.
        ariaLabel: `${KINDS[step.kind].label}: ${step.name || 'Unnamed step'}`,
        selected,
        // The card's usual size until it is measured, so the mini-map can draw it.
        initialWidth: 240,
        initialHeight: 140,
        ...(measured ? { measured } : {}),
      } as StepNodeType;
      next.set(step.id, { step, selected, i, node });
      return node;
    });
    nodeCache.current = next;
    return out;
  }, [steps, selection.steps, flow]);

  const names = useMemo(() => {
    const out: Record<string, { name: string; kind: string }> = {};
    for (const c of components)
      out[keyOf(c)] = {
        name: c.kind === 'compound' ? c.name : c.kind === 'solvent' ? c.solventId : c.soluteId,
        kind: c.kind,
      };
    return out;
  }, [components]);
  const productId = useMemo(() => {
    const p = components.find((c) => c.kind === 'compound' && c.role === 'product');
    return p ? keyOf(p) : null;
  }, [components]);

  const edgeCache = useRef(
    new Map<
      string,
      {
        c: ConnectionInput;
        selected: boolean;
        phase: PortPhase;
        data: StreamEdgeData;
        edge: StreamEdgeType;
      }
    >(),
  );
  const lastEdges = useRef<StreamEdgeType[]>([]);
  const edges = useMemo<StreamEdgeType[]>(() => {
    const sel = new Set(selection.connections);
    const kindOf = new Map(steps.map((s) => [s.id, s.kind]));
    const stepName = new Map(steps.map((s) => [s.id, s.name || KINDS[s.kind].label]));
    const cache = edgeCache.current;
    const next = new Map<
      string,
      {
        c: ConnectionInput;
        selected: boolean;
        phase: PortPhase;
        data: StreamEdgeData;
        edge: StreamEdgeType;
      }
    >();
    const out = connections.map((c) => {
      const selected = sel.has(c.id);
      const phase =
        portPhase(kindOf.get(c.from.stepId) ?? 'charge', 'out', c.from.port) ?? 'liquid';
      const ariaLabel = `Stream from ${stepName.get(c.from.stepId) ?? 'a step'} (${c.from.port}) to ${stepName.get(c.to.stepId) ?? 'a step'} (${c.to.port})`;
      const hit = cache.get(c.id);
      if (
        hit &&
        hit.c === c &&
        hit.selected === selected &&
        hit.phase === phase &&
        hit.data.productId === productId &&
        hit.data.names === names &&
        hit.edge.ariaLabel === ariaLabel
      ) {
        next.set(c.id, hit);
        return hit.edge;
      }
      const data: StreamEdgeData = { phase, productId, names };
      const edge: StreamEdgeType = {
        id: c.id,
        type: 'stream',
        source: c.from.stepId,
        sourceHandle: handleId('out', c.from.port),
        target: c.to.stepId,
        targetHandle: handleId('in', c.to.port),
        selected,
        ariaLabel,
        data,
      };
      next.set(c.id, { c, selected, phase, data, edge });
      return edge;
    });
    edgeCache.current = next;
    // Every connection unchanged (a setting was edited): the same list, so the canvas has nothing to redo.
    const last = lastEdges.current;
    if (last.length === out.length && out.every((e, i) => e === last[i])) return last;
    lastEdges.current = out;
    return out;
  }, [connections, steps, selection.connections, productId, names]);

  const onNodesChange = useCallback((changes: NodeChange<StepNodeType>[]) => {
    const positions: Record<string, { x: number; y: number }> = {};
    let selChanged = false;
    const sel = new Set(useEditorStore.getState().selection.steps);
    for (const ch of changes) {
      if (ch.type === 'position' && ch.position)
        positions[ch.id] = { x: Math.round(ch.position.x), y: Math.round(ch.position.y) };
      if (ch.type === 'select') {
        selChanged = true;
        if (ch.selected) sel.add(ch.id);
        else sel.delete(ch.id);
      }
    }
    if (Object.keys(positions).length) useEditorStore.getState().moveSteps(positions);
    if (selChanged) useEditorStore.getState().select({ steps: [...sel] });
  }, []);

  const onEdgesChange = useCallback((changes: EdgeChange<StreamEdgeType>[]) => {
    const sel = new Set(useEditorStore.getState().selection.connections);
    let changed = false;
    for (const ch of changes) {
      if (ch.type === 'select') {
        changed = true;
        if (ch.selected) sel.add(ch.id);
        else sel.delete(ch.id);
      }
    }
    if (changed) useEditorStore.getState().select({ connections: [...sel] });
  }, []);

  const isValidConnection = useCallback<IsValidConnection>((c) => {
    const doc = useEditorStore.getState().doc;
    const r = checkConnection(
      doc,
      { stepId: c.source, port: portOfHandle(c.sourceHandle) },
      { stepId: c.target, port: portOfHandle(c.targetHandle) },
    );
    return r.ok;
  }, []);

  const onConnect = useCallback((c: Connection) => {
    useEditorStore
      .getState()
      .connect(
        { stepId: c.source, port: portOfHandle(c.sourceHandle) },
        { stepId: c.target, port: portOfHandle(c.targetHandle) },
      );
  }, []);

  // A drop on an input that does not fit is refused by isValidConnection before onConnect:
  // say why, in the same words as the step's settings.
  const onConnectEnd = useCallback<OnConnectEnd>((_, state) => {
    if (state.isValid !== false || !state.toHandle || !state.fromHandle) return;
    const [out, inn] =
      state.fromHandle.type === 'source'
        ? [state.fromHandle, state.toHandle]
        : [state.toHandle, state.fromHandle];
    useEditorStore
      .getState()
      .connect(
        { stepId: out.nodeId, port: portOfHandle(out.id) },
        { stepId: inn.nodeId, port: portOfHandle(inn.id) },
      );
  }, []);

  const onDrop = useCallback(
    (e: DragEvent) => {
      const kind = e.dataTransfer.getData(PALETTE_MIME) as StepKind;
      if (!kind || !(kind in PORTS)) return;
      e.preventDefault();
      const p = flow.screenToFlowPosition({ x: e.clientX, y: e.clientY });
      useEditorStore
        .getState()
        .addStep(kind, { x: Math.round(p.x - 120), y: Math.round(p.y - 30) });
    },
    [flow],
  );

  return (
    <div className="flex h-full w-full flex-col">
      <div
        className="relative min-h-0 w-full flex-1"
        onDragOver={(e) => {
          if (e.dataTransfer.types.includes(PALETTE_MIME)) {
            e.preventDefault();
            e.dataTransfer.dropEffect = 'copy';
          }
        }}
        onDrop={onDrop}
      >
        <ReactFlow<StepNodeType, StreamEdgeType>
          nodes={nodes}
          edges={edges}
          nodeTypes={nodeTypes}
          edgeTypes={edgeTypes}
          onNodesChange={onNodesChange}
          onEdgesChange={onEdgesChange}
          onNodeDragStart={actions.beginMove}
          onNodeDragStop={actions.endMove}
          onConnect={onConnect}
          onConnectEnd={onConnectEnd}
          isValidConnection={isValidConnection}
          deleteKeyCode={null}
          // Tab goes from card to card; a connection is made or removed from the keyboard in the
          // step's settings (where each input comes from).
          edgesFocusable={false}
          nodesDraggable={!readOnly}
          nodesConnectable={!readOnly}
          multiSelectionKeyCode={['Shift', 'Meta', 'Control']}
          selectionKeyCode="Shift"
          snapToGrid
          snapGrid={[20, 20]}
          fitView
          fitViewOptions={READABLE_FIT}
          minZoom={0.1}
          proOptions={{ hideAttribution: true }}
          aria-label="Route canvas"
        >
          <Background variant={BackgroundVariant.Dots} gap={20} size={1.2} color="#D9D5CB" />
        </ReactFlow>
      </div>
      {/* Below the canvas, never over a card: the phase key and the overview of the route. */}
      <div className="flex h-15 shrink-0 items-center gap-3 border-t border-rule bg-paper px-3">
        <Controls
          showInteractive={false}
          aria-label="Zoom"
          orientation="horizontal"
          style={{ position: 'relative', margin: 0 }}
          className="pw-zoom"
        />
        <Legend />
        <div className="ml-auto" data-minimap>
          <MiniMap
            pannable
            zoomable
            ariaLabel="Overview of the route"
            style={{ width: 96, height: 50, position: 'relative', margin: 0 }}
            bgColor="#FFFFFF"
            nodeColor={miniMapFill}
            nodeStrokeColor={miniMapStroke}
            nodeStrokeWidth={4}
            nodeBorderRadius={6}
            maskColor="rgba(236,234,228,0.55)"
            maskStrokeColor="#3B4C86"
            maskStrokeWidth={2}
          />
        </div>
      </div>
    </div>
  );
}

/** The first view: the whole route when it fits at a readable size, else its start at that size (pan or use the mini-map for the rest). */
const READABLE_FIT = { maxZoom: 1, minZoom: READABLE_ZOOM, padding: 0.05 } as const;

// Mini-map cards: the card colours of the canvas (ink-faint outline, accent when selected), so the overview reads like the route.
const miniMapFill = (node: StepNodeType) => (node.selected ? '#E6E9F4' : '#ECEAE4');
const miniMapStroke = (node: StepNodeType) => (node.selected ? '#3B4C86' : '#585E67');

function Legend() {
  return (
    <div className="flex flex-wrap gap-x-3 text-caption text-ink-muted" aria-label="Phase key">
      {(Object.keys(PHASES) as Array<keyof typeof PHASES>).map((p) => (
        <span key={p} className="inline-flex items-center gap-1">
          <svg width="22" height="6" aria-hidden="true">
            <line
              x1="0"
              y1="3"
              x2="22"
              y2="3"
              stroke={PHASES[p].stroke}
              strokeWidth="2"
              strokeDasharray={PHASES[p].dash}
            />
          </svg>
          {PHASES[p].label}
        </span>
      ))}
    </div>
  );
}

/** Drawn again only for its own subscriptions, not with every change of the page around it. */
export const Canvas = memo(CanvasImpl);
