import { useState, type FormEvent } from 'react';
import {
  EQUIPMENT_KIND_LABELS,
  EQUIPMENT_KINDS,
  equipmentCreateSchema,
  type Equipment,
  type EquipmentCreateInput,
  type EquipmentKind,
} from '@shared/schemas/equipment';
import { isApiError } from '@/api/client';
import { Button } from '@/components/button';
import { Select } from '@/components/select';
import { FieldError, TextField } from '@/components/text-field';
import { issuesToErrors, type FieldErrors } from '@/lib/use-form';

type NumberField = { key: string; label: string; unit: string; hint?: string };

const VESSEL_FIELDS: NumberField[] = [
  { key: 'nominalL', label: 'Nominal volume', unit: 'L' },
  {
    key: 'minStirrableL',
    label: 'Minimum stirrable volume',
    unit: 'L',
    hint: 'The least liquid the agitator still mixes.',
  },
  { key: 'maxWorkingL', label: 'Maximum working volume', unit: 'L' },
  { key: 'minC', label: 'Lowest temperature', unit: '°C' },
  { key: 'maxC', label: 'Highest temperature', unit: '°C' },
  { key: 'minMbar', label: 'Lowest pressure', unit: 'mbar', hint: 'Full vacuum the vessel takes.' },
  { key: 'maxMbar', label: 'Highest pressure', unit: 'mbar', hint: 'Absolute, e.g. 4000 mbar.' },
];
const UNIT_FIELDS: NumberField[] = [
  { key: 'areaM2', label: 'Area', unit: 'm²' },
  { key: 'capacityL', label: 'Capacity', unit: 'L', hint: 'Cake or charge volume it holds.' },
];

type Values = Record<string, string>;

function initialValues(item: Equipment | null): Values {
  if (!item) return { kind: 'vessel', name: '', material: '' };
  return Object.fromEntries(
    Object.entries(item)
      .filter(([key]) => !['id', 'createdAt', 'updatedAt'].includes(key))
      .map(([key, value]) => [key, String(value)]),
  );
}

/** Reads a typed number; an empty or unreadable field stays undefined so the schema names it. */
const toNumber = (text: string | undefined) => {
  if (text === undefined || text.trim() === '') return undefined;
  const value = Number(text.replace(',', '.'));
  return Number.isFinite(value) ? value : text;
};

type EquipmentFormProps = {
  item: Equipment | null;
  readOnly: boolean;
  busy: boolean;
  onSubmit: (input: EquipmentCreateInput) => Promise<void>;
  onCancel: () => void;
  onDelete?: () => void;
};

/** Add or change a vessel, filter or dryer; checked with the shared schema before it is sent. */
export function EquipmentForm({
  item,
  readOnly,
  busy,
  onSubmit,
  onCancel,
  onDelete,
}: EquipmentFormProps) {
  const [values, setValues] = useState<Values>(() => initialValues(item));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string>();
  const kind = values.kind as EquipmentKind;
  const fields = kind === 'vessel' ? VESSEL_FIELDS : UNIT_FIELDS;

  const set = (key: string, value: string) => {
    setValues((v) => ({ ...v, [key]: value }));
    setErrors(({ [key]: _dropped, ...rest }) => rest);
  };

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setFormError(undefined);
    const candidate: Record<string, unknown> = { kind, name: values.name };
    for (const field of fields) candidate[field.key] = toNumber(values[field.key]);
    if (kind === 'vessel') candidate.material = values.material;
    const parsed = equipmentCreateSchema.safeParse(candidate);
    if (!parsed.success) {
      setErrors(issuesToErrors(parsed.error.issues));
      return;
    }
    try {
      await onSubmit(parsed.data);
    } catch (error) {
      if (isApiError(error) && Object.keys(error.fieldErrors()).length > 0) {
        setErrors(error.fieldErrors());
        setFormError(undefined);
      } else setFormError(error instanceof Error ? error.message : 'Something went wrong.');
    }
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      className="space-y-4"
      aria-label={item ? `Equipment ${item.name}` : 'Add equipment'}
    >
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <Select
          label="Kind"
          value={kind}
          disabled={readOnly || item !== null}
          options={EQUIPMENT_KINDS.map((k) => ({ value: k, label: EQUIPMENT_KIND_LABELS[k] }))}
          onValueChange={(value) => set('kind', value)}
        />
        <TextField
          label="Name"
          className="sm:col-span-2"
          value={values.name ?? ''}
          onValueChange={(value) => set('name', value)}
          error={errors.name}
          readOnly={readOnly}
          hint="The plant tag, e.g. R-101."
          maxLength={120}
        />
      </div>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        {fields.map((field) => (
          <TextField
            key={field.key}
            label={`${field.label} (${field.unit})`}
            inputMode="decimal"
            value={values[field.key] ?? ''}
            onValueChange={(value) => set(field.key, value)}
            error={errors[field.key]}
            hint={field.hint}
            readOnly={readOnly}
          />
        ))}
        {kind === 'vessel' ? (
          <TextField
            label="Material of construction"
            value={values.material ?? ''}
            onValueChange={(value) => set('material', value)}
            error={errors.material}
            hint="E.g. glass-lined steel, 316L, Hastelloy."
            readOnly={readOnly}
            maxLength={120}
          />
        ) : null}
      </div>
      {errors.kind ? <FieldError>{errors.kind}</FieldError> : null}
      {formError ? <FieldError>{formError}</FieldError> : null}
      <div className="flex flex-wrap gap-2">
        {readOnly ? null : (
          <Button type="submit" busy={busy}>
            {item ? 'Save changes' : `Add the ${EQUIPMENT_KIND_LABELS[kind].toLowerCase()}`}
          </Button>
        )}
        <Button type="button" variant="secondary" onClick={onCancel}>
          {readOnly ? 'Close' : 'Cancel'}
        </Button>
        {onDelete && !readOnly ? (
          <Button type="button" variant="danger" className="ml-auto" onClick={onDelete}>
            Delete
          </Button>
        ) : null}
      </div>
    </form>
  );
}
