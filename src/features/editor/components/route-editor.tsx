import '@xyflow/react/dist/style.css';
import './editor.css';
import { useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { ReactFlowProvider, useReactFlow, type ReactFlowInstance } from '@xyflow/react';
import { useShallow } from 'zustand/react/shallow';
import { Link } from 'react-router-dom';
import { Button } from '@/components/button';
import { formatDateTime } from '@/lib/format';
import { paths } from '@/paths';
import { useEditorStore } from '@/stores/editor-store';
import type { DraftConflict, RouteDetail } from '@/features/routes';
import { useCompounds } from '@/features/compounds';
import { requestEvaluation, resetEvaluation, useEvaluation } from '../evaluation';
import { initialDocument, useAutosave, type SaveState } from '../autosave';
import { normaliseDocument } from '../document';
import { useStepMarks, type StepMark } from '../marks';
import { READABLE_ZOOM, tidyLayout } from '../layout';
import { KINDS } from '../step-kinds';
import { Canvas } from './canvas';
import { Palette } from './palette';
import { StepPanel } from './step-panel';
import { StepSamplesPanel } from './step-samples-panel';
import { AdvisorPanel } from '@/features/assistant';
import { CautionList, StreamTable, TotalsCard, cautionJump } from './results';
import { ProductFlow, StepPlot } from './plots';
import { PurgePanel } from './purge-view';
import { UncertaintyPanel } from './uncertainty';
import { SEVERITY_LABEL, SEVERITY_ORDER, SeverityChip, SeverityMark } from './phase';

/** An edit's result later than this dims the cards' numbers as stale. */
const STALE_AFTER_MS = 150;

/** A saved revision opened read-only: its document, what the header says, extra side tabs and canvas marks. */
export interface EditorView {
  document: RouteDetail['draft']['document'];
  heading: ReactNode;
  tabs: Array<{ id: string; label: string; content: ReactNode }>;
  initialTab?: string;
  marks?: Record<string, StepMark>;
}

/** What the draft's header actions may do: save pending edits now (the version then on the server, or null). */
export interface DraftControls {
  canEdit: boolean;
  saveNow: () => Promise<number | null>;
}

export default function RouteEditor({
  workspaceId,
  route,
  view,
  actions,
}: {
  workspaceId: string;
  route: RouteDetail;
  view?: EditorView;
  actions?: (draft: DraftControls) => ReactNode;
}) {
  const start = useMemo(
    () =>
      view
        ? { doc: normaliseDocument(view.document), restored: false, staleLocal: null }
        : initialDocument(route.id, route.draft),
    [route.id, route.draft, view?.document], // eslint-disable-line react-hooks/exhaustive-deps
  );
  const [ready, setReady] = useState(false);
  const viewing = view !== undefined;
  // Before the first paint (a layout effect): the cards are drawn in the same frame as the page,
  // not one frame and a passive effect later.
  useLayoutEffect(() => {
    useEditorStore.getState().load(start.doc, { readOnly: viewing || !route.abilities.edit });
    setReady(true);
    return () => resetEvaluation();
  }, [start, route.abilities.edit, viewing]);
  const marks = view?.marks;
  useEffect(() => {
    useStepMarks.setState({ marks: marks ?? {} });
    return () => useStepMarks.setState({ marks: {} });
  }, [marks]);
  if (!ready) return null;
  return (
    <ReactFlowProvider>
      <EditorFrame
        workspaceId={workspaceId}
        route={route}
        restored={start.restored}
        staleLocal={start.staleLocal !== null}
        view={view}
        actions={actions}
      />
    </ReactFlowProvider>
  );
}

function EditorFrame({
  workspaceId,
  route,
  restored,
  staleLocal,
  view,
  actions,
}: {
  workspaceId: string;
  route: RouteDetail;
  restored: boolean;
  staleLocal: boolean;
  view?: EditorView;
  actions?: (draft: DraftControls) => ReactNode;
}) {
  const canEdit = !view && route.abilities.edit;
  const save = useAutosave(workspaceId, route.id, route.draft, canEdit, restored);
  const compounds = useCompounds(workspaceId);
  const viewTabs = view?.tabs ?? [];
  const viewTabKey = viewTabs.map((v) => v.id).join(' ');
  const [tab, setTab] = useState<string>(view?.initialTab ?? 'cautions');
  const selectedId = useEditorStore((s) =>
    s.selection.steps.length === 1 ? s.selection.steps[0] : null,
  );
  // Choosing a step shows its settings (a jump from the caution list keeps the list).
  useEffect(() => {
    // A page's own tab (the review) stays open: choosing a step there picks what to comment on.
    if (selectedId && !cautionJump.current)
      setTab((t) => (viewTabKey.split(' ').includes(t) ? t : 'step'));
    cautionJump.current = false;
  }, [selectedId, viewTabKey]);
  const selectedCautions = useEvaluation((s) =>
    selectedId ? (s.result?.warnings ?? []).filter((w) => w.stepId === selectedId).length : 0,
  );
  const [help, setHelp] = useState(false);
  const flow = useReactFlow();
  const { selected, past, future, notice } = useEditorStore(
    useShallow((s) => ({
      selected:
        s.selection.steps.length === 1
          ? (s.doc.steps.find((x) => x.id === s.selection.steps[0]) ?? null)
          : null,
      past: s.past.length,
      future: s.future.length,
      notice: s.notice,
    })),
  );
  const cautionCount = useEvaluation(
    (s) => (s.result?.warnings.length ?? 0) + (s.status === 'invalid' ? s.issues.length : 0),
  );
  const worst = useEvaluation((s) =>
    SEVERITY_ORDER.find((sev) => s.result?.warnings.some((w) => w.severity === sev)),
  );

  // Stale results dim on every card through one attribute here, not a re-render of each card.
  // While an edit is evaluated they dim only if its result is late: a quick result would
  // otherwise cost two repaints of every card (and a flicker) on the way to the new numbers.
  const canvasBox = useRef<HTMLDivElement>(null);
  useEffect(() => {
    let late: ReturnType<typeof setTimeout> | undefined;
    const set = (stale: boolean) => {
      if (canvasBox.current) canvasBox.current.dataset.resultsStale = String(stale);
    };
    const mark = (status: string) => {
      clearTimeout(late);
      if (status === 'running')
        late = setTimeout(() => set(useEvaluation.getState().status === 'running'), STALE_AFTER_MS);
      else set(status === 'invalid');
    };
    mark(useEvaluation.getState().status);
    const unsub = useEvaluation.subscribe((s, prev) => {
      if (s.status !== prev.status) mark(s.status);
    });
    return () => {
      clearTimeout(late);
      unsub();
    };
  }, []);

  // Every change of the model re-evaluates in the worker.
  useEffect(() => {
    const st = useEditorStore.getState();
    requestEvaluation(st.doc, st.modelRevision);
    return useEditorStore.subscribe((s, prev) => {
      if (s.modelRevision !== prev.modelRevision) requestEvaluation(s.doc, s.modelRevision);
    });
  }, []);

  // Keyboard shortcuts on the editor (not while typing in a field).
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement;
      const typing = t.closest('input, textarea, select, [contenteditable="true"]');
      const st = useEditorStore.getState();
      const mod = e.ctrlKey || e.metaKey;
      if (mod && e.key.toLowerCase() === 'z' && !typing) {
        e.preventDefault();
        if (e.shiftKey) st.redo();
        else st.undo();
      } else if (mod && e.key.toLowerCase() === 'y' && !typing) {
        e.preventDefault();
        st.redo();
      } else if (typing) {
        return;
      } else if (mod && e.key.toLowerCase() === 'c') st.copy();
      else if (mod && e.key.toLowerCase() === 'v') st.paste();
      else if (mod && e.key.toLowerCase() === 'a') {
        e.preventDefault();
        st.selectAll();
      } else if (e.key === 'Delete' || e.key === 'Backspace') {
        e.preventDefault();
        st.removeSelection();
      } else if (e.key === '?') setHelp((h) => !h);
      else if (e.key === 'Escape') {
        setHelp(false);
        st.select({ steps: [], connections: [] });
      } else if (e.key.toLowerCase() === 'f' && !mod) flow.fitView({ maxZoom: 1, padding: 0.2 });
      else if (e.key.toLowerCase() === 'l' && !mod) {
        tidy(flow);
      } else if (e.key.toLowerCase() === 'a' && !mod) {
        e.preventDefault();
        document.querySelector<HTMLButtonElement>('#step-palette button[data-kind]')?.focus();
      }
    };
    // Arrow keys move the selected cards by a grid step (Shift: five); one undo step per press.
    // Listened for before the canvas, which would otherwise nudge a focused card without history.
    const onArrow = (e: KeyboardEvent) => {
      const delta = ARROWS[e.key];
      if (!delta || e.ctrlKey || e.metaKey || e.altKey) return;
      if ((e.target as HTMLElement).closest('input, textarea, select, [contenteditable="true"]'))
        return;
      const st = useEditorStore.getState();
      const ids = st.selection.steps;
      if (!ids.length) return;
      e.preventDefault();
      e.stopPropagation();
      const step = e.shiftKey ? GRID * 5 : GRID;
      const positions: Record<string, { x: number; y: number }> = {};
      for (const id of ids) {
        const node = flow.getNode(id);
        const at = node?.position ??
          st.doc.steps.find((x) => x.id === id)?.position ?? { x: 0, y: 0 };
        positions[id] = {
          x: Math.round(at.x + delta[0] * step),
          y: Math.round(at.y + delta[1] * step),
        };
      }
      st.beginMove();
      st.moveSteps(positions);
      st.endMove();
    };
    window.addEventListener('keydown', onArrow, true);
    window.addEventListener('keydown', onKey);
    return () => {
      window.removeEventListener('keydown', onArrow, true);
      window.removeEventListener('keydown', onKey);
    };
  }, [flow]);

  // On opening, a readable view of the route (its start when it is long); keep the view on a new step when one is added.
  const stepCount = useEditorStore((s) => s.doc.steps.length);
  const seenCount = useRef(0);
  useEffect(() => {
    const opening = seenCount.current === 0;
    const grew = stepCount > seenCount.current;
    seenCount.current = stepCount;
    if (!stepCount || !grew) return;
    const steps = useEditorStore.getState().doc.steps;
    requestAnimationFrame(() =>
      fitReadable(flow, opening ? undefined : steps[steps.length - 1]?.id),
    );
  }, [stepCount, flow]);

  return (
    <div className="flex h-full flex-col">
      <header className="flex h-bar shrink-0 items-center gap-3 border-b border-rule bg-paper-raised px-4">
        <Link
          to={paths.workspace.home.to(workspaceId)}
          className="shrink-0 text-small text-accent hover:underline"
        >
          Routes
        </Link>
        <span aria-hidden="true" className="shrink-0 text-ink-faint">
          /
        </span>
        {/* Long names end in an ellipsis on one line; the full name is the tooltip. */}
        <h1 className="min-w-0 truncate text-lead font-semibold" title={route.name}>
          {route.name}
        </h1>
        {route.project ? (
          <span
            className="min-w-0 max-w-[10rem] truncate whitespace-nowrap text-small text-ink-muted"
            title={route.project.name}
          >
            {route.project.name}
          </span>
        ) : null}
        {view ? view.heading : <SaveIndicator state={save.state} canEdit={canEdit} />}
        <div className="ml-auto flex shrink-0 items-center gap-1">
          {!view && actions ? actions({ canEdit, saveNow: save.saveNow }) : null}
          <Button
            size="sm"
            variant="secondary"
            onClick={() => useEditorStore.getState().undo()}
            disabled={!past}
            aria-keyshortcuts="Control+Z"
          >
            Undo
          </Button>
          <Button
            size="sm"
            variant="secondary"
            onClick={() => useEditorStore.getState().redo()}
            disabled={!future}
            aria-keyshortcuts="Control+Shift+Z"
          >
            Redo
          </Button>
          <Button
            size="sm"
            variant="secondary"
            disabled={!canEdit}
            onClick={() => tidy(flow)}
            aria-keyshortcuts="L"
          >
            Tidy layout
          </Button>
          <Button
            size="sm"
            variant="secondary"
            onClick={() => flow.fitView({ maxZoom: 1, padding: 0.2 })}
            aria-keyshortcuts="F"
          >
            Fit view
          </Button>
          <Button
            size="sm"
            variant="quiet"
            onClick={() => setHelp((h) => !h)}
            aria-expanded={help}
            aria-keyshortcuts="?"
          >
            Shortcuts
          </Button>
        </div>
      </header>
      {save.state.kind === 'conflict' ? (
        <ConflictBanner
          current={save.state.current}
          onTheirs={save.takeTheirs}
          onMine={save.keepMine}
        />
      ) : null}
      {save.kept && !view ? (
        <div
          role="status"
          className="flex flex-wrap items-center gap-3 border-b border-rule bg-phase-aqueous-soft px-4 py-1.5 text-small text-phase-aqueous-deep"
          data-kept-version
        >
          <span>
            Their version is open. Yours is kept on this computer: Undo brings it back, or restore
            it here.
          </span>
          <Button size="sm" variant="secondary" onClick={save.restoreMine}>
            Restore my version
          </Button>
          <Button size="sm" variant="quiet" onClick={save.dismissKept}>
            Discard my version
          </Button>
        </div>
      ) : null}
      {staleLocal ? (
        <p
          role="status"
          className="border-b border-rule bg-caution-advisory-soft px-4 py-1.5 text-small text-caution-advisory-deep"
        >
          This computer held edits made on an older version of the draft; the saved draft is shown.
          Use Undo history or ask whoever changed it.
        </p>
      ) : null}
      {restored ? (
        <p
          role="status"
          className="border-b border-rule bg-phase-aqueous-soft px-4 py-1.5 text-small text-phase-aqueous-deep"
        >
          Unsaved edits from this computer were restored and are being saved.
        </p>
      ) : null}
      <div className="flex min-h-0 flex-1">
        {canEdit ? <Palette /> : null}
        {/* The canvas draws only in its own area: a card panned or fitted past its edge is cut there. */}
        <div className="relative min-w-0 flex-1 overflow-hidden" ref={canvasBox}>
          <Canvas />
          {stepCount === 0 ? (
            <div className="pointer-events-none absolute inset-0 flex items-center justify-center">
              <div className="rounded-card border border-dashed border-rule-strong bg-paper/90 px-6 py-5 text-center">
                <p className="text-title font-medium">An empty canvas — start with a Charge</p>
                <p className="mt-1 max-w-sm text-body text-ink-muted">
                  Pick “Charge” in the list on the left (or press A, then Enter). Each step you add
                  next joins the selected one.
                </p>
              </div>
            </div>
          ) : null}
          {notice ? (
            <p
              role="alert"
              className="absolute top-2 left-1/2 max-w-[90%] -translate-x-1/2 rounded-control border border-caution-warning/50 bg-caution-warning-soft px-3 py-1 text-small text-caution-warning-deep"
            >
              {notice}
            </p>
          ) : null}
          {help ? <ShortcutHelp onClose={() => setHelp(false)} /> : null}
        </div>
        <aside
          aria-label="Step and results"
          className="flex w-96 shrink-0 flex-col border-l border-rule bg-paper-raised"
        >
          <div className="border-b border-rule p-3">
            <TotalsCard />
          </div>
          <div
            role="tablist"
            aria-label="Side panel"
            className="flex flex-wrap gap-x-0.5 gap-y-1 border-b border-rule bg-paper px-2 pt-1.5"
          >
            {[...viewTabs.map((v) => [v.id, v.label] as [string, string]), ...RESULT_TABS].map(
              ([id, label]) => (
                <button
                  key={id}
                  type="button"
                  role="tab"
                  id={`results-tab-${id}`}
                  aria-controls="results-panel"
                  aria-selected={tab === id}
                  onClick={() => setTab(id)}
                  className={`-mb-px flex shrink-0 items-center gap-1 rounded-t-control border px-2 py-1 text-small ${tab === id ? 'border-rule border-b-paper-raised bg-paper-raised font-medium text-ink' : 'border-transparent text-ink-muted hover:text-ink'}`}
                >
                  {label}
                  {id === 'cautions' && cautionCount ? (
                    <span
                      className="inline-flex items-center gap-1 tabular-nums"
                      data-caution-count={cautionCount}
                      data-worst={worst ?? ''}
                    >
                      {worst ? <SeverityMark severity={worst} /> : null}
                      <span>{cautionCount}</span>
                      {worst ? (
                        <span className="sr-only">, worst: {SEVERITY_LABEL[worst]}</span>
                      ) : null}
                    </span>
                  ) : null}
                </button>
              ),
            )}
          </div>
          <div
            role="tabpanel"
            id="results-panel"
            aria-labelledby={`results-tab-${tab}`}
            className="min-h-0 flex-1 overflow-y-auto p-3"
          >
            {viewTabs.some((v) => v.id === tab) ? (
              viewTabs.find((v) => v.id === tab)!.content
            ) : tab === 'step' ? (
              selected ? (
                <>
                  <h2 className="mb-2 text-title font-medium">
                    {KINDS[selected.kind].label}: {selected.name}
                  </h2>
                  {/* A disabled fieldset greys out every field for people who may only look. */}
                  <fieldset disabled={!canEdit} className="min-w-0">
                    <StepPanel key={selected.id} step={selected} compounds={compounds.data} />
                  </fieldset>
                  <StepPlot key={`plot-${selected.id}`} step={selected} />
                  {view ? null : (
                    <>
                      <StepSamplesPanel
                        key={`samples-${selected.id}`}
                        workspaceId={workspaceId}
                        routeId={route.id}
                        step={selected}
                      />
                      <AdvisorPanel
                        key={`advisor-${selected.id}`}
                        workspaceId={workspaceId}
                        routeName={route.name}
                        projectName={route.project?.name}
                        stepId={selected.id}
                      />
                    </>
                  )}
                </>
              ) : (
                <p className="text-small text-ink-muted">
                  Select a step on the canvas to see and change its settings.
                </p>
              )
            ) : tab === 'cautions' ? (
              <CautionList />
            ) : tab === 'streams' ? (
              <StreamTable />
            ) : tab === 'product' ? (
              <ProductFlow />
            ) : tab === 'purge' ? (
              <PurgePanel />
            ) : (
              <UncertaintyPanel />
            )}
          </div>
          {tab === 'step' && worst && cautionCount ? (
            <button
              type="button"
              onClick={() => setTab('cautions')}
              className="flex items-center gap-2 border-t border-rule bg-paper px-3 py-1.5 text-left text-caption text-ink-muted hover:bg-accent-soft"
              data-caution-summary
            >
              <SeverityChip severity={worst} />
              <span>
                {cautionCount} caution{cautionCount === 1 ? '' : 's'} on the route
                {selectedCautions ? `, ${selectedCautions} on this step` : ''} — show the list
              </span>
            </button>
          ) : null}
        </aside>
      </div>
    </div>
  );
}

/** The canvas grid the cards snap to [px]. */
const GRID = 20;
const ARROWS: Record<string, [number, number]> = {
  ArrowLeft: [-1, 0],
  ArrowRight: [1, 0],
  ArrowUp: [0, -1],
  ArrowDown: [0, 1],
};

/** Tidy layout: the steps wrapped in flow order to fit the canvas, then a readable view of them. */
function tidy(flow: ReactFlowInstance) {
  const st = useEditorStore.getState();
  const sizes: Record<string, { width: number; height: number }> = {};
  for (const n of flow.getNodes()) {
    const measured = flow.getInternalNode(n.id)?.measured;
    if (measured?.width && measured.height)
      sizes[n.id] = { width: measured.width, height: measured.height };
  }
  const pane = document.querySelector('.react-flow');
  st.setPositions(
    tidyLayout(st.doc, {
      sizes,
      pane: pane ? { width: pane.clientWidth, height: pane.clientHeight } : undefined,
    }),
  );
  requestAnimationFrame(() => fitReadable(flow));
}

/**
 * The whole route when it fits at a readable zoom; otherwise that zoom, on the
 * step just added or on the start of the route (the mini-map shows the rest).
 */
function fitReadable(flow: ReactFlowInstance, focusId?: string) {
  const nodes = flow.getNodes();
  if (!nodes.length) return;
  const pane = document.querySelector('.react-flow');
  const w = pane?.clientWidth ?? 800;
  const h = pane?.clientHeight ?? 600;
  // The drawn size is kept on the canvas's own copy of each card.
  const width = (n: (typeof nodes)[number]) =>
    flow.getInternalNode(n.id)?.measured.width ?? n.measured?.width ?? 240;
  const height = (n: (typeof nodes)[number]) =>
    flow.getInternalNode(n.id)?.measured.height ?? n.measured?.height ?? 150;
  const minX = Math.min(...nodes.map((n) => n.position.x));
  const maxX = Math.max(...nodes.map((n) => n.position.x + width(n)));
  const minY = Math.min(...nodes.map((n) => n.position.y));
  const maxY = Math.max(...nodes.map((n) => n.position.y + height(n)));
  const zoomAll = Math.min(w / ((maxX - minX) * 1.04), h / ((maxY - minY) * 1.04));
  if (zoomAll >= READABLE_ZOOM) {
    flow.fitView({ maxZoom: 1, padding: 0.02 });
    return;
  }
  const focus = focusId ? nodes.find((n) => n.id === focusId) : undefined;
  if (focus)
    flow.setCenter(focus.position.x + width(focus) / 2, focus.position.y + height(focus) / 2, {
      zoom: Math.max(flow.getZoom(), READABLE_ZOOM),
    });
  else
    flow.setViewport({
      x:
        (maxX - minX) * READABLE_ZOOM <= w
          ? (w - (maxX - minX) * READABLE_ZOOM) / 2 - minX * READABLE_ZOOM
          : 24 - minX * READABLE_ZOOM,
      y:
        (maxY - minY) * READABLE_ZOOM <= h
          ? h / 2 - ((minY + maxY) / 2) * READABLE_ZOOM
          : 16 - minY * READABLE_ZOOM,
      zoom: READABLE_ZOOM,
    });
}

type ResultTab = 'step' | 'cautions' | 'streams' | 'product' | 'purge' | 'uncertainty';
const RESULT_TABS: Array<[ResultTab, string]> = [
  ['step', 'Step'],
  ['cautions', 'Cautions'],
  ['streams', 'Streams'],
  ['product', 'Product flow'],
  ['purge', 'Purge'],
  ['uncertainty', 'Uncertainty'],
];

function SaveIndicator({ state, canEdit }: { state: SaveState; canEdit: boolean }) {
  if (!canEdit)
    return (
      <span
        className="min-w-0 truncate whitespace-nowrap text-small text-ink-muted"
        title="Read only — you can look but not change this route"
      >
        Read only — you can look but not change this route
      </span>
    );
  const text =
    state.kind === 'saved'
      ? `Draft saved ${formatDateTime(state.at)}`
      : state.kind === 'pending'
        ? 'Unsaved changes…'
        : state.kind === 'saving'
          ? 'Saving…'
          : state.kind === 'offline'
            ? `Not saved yet — kept on this computer (${state.message})`
            : 'Not saved: changed elsewhere';
  return (
    <span
      role="status"
      aria-live="polite"
      className={`max-w-[16rem] shrink-0 truncate whitespace-nowrap text-small ${state.kind === 'offline' || state.kind === 'conflict' ? 'text-caution-warning-deep' : 'text-ink-muted'}`}
      data-save-state={state.kind}
      title={text}
    >
      {text}
    </span>
  );
}

function ConflictBanner({
  current,
  onTheirs,
  onMine,
}: {
  current: DraftConflict['current'];
  onTheirs: (d: typeof current) => void;
  onMine: (d: typeof current) => void;
}) {
  return (
    <div
      role="alert"
      className="flex flex-wrap items-center gap-3 border-b border-caution-warning/50 bg-caution-warning-soft px-4 py-2 text-small text-caution-warning-deep"
    >
      <svg width="12" height="12" viewBox="0 0 10 10" aria-hidden="true">
        <path d="M5 0.5 L9.5 9.5 L0.5 9.5 Z" fill="#C4631D" />
      </svg>
      <span>
        <strong>This draft was changed elsewhere by {current.updatedBy?.name ?? 'someone'}</strong>{' '}
        ({formatDateTime(current.updatedAt)}). Your edits are not saved yet and nothing was
        overwritten.
      </span>
      <Button size="sm" variant="secondary" onClick={() => onTheirs(current)}>
        Reload their version
      </Button>
      <Button size="sm" variant="secondary" onClick={() => onMine(current)}>
        Keep mine
      </Button>
    </div>
  );
}

const SHORTCUTS: Array<[string, string]> = [
  ['A', 'Go to the step list; Enter adds the step'],
  ['Delete / Backspace', 'Delete the selected steps and connections'],
  ['Ctrl+Z', 'Undo'],
  ['Ctrl+Shift+Z or Ctrl+Y', 'Redo'],
  ['Ctrl+C / Ctrl+V', 'Copy and paste the selected steps'],
  ['Ctrl+A', 'Select everything'],
  ['Shift+click, Shift+drag', 'Select several steps'],
  ['Arrow keys', 'Move the selected steps (Shift: five grid steps)'],
  ['F', 'Fit the route in view'],
  ['L', 'Tidy the layout'],
  ['Esc', 'Clear the selection, close this panel'],
  ['?', 'Show or hide these shortcuts'],
];

function ShortcutHelp({ onClose }: { onClose: () => void }) {
  return (
    <section
      aria-label="Keyboard shortcuts"
      className="absolute top-3 right-3 z-10 w-80 rounded-card border border-rule bg-paper-raised p-3 shadow-overlay"
    >
      <div className="mb-2 flex items-center justify-between">
        <h2 className="text-title font-medium">Keyboard shortcuts</h2>
        <Button size="sm" variant="quiet" onClick={onClose}>
          Close
        </Button>
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-small">
        {SHORTCUTS.map(([k, d]) => (
          <div key={k} className="contents">
            <dt>
              <kbd className="rounded-control border border-rule bg-paper-sunken px-1 text-caption">
                {k}
              </kbd>
            </dt>
            <dd className="text-ink-muted">{d}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-2 text-caption text-ink-muted">
        Connections: drag from an output mark (right) to an input mark (left), or choose the source
        under “Inputs” in a step’s settings.
      </p>
    </section>
  );
}
