import { cn } from './cn';

export function Spinner({ size = 'md', className }: { size?: 'sm' | 'md'; className?: string }) {
  return (
    <span
      aria-hidden="true"
      className={cn(
        'inline-block animate-spin rounded-full border-2 border-current border-r-transparent',
        size === 'sm' ? 'size-3.5' : 'size-5',
        className,
      )}
    />
  );
}

/** A block that says something is loading; announced to screen readers. */
export function Loading({ label = 'Loading…', className }: { label?: string; className?: string }) {
  return (
    <div role="status" className={cn('flex items-center gap-2 py-6 text-ink-muted', className)}>
      <Spinner className="text-accent" />
      <span>{label}</span>
    </div>
  );
}
