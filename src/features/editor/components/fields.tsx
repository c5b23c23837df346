import { useEffect, useId, useState, type ReactNode } from 'react';
import { SOLVENTS, AQUEOUS_SOLUTES } from '@shared/engine/data';
import { compoundSnapshotSchema } from '@shared/schemas/route';
import { pKaForEngine, type Compound } from '@shared/schemas/compounds';
import { FieldError } from '@/components/text-field';
import {
  formatQuantity,
  parseUncertain,
  parseUncertainVolume,
  parseVolume,
  PARSERS,
  type QuantityKind,
} from '@/lib/units';
import { useEditorStore } from '@/stores/editor-store';
import { keyOf, type ComponentInput } from '../document';

const inputCls =
  'nodrag nokey block h-8 w-full rounded-control border bg-paper-raised px-2 text-body text-ink focus-visible:outline-2 focus-visible:outline-accent disabled:cursor-not-allowed disabled:border-rule disabled:bg-paper-sunken disabled:text-ink-muted read-only:border-rule read-only:bg-paper-sunken';

/** A labelled row of the side panel; `common` marks a value taken from common practice. */
export function Field({
  label,
  htmlFor,
  hint,
  error,
  common,
  children,
}: {
  label: string;
  htmlFor: string;
  hint?: ReactNode;
  error?: string;
  common?: boolean;
  children: ReactNode;
}) {
  return (
    <div className="space-y-1">
      <label
        htmlFor={htmlFor}
        className="flex items-baseline justify-between gap-2 text-small font-medium text-ink"
      >
        <span>{label}</span>
        {common ? (
          <span className="rounded-control bg-caution-info-soft px-1 text-caption font-normal text-caution-info-deep">
            default from common practice
          </span>
        ) : null}
      </label>
      {children}
      {error ? (
        <FieldError id={`${htmlFor}-error`}>{error}</FieldError>
      ) : hint ? (
        <p className="text-caption text-ink-muted">{hint}</p>
      ) : null}
    </div>
  );
}

/**
 * A quantity typed naturally ("250 mL", "45 °C", "10 ± 1 vol"), converted on
 * Enter or leaving the field; a reading error stays inline and nothing changes.
 */
export function QuantityField({
  label,
  kind,
  value,
  onCommit,
  hint,
  error,
  common,
  allowRange = true,
}: {
  label: string;
  kind: QuantityKind;
  value: unknown;
  /** Puts the value into the route; a string back is why the route refused it. */
  onCommit: (value: unknown) => string | undefined | void;
  hint?: ReactNode;
  error?: string;
  common?: boolean;
  allowRange?: boolean;
}) {
  const id = useId();
  const shown = formatQuantity(kind, value);
  const [text, setText] = useState(shown);
  const [parseError, setParseError] = useState<string | null>(null);
  useEffect(() => {
    setText(shown);
    setParseError(null);
  }, [shown]);
  const commit = () => {
    if (text === shown) return;
    let r: { ok: true; value: unknown } | { ok: false; error: string };
    if (kind === 'volume') {
      r = allowRange ? parseUncertainVolume(text) : parseVolume(text);
    } else {
      const parse = PARSERS[kind as keyof typeof PARSERS];
      r = allowRange ? parseUncertain(text, parse) : parse(text);
    }
    if (!r.ok) {
      setParseError(r.error);
      return;
    }
    // The step refuses a value it cannot take (out of range): said here, the route unchanged.
    const refused = onCommit(r.value);
    setParseError(typeof refused === 'string' ? refused : null);
  };
  const err = parseError ?? error;
  return (
    <Field label={label} htmlFor={id} hint={hint} error={err} common={common}>
      <input
        id={id}
        value={text}
        onChange={(e) => setText(e.target.value)}
        onBlur={commit}
        onKeyDown={(e) => {
          if (e.key === 'Enter') commit();
          if (e.key === 'Escape') {
            setText(shown);
            setParseError(null);
          }
        }}
        aria-invalid={err ? true : undefined}
        aria-describedby={err ? `${id}-error` : undefined}
        className={`${inputCls} ${err ? 'border-caution-hazard' : 'border-rule-strong'}`}
      />
    </Field>
  );
}

export function ChoiceField({
  label,
  value,
  options,
  onChange,
  hint,
  error,
}: {
  label: string;
  value: string;
  options: Array<{ value: string; label: string }>;
  onChange: (v: string) => void;
  hint?: ReactNode;
  error?: string;
}) {
  const id = useId();
  return (
    <Field label={label} htmlFor={id} hint={hint} error={error}>
      <select
        id={id}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className={`${inputCls} ${error ? 'border-caution-hazard' : 'border-rule-strong'}`}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Field>
  );
}

export function TextInputField({
  label,
  value,
  onCommit,
}: {
  label: string;
  value: string;
  onCommit: (v: string) => void;
}) {
  const id = useId();
  const [text, setText] = useState(value);
  useEffect(() => setText(value), [value]);
  return (
    <Field label={label} htmlFor={id}>
      <input
        id={id}
        value={text}
        onChange={(e) => setText(e.target.value)}
        onBlur={() => text !== value && onCommit(text)}
        onKeyDown={(e) => e.key === 'Enter' && text !== value && onCommit(text)}
        className={`${inputCls} border-rule-strong`}
      />
    </Field>
  );
}

type PickerFilter = 'solvent' | 'compound' | 'any' | 'solute';

export function componentLabel(c: ComponentInput): string {
  if (c.kind === 'compound') return `${c.name} (${c.role})`;
  if (c.kind === 'solvent') return SOLVENTS.find((s) => s.id === c.solventId)?.name ?? c.solventId;
  return `${AQUEOUS_SOLUTES.find((s) => s.id === c.soluteId)?.name ?? c.soluteId} (aqueous)`;
}

/** Compound record → the self-contained snapshot a route stores. */
export function snapshotOf(c: Compound): ComponentInput | null {
  // Measured pKa values win; otherwise the estimates from the structure.
  const pKa = pKaForEngine(c.pKa ?? [], c.ionisableGroups ?? []);
  const snap = {
    kind: 'compound' as const,
    id: c.id,
    name: c.name,
    role: c.role,
    ...(c.smiles ? { smiles: c.smiles } : {}),
    molarMassGmol: c.molarMassGmol,
    ...(c.meltingPointC !== null ? { meltingPointC: c.meltingPointC } : {}),
    ...(c.enthalpyFusionKJmol !== null ? { enthalpyFusionKJmol: c.enthalpyFusionKJmol } : {}),
    ...(c.logP ? { logP: c.logP.value } : {}),
    ...(pKa.length ? { pKa } : {}),
    ...(c.ionisableGroups?.length
      ? {
          ionisableGroups: c.ionisableGroups
            .slice(0, 20)
            .map(({ group, type }) => ({ group, type })),
        }
      : {}),
    ...(c.specLimitPct !== null ? { specLimitPct: c.specLimitPct } : {}),
    ...(c.solidIncorporation !== null ? { solidIncorporation: c.solidIncorporation } : {}),
    ...(c.fingerprint ? { fingerprint: c.fingerprint } : {}),
    ...(Object.keys(c.unifac?.groups ?? {}).length ? { unifac: c.unifac.groups } : {}),
    ...(c.hansen ? { hansen: { d: c.hansen.d, p: c.hansen.p, h: c.hansen.h } } : {}),
    ...(c.solubility?.length ? { solubility: c.solubility } : {}),
    ...(c.partition?.length ? { partition: c.partition } : {}),
  };
  const r = compoundSnapshotSchema.safeParse(snap);
  return r.success ? (r.data as ComponentInput) : null;
}

/**
 * Pick a component: the route's own, the solvent library, the aqueous
 * solutes or the workspace's compounds. Picking one from a library adds it
 * to the route's components.
 */
export function ComponentPicker({
  label,
  value,
  onChange,
  filter = 'any',
  compounds,
  error,
  hint,
}: {
  label: string;
  value: string;
  onChange: (componentId: string) => void;
  filter?: PickerFilter;
  compounds?: Compound[];
  error?: string;
  hint?: ReactNode;
}) {
  const id = useId();
  const components = useEditorStore((s) => s.doc.components);
  const inRoute = components.filter((c) =>
    filter === 'any'
      ? true
      : filter === 'solvent'
        ? c.kind === 'solvent'
        : filter === 'solute'
          ? c.kind === 'aqueous-solute'
          : c.kind === 'compound',
  );
  const have = new Set(components.map(keyOf));
  const lib =
    filter === 'solvent' || filter === 'any' ? SOLVENTS.filter((s) => !have.has(s.id)) : [];
  const solutes =
    filter === 'solute' || filter === 'any' ? AQUEOUS_SOLUTES.filter((s) => !have.has(s.id)) : [];
  const ws =
    filter === 'compound' || filter === 'any'
      ? (compounds ?? []).filter((c) => !have.has(c.id))
      : [];
  return (
    <Field label={label} htmlFor={id} error={error} hint={hint}>
      <select
        id={id}
        value={`route::${value}`}
        onChange={(e) => {
          const v = e.target.value;
          const [src, key] = v.split('::');
          const add = useEditorStore.getState().addComponent;
          if (src === 'lib') add({ kind: 'solvent', id: key, solventId: key });
          else if (src === 'sol') add({ kind: 'aqueous-solute', id: key, soluteId: key });
          else if (src === 'ws') {
            const c = compounds?.find((x) => x.id === key);
            const snap = c ? snapshotOf(c) : null;
            if (!snap) return;
            add(snap);
          }
          onChange(src === 'route' ? key : key);
        }}
        className={`${inputCls} ${error ? 'border-caution-hazard' : 'border-rule-strong'}`}
      >
        {!have.has(value) ? (
          <option value={`route::${value}`}>
            {value ? `${value} (not in the route)` : 'Choose…'}
          </option>
        ) : null}
        {inRoute.length ? (
          <optgroup label="In this route">
            {inRoute.map((c) => (
              <option key={keyOf(c)} value={`route::${keyOf(c)}`}>
                {componentLabel(c)}
              </option>
            ))}
          </optgroup>
        ) : null}
        {ws.length ? (
          <optgroup label="Workspace compounds">
            {ws.map((c) => (
              <option key={c.id} value={`ws::${c.id}`}>
                {c.name} ({c.role})
              </option>
            ))}
          </optgroup>
        ) : null}
        {lib.length ? (
          <optgroup label="Solvent library">
            {lib.map((s) => (
              <option key={s.id} value={`lib::${s.id}`}>
                {s.name}
              </option>
            ))}
          </optgroup>
        ) : null}
        {solutes.length ? (
          <optgroup label="Aqueous solutes">
            {solutes.map((s) => (
              <option key={s.id} value={`sol::${s.id}`}>
                {s.name}
              </option>
            ))}
          </optgroup>
        ) : null}
      </select>
    </Field>
  );
}
