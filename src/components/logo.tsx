/** The Phasewright mark: two liquid layers and a settled solid, in a rounded vessel. */
export function Logo({ className }: { className?: string }) {
  return (
    <span className={className}>
      <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true" className="shrink-0">
        <rect
          x="1"
          y="1"
          width="20"
          height="20"
          rx="6"
          fill="none"
          stroke="currentColor"
          strokeWidth="1.5"
        />
        <rect x="4" y="5" width="14" height="5" rx="1.5" className="fill-phase-organic" />
        <rect x="4" y="11" width="14" height="4" rx="1" className="fill-phase-aqueous" />
        <rect x="7" y="16" width="8" height="2" rx="1" className="fill-phase-solid" />
      </svg>
    </span>
  );
}
