import { useEditorStore } from '@/stores/editor-store';
import { KIND_ORDER, KINDS } from '../step-kinds';
import { KindGlyph } from './kind-glyph';
import { PALETTE_MIME } from './canvas';

/** Step kinds to add: click or Enter adds one (joined to the selected step), or drag one onto the canvas. */
export function Palette() {
  const addStep = useEditorStore((s) => s.addStep);
  const groups = [...new Set(KIND_ORDER.map((k) => KINDS[k].group))];
  return (
    <nav aria-label="Add a step" className="flex h-full w-48 shrink-0 flex-col overflow-y-auto border-r border-rule bg-paper-sunken px-2 py-2" id="step-palette">
      <p className="px-1 pb-1 text-caption text-ink-muted">Click, press Enter or drag onto the canvas. A new step joins the selected one.</p>
      {groups.map((g) => (
        <div key={g} className="mt-2">
          <p className="px-1 text-caption font-medium uppercase tracking-wide text-ink-faint">{g}</p>
          <ul>
            {KIND_ORDER.filter((k) => KINDS[k].group === g).map((k) => (
              <li key={k}>
                <button
                  type="button"
                  draggable
                  onDragStart={(e) => {
                    e.dataTransfer.setData(PALETTE_MIME, k);
                    e.dataTransfer.effectAllowed = 'copy';
                  }}
                  onClick={() => addStep(k)}
                  title={KINDS[k].purpose}
                  aria-label={`Add ${KINDS[k].label}`}
                  data-kind={k}
                  className="flex w-full items-center gap-2 rounded-control px-1.5 py-1 text-left text-small text-ink hover:bg-paper-raised focus-visible:outline-2 focus-visible:outline-accent"
                >
                  <KindGlyph kind={k} />
                  {KINDS[k].label}
                </button>
              </li>
            ))}
          </ul>
        </div>
      ))}
    </nav>
  );
}
