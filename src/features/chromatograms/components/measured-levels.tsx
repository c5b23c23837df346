import { Table, Td, Th } from '@/components/table';
import type { ChromatogramSummary } from '@shared/schemas/chromatograms';
import type { PredictedLevel } from '@shared/chromatography/levels';
import { fmt } from './format';

export interface LevelRow {
  componentId: string;
  name: string;
  measuredPct: number | null;
  predictedPct: number | null;
}

/** Measured area % of each assigned component beside the level the route predicts at the step. */
export function levelRows(
  sample: Pick<ChromatogramSummary, 'peaks'>,
  predicted: PredictedLevel[],
  names: Record<string, string>,
): LevelRow[] {
  const measured = new Map<string, number>();
  for (const p of sample.peaks)
    if (p.componentId) measured.set(p.componentId, (measured.get(p.componentId) ?? 0) + p.areaPct);
  const ids = [...new Set([...measured.keys(), ...predicted.map((p) => p.componentId)])];
  return ids
    .map((id) => ({
      componentId: id,
      name: names[id] ?? predicted.find((p) => p.componentId === id)?.name ?? id,
      measuredPct: measured.get(id) ?? null,
      predictedPct: predicted.find((p) => p.componentId === id)?.levelPct ?? null,
    }))
    .filter((r) => r.measuredPct !== null);
}

export function MeasuredLevels({
  rows,
  caption,
  evaluated,
}: {
  rows: LevelRow[];
  caption: string;
  evaluated: boolean;
}) {
  if (!rows.length)
    return (
      <p className="text-small text-ink-muted">
        Assign peaks to the route’s compounds to see the measured levels beside the predicted ones.
      </p>
    );
  return (
    <div>
      <Table caption={caption}>
        <thead>
          <tr>
            <Th>Compound</Th>
            <Th className="text-right">Measured (area %)</Th>
            <Th className="text-right">Predicted (%)</Th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.componentId} data-component={r.componentId}>
              <Td>{r.name}</Td>
              <Td className="text-right tabular-nums" data-measured>
                {r.measuredPct === null ? '—' : fmt.pct(r.measuredPct)}
              </Td>
              <Td className="text-right tabular-nums" data-predicted>
                {r.predictedPct === null
                  ? evaluated
                    ? 'not in this stream'
                    : '…'
                  : fmt.pct(r.predictedPct)}
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
      <p className="mt-1 text-caption text-ink-faint">
        Predicted: the compound’s share of all compounds in the stream leaving the step. Area %
        equals it only when every compound gives the same detector response per mass; no response
        factors are applied.
      </p>
    </div>
  );
}
