import { useEffect, useMemo, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { routeDocumentSchema, type RouteDocument } from '@shared/schemas/route';
import type { SolventAlternative } from '@shared/schemas/solvent-alternatives';
import {
  PURITY_TOLERANCE_POINTS,
  YIELD_WINDOW_POINTS,
} from '@shared/engine/substitution/keep-rule';
import {
  ROLE_LABELS,
  roleSolvent,
  SUBSTITUTION_ROLES,
  substituteSolvent,
  type SubstitutionRole,
} from '@shared/engine/substitution/roles';
import { Button } from '@/components/button';
import { ErrorState } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { Select } from '@/components/select';
import { formatPurity } from '@/features/editor';
import { paths } from '@/paths';
import { useEditorStore } from '@/stores/editor-store';
import { useSolventAlternatives } from '../api/advisor-solvent-alternatives';
import { useTryInCopy } from '../api/advisor-try-copy';
import { formatSignificant } from '@/lib/format';

const GUIDE_LABELS: Record<NonNullable<SolventAlternative['guideCategory']>, string> = {
  recommended: 'Recommended',
  problematic: 'Problematic',
  hazardous: 'Hazardous',
  'highly-hazardous': 'Highly hazardous',
};

const fmt = (v: number | null | undefined, digits = 1) =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits);
const signed = (v: number | null | undefined, digits = 1) =>
  v === null || v === undefined || !Number.isFinite(v)
    ? ''
    : ` (${v >= 0 ? '+' : '−'}${Math.abs(v).toFixed(digits)})`;

/**
 * A p5–p95 spread as text: one value when both ends read the same (two
 * purities above 99.99 % are "> 99.99 %", never "> 99.99–> 99.99 %"), and
 * "to" when an end is a bound ("99.98 % to > 99.99 %").
 */
export function formatSpread(low: string, high: string, unit = ''): string {
  if (low === high) return `${low}${unit}`;
  if (/^[<>]/.test(low) || /^[<>]/.test(high)) return `${low}${unit} to ${high}${unit}`;
  return `${low}–${high}${unit}`;
}

/**
 * What is not in the solvent-free solid, before and after, in one unit: ppm
 * when both are below 0.01 % (where both purities read "> 99.99"), else %.
 */
function impurityChange(purityBefore: number, purityAfter: number): string {
  const before = Math.max(0, 100 - purityBefore);
  const after = Math.max(0, 100 - purityAfter);
  if (Math.max(before, after) < 0.01) {
    const ppm = (pct: number) => {
      const v = pct * 1e4;
      return v >= 10 && v < 1e5 ? v.toFixed(0) : formatSignificant(v, 2);
    };
    return `${ppm(before)} → ${ppm(after)} ppm`;
  }
  return `${before.toFixed(2)} → ${after.toFixed(2)} %`;
}

/**
 * Why a substitute is not ranked with those that keep the yield and purity,
 * with the figures that decide it (the rule of keepsYieldAndPurity): the
 * yield lost beyond the window, and the impurities gained in the
 * solvent-free solid, which the purity alone hides above 99.99 %.
 */
export function verdictOf(a: SolventAlternative): string {
  if (a.totals === null) return 'cannot be evaluated';
  if (a.keepsYieldAndPurity) return 'keeps yield and purity';
  const dy = a.deltaVsCurrent?.yieldPct ?? null;
  const dp = a.deltaVsCurrent?.solventFreePurityPct ?? null;
  const p = a.totals.solventFreePurityPct;
  if (dy === null || dp === null || p === null || a.totals.yieldPct === null)
    return 'isolates no product to compare';
  const losses: string[] = [];
  if (dy < -YIELD_WINDOW_POINTS)
    losses.push(
      `yield: ${Math.abs(dy).toFixed(1)} points lower (at most ${YIELD_WINDOW_POINTS} allowed)`,
    );
  if (dp < -PURITY_TOLERANCE_POINTS) losses.push(`purity: impurities ${impurityChange(p - dp, p)}`);
  return losses.length > 0 ? `loses ${losses.join('; ')}` : 'loses yield or purity';
}

function parseRoute(doc: unknown): RouteDocument | null {
  const r = routeDocumentSchema.safeParse(doc);
  return r.success ? r.data : null;
}

/** Runs `fn` when the page has nothing else to do (at the latest after `timeout` ms). */
function whenIdle(fn: () => void, timeout: number): () => void {
  if (typeof requestIdleCallback === 'function') {
    const id = requestIdleCallback(fn, { timeout });
    return () => cancelIdleCallback(id);
  }
  const id = setTimeout(fn, 0);
  return () => clearTimeout(id);
}

/**
 * The route parsed with its schema: at once when the panel opens, then again when the page is
 * idle after each edit, so reading the whole route never delays an edit's own results.
 */
function useParsedWhenIdle(doc: unknown): RouteDocument | null {
  const [parsed, setParsed] = useState(() => ({ doc, value: parseRoute(doc) }));
  useEffect(() => {
    if (parsed.doc === doc) return;
    return whenIdle(() => setParsed({ doc, value: parseRoute(doc) }), 500);
  }, [doc, parsed.doc]);
  return parsed.value;
}

/** The roles the step has a solvent in, with that solvent, for the route as it stands. */
function rolesOf(doc: RouteDocument | null, stepId: string) {
  if (!doc) return [];
  return SUBSTITUTION_ROLES.flatMap((role) => {
    try {
      return [{ role, solventId: roleSolvent(doc, stepId, role).solventId }];
    } catch {
      return [];
    }
  });
}

/**
 * "Suggest alternatives" for the selected step's solvent: the advisor ranks
 * library solvents by evaluating the whole route again with each one in this
 * step's role; one click saves a substitute as a copy of the route.
 */
export function AdvisorPanel({
  workspaceId,
  routeName,
  projectName,
  stepId,
}: {
  workspaceId: string;
  routeName: string;
  projectName?: string;
  stepId: string;
}) {
  const doc = useEditorStore((s) => s.doc);
  const parsed = useParsedWhenIdle(doc);
  const roles = useMemo(() => rolesOf(parsed, stepId), [parsed, stepId]);
  const [chosen, setChosen] = useState<SubstitutionRole | null>(null);
  const role = roles.find((r) => r.role === chosen) ?? roles[0];
  const advice = useSolventAlternatives();
  const copy = useTryInCopy(workspaceId);
  const navigate = useNavigate();
  const [asked, setAsked] = useState<{ role: SubstitutionRole; document: RouteDocument } | null>(
    null,
  );

  if (!parsed || roles.length === 0 || !role) return null;

  const ask = () => {
    // The route as it stands now (the one parsed for the list of roles may be an edit behind);
    // a route that no longer reads as a route hides the panel a moment later.
    const document = parseRoute(useEditorStore.getState().doc);
    if (!document) return;
    setAsked({ role: role.role, document });
    advice.mutate({ document, stepId, role: role.role });
  };

  const tryInCopy = (a: SolventAlternative) => {
    if (!asked) return;
    const document = substituteSolvent(asked.document, stepId, asked.role, a.solventId);
    const name = `${routeName} — ${a.name} as ${ROLE_LABELS[asked.role]}`.slice(0, 200);
    copy.mutate(
      { name, projectName, document },
      { onSuccess: (route) => navigate(paths.workspace.route.to(workspaceId, route.id)) },
    );
  };

  return (
    <section aria-labelledby="advisor-heading" className="mt-4 border-t border-rule pt-3">
      <h3 id="advisor-heading" className="text-body font-medium">
        Solvent alternatives
      </h3>
      <div className="mt-2 flex flex-wrap items-end gap-2">
        {roles.length > 1 ? (
          <Select
            label="Solvent to replace"
            value={role.role}
            onValueChange={(v) => setChosen(v as SubstitutionRole)}
            options={roles.map((r) => ({
              value: r.role,
              label: `${ROLE_LABELS[r.role]} (${r.solventId})`,
            }))}
          />
        ) : (
          <p className="text-small text-ink-muted">
            Replace the {ROLE_LABELS[role.role]} ({role.solventId}).
          </p>
        )}
        <Button size="sm" variant="secondary" onClick={ask} disabled={advice.isPending}>
          Suggest alternatives
        </Button>
      </div>
      {advice.isPending ? (
        <Loading className="mt-2" label="Evaluating the route with each library solvent…" />
      ) : advice.isError ? (
        <ErrorState className="mt-2" title="No suggestions" error={advice.error} onRetry={ask} />
      ) : advice.data && asked ? (
        <AlternativesList
          items={advice.data}
          role={asked.role}
          onTry={tryInCopy}
          busy={copy.isPending}
        />
      ) : null}
      {copy.isError ? (
        <ErrorState className="mt-2" title="The copy was not saved" error={copy.error} />
      ) : null}
    </section>
  );
}

export function AlternativesList({
  items,
  role,
  onTry,
  busy,
}: {
  items: SolventAlternative[];
  role: SubstitutionRole;
  onTry: (a: SolventAlternative) => void;
  busy: boolean;
}) {
  if (items.length === 0)
    return (
      <p className="mt-2 text-small text-ink-muted">The library has no other solvent to try.</p>
    );
  return (
    <div className="mt-2 space-y-2">
      <p className="text-caption text-ink-muted">
        Each line is the whole route evaluated again with that solvent as the {ROLE_LABELS[role]} of
        this step only (volumes and every other step unchanged), ranked by PMI among those that keep
        the yield within 2 points and the solvent-free purity at least the current, then the rest.
        Model results: confirm at the bench and through the site&apos;s process-safety review. Each
        line gives the spread of its PMI, yield and purity (p5–p95 over 8 draws of the route&apos;s
        ± ranges, with that solvent); it does not include the error of the models or the solvent
        data. Guide categories: CHEM21 (Prat et al., Green Chem. 2016, 18, 288), as read from the
        guide&apos;s table.
      </p>
      <ol aria-label="Ranked alternatives" className="space-y-2">
        {items.map((a, i) => (
          <li
            key={a.solventId}
            aria-label={a.name}
            className="rounded-control border border-rule px-2 py-1.5 text-small"
          >
            <div className="flex items-baseline justify-between gap-2">
              <span className="font-medium">
                {i + 1}. {a.name}
              </span>
              <span className="text-caption text-ink-muted">{verdictOf(a)}</span>
            </div>
            {a.totals ? (
              <p>
                PMI {fmt(a.totals.pmi)}
                {signed(a.deltaVsCurrent?.pmi)} · yield {fmt(a.totals.yieldPct)} %
                {signed(a.deltaVsCurrent?.yieldPct)} · purity{' '}
                {formatPurity(a.totals.solventFreePurityPct)} %
              </p>
            ) : null}
            {a.uncertainty ? (
              <p className="text-caption text-ink-muted">
                Spread p5–p95: PMI{' '}
                {formatSpread(fmt(a.uncertainty.pmi.p5), fmt(a.uncertainty.pmi.p95))}, yield{' '}
                {formatSpread(
                  fmt(a.uncertainty.yieldPct.p5),
                  fmt(a.uncertainty.yieldPct.p95),
                  ' %',
                )}
                , purity{' '}
                {formatSpread(
                  formatPurity(a.uncertainty.solventFreePurityPct.p5),
                  formatPurity(a.uncertainty.solventFreePurityPct.p95),
                  ' %',
                )}
              </p>
            ) : null}
            <p className="text-caption">
              {a.ich.class === null
                ? 'No ICH Q3C class'
                : `ICH class ${a.ich.class}${a.ich.limitPpm !== null ? `, ${a.ich.limitPpm} ppm` : ''}`}
              {' · '}Guide: {a.guideCategory ? GUIDE_LABELS[a.guideCategory] : 'not in the guide'}
              {' · '}bp {fmt(a.boilingPointC, 0)} °C · flash point{' '}
              {a.flashPointC === null ? 'none given' : `${fmt(a.flashPointC, 0)} °C`}
              {' · '}
              {a.waterMiscibility === 'miscible'
                ? 'miscible with water'
                : 'partly miscible with water'}
              {a.heteroazeotropeWithWater?.forms
                ? `, heteroazeotrope with water near ${fmt(a.heteroazeotropeWithWater.temperatureC, 0)} °C`
                : a.heteroazeotropeWithWater
                  ? ', no heteroazeotrope with water'
                  : ''}
            </p>
            <details className="text-caption">
              <summary>Cautions ({a.cautions.length})</summary>
              <ul className="list-disc pl-4">
                {a.cautions.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ul>
            </details>
            {a.totals ? (
              <Button
                size="sm"
                variant="quiet"
                className="mt-1"
                disabled={busy}
                onClick={() => onTry(a)}
                aria-label={`Try ${a.name} in a copy`}
              >
                Try in a copy
              </Button>
            ) : null}
          </li>
        ))}
      </ol>
    </div>
  );
}
