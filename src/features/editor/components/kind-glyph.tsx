import type { StepKind } from '@shared/schemas/route';

/** A small line drawing per step kind (our own: vessels, layers, a funnel, a tray). */
export function KindGlyph({
  kind,
  className = 'text-ink-muted',
}: {
  kind: StepKind;
  className?: string;
}) {
  const common = {
    width: 20,
    height: 20,
    viewBox: '0 0 20 20',
    fill: 'none',
    stroke: 'currentColor',
    strokeWidth: 1.4,
    'aria-hidden': true,
    className: `shrink-0 ${className}`,
  } as const;
  switch (kind) {
    case 'charge':
      return (
        <svg {...common}>
          <path d="M4 6h12v9a2 2 0 0 1-2 2H6a2 2 0 0 1-2-2Z" />
          <path d="M10 1v6M7.5 4.5 10 7l2.5-2.5" />
        </svg>
      );
    case 'wash':
    case 'extraction':
      return (
        <svg {...common}>
          <path d="M6 2h8l-1 4v8a3 3 0 0 1-6 0V6Z" />
          <path d="M7 10h6" strokeDasharray={kind === 'wash' ? '1.5 1.5' : undefined} />
        </svg>
      );
    case 'distillation':
      return (
        <svg {...common}>
          <circle cx="7" cy="13" r="4" />
          <path d="M7 9V4h4l6 6" />
          <path d="M15 14v3" strokeDasharray="1 1.5" />
        </svg>
      );
    case 'crystallisation':
      return (
        <svg {...common}>
          <path d="M4 4v11a2 2 0 0 0 2 2h8a2 2 0 0 0 2-2V4" />
          <path d="m8 12 2-2 2 2-2 2Z" />
          <path d="m12 8 1-1 1 1-1 1Z" />
        </svg>
      );
    case 'filtration':
      return (
        <svg {...common}>
          <path d="M3 4h14l-5 6v6l-4 1.5V10Z" />
        </svg>
      );
    case 'drying':
      return (
        <svg {...common}>
          <rect x="3" y="11" width="14" height="5" rx="1" />
          <path d="M7 8c0-2 2-2 2-4M11 8c0-2 2-2 2-4" />
        </svg>
      );
    case 'quench':
      return (
        <svg {...common}>
          <path d="M5 3h10M6 3v5l-3 8a1 1 0 0 0 1 1h12a1 1 0 0 0 1-1l-3-8V3" />
          <path d="M8 12h1M11 14h1" />
        </svg>
      );
    case 'ph-adjust':
      return (
        <svg {...common}>
          <path d="M3 17 17 3" />
          <path d="M4 6h4M6 4v4M12 14h4" />
        </svg>
      );
    case 'carbon-treatment':
      return (
        <svg {...common}>
          <circle cx="7" cy="8" r="2" />
          <circle cx="13" cy="9" r="2.5" />
          <circle cx="9" cy="14" r="2" />
        </svg>
      );
    case 'polish-filtration':
      return (
        <svg {...common}>
          <path d="M3 10h14" strokeDasharray="2 1.5" />
          <path d="M10 3v4M10 13v4" />
        </svg>
      );
    case 'split':
      return (
        <svg {...common}>
          <path d="M2 10h6l8-6M8 10l8 6" />
        </svg>
      );
    case 'merge':
      return (
        <svg {...common}>
          <path d="M2 4l8 6h8M2 16l8-6" />
        </svg>
      );
  }
}
