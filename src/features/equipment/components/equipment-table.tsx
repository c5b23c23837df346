import { EQUIPMENT_KIND_LABELS, type Equipment } from '@shared/schemas/equipment';
import { Button } from '@/components/button';
import { Table, Td, Th } from '@/components/table';

const litres = (value: number) => `${value.toLocaleString('en', { maximumFractionDigits: 1 })} L`;

/** One row per vessel, filter or dryer, with the numbers the step list checks against. */
export function EquipmentTable({
  items,
  canWrite,
  selectedId,
  onOpen,
}: {
  items: Equipment[];
  canWrite: boolean;
  selectedId?: string;
  onOpen: (item: Equipment) => void;
}) {
  return (
    <Table caption="Equipment of this workspace">
      <thead>
        <tr>
          <Th>Name</Th>
          <Th>Kind</Th>
          <Th className="text-right">Working range</Th>
          <Th className="text-right">Nominal / capacity</Th>
          <Th className="text-right">Temperature</Th>
          <Th className="text-right">Pressure</Th>
          <Th>Material / area</Th>
          <Th>
            <span className="sr-only">Actions</span>
          </Th>
        </tr>
      </thead>
      <tbody>
        {items.map((item) => (
          <tr key={item.id} className={item.id === selectedId ? 'bg-accent-soft' : undefined}>
            <Td className="font-medium">{item.name}</Td>
            <Td>{EQUIPMENT_KIND_LABELS[item.kind]}</Td>
            {item.kind === 'vessel' ? (
              <>
                <Td className="text-right tabular-nums">
                  {litres(item.minStirrableL)} – {litres(item.maxWorkingL)}
                </Td>
                <Td className="text-right tabular-nums">{litres(item.nominalL)}</Td>
                <Td className="text-right tabular-nums">
                  {item.minC} to {item.maxC} °C
                </Td>
                <Td className="text-right tabular-nums">
                  {item.minMbar} – {item.maxMbar} mbar
                </Td>
                <Td>{item.material}</Td>
              </>
            ) : (
              <>
                <Td className="text-right text-ink-faint">—</Td>
                <Td className="text-right tabular-nums">{litres(item.capacityL)}</Td>
                <Td className="text-right text-ink-faint">—</Td>
                <Td className="text-right text-ink-faint">—</Td>
                <Td className="tabular-nums">{item.areaM2} m²</Td>
              </>
            )}
            <Td className="text-right">
              <Button size="sm" variant="quiet" onClick={() => onOpen(item)}>
                {canWrite ? 'Edit' : 'View'}
                <span className="sr-only"> {item.name}</span>
              </Button>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
