import { useEffect, useRef } from 'react';
import type { SolventDetail, ValueSource } from '@shared/schemas/solvents';
import { Button } from '@/components/button';
import { ErrorState } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { useSolvent } from '../api/get-solvent';
import { GuideChip } from './solvent-table';

/** Every value of one solvent with its source, in a panel beside the table. Escape closes it. */
export function SolventDrawer({ solventId, onClose }: { solventId: string; onClose: () => void }) {
  const solvent = useSolvent(solventId);
  const ref = useRef<HTMLElement>(null);
  useEffect(() => {
    ref.current?.focus();
    const onKey = (e: KeyboardEvent) => e.key === 'Escape' && onClose();
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [solventId, onClose]);
  return (
    <aside
      ref={ref}
      tabIndex={-1}
      role="dialog"
      aria-label={solvent.data ? solvent.data.name : 'Solvent'}
      className="fixed top-0 right-0 z-40 flex h-screen w-[30rem] flex-col border-l border-rule bg-paper-raised shadow-overlay focus:outline-none"
    >
      <header className="flex items-start justify-between gap-3 border-b border-rule px-4 py-3">
        <div>
          <h2 className="text-title font-medium text-ink">{solvent.data?.name ?? 'Solvent'}</h2>
          {solvent.data ? (
            <p className="text-small text-ink-muted">
              CAS {solvent.data.cas} · <span className="font-mono">{solvent.data.smiles}</span>
            </p>
          ) : null}
        </div>
        <Button variant="secondary" size="sm" onClick={onClose}>
          Close
        </Button>
      </header>
      <div className="flex-1 overflow-y-auto px-4 py-3">
        {solvent.isPending ? (
          <Loading />
        ) : solvent.isError ? (
          <ErrorState error={solvent.error} onRetry={() => solvent.refetch()} />
        ) : (
          <Details s={solvent.data} />
        )}
      </div>
    </aside>
  );
}

function Details({ s }: { s: SolventDetail }) {
  const rows: Array<[string, React.ReactNode, string | null]> = [
    ['Molar mass', `${s.molarMassGmol.toFixed(3)} g/mol`, 'molarMassGmol'],
    [
      'Density',
      `${s.densityGmL.toFixed(4)} g/mL at ${s.densityTemperatureC} °C${s.densityPerK !== null ? ` (${s.densityPerK} g/mL per K)` : ''}`,
      'densityGmL',
    ],
    ['Normal boiling point', `${s.boilingPointC.toFixed(2)} °C`, 'boilingPointC'],
    ['Melting point', `${s.meltingPointC.toFixed(1)} °C`, 'meltingPointC'],
    [
      'Flash point (closed cup)',
      s.flashPointC !== null
        ? `${s.flashPointC} °C`
        : s.sources.flashPointC?.status === 'not-confirmed'
          ? 'not confirmed — treat as flammable'
          : 'none',
      'flashPointC',
    ],
    [
      'Enthalpy of vaporisation at Tb',
      s.enthalpyVapKJmol === null ? '—' : `${s.enthalpyVapKJmol} kJ/mol`,
      s.enthalpyVapKJmol === null ? null : 'enthalpyVapKJmol',
    ],
    ['Viscosity at 25 °C', `${s.viscosityMPas25C} mPa·s`, 'viscosityMPas25C'],
    ['Hansen δD / δP / δH', `${s.hansen.d} / ${s.hansen.p} / ${s.hansen.h} MPa½`, 'hansen'],
    [
      'Molar volume',
      s.molarVolumeCm3mol === null ? '—' : `${s.molarVolumeCm3mol} cm³/mol`,
      s.molarVolumeCm3mol === null ? null : 'molarVolumeCm3mol',
    ],
    [
      'Water',
      s.waterMiscibility === 'miscible'
        ? 'miscible'
        : s.waterMutualSolubility
          ? `partly miscible: ${s.waterMutualSolubility.solventInWaterWtPct} wt % in water, ${s.waterMutualSolubility.waterInSolventWtPct} wt % water in it (${s.waterMutualSolubility.temperatureC} °C)`
          : 'partly miscible',
      s.waterMutualSolubility ? 'waterMutualSolubility' : null,
    ],
    [
      'ICH Q3C',
      s.ich.class === null
        ? s.sources.ich?.status === 'not-confirmed'
          ? 'not confirmed — check the current guideline'
          : 'not listed'
        : `Class ${s.ich.class}${s.ich.limitPpm !== null ? `, ${s.ich.limitPpm} ppm` : ''}${s.pdeMgDay ? `, PDE ${s.pdeMgDay} mg/day` : ''}`,
      'ich',
    ],
    ['Solvent-selection guide', <GuideChip key="g" category={s.guideCategory} />, 'guideCategory'],
    ['Peroxide former', s.peroxideFormer ? 'yes' : 'no', 'peroxideFormer'],
    ['Low conductivity (static)', s.lowConductivity ? 'yes' : 'no', 'lowConductivity'],
    ['UNIFAC groups', s.unifac.map((g) => `${g.count} × ${g.name}`).join(', '), 'unifac'],
  ];
  return (
    <div className="space-y-5">
      <dl className="divide-y divide-rule">
        {rows.map(([label, value, key]) => (
          <div key={label} className="py-2">
            <dt className="text-small font-medium text-ink-muted">{label}</dt>
            <dd className="text-body text-ink">{value}</dd>
            {key && s.sources[key] ? <SourceLine source={s.sources[key]} /> : null}
          </div>
        ))}
      </dl>
      <section>
        <h3 className="text-small font-medium text-ink">Antoine constants</h3>
        {s.antoine.length === 0 ? (
          <p className="text-small text-ink-muted">
            None curated: vapour pressures use Clausius–Clapeyron from Tb.
          </p>
        ) : (
          <ul className="mt-1 space-y-2">
            {s.antoine.map((a, i) => (
              <li key={i} className="rounded-control border border-rule px-2 py-1.5 text-small">
                <p className="font-mono">
                  log10(P/bar) = {a.A} − {a.B} / ({a.form === 'log10-bar-degC' ? 't/°C' : 'T/K'} +{' '}
                  {a.C})
                </p>
                <p className="text-ink-muted">
                  valid {a.TminK}–{a.TmaxK} K ({(a.TminK - 273.15).toFixed(0)}–
                  {(a.TmaxK - 273.15).toFixed(0)} °C)
                </p>
                <SourceLine source={a.source} />
              </li>
            ))}
          </ul>
        )}
      </section>
      <p className="text-caption text-ink-muted">Library data version {s.dataVersion}.</p>
    </div>
  );
}

const STATUS_LABEL: Record<ValueSource['status'], string> = {
  confirmed: 'read in the source',
  secondary: 'read in a published reproduction, not the original',
  'unverified-memory': 'from memory, unverified',
  estimated: 'estimated',
  'common-practice': 'common practice',
  'not-confirmed': 'not confirmed: no value held',
};

function SourceLine({ source }: { source: ValueSource }) {
  return (
    <p className="mt-0.5 text-caption text-ink-muted">
      <span
        className={
          source.status === 'unverified-memory' || source.status === 'not-confirmed'
            ? 'font-medium text-caution-advisory-deep'
            : undefined
        }
      >
        {STATUS_LABEL[source.status]}
      </span>
      {' — '}
      {source.citation ?? source.ref}
      {source.note ? ` (${source.note})` : ''}
    </p>
  );
}
