/**
 * Draft autosave: a debounced PUT with the version the edits are based on.
 * Every change is first kept in localStorage, so a dropped connection or a
 * closed tab loses nothing; a 409 shows who changed the draft elsewhere and
 * waits for the chemist's choice — never a silent overwrite.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import { useEditorStore } from '@/stores/editor-store';
import { saveDraft } from '@/features/routes';
import type { Draft, DraftConflict } from '@/features/routes';
import type { EditorDoc } from './document';
import { normaliseDocument } from './document';

const DEBOUNCE_MS = 800;
const key = (routeId: string) => `phasewright.draft.${routeId}`;
/** The chemist's own version, kept when they took someone else's after a conflict. */
const keptKey = (routeId: string) => `phasewright.draft.${routeId}.kept`;

export function readKeptCopy(routeId: string): EditorDoc | null {
  try {
    const raw = localStorage.getItem(keptKey(routeId));
    return raw ? (JSON.parse(raw) as { document: EditorDoc }).document : null;
  } catch {
    return null;
  }
}
function writeKeptCopy(routeId: string, document: EditorDoc | null) {
  try {
    if (document)
      localStorage.setItem(
        keptKey(routeId),
        JSON.stringify({ document, keptAt: new Date().toISOString() }),
      );
    else localStorage.removeItem(keptKey(routeId));
  } catch {
    /* storage full or disabled: Undo still brings it back in this tab */
  }
}

type LocalCopy = { document: EditorDoc; baseVersion: number; savedAt: string; dirty: boolean };

export function readLocalCopy(routeId: string): LocalCopy | null {
  try {
    const raw = localStorage.getItem(key(routeId));
    return raw ? (JSON.parse(raw) as LocalCopy) : null;
  } catch {
    return null;
  }
}
function writeLocalCopy(routeId: string, copy: LocalCopy) {
  try {
    localStorage.setItem(key(routeId), JSON.stringify(copy));
  } catch {
    /* storage full or disabled: the server copy still saves */
  }
}

export type SaveState =
  | { kind: 'saved'; at: string }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'offline'; message: string }
  | { kind: 'conflict'; current: DraftConflict['current'] };

/** Choose the starting document: the server's draft, or this computer's unsaved edits made on the same version. */
export function initialDocument(
  routeId: string,
  draft: Draft,
): { doc: EditorDoc; restored: boolean; staleLocal: LocalCopy | null } {
  const local = readLocalCopy(routeId);
  if (local?.dirty && local.baseVersion === draft.version)
    return { doc: local.document, restored: true, staleLocal: null };
  if (local?.dirty && local.baseVersion !== draft.version)
    return { doc: normaliseDocument(draft.document), restored: false, staleLocal: local };
  return { doc: normaliseDocument(draft.document), restored: false, staleLocal: null };
}

export function useAutosave(
  workspaceId: string,
  routeId: string,
  draft: Draft,
  canEdit: boolean,
  startDirty: boolean,
) {
  const base = useRef(draft.version);
  const [state, setState] = useState<SaveState>({ kind: 'saved', at: draft.updatedAt });
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const saving = useRef(false);
  const again = useRef(false);
  const blocked = useRef(false);
  const [kept, setKept] = useState<EditorDoc | null>(() => readKeptCopy(routeId));

  const flush = useCallback(async () => {
    if (!canEdit || blocked.current) return;
    if (saving.current) {
      again.current = true;
      return;
    }
    saving.current = true;
    setState({ kind: 'saving' });
    const doc = useEditorStore.getState().doc;
    try {
      const outcome = await saveDraft(workspaceId, routeId, doc, base.current);
      if (outcome.kind === 'saved') {
        base.current = outcome.reply.version;
        const stillSame = useEditorStore.getState().doc === doc;
        writeLocalCopy(routeId, {
          document: useEditorStore.getState().doc,
          baseVersion: base.current,
          savedAt: new Date().toISOString(),
          dirty: !stillSame,
        });
        setState(stillSame ? { kind: 'saved', at: outcome.reply.updatedAt } : { kind: 'pending' });
        if (!stillSame) again.current = true;
      } else {
        blocked.current = true;
        setState({ kind: 'conflict', current: outcome.conflict.current });
      }
    } catch (error) {
      setState({
        kind: 'offline',
        message: error instanceof Error ? error.message : 'The draft could not be saved.',
      });
    } finally {
      saving.current = false;
      if (again.current && !blocked.current) {
        again.current = false;
        timer.current = setTimeout(flush, DEBOUNCE_MS);
      }
    }
  }, [workspaceId, routeId, canEdit]);

  useEffect(() => {
    if (startDirty && canEdit) void flush();
    const unsub = useEditorStore.subscribe((s, prev) => {
      if (s.doc === prev.doc || s.docRevision === prev.docRevision) return;
      writeLocalCopy(routeId, {
        document: s.doc,
        baseVersion: base.current,
        savedAt: new Date().toISOString(),
        dirty: true,
      });
      if (!canEdit || blocked.current) return;
      setState({ kind: 'pending' });
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(flush, DEBOUNCE_MS);
    });
    const retry = () => void flush();
    window.addEventListener('online', retry);
    return () => {
      unsub();
      window.removeEventListener('online', retry);
      if (timer.current) clearTimeout(timer.current);
    };
  }, [flush, routeId, canEdit, startDirty]);

  /**
   * Take the other version: their document replaces mine as one edit, so Undo
   * brings mine back; mine is also kept on this computer until dismissed.
   */
  const takeTheirs = useCallback(
    (current: DraftConflict['current']) => {
      const mine = useEditorStore.getState().doc;
      writeKeptCopy(routeId, mine);
      setKept(mine);
      base.current = current.version;
      // Still blocked while theirs comes in, so it is not saved back as a change.
      useEditorStore.getState().replaceDocument(normaliseDocument(current.document));
      blocked.current = false;
      writeLocalCopy(routeId, {
        document: useEditorStore.getState().doc,
        baseVersion: current.version,
        savedAt: new Date().toISOString(),
        dirty: false,
      });
      setState({ kind: 'saved', at: current.updatedAt });
    },
    [routeId],
  );

  /** Keep mine: save it on top of their version, knowingly. */
  const keepMine = useCallback(
    (current: DraftConflict['current']) => {
      base.current = current.version;
      blocked.current = false;
      void flush();
    },
    [flush],
  );

  /** Puts the kept version back (it is then saved on top of theirs, knowingly). */
  const restoreMine = useCallback(() => {
    if (!kept) return;
    useEditorStore.getState().replaceDocument(kept);
    writeKeptCopy(routeId, null);
    setKept(null);
  }, [kept, routeId]);
  const dismissKept = useCallback(() => {
    writeKeptCopy(routeId, null);
    setKept(null);
  }, [routeId]);

  /** Saves pending edits now; answers the draft version on the server, or null when it could not be saved. */
  const saveNow = useCallback(async (): Promise<number | null> => {
    if (!canEdit) return base.current;
    if (timer.current) clearTimeout(timer.current);
    const idle = async () => {
      for (let i = 0; i < 100 && saving.current; i += 1)
        await new Promise((resolve) => setTimeout(resolve, 100));
    };
    await idle();
    if (readLocalCopy(routeId)?.dirty) await flush();
    await idle();
    return blocked.current || readLocalCopy(routeId)?.dirty ? null : base.current;
  }, [canEdit, flush, routeId]);

  return {
    state,
    kept,
    restoreMine,
    dismissKept,
    saveNow,
    takeTheirs,
    keepMine,
    flush,
    conflictFrom: (d: Draft) => setState({ kind: 'conflict', current: d }),
    block: () => {
      blocked.current = true;
    },
  };
}
