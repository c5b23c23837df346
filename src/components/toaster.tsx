import { useToasts } from '@/stores/toasts';
import { cn } from './cn';

const tones = {
  success: 'border-l-phase-aqueous',
  error: 'border-l-caution-hazard',
  info: 'border-l-caution-info',
} as const;

/**
 * Messages in the bottom-right corner. Only their dismiss buttons take the
 * pointer: a click anywhere else on a message reaches the control beneath it,
 * so a message never blocks the row or button it happens to cover.
 */
export function Toaster() {
  const toasts = useToasts((s) => s.toasts);
  const dismiss = useToasts((s) => s.dismiss);
  return (
    <div
      aria-live="polite"
      className="pointer-events-none fixed right-4 bottom-4 z-50 flex w-80 flex-col gap-2"
    >
      {toasts.map((t) => (
        <div
          key={t.id}
          role={t.tone === 'error' ? 'alert' : 'status'}
          className={cn(
            'flex items-start gap-3 rounded-card border border-rule border-l-4 bg-paper-raised px-3 py-2 shadow-overlay',
            tones[t.tone],
          )}
        >
          <p className="flex-1 text-body text-ink">{t.message}</p>
          <button
            type="button"
            onClick={() => dismiss(t.id)}
            className="pointer-events-auto rounded-control px-1 text-small text-ink-muted hover:text-ink"
            aria-label="Dismiss message"
          >
            ✕
          </button>
        </div>
      ))}
    </div>
  );
}
