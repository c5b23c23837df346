import { useState } from 'react';
import type { StructurePreview, UnifacGroupCounts } from '@shared/schemas/compounds';
import { isApiError } from '@/api/client';
import { Button } from '@/components/button';
import { Spinner } from '@/components/spinner';
import { StructureImage } from './structure-image';

type Props = {
  /** Whether anything is typed yet. */
  hasInput: boolean;
  preview: StructurePreview | undefined;
  error: unknown;
  loading: boolean;
  /** Hand-edited groups, or null for the automatic ones. */
  groups: UnifacGroupCounts | null;
  onGroupsChange: (groups: UnifacGroupCounts | null) => void;
  readOnly?: boolean;
  /** Whether a measured logP / entered Hansen set replaces the estimate. */
  measured: { logP: boolean; hansen: boolean; pKa: boolean };
};

/** The structure as the server reads it: drawing, formula, groups and estimates, updated as the chemist types. */
export function StructurePanel({
  hasInput,
  preview,
  error,
  loading,
  groups,
  onGroupsChange,
  readOnly,
  measured,
}: Props) {
  if (!hasInput) {
    return (
      <div className="flex h-full min-h-48 items-center justify-center rounded-card border border-dashed border-rule-strong px-4 text-center text-body text-ink-muted">
        Type a SMILES (or paste a molfile) and the structure, its formula and its UNIFAC groups
        appear here.
      </div>
    );
  }
  const unreadable = isApiError(error, 422);
  return (
    <section aria-label="Structure preview" aria-busy={loading || undefined} className="space-y-3">
      {unreadable ? (
        <div
          role="alert"
          className="rounded-card border border-caution-hazard/40 bg-caution-hazard-soft px-3 py-2"
        >
          <p className="font-medium text-caution-hazard-deep">This structure cannot be read</p>
          <p className="mt-0.5 text-body text-ink">{(error as Error).message}</p>
        </div>
      ) : error ? (
        <div
          role="alert"
          className="rounded-card border border-caution-hazard/40 bg-caution-hazard-soft px-3 py-2 text-body"
        >
          The preview could not be loaded: {(error as Error).message}
        </div>
      ) : null}
      {preview && !unreadable ? (
        <>
          <div className="relative rounded-card border border-rule bg-paper-raised">
            <StructureImage
              svg={preview.svg}
              alt={`Structure drawing, ${preview.formula}`}
              className="mx-auto h-44 w-60 object-contain"
            />
            {loading ? <Spinner size="sm" className="absolute top-2 right-2 text-accent" /> : null}
          </div>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-body">
            <dt className="text-ink-muted">Formula</dt>
            <dd data-testid="preview-formula" className="font-medium">
              {preview.formula}
            </dd>
            <dt className="text-ink-muted">Molar mass</dt>
            <dd className="tabular-nums">{preview.molarMassGmol.toFixed(2)} g/mol</dd>
            <dt className="text-ink-muted">Canonical SMILES</dt>
            <dd className="break-all text-small">{preview.canonicalSmiles}</dd>
          </dl>
          {preview.librarySolventId ? (
            <p className="rounded-control bg-caution-info-soft px-2 py-1 text-small text-caution-info-deep">
              This is a library solvent ({preview.librarySolventId}); routes use its curated data.
            </p>
          ) : null}
          <GroupEditor
            preview={preview}
            groups={groups}
            onChange={onGroupsChange}
            readOnly={readOnly}
          />
          <Estimates preview={preview} measured={measured} />
        </>
      ) : !unreadable && loading ? (
        <p className="flex items-center gap-2 text-ink-muted" role="status">
          <Spinner size="sm" className="text-accent" /> Reading the structure…
        </p>
      ) : null}
    </section>
  );
}

function GroupEditor({
  preview,
  groups,
  onChange,
  readOnly,
}: {
  preview: StructurePreview;
  groups: UnifacGroupCounts | null;
  onChange: (g: UnifacGroupCounts | null) => void;
  readOnly?: boolean;
}) {
  const [newSubgroup, setNewSubgroup] = useState('');
  const shown = groups ?? preview.unifac.groups;
  const names = new Map(preview.unifac.summary.map((s) => [String(s.subgroup), s.name]));
  const set = (key: string, count: number) => {
    const next = { ...shown };
    if (!Number.isFinite(count) || count <= 0) delete next[key];
    else next[key] = Math.min(100, Math.round(count));
    onChange(next);
  };
  const entries = Object.entries(shown).sort((a, b) => Number(a[0]) - Number(b[0]));
  return (
    <div className="space-y-2">
      <div className="flex items-baseline justify-between">
        <h3 className="text-small font-medium text-ink">
          UNIFAC groups{' '}
          {groups ? (
            <span className="text-caption font-normal text-caution-advisory-deep">(edited)</span>
          ) : (
            <span className="text-caption font-normal text-ink-muted">
              (assigned from the structure)
            </span>
          )}
        </h3>
        {groups && !readOnly ? (
          <Button variant="quiet" size="sm" onClick={() => onChange(null)}>
            Use the automatic groups
          </Button>
        ) : null}
      </div>
      {entries.length === 0 ? (
        <p className="text-small text-ink-muted">No group assigned.</p>
      ) : (
        <table className="w-full text-body" aria-label="UNIFAC groups">
          <thead>
            <tr className="text-caption text-ink-muted uppercase">
              <th scope="col" className="py-1 text-left font-medium">
                Subgroup
              </th>
              <th scope="col" className="py-1 text-left font-medium">
                No.
              </th>
              <th scope="col" className="py-1 text-right font-medium">
                Count
              </th>
            </tr>
          </thead>
          <tbody>
            {entries.map(([key, count]) => (
              <tr key={key} className="border-t border-rule">
                <td className="py-1 font-medium">{names.get(key) ?? `subgroup ${key}`}</td>
                <td className="py-1 text-ink-muted tabular-nums">{key}</td>
                <td className="py-1 text-right">
                  {readOnly ? (
                    <span className="tabular-nums">{count}</span>
                  ) : (
                    <input
                      type="number"
                      min={0}
                      max={100}
                      value={count}
                      aria-label={`Count of ${names.get(key) ?? `subgroup ${key}`}`}
                      onChange={(e) => set(key, Number(e.target.value))}
                      className="ml-auto block h-7 w-16 rounded-control border border-rule-strong bg-paper-raised px-2 text-right text-body tabular-nums focus-visible:outline-2 focus-visible:outline-accent"
                    />
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {!readOnly ? (
        <div className="flex items-end gap-2">
          <label className="text-small text-ink-muted">
            Add subgroup no.
            <input
              type="number"
              min={1}
              value={newSubgroup}
              onChange={(e) => setNewSubgroup(e.target.value)}
              className="mt-0.5 block h-7 w-20 rounded-control border border-rule-strong bg-paper-raised px-2 text-body focus-visible:outline-2 focus-visible:outline-accent"
            />
          </label>
          <Button
            variant="secondary"
            size="sm"
            disabled={!/^\d+$/.test(newSubgroup)}
            onClick={() => {
              set(newSubgroup, (shown[newSubgroup] ?? 0) + 1);
              setNewSubgroup('');
            }}
          >
            Add
          </Button>
        </div>
      ) : null}
      {preview.unifac.unassignedAtoms.length > 0 && !groups ? (
        <div className="rounded-control border border-caution-warning/40 bg-caution-warning-soft px-2 py-1.5 text-small text-caution-warning-deep">
          <p className="font-medium">Atoms no group covers</p>
          <ul className="mt-0.5 list-disc pl-4">
            {preview.unifac.unassignedAtoms.map((a) => (
              <li key={a.index}>
                {a.element} (atom {a.index + 1}): {a.reason}
              </li>
            ))}
          </ul>
          <p className="mt-1">
            Activity coefficients need every atom in a group: edit the counts above.
          </p>
        </div>
      ) : null}
    </div>
  );
}

function Estimates({
  preview,
  measured,
}: {
  preview: StructurePreview;
  measured: { logP: boolean; hansen: boolean; pKa: boolean };
}) {
  const { logP, hansen, notes } = preview.estimates;
  return (
    <div className="space-y-1.5">
      <h3 className="text-small font-medium text-ink">Estimates from the structure</h3>
      <dl className="space-y-1.5 text-body">
        <div>
          <dt className="inline text-ink-muted">logP </dt>
          <dd className="inline">
            {logP ? (
              <>
                <span className="font-medium tabular-nums">{logP.value.toFixed(2)}</span>{' '}
                <EstimateBadge />
                {measured.logP ? (
                  <span className="text-caption text-ink-muted">
                    {' '}
                    — your measured value is used instead
                  </span>
                ) : null}
                <p className="text-caption text-ink-muted">{logP.method}</p>
              </>
            ) : (
              <span className="text-ink-muted">not estimated</span>
            )}
          </dd>
        </div>
        <div>
          <dt className="inline text-ink-muted">Hansen δD / δP / δH </dt>
          <dd className="inline">
            {hansen ? (
              <>
                <span className="font-medium tabular-nums">
                  {hansen.d.toFixed(1)} / {hansen.p.toFixed(1)} / {hansen.h.toFixed(1)}
                </span>{' '}
                MPa½ <EstimateBadge />
                {measured.hansen ? (
                  <span className="text-caption text-ink-muted">
                    {' '}
                    — your entered values are used instead
                  </span>
                ) : null}
                <p className="text-caption text-ink-muted">{hansen.method}</p>
              </>
            ) : (
              <span className="text-ink-muted">not estimated</span>
            )}
          </dd>
        </div>
      </dl>
      <IonisableGroups groups={preview.ionisableGroups} measured={measured.pKa} />
      {notes.length > 0 ? (
        <ul className="list-disc pl-4 text-caption text-ink-muted">
          {notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** Acidic and basic groups found in the structure, each with its estimated pKa and the method. */
export function IonisableGroups({
  groups,
  measured,
}: {
  groups: StructurePreview['ionisableGroups'];
  measured: boolean;
}) {
  return (
    <div data-ionisable-groups={groups.length}>
      <h4 className="text-small text-ink-muted">Ionisable groups</h4>
      {groups.length === 0 ? (
        <p className="text-caption text-ink-muted">
          None found: the compound is treated as neutral.
        </p>
      ) : (
        <ul className="space-y-1 text-body">
          {groups.map((g, k) => (
            <li key={k}>
              {g.group} ({g.type === 'acid' ? 'acid' : 'base; pKa of its conjugate acid'}):{' '}
              {g.pKa !== null ? (
                <>
                  <span className="font-medium tabular-nums">pKa {g.pKa.toFixed(1)}</span> ±
                  {g.typicalError} <EstimateBadge />
                </>
              ) : (
                <span className="font-medium text-caution-warning-deep">
                  no estimate — enter a measured pKa
                </span>
              )}
              {measured ? (
                <span className="text-caption text-ink-muted">
                  {' '}
                  — your measured values are used instead
                </span>
              ) : null}
              <p className="text-caption text-ink-muted">
                {g.method}
                {g.notes.length ? `; ${g.notes.join('; ')}` : ''}
              </p>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

export function EstimateBadge() {
  return (
    <span className="rounded-control bg-caution-advisory-soft px-1 py-px text-caption font-medium text-caution-advisory-deep">
      estimate
    </span>
  );
}
