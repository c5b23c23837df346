/**
 * The route editor's state: the draft document, the selection, undo/redo
 * history and the clipboard. Components subscribe with narrow selectors.
 * Results are never stored here: they are derived from the engine (see
 * features/editor/evaluation.ts).
 */
import { create } from 'zustand';
import type { StepKind } from '@shared/schemas/route';
import {
  checkConnection,
  keptOutput,
  keyOf,
  setIn,
  type ComponentInput,
  type ConnectionInput,
  type EditorDoc,
  type StepInput,
} from '@/features/editor/document';
import { defaultParams, KINDS } from '@/features/editor/step-kinds';
import { PORTS } from '@shared/schemas/route';

const HISTORY_LIMIT = 200;

type Selection = { steps: string[]; connections: string[] };
type Clip = { steps: StepInput[]; connections: ConnectionInput[] };

export interface EditorState {
  doc: EditorDoc;
  /** Increases with every change that can alter results (not with moving a card). */
  modelRevision: number;
  /** Increases with every change of the document, moves included (for saving). */
  docRevision: number;
  past: EditorDoc[];
  future: EditorDoc[];
  selection: Selection;
  clipboard: Clip | null;
  /** A short note for the last refused action (e.g. a connection that does not fit). */
  notice: string | null;
  /** Set for people who may look at the route but not change it: every edit is refused. */
  readOnly: boolean;
  load: (doc: EditorDoc, options?: { readOnly?: boolean }) => void;
  replaceDocument: (doc: EditorDoc) => void;
  addStep: (kind: StepKind, position?: { x: number; y: number }) => string;
  updateStep: (stepId: string, path: ReadonlyArray<string | number>, value: unknown) => void;
  renameStep: (stepId: string, name: string) => void;
  addComponent: (c: ComponentInput) => void;
  connect: (
    from: { stepId: string; port: string },
    to: { stepId: string; port: string },
  ) => boolean;
  disconnect: (connectionId: string) => void;
  removeSelection: () => void;
  /** While dragging: move without history; `beginMove` keeps the state to return to. */
  beginMove: () => void;
  moveSteps: (positions: Record<string, { x: number; y: number }>) => void;
  endMove: () => void;
  setPositions: (positions: Record<string, { x: number; y: number }>) => void;
  select: (selection: Partial<Selection>) => void;
  selectAll: () => void;
  copy: () => void;
  paste: () => void;
  undo: () => void;
  redo: () => void;
  setNotice: (notice: string | null) => void;
}

export const READ_ONLY_NOTICE = 'You can look at this route but not change it.';

let moveSnapshot: EditorDoc | null = null;
let idCounter = 0;

function newId(prefix: string, taken: Set<string>): string {
  let id: string;
  do id = `${prefix}-${Date.now().toString(36).slice(-4)}${(idCounter++).toString(36)}`;
  while (taken.has(id));
  return id;
}

const emptyDoc: EditorDoc = {
  schemaVersion: 1,
  referenceInput: { componentId: 'product', massKg: 1 },
  components: [],
  steps: [],
  connections: [],
};

function withComponents(doc: EditorDoc, needs: ComponentInput[]): EditorDoc {
  const have = new Set(doc.components.map(keyOf));
  const add = needs.filter((c) => !have.has(keyOf(c)));
  return add.length ? { ...doc, components: [...doc.components, ...add] } : doc;
}

/** Room a card takes on the canvas, with a margin [px]; used to keep new cards off existing ones. */
const CARD_FOOTPRINT = { width: 300, height: 200 };

/** A free place for a new card: right of the step it follows (or of the rightmost card), moved down until no card is there. */
function nextPosition(doc: EditorDoc, after?: StepInput): { x: number; y: number } {
  let candidate: { x: number; y: number };
  if (after?.position) candidate = { x: after.position.x + 340, y: after.position.y };
  else if (!doc.steps.length) return { x: 80, y: 120 };
  else {
    const maxX = Math.max(...doc.steps.map((s) => s.position?.x ?? 0));
    const at = doc.steps.find((s) => (s.position?.x ?? 0) === maxX);
    candidate = { x: maxX + 340, y: at?.position?.y ?? 120 };
  }
  const taken = (p: { x: number; y: number }) =>
    doc.steps.some(
      (s) =>
        s.position &&
        Math.abs(s.position.x - p.x) < CARD_FOOTPRINT.width &&
        Math.abs(s.position.y - p.y) < CARD_FOOTPRINT.height,
    );
  for (let tries = 0; tries < 50 && taken(candidate); tries++)
    candidate = { x: candidate.x, y: candidate.y + CARD_FOOTPRINT.height + 20 };
  return candidate;
}

export const useEditorStore = create<EditorState>((set, get) => {
  /** Apply a change that belongs in the history. */
  const commit = (next: EditorDoc, extra: Partial<EditorState> = {}, model = true) => {
    // The one place every edit passes, so no shortcut, paste or drag can slip past it.
    if (get().readOnly) {
      set({ notice: READ_ONLY_NOTICE });
      return;
    }
    set((s) => ({
      doc: next,
      past: [...s.past.slice(-HISTORY_LIMIT + 1), s.doc],
      future: [],
      modelRevision: s.modelRevision + (model ? 1 : 0),
      docRevision: s.docRevision + 1,
      notice: null,
      ...extra,
    }));
  };

  return {
    doc: emptyDoc,
    modelRevision: 0,
    docRevision: 0,
    past: [],
    future: [],
    selection: { steps: [], connections: [] },
    clipboard: null,
    notice: null,
    readOnly: false,

    load: (doc, options) =>
      set((s) => ({
        doc,
        past: [],
        future: [],
        selection: { steps: [], connections: [] },
        modelRevision: s.modelRevision + 1,
        docRevision: 0,
        notice: null,
        readOnly: options?.readOnly ?? false,
      })),
    replaceDocument: (doc) => commit(doc),

    addStep: (kind, position) => {
      const { doc, selection } = get();
      const taken = new Set(doc.steps.map((s) => s.id));
      const id = newId(kind.replace(/[^a-z]/g, '').slice(0, 6), taken);
      const { params, needs } = defaultParams(kind, doc);
      const source =
        selection.steps.length === 1
          ? doc.steps.find((s) => s.id === selection.steps[0])
          : undefined;
      const count = doc.steps.filter((s) => s.kind === kind).length;
      const step = {
        id,
        kind,
        name: `${KINDS[kind].label}${count ? ` ${count + 1}` : ''}`,
        position: position ?? nextPosition(doc, source),
        params,
      } as StepInput;
      let next = withComponents({ ...doc, steps: [...doc.steps, step] }, needs);
      // Added from the palette with one step selected: the new step joins that step's kept output
      // (the layer a wash keeps, the pot, the cake, ...) in line: whatever that output fed now
      // comes from the new step's kept output instead.
      let notice: string | null = null;
      if (source && !position && PORTS[kind].inputs.length) {
        const from = { stepId: source.id, port: keptOutput(source) };
        const to = { stepId: id, port: PORTS[kind].inputs[0].name };
        const onward = next.connections.find(
          (c) => c.from.stepId === from.stepId && c.from.port === from.port,
        );
        const without = onward
          ? { ...next, connections: next.connections.filter((c) => c !== onward) }
          : next;
        const check = checkConnection(without, from, to);
        const out = { stepId: id, port: keptOutput(step) };
        const onwardCheck = onward
          ? checkConnection({ ...without, connections: [] }, out, onward.to)
          : ({ ok: true } as const);
        if (!check.ok) notice = `Not joined to ${source.name || source.kind}: ${check.reason}`;
        else if (!onwardCheck.ok)
          notice = `Not put in line after ${source.name || source.kind}: ${onwardCheck.reason}`;
        else {
          const joined = [{ id: newId('c', new Set(next.connections.map((c) => c.id))), from, to }];
          if (onward) joined.push({ ...onward, from: out });
          next = { ...without, connections: [...without.connections, ...joined] };
        }
      }
      commit(next, { selection: { steps: [id], connections: [] } });
      if (notice) set({ notice });
      return id;
    },

    updateStep: (stepId, path, value) => {
      const { doc } = get();
      const i = doc.steps.findIndex((s) => s.id === stepId);
      if (i < 0) return;
      const step = setIn(doc.steps[i], path, value);
      let next = { ...doc, steps: doc.steps.map((s, j) => (j === i ? step : s)) };
      // A solvent or solute named in a step must be a route component.
      if (typeof value === 'string') {
        const last = String(path[path.length - 1]);
        if (
          /solventId$|SolventId$|antisolventId$/.test(last) &&
          !next.components.some((c) => keyOf(c) === value)
        )
          next = withComponents(next, [{ kind: 'solvent', id: value, solventId: value }]);
      }
      commit(next);
    },

    renameStep: (stepId, name) => {
      const { doc } = get();
      commit({ ...doc, steps: doc.steps.map((s) => (s.id === stepId ? { ...s, name } : s)) });
    },

    addComponent: (c) => {
      const { doc } = get();
      if (doc.components.some((x) => keyOf(x) === keyOf(c))) return;
      let next = { ...doc, components: [...doc.components, c] };
      // The first product becomes what "vol" and "equiv" refer to.
      if (
        c.kind === 'compound' &&
        c.role === 'product' &&
        !doc.components.some((x) => x.kind === 'compound' && x.role === 'product')
      ) {
        next = { ...next, referenceInput: { ...next.referenceInput, componentId: keyOf(c) } };
      }
      commit(next);
    },

    connect: (from, to) => {
      const { doc } = get();
      const check = checkConnection(doc, from, to);
      if (!check.ok) {
        set({ notice: check.reason });
        return false;
      }
      const id = newId('c', new Set(doc.connections.map((c) => c.id)));
      commit({ ...doc, connections: [...doc.connections, { id, from, to }] });
      return true;
    },

    disconnect: (connectionId) => {
      const { doc } = get();
      commit({ ...doc, connections: doc.connections.filter((c) => c.id !== connectionId) });
    },

    removeSelection: () => {
      const { doc, selection } = get();
      if (!selection.steps.length && !selection.connections.length) return;
      const steps = new Set(selection.steps);
      const conns = new Set(selection.connections);
      commit(
        {
          ...doc,
          steps: doc.steps.filter((s) => !steps.has(s.id)),
          connections: doc.connections.filter(
            (c) => !conns.has(c.id) && !steps.has(c.from.stepId) && !steps.has(c.to.stepId),
          ),
        },
        { selection: { steps: [], connections: [] } },
      );
    },

    beginMove: () => {
      moveSnapshot = get().doc;
    },
    moveSteps: (positions) =>
      get().readOnly
        ? undefined
        : set((s) => ({
            doc: {
              ...s.doc,
              steps: s.doc.steps.map((st) =>
                positions[st.id] ? { ...st, position: positions[st.id] } : st,
              ),
            },
          })),
    endMove: () => {
      const before = moveSnapshot;
      moveSnapshot = null;
      if (!before || before === get().doc) return;
      set((s) => ({
        past: [...s.past.slice(-HISTORY_LIMIT + 1), before],
        future: [],
        docRevision: s.docRevision + 1,
      }));
    },
    setPositions: (positions) => {
      const { doc } = get();
      commit(
        {
          ...doc,
          steps: doc.steps.map((st) =>
            positions[st.id] ? { ...st, position: positions[st.id] } : st,
          ),
        },
        {},
        false,
      );
    },

    select: (sel) =>
      set((s) => ({
        selection: {
          steps: sel.steps ?? s.selection.steps,
          connections: sel.connections ?? s.selection.connections,
        },
      })),
    selectAll: () =>
      set((s) => ({
        selection: {
          steps: s.doc.steps.map((x) => x.id),
          connections: s.doc.connections.map((c) => c.id),
        },
      })),

    copy: () => {
      const { doc, selection } = get();
      const ids = new Set(selection.steps);
      if (!ids.size) return;
      set({
        clipboard: {
          steps: doc.steps.filter((s) => ids.has(s.id)),
          connections: doc.connections.filter(
            (c) => ids.has(c.from.stepId) && ids.has(c.to.stepId),
          ),
        },
      });
    },
    paste: () => {
      const { doc, clipboard } = get();
      if (!clipboard?.steps.length) return;
      const taken = new Set(doc.steps.map((s) => s.id));
      const map = new Map<string, string>();
      const steps = clipboard.steps.map((s) => {
        const id = newId(s.kind.replace(/[^a-z]/g, '').slice(0, 6), taken);
        taken.add(id);
        map.set(s.id, id);
        return {
          ...s,
          id,
          name: `${s.name} (copy)`,
          position: { x: (s.position?.x ?? 0) + 40, y: (s.position?.y ?? 0) + 60 },
        } as StepInput;
      });
      const cTaken = new Set(doc.connections.map((c) => c.id));
      const connections = clipboard.connections.map((c) => {
        const id = newId('c', cTaken);
        cTaken.add(id);
        return {
          id,
          from: { ...c.from, stepId: map.get(c.from.stepId)! },
          to: { ...c.to, stepId: map.get(c.to.stepId)! },
        };
      });
      commit(
        {
          ...doc,
          steps: [...doc.steps, ...steps],
          connections: [...doc.connections, ...connections],
        },
        { selection: { steps: steps.map((s) => s.id), connections: [] } },
      );
    },

    undo: () =>
      set((s) => {
        if (!s.past.length) return s;
        const prev = s.past[s.past.length - 1];
        return {
          doc: prev,
          past: s.past.slice(0, -1),
          future: [s.doc, ...s.future],
          modelRevision: s.modelRevision + 1,
          docRevision: s.docRevision + 1,
          notice: null,
        };
      }),
    redo: () =>
      set((s) => {
        if (!s.future.length) return s;
        const [next, ...rest] = s.future;
        return {
          doc: next,
          past: [...s.past, s.doc],
          future: rest,
          modelRevision: s.modelRevision + 1,
          docRevision: s.docRevision + 1,
          notice: null,
        };
      }),
    setNotice: (notice) => set({ notice }),
  };
});
