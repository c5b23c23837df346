import { useEffect, useId, useRef, useState } from 'react';
import {
  COMPOUND_ROLE_LABELS,
  COMPOUND_ROLES,
  SOLUBILITY_UNITS,
  type Compound,
  type CompoundRole,
} from '@shared/schemas/compounds';
import type { SolventSummary } from '@shared/schemas/solvents';
import { isApiError } from '@/api/client';
import { Button } from '@/components/button';
import { cn } from '@/components/cn';
import { FormMessage } from '@/components/error-state';
import { Select } from '@/components/select';
import { FieldError, inputClass, TextField } from '@/components/text-field';
import type { FieldErrors } from '@/lib/use-form';
import { useStructurePreview } from '../api/preview-structure';
import { checkDraft, draftFromCompound, emptyDraft, type CompoundDraft } from './compound-draft';
import { StructurePanel } from './structure-panel';

function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}

const NEEDS_ATTENTION = 'Some fields need attention: they are marked below.';

/** The errors without those of one field of the draft (and of its rows). */
function withoutField(errors: FieldErrors, key: string): FieldErrors {
  const kept = Object.entries(errors).filter(([k]) => k !== key && !k.startsWith(`${key}.`));
  return kept.length === Object.keys(errors).length ? errors : Object.fromEntries(kept);
}

type Props = {
  compound: Compound | null;
  solvents: SolventSummary[];
  readOnly: boolean;
  busy: boolean;
  onSubmit: (draft: ReturnType<typeof checkDraft> & { ok: true }) => Promise<unknown>;
  onCancel: () => void;
  onDelete?: () => void;
};

/** Add or edit a compound: structure with a live preview, then the chemist's own data in small tables. */
export function CompoundForm({
  compound,
  solvents,
  readOnly,
  busy,
  onSubmit,
  onCancel,
  onDelete,
}: Props) {
  const [draft, setDraft] = useState<CompoundDraft>(() =>
    compound ? draftFromCompound(compound) : emptyDraft(),
  );
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string>();
  /** Problems only the server can judge (a name in use, a structure it cannot read). */
  const fromServer = useRef(new Set<string>());
  const set = <K extends keyof CompoundDraft>(key: K, value: CompoundDraft[K]) => {
    setDraft((d) => ({ ...d, [key]: value }));
    // A changed field drops the server's word on it (the next save checks it again).
    for (const k of fromServer.current)
      if (k === key || k.startsWith(`${key}.`)) fromServer.current.delete(k);
    setErrors((e) => withoutField(e, key));
  };
  // Once problems are shown, each goes as soon as its field is fixed, and says the current
  // problem while it is not: the draft is checked again on every change.
  useEffect(() => {
    setErrors((shown) => {
      if (!Object.keys(shown).length) return shown;
      const checked = checkDraft(draft);
      const now: FieldErrors = checked.ok ? {} : checked.errors;
      const next: FieldErrors = {};
      for (const [k, m] of Object.entries(shown)) {
        if (k in now) next[k] = now[k];
        else if (fromServer.current.has(k)) next[k] = m;
      }
      const same =
        Object.keys(next).length === Object.keys(shown).length &&
        Object.entries(next).every(([k, m]) => shown[k] === m);
      return same ? shown : next;
    });
  }, [draft]);
  useEffect(() => {
    if (!Object.keys(errors).length) setFormError((f) => (f === NEEDS_ATTENTION ? undefined : f));
  }, [errors]);

  const structureText = (draft.structureKind === 'smiles' ? draft.smiles : draft.molfile).trim()
    ? draft.structureKind === 'smiles'
      ? draft.smiles.trim()
      : draft.molfile
    : '';
  const debounced = useDebounced(
    structureText
      ? draft.structureKind === 'smiles'
        ? { smiles: structureText }
        : { molfile: structureText }
      : null,
    400,
  );
  const preview = useStructurePreview(debounced);
  const structureError = isApiError(preview.error, 422) ? preview.error.message : undefined;

  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setFormError(undefined);
    const checked = checkDraft(draft);
    if (!checked.ok) {
      setErrors(checked.errors);
      setFormError(NEEDS_ATTENTION);
      return;
    }
    setErrors({});
    try {
      await onSubmit(checked);
    } catch (error) {
      if (isApiError(error)) {
        const fields = error.fieldErrors();
        fromServer.current = new Set(Object.keys(fields));
        setErrors(fields);
        setFormError(error.message);
      } else
        setFormError(error instanceof Error ? error.message : 'Something went wrong. Try again.');
    }
  };

  const solventOptions = [
    { value: '', label: 'Choose a solvent…' },
    ...solvents.map((s) => ({ value: s.id, label: s.name })),
  ];
  const partitionSolvents = [
    { value: '', label: 'Choose a solvent…' },
    ...solvents
      .filter((s) => s.waterMiscibility === 'partial' && s.id !== 'water')
      .map((s) => ({ value: s.id, label: s.name })),
  ];

  return (
    <form
      noValidate
      onSubmit={submit}
      aria-label={compound ? `Compound ${compound.name}` : 'Add a compound'}
      className="space-y-5"
    >
      {formError ? <FormMessage tone="error">{formError}</FormMessage> : null}
      <fieldset disabled={readOnly} className="grid grid-cols-[minmax(0,1fr)_20rem] gap-6">
        <div className="space-y-4">
          <div className="grid grid-cols-[minmax(0,1fr)_11rem] gap-3">
            <TextField
              label="Name"
              value={draft.name}
              onValueChange={(v) => set('name', v)}
              error={errors.name}
              autoComplete="off"
            />
            <Select
              label="Role"
              value={draft.role}
              onValueChange={(v) => set('role', v as CompoundRole)}
              options={COMPOUND_ROLES.map((r) => ({ value: r, label: COMPOUND_ROLE_LABELS[r] }))}
            />
          </div>
          <div className="space-y-1.5">
            <div
              role="radiogroup"
              aria-label="Structure given as"
              className="flex gap-4 text-small"
            >
              {(['smiles', 'molfile'] as const).map((kind) => (
                <label key={kind} className="flex items-center gap-1.5">
                  <input
                    type="radio"
                    name="structure-kind"
                    checked={draft.structureKind === kind}
                    onChange={() => set('structureKind', kind)}
                    className="accent-accent"
                  />
                  {kind === 'smiles' ? 'SMILES' : 'Paste a molfile'}
                </label>
              ))}
            </div>
            {draft.structureKind === 'smiles' ? (
              <TextField
                label="SMILES"
                value={draft.smiles}
                onValueChange={(v) => set('smiles', v)}
                error={errors.smiles ?? structureError}
                hint="For example CC(=O)OCC. The preview updates as you type."
                spellCheck={false}
                autoComplete="off"
              />
            ) : (
              <TextArea
                label="Molfile (V2000 or V3000)"
                value={draft.molfile}
                onValueChange={(v) => set('molfile', v)}
                error={errors.molfile ?? errors.smiles ?? structureError}
                rows={6}
              />
            )}
          </div>

          <div className="grid grid-cols-3 gap-3">
            <TextField
              label="Melting point (°C)"
              inputMode="decimal"
              value={draft.meltingPointC}
              onValueChange={(v) => set('meltingPointC', v)}
              error={errors.meltingPointC}
            />
            <TextField
              label="ΔHfus (kJ/mol)"
              inputMode="decimal"
              value={draft.enthalpyFusionKJmol}
              onValueChange={(v) => set('enthalpyFusionKJmol', v)}
              error={errors.enthalpyFusionKJmol}
            />
            <TextField
              label="Measured logP"
              inputMode="decimal"
              value={draft.logP}
              onValueChange={(v) => set('logP', v)}
              error={errors['logP.value'] ?? errors.logP}
              hint="Empty: estimated from the groups."
            />
          </div>
          <div className="grid grid-cols-2 gap-3">
            <TextField
              label="Specification limit (%)"
              inputMode="decimal"
              value={draft.specLimitPct}
              onValueChange={(v) => set('specLimitPct', v)}
              error={errors.specLimitPct}
              hint="In the isolated product, solvent-free (area-%), e.g. 0.15. Empty: no limit."
            />
            <TextField
              label="Incorporation into the crystals (K)"
              inputMode="decimal"
              value={draft.solidIncorporation}
              onValueChange={(v) => set('solidIncorporation', v)}
              error={errors.solidIncorporation}
              hint="Ratio to the product in the crystals over that in the liquor; 0 none, 1 no purification. Empty: none."
            />
          </div>
          <div className="grid grid-cols-3 gap-3">
            {(['d', 'p', 'h'] as const).map((k) => (
              <TextField
                key={k}
                label={`Hansen δ${k.toUpperCase()} (MPa½)`}
                inputMode="decimal"
                value={draft.hansen[k]}
                onValueChange={(v) => set('hansen', { ...draft.hansen, [k]: v })}
                error={errors[`hansen.${k}`] ?? errors.hansen}
                hint={k === 'd' ? 'Empty: estimated by group contributions.' : undefined}
              />
            ))}
          </div>

          <RowTable
            title="pKa values"
            hint="For a base, the pKa of its conjugate acid."
            addLabel="Add a pKa"
            rows={draft.pKa}
            onAdd={() => set('pKa', [...draft.pKa, { value: '', type: 'acid' }])}
            onRemove={(i) =>
              set(
                'pKa',
                draft.pKa.filter((_, j) => j !== i),
              )
            }
            headers={['pKa', 'Type']}
            error={errors.pKa}
            renderRow={(row, i) => [
              <CellInput
                key="v"
                label={`pKa ${i + 1}`}
                value={row.value}
                error={errors[`pKa.${i}.value`]}
                onChange={(v) =>
                  set(
                    'pKa',
                    draft.pKa.map((p, j) => (j === i ? { ...p, value: v } : p)),
                  )
                }
              />,
              <CellSelect
                key="t"
                label={`Type of pKa ${i + 1}`}
                value={row.type}
                options={[
                  { value: 'acid', label: 'Acid' },
                  { value: 'base', label: 'Base' },
                ]}
                onChange={(v) =>
                  set(
                    'pKa',
                    draft.pKa.map((p, j) => (j === i ? { ...p, type: v as 'acid' | 'base' } : p)),
                  )
                }
              />,
            ]}
          />

          <RowTable
            title="Measured solubility"
            addLabel="Add a solubility point"
            rows={draft.solubility}
            onAdd={() =>
              set('solubility', [
                ...draft.solubility,
                { solventId: '', temperatureC: '20', value: '', unit: 'g/L' },
              ])
            }
            onRemove={(i) =>
              set(
                'solubility',
                draft.solubility.filter((_, j) => j !== i),
              )
            }
            headers={['Solvent', 'T (°C)', 'Value', 'Unit']}
            renderRow={(row, i) => {
              const put = (patch: Partial<typeof row>) =>
                set(
                  'solubility',
                  draft.solubility.map((p, j) => (j === i ? { ...p, ...patch } : p)),
                );
              return [
                <CellSelect
                  key="s"
                  label={`Solvent of point ${i + 1}`}
                  value={row.solventId}
                  options={solventOptions}
                  error={errors[`solubility.${i}.solventId`]}
                  onChange={(v) => put({ solventId: v })}
                />,
                <CellInput
                  key="t"
                  label={`Temperature of point ${i + 1}`}
                  value={row.temperatureC}
                  error={errors[`solubility.${i}.temperatureC`]}
                  onChange={(v) => put({ temperatureC: v })}
                />,
                <CellInput
                  key="v"
                  label={`Solubility of point ${i + 1}`}
                  value={row.value}
                  error={errors[`solubility.${i}.value`]}
                  onChange={(v) => put({ value: v })}
                />,
                <CellSelect
                  key="u"
                  label={`Unit of point ${i + 1}`}
                  value={row.unit}
                  options={SOLUBILITY_UNITS.map((u) => ({ value: u, label: u }))}
                  onChange={(v) => put({ unit: v as typeof row.unit })}
                />,
              ];
            }}
          />

          <RowTable
            title="Measured partition (D = c organic / c aqueous)"
            addLabel="Add a partition point"
            rows={draft.partition}
            onAdd={() =>
              set('partition', [
                ...draft.partition,
                { organicSolventId: '', pH: '', temperatureC: '20', D: '' },
              ])
            }
            onRemove={(i) =>
              set(
                'partition',
                draft.partition.filter((_, j) => j !== i),
              )
            }
            headers={['Organic solvent', 'pH', 'T (°C)', 'D']}
            renderRow={(row, i) => {
              const put = (patch: Partial<typeof row>) =>
                set(
                  'partition',
                  draft.partition.map((p, j) => (j === i ? { ...p, ...patch } : p)),
                );
              return [
                <CellSelect
                  key="s"
                  label={`Organic solvent of partition ${i + 1}`}
                  value={row.organicSolventId}
                  options={partitionSolvents}
                  error={errors[`partition.${i}.organicSolventId`]}
                  onChange={(v) => put({ organicSolventId: v })}
                />,
                <CellInput
                  key="p"
                  label={`pH of partition ${i + 1}`}
                  value={row.pH}
                  error={errors[`partition.${i}.pH`]}
                  onChange={(v) => put({ pH: v })}
                />,
                <CellInput
                  key="t"
                  label={`Temperature of partition ${i + 1}`}
                  value={row.temperatureC}
                  error={errors[`partition.${i}.temperatureC`]}
                  onChange={(v) => put({ temperatureC: v })}
                />,
                <CellInput
                  key="d"
                  label={`D of partition ${i + 1}`}
                  value={row.D}
                  error={errors[`partition.${i}.D`]}
                  onChange={(v) => put({ D: v })}
                />,
              ];
            }}
          />
          <TextArea
            label="Notes"
            value={draft.notes}
            onValueChange={(v) => set('notes', v)}
            error={errors.notes}
            rows={2}
          />
        </div>
        <StructurePanel
          hasInput={structureText !== ''}
          preview={preview.data}
          error={preview.error}
          loading={preview.isFetching}
          groups={draft.unifacGroups}
          onGroupsChange={(g) => set('unifacGroups', g)}
          readOnly={readOnly}
          measured={{
            logP: draft.logP.trim() !== '',
            hansen: draft.hansen.d.trim() !== '',
            pKa: draft.pKa.length > 0,
          }}
        />
      </fieldset>
      <div className="flex items-center gap-2 border-t border-rule pt-4">
        {!readOnly ? (
          <Button type="submit" busy={busy}>
            {compound ? 'Save changes' : 'Save compound'}
          </Button>
        ) : null}
        <Button variant="secondary" onClick={onCancel}>
          {readOnly ? 'Close' : 'Cancel'}
        </Button>
        {onDelete && !readOnly ? (
          <Button variant="danger" className="ml-auto" onClick={onDelete}>
            Delete compound
          </Button>
        ) : null}
      </div>
    </form>
  );
}

function TextArea({
  label,
  value,
  onValueChange,
  error,
  rows,
}: {
  label: string;
  value: string;
  onValueChange: (v: string) => void;
  error?: string;
  rows: number;
}) {
  const id = useId();
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-small font-medium text-ink">
        {label}
      </label>
      <textarea
        id={id}
        rows={rows}
        value={value}
        onChange={(e) => onValueChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        spellCheck={false}
        className={cn(
          inputClass,
          'h-auto py-1.5 font-mono text-small',
          error ? 'border-caution-hazard' : 'border-rule-strong',
        )}
      />
      {error ? <FieldError id={`${id}-error`}>{error}</FieldError> : null}
    </div>
  );
}

function RowTable<R>({
  title,
  hint,
  addLabel,
  rows,
  onAdd,
  onRemove,
  headers,
  renderRow,
  error,
}: {
  title: string;
  hint?: string;
  addLabel: string;
  rows: R[];
  onAdd: () => void;
  onRemove: (i: number) => void;
  headers: string[];
  renderRow: (row: R, i: number) => React.ReactNode[];
  error?: string;
}) {
  return (
    <fieldset className="space-y-1.5">
      <legend className="text-small font-medium text-ink">{title}</legend>
      {hint ? <p className="text-caption text-ink-muted">{hint}</p> : null}
      {rows.length > 0 ? (
        <table className="w-full text-body">
          <thead>
            <tr>
              {headers.map((h) => (
                <th
                  key={h}
                  scope="col"
                  className="pb-1 text-left text-caption font-medium text-ink-muted uppercase"
                >
                  {h}
                </th>
              ))}
              <th scope="col">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row, i) => (
              <tr key={i} className="align-top">
                {renderRow(row, i).map((cell, j) => (
                  <td key={j} className="pr-2 pb-1.5">
                    {cell}
                  </td>
                ))}
                <td className="pb-1.5 text-right">
                  <Button
                    variant="quiet"
                    size="sm"
                    onClick={() => onRemove(i)}
                    aria-label={`Remove row ${i + 1} of ${title}`}
                  >
                    Remove
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {error ? <FieldError>{error}</FieldError> : null}
      <Button variant="secondary" size="sm" onClick={onAdd}>
        {addLabel}
      </Button>
    </fieldset>
  );
}

function CellInput({
  label,
  value,
  onChange,
  error,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
}) {
  return (
    <div>
      <input
        aria-label={label}
        inputMode="decimal"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        className={cn(inputClass, 'h-8', error ? 'border-caution-hazard' : 'border-rule-strong')}
      />
      {error ? <FieldError>{error}</FieldError> : null}
    </div>
  );
}

function CellSelect({
  label,
  value,
  options,
  onChange,
  error,
}: {
  label: string;
  value: string;
  options: Array<{ value: string; label: string }>;
  onChange: (v: string) => void;
  error?: string;
}) {
  return (
    <div>
      <Select label={label} hideLabel value={value} options={options} onValueChange={onChange} />
      {error ? <FieldError>{error}</FieldError> : null}
    </div>
  );
}
