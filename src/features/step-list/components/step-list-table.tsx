import type { StepListDocument } from '@shared/schemas/step-list';

const fmt = (x: number, digits = 1) =>
  x.toLocaleString('en', { maximumFractionDigits: Math.abs(x) >= 100 ? 0 : digits });

/** The numbered operations with their conditions, volume, vessel check and cautions; prints as it shows. */
export function StepListTable({
  list,
  stepNames,
}: {
  list: StepListDocument;
  stepNames: Record<string, string>;
}) {
  const equipment = Object.fromEntries(list.equipment.map((e) => [e.stepId, e.name]));
  let previous = '';
  return (
    <ol className="divide-y divide-rule rounded-card border border-rule bg-paper-raised">
      {list.operations.map((op) => {
        const first = op.stepId !== previous;
        previous = op.stepId;
        return (
          <li
            key={op.number}
            className="break-inside-avoid px-3 py-2"
            aria-label={`Operation ${op.number}`}
          >
            {first ? (
              <p className="mb-1 text-caption font-medium tracking-wide text-ink-muted uppercase">
                {stepNames[op.stepId] ?? op.stepId}
                {equipment[op.stepId] ? ` · ${equipment[op.stepId]}` : ''}
              </p>
            ) : null}
            <div className="flex gap-3">
              <span className="w-8 shrink-0 text-right font-semibold tabular-nums">
                {op.number}.
              </span>
              <div className="min-w-0 flex-1">
                <p className="text-body text-ink">{op.text}</p>
                <p className="text-small text-ink-muted tabular-nums">
                  {[
                    op.temperatureC !== undefined ? `${fmt(op.temperatureC, 0)} °C` : null,
                    op.pressureMbar !== undefined ? `${fmt(op.pressureMbar, 0)} mbar` : null,
                    op.durationH !== undefined ? `${fmt(op.durationH, 2)} h` : null,
                    `volume after ${fmt(op.volumeAfterL)} L`,
                  ]
                    .filter(Boolean)
                    .join(' · ')}
                </p>
                {op.vesselCheck ? (
                  <p
                    className={
                      op.vesselCheck.ok
                        ? 'text-small text-ink-muted'
                        : 'text-small font-medium text-caution-hazard-deep'
                    }
                  >
                    <span
                      className={
                        op.vesselCheck.ok
                          ? 'mr-1 rounded-control bg-accent-soft px-1.5 text-caption font-medium text-accent-deep'
                          : 'mr-1 rounded-control bg-caution-hazard-soft px-1.5 text-caption font-medium text-caution-hazard-deep'
                      }
                    >
                      {op.vesselCheck.ok ? 'Vessel OK' : 'Vessel check'}
                    </span>
                    {op.vesselCheck.message}
                  </p>
                ) : null}
                {op.cautions.length > 0 ? (
                  <ul
                    className="mt-1 space-y-0.5"
                    aria-label={`Cautions of operation ${op.number}`}
                  >
                    {op.cautions.map((caution) => (
                      <li
                        key={caution}
                        className="flex gap-1.5 text-small text-caution-warning-deep"
                      >
                        <span
                          aria-hidden="true"
                          className="mt-[5px] inline-block size-2 shrink-0 rotate-45 bg-caution-warning"
                        />
                        <span>
                          <span className="sr-only">Caution: </span>
                          {caution}
                        </span>
                      </li>
                    ))}
                  </ul>
                ) : null}
              </div>
            </div>
          </li>
        );
      })}
    </ol>
  );
}
