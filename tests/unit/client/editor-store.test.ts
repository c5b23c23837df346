import { beforeEach, describe, expect, it } from 'vitest';
import { READ_ONLY_NOTICE, useEditorStore } from '@/stores/editor-store';
import type { EditorDoc } from '@/features/editor/document';

const emptyRoute: EditorDoc = { schemaVersion: 1, referenceInput: { componentId: 'product', massKg: 1 }, components: [], steps: [], connections: [] };

describe('editor store', () => {
  beforeEach(() => useEditorStore.getState().load(emptyRoute));

  it('records an added step in the history so that undo takes it away', () => {
    const store = useEditorStore.getState();
    store.addStep('charge');
    expect(useEditorStore.getState().doc.steps).toHaveLength(1);
    useEditorStore.getState().undo();
    expect(useEditorStore.getState().doc.steps).toHaveLength(0);
  });

  it('refuses every edit of a route opened read-only, with a plain note', () => {
    const store = useEditorStore.getState();
    store.load(emptyRoute, { readOnly: true });
    store.addStep('charge');
    store.paste();
    store.setPositions({});
    const after = useEditorStore.getState();
    expect(after.doc).toBe(emptyRoute);
    expect(after.past).toHaveLength(0);
    expect(after.notice).toBe(READ_ONLY_NOTICE);
  });

  it('opens the next route editable again', () => {
    useEditorStore.getState().load(emptyRoute, { readOnly: true });
    useEditorStore.getState().load(emptyRoute);
    useEditorStore.getState().addStep('charge');
    expect(useEditorStore.getState().doc.steps).toHaveLength(1);
  });
});
