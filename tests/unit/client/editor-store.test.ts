import { beforeEach, describe, expect, it } from 'vitest';
import { READ_ONLY_NOTICE, useEditorStore } from '@/stores/editor-store';
import type { EditorDoc } from '@/features/editor/document';

const emptyRoute: EditorDoc = {
  schemaVersion: 1,
  referenceInput: { componentId: 'product', massKg: 1 },
  components: [],
  steps: [],
  connections: [],
};

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

describe('placing a new step', () => {
  it('puts it right of the selected step, or below when a card already stands there', () => {
    const store = useEditorStore.getState();
    store.load(emptyRoute);
    const first = store.addStep('charge');
    const second = useEditorStore.getState().addStep('wash');
    const at = (id: string) =>
      useEditorStore.getState().doc.steps.find((s) => s.id === id)!.position!;
    expect(at(second).x).toBeGreaterThan(at(first).x);
    // Add another step after the first one: the place right of it is taken by the second.
    useEditorStore.getState().select({ steps: [first] });
    const third = useEditorStore.getState().addStep('wash');
    expect(at(third).x).toBe(at(second).x);
    expect(at(third).y).toBeGreaterThan(at(second).y);
  });
});
