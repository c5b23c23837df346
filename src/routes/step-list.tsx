import { useMemo, useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import {
  STEP_LIST_BASES,
  STEP_LIST_BASIS_LABELS,
  STEP_LIST_FORMATS,
  stepListRequestSchema,
  type StepListDocument,
  type StepListFormat,
  type StepListRequest,
} from '@shared/schemas/step-list';
import { EQUIPMENT_KIND_LABELS, type Equipment } from '@shared/schemas/equipment';
import { Button } from '@/components/button';
import { Card } from '@/components/card';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { PageHeader } from '@/components/page-header';
import { Select } from '@/components/select';
import { Loading } from '@/components/spinner';
import { FieldError, TextField } from '@/components/text-field';
import { isApiError } from '@/api/client';
import { canInWorkspace } from '@/features/auth/abilities';
import { useSession } from '@/features/auth/api/get-session';
import { useWorkspace } from '@/features/auth/use-workspace';
import { useEquipment } from '@/features/equipment';
import { SignatureRecord, StatusBadge, useRevision } from '@/features/review';
import { useDownloadStepList, useStepList } from '@/features/step-list/api/step-list';
import { StepListTable } from '@/features/step-list/components/step-list-table';
import { issuesToErrors, type FieldErrors } from '@/lib/use-form';
import { paths } from '@/paths';
import { toast } from '@/stores/toasts';

const FORMAT_LABELS: Record<StepListFormat, string> = {
  json: 'JSON',
  csv: 'CSV',
  xlsx: 'Excel (XLSX)',
  pdf: 'PDF',
};

/** Which equipment a step can run in. */
const kindsFor = (stepKind: string): Equipment['kind'][] =>
  stepKind === 'filtration'
    ? ['filter', 'vessel']
    : stepKind === 'drying'
      ? ['dryer', 'vessel']
      : ['vessel'];

/** The plant step list of one revision: batch size, equipment per step, the operations with their vessel checks, downloads and a printable page. */
export function Component() {
  const workspace = useWorkspace();
  const { routeId = '', number = '' } = useParams();
  const revisionNumber = Number(number);
  const where = { workspaceId: workspace.id, routeId, number: revisionNumber };
  const { data: session } = useSession();
  const revision = useRevision(workspace.id, routeId, revisionNumber);
  const equipment = useEquipment(workspace.id);
  const build = useStepList(where);
  const download = useDownloadStepList(where);
  const [batchKg, setBatchKg] = useState('');
  const [basis, setBasis] = useState<StepListRequest['basis']>('input');
  const [chosen, setChosen] = useState<Record<string, string>>({});
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string>();
  const [list, setList] = useState<StepListDocument | null>(null);

  const steps = useMemo(
    () =>
      (
        (revision.data?.document.steps ?? []) as Array<{ id: string; name: string; kind: string }>
      ).map((s) => ({ id: s.id, name: s.name || s.id, kind: s.kind })),
    [revision.data],
  );
  if (!session) return null;
  const canExport = canInWorkspace(session, workspace.id, 'stepList.export');

  const request = (): Omit<StepListRequest, 'format'> | null => {
    const equipmentChoice = Object.fromEntries(Object.entries(chosen).filter(([, id]) => id));
    const parsed = stepListRequestSchema.safeParse({
      batchKg: batchKg.trim() === '' ? undefined : Number(batchKg.replace(',', '.')),
      basis,
      equipment: equipmentChoice,
      format: 'json',
    });
    if (!parsed.success) {
      setErrors(issuesToErrors(parsed.error.issues));
      return null;
    }
    setErrors({});
    const { format: _format, ...rest } = parsed.data;
    return rest;
  };

  const showFailure = (error: unknown) => {
    if (isApiError(error) && Object.keys(error.fieldErrors()).length > 0) {
      setErrors(error.fieldErrors());
      setFormError(error.message);
    } else setFormError(error instanceof Error ? error.message : 'Something went wrong.');
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(undefined);
    const body = request();
    if (!body) return;
    build.mutate(body, { onSuccess: setList, onError: showFailure });
  };

  const fetchFile = (format: StepListFormat) => {
    setFormError(undefined);
    const body = request();
    if (!body) return;
    download.mutate(
      { request: body, format },
      {
        onSuccess: ({ filename }) => toast.success(`${filename} downloaded.`),
        onError: showFailure,
      },
    );
  };

  if (revision.isPending) return <Loading label="Opening the revision…" />;
  if (revision.isError)
    return (
      <ErrorState
        title="The revision could not be opened"
        error={revision.error}
        onRetry={() => revision.refetch()}
      />
    );
  const data = revision.data;
  const approval = data.approval?.signatures.at(-1);
  const failedChecks = list?.operations.filter((op) => op.vesselCheck && !op.vesselCheck.ok) ?? [];

  return (
    <div className="step-list-page">
      <PageHeader
        eyebrow={
          <Link
            className="text-accent hover:underline print:text-ink"
            to={paths.workspace.revision.to(workspace.id, routeId, revisionNumber)}
          >
            {list?.route.name ?? 'Revision'} · revision {revisionNumber}
          </Link>
        }
        title="Plant step list"
        description="The revision as numbered operations for your batch and your vessels, with charges, conditions, IPCs and cautions. Each operation's volume is checked against the equipment you choose."
        actions={
          <span className="flex items-center gap-2">
            <StatusBadge status={data.status} />
          </span>
        }
      />
      {!canExport ? (
        <EmptyState title="Step lists are made by scale-up engineers and admins">
          Ask a scale-up engineer of this workspace for the step list of this revision.
        </EmptyState>
      ) : (
        <>
          {approval ? (
            <div className="mb-4 max-w-prose">
              <SignatureRecord signature={approval} />
            </div>
          ) : (
            <p
              role="status"
              className="mb-4 rounded-card border border-caution-hazard bg-caution-hazard-soft px-3 py-2 font-medium text-caution-hazard-deep"
            >
              DRAFT — this revision is not approved. Its step list carries the draft mark and is not
              for use in the plant.
            </p>
          )}
          <Card title="Batch and equipment" className="mb-6 print:hidden">
            <form
              onSubmit={submit}
              noValidate
              aria-label="Batch and equipment"
              className="space-y-4"
            >
              <div className="grid max-w-2xl grid-cols-1 gap-3 sm:grid-cols-2">
                <TextField
                  label="Batch size (kg)"
                  inputMode="decimal"
                  value={batchKg}
                  onValueChange={(value) => {
                    setBatchKg(value);
                    setErrors(({ batchKg: _dropped, ...rest }) => rest);
                  }}
                  error={errors.batchKg}
                  hint="For example 50."
                />
                <Select
                  label="The batch size is"
                  value={basis}
                  options={STEP_LIST_BASES.map((b) => ({
                    value: b,
                    label: STEP_LIST_BASIS_LABELS[b],
                  }))}
                  onValueChange={(value) => setBasis(value as StepListRequest['basis'])}
                />
              </div>
              {equipment.isError ? (
                <ErrorState
                  title="The equipment could not be loaded"
                  error={equipment.error}
                  onRetry={() => equipment.refetch()}
                />
              ) : equipment.data && equipment.data.length === 0 ? (
                <p className="text-small text-ink-muted">
                  This workspace has no equipment yet: the step list is made without vessel checks.{' '}
                  <Link
                    className="text-accent hover:underline"
                    to={paths.workspace.equipment.to(workspace.id)}
                  >
                    Add your vessels
                  </Link>
                  .
                </p>
              ) : (
                <fieldset>
                  <legend className="mb-2 text-small font-medium text-ink">
                    Equipment per step
                  </legend>
                  <div className="grid grid-cols-1 gap-2 sm:grid-cols-2 lg:grid-cols-3">
                    {steps.map((step) => (
                      <div key={step.id}>
                        <Select
                          label={step.name}
                          value={chosen[step.id] ?? ''}
                          options={[
                            { value: '', label: 'No equipment (no check)' },
                            ...(equipment.data ?? [])
                              .filter((item) => kindsFor(step.kind).includes(item.kind))
                              .map((item) => ({
                                value: item.id,
                                label: `${item.name} — ${EQUIPMENT_KIND_LABELS[item.kind].toLowerCase()}, ${
                                  item.kind === 'vessel'
                                    ? `${item.minStirrableL}–${item.maxWorkingL} L`
                                    : `${item.capacityL} L`
                                }`,
                              })),
                          ]}
                          onValueChange={(value) => setChosen((c) => ({ ...c, [step.id]: value }))}
                        />
                        {errors[`equipment.${step.id}`] ? (
                          <FieldError>{errors[`equipment.${step.id}`]}</FieldError>
                        ) : null}
                      </div>
                    ))}
                  </div>
                </fieldset>
              )}
              {formError ? <FieldError>{formError}</FieldError> : null}
              <div className="flex flex-wrap items-center gap-2">
                <Button type="submit" busy={build.isPending}>
                  Make the step list
                </Button>
                <span className="mx-1 text-small text-ink-muted">Download:</span>
                {STEP_LIST_FORMATS.map((format) => (
                  <Button
                    key={format}
                    type="button"
                    variant="secondary"
                    size="sm"
                    busy={download.isPending && download.variables?.format === format}
                    onClick={() => fetchFile(format)}
                  >
                    {FORMAT_LABELS[format]}
                  </Button>
                ))}
                {list ? (
                  <Button type="button" variant="quiet" size="sm" onClick={() => window.print()}>
                    Print
                  </Button>
                ) : null}
              </div>
            </form>
          </Card>
          {build.isPending ? (
            <Loading label="Scaling the route and checking the vessels…" />
          ) : list ? (
            <section aria-label="Step list">
              <header className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
                <h2 className="text-title font-medium">
                  {list.operations.length} operations for {list.batchKg}{' '}
                  {STEP_LIST_BASIS_LABELS[list.basis]}
                  {list.draft ? ' — DRAFT' : ''}
                </h2>
                <p
                  role="status"
                  className={
                    failedChecks.length ? 'font-medium text-caution-hazard-deep' : 'text-ink-muted'
                  }
                >
                  {list.equipment.length === 0
                    ? 'No equipment chosen: no vessel checks.'
                    : failedChecks.length === 0
                      ? 'Every operation fits its equipment.'
                      : `${failedChecks.length} operation${failedChecks.length === 1 ? '' : 's'} need another vessel or a smaller batch.`}
                </p>
              </header>
              <StepListTable
                list={list}
                stepNames={Object.fromEntries(steps.map((s) => [s.id, s.name]))}
              />
              <p className="mt-4 max-w-prose text-small text-ink-muted">{list.processSafetyNote}</p>
            </section>
          ) : (
            <EmptyState title="Enter the batch size and choose the vessels, then make the step list">
              The revision is scaled to your batch and run through the engine again, so every
              charge, volume and time is for the plant.
            </EmptyState>
          )}
        </>
      )}
    </div>
  );
}
