import { useState, memo } from 'react';
import { useEditorStore } from '@/stores/editor-store';
import { KIND_ORDER, KINDS } from '../step-kinds';
import { KindGlyph } from './kind-glyph';
import { PALETTE_MIME } from './canvas';

const COLLAPSE_KEY = 'phasewright:step-list-collapsed';

function remembered(): boolean {
  try {
    return localStorage.getItem(COLLAPSE_KEY) === '1';
  } catch {
    return false;
  }
}

/**
 * Step kinds to add: click or Enter adds one (joined to the selected step), or drag one onto the canvas.
 * The list folds to its marks (names stay as tooltips and accessible names) to give the canvas room.
 */
function PaletteImpl() {
  const addStep = useEditorStore((s) => s.addStep);
  const [collapsed, setCollapsed] = useState(remembered);
  const toggle = () => {
    setCollapsed((c) => {
      try {
        localStorage.setItem(COLLAPSE_KEY, c ? '0' : '1');
      } catch {
        /* private mode: the choice lasts for this page only */
      }
      return !c;
    });
  };
  const groups = [...new Set(KIND_ORDER.map((k) => KINDS[k].group))];
  return (
    <nav
      aria-label="Add a step"
      className={`flex h-full shrink-0 flex-col overflow-y-auto border-r border-rule bg-paper-sunken py-2 ${collapsed ? 'w-12 px-1' : 'w-44 px-2'}`}
      id="step-palette"
      data-collapsed={collapsed ? 'true' : 'false'}
    >
      <button
        type="button"
        onClick={toggle}
        aria-expanded={!collapsed}
        aria-controls="step-palette-list"
        title={collapsed ? 'Show the step names' : 'Fold the step list to its marks'}
        className={`mb-1 flex items-center gap-1.5 rounded-control px-1.5 py-1 text-caption text-ink-muted hover:bg-paper-raised hover:text-ink focus-visible:outline-2 focus-visible:outline-accent ${collapsed ? 'justify-center' : ''}`}
        data-palette-toggle
      >
        <svg
          width="12"
          height="12"
          viewBox="0 0 12 12"
          aria-hidden="true"
          className={collapsed ? 'rotate-180' : ''}
        >
          <path d="M7.5 2.5 4 6l3.5 3.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
        </svg>
        <span className={collapsed ? 'sr-only' : ''}>
          {collapsed ? 'Show step names' : 'Fold step list'}
        </span>
      </button>
      <div id="step-palette-list">
        {collapsed ? null : (
          <p className="px-1 pb-1 text-caption text-ink-muted">
            Click, Enter or drag onto the canvas; a new step joins the selected one.
          </p>
        )}
        {groups.map((g) => (
          <div
            key={g}
            className={collapsed ? 'mt-1 border-t border-rule pt-1 first:border-0' : 'mt-2'}
          >
            <p
              className={
                collapsed
                  ? 'sr-only'
                  : 'px-1 text-caption font-medium uppercase tracking-wide text-ink-faint'
              }
            >
              {g}
            </p>
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
                    title={collapsed ? `${KINDS[k].label} — ${KINDS[k].purpose}` : KINDS[k].purpose}
                    aria-label={`Add ${KINDS[k].label}`}
                    data-kind={k}
                    className={`flex w-full items-center gap-2 rounded-control py-1 text-left text-small text-ink hover:bg-paper-raised focus-visible:outline-2 focus-visible:outline-accent ${collapsed ? 'justify-center px-0 py-1.5' : 'px-1.5'}`}
                  >
                    <KindGlyph kind={k} />
                    {collapsed ? null : KINDS[k].label}
                  </button>
                </li>
              ))}
            </ul>
          </div>
        ))}
      </div>
    </nav>
  );
}

/** Drawn again only for its own state, not with every edit of the route. */
export const Palette = memo(PaletteImpl);
