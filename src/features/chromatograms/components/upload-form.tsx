import { useId, useRef, useState, type FormEvent } from 'react';
import { CHROMATOGRAM_LIMITS } from '@shared/schemas/chromatograms';
import { isApiError } from '@/api/client';
import { Button } from '@/components/button';
import { TextField } from '@/components/text-field';
import { useUploadChromatogram } from '../api/upload-chromatogram';

/** Attach a sample to the step: a file, its name and when it was taken; a progress bar while it goes up. */
export function UploadForm({
  workspaceId,
  routeId,
  stepId,
  onUploaded,
}: {
  workspaceId: string;
  routeId: string;
  stepId: string;
  onUploaded: (id: string) => void;
}) {
  const upload = useUploadChromatogram(workspaceId, routeId);
  const fileInput = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [sampleName, setSampleName] = useState('');
  const [takenAt, setTakenAt] = useState('');
  const [signal, setSignal] = useState('');
  const [methodNote, setMethodNote] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const fileId = useId();
  const progressId = useId();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const problems: Record<string, string> = {};
    if (!file) problems.file = 'Choose a file to upload.';
    else if (file.size > CHROMATOGRAM_LIMITS.defaultMaxBytes)
      problems.file = `The file is larger than ${CHROMATOGRAM_LIMITS.defaultMaxBytes / 1024 / 1024} MB.`;
    if (!sampleName.trim()) problems.sampleName = 'Give the sample a name.';
    setErrors(problems);
    setFailure(null);
    if (Object.keys(problems).length || !file) return;
    upload.mutate(
      {
        file,
        stepId,
        sampleName: sampleName.trim(),
        takenAt: takenAt ? new Date(takenAt).toISOString() : undefined,
        signal: signal.trim() || undefined,
        methodNote: methodNote.trim() || undefined,
      },
      {
        onSuccess: (created) => {
          setFile(null);
          setSampleName('');
          setTakenAt('');
          setSignal('');
          setMethodNote('');
          if (fileInput.current) fileInput.current.value = '';
          onUploaded(created.id);
        },
        onError: (error) => {
          if (isApiError(error) && error.details.length) setErrors(error.fieldErrors());
          setFailure(error instanceof Error ? error.message : 'The upload failed.');
        },
      },
    );
  };

  const busy = upload.isPending;
  return (
    <form onSubmit={submit} className="space-y-2" aria-label="Upload a sample" noValidate>
      <div className="space-y-1">
        <label htmlFor={fileId} className="block text-small font-medium text-ink">
          Chromatogram or document
        </label>
        <input
          ref={fileInput}
          id={fileId}
          type="file"
          accept=".csv,.tsv,.txt,.asc,.cdf,.nc,.pdf,image/png,image/jpeg,image/gif,image/webp,image/tiff"
          onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          aria-invalid={errors.file ? true : undefined}
          aria-describedby={`${fileId}-hint`}
          disabled={busy}
          className="block w-full text-small file:mr-2 file:rounded-control file:border file:border-rule-strong file:bg-paper-raised file:px-2 file:py-1 file:text-small"
        />
        <p id={`${fileId}-hint`} className="text-caption text-ink-muted">
          CSV or TSV (time and signal columns), ANDI/AIA netCDF (.cdf), or a PDF or image; up to 20
          MB.
        </p>
        {errors.file ? (
          <p className="text-caption text-caution-hazard-deep" role="alert">
            {errors.file}
          </p>
        ) : null}
      </div>
      <TextField
        label="Sample name"
        value={sampleName}
        onValueChange={setSampleName}
        error={errors.sampleName}
        placeholder="e.g. Organic layer after wash"
        maxLength={CHROMATOGRAM_LIMITS.sampleNameMax}
        disabled={busy}
      />
      <div className="grid grid-cols-2 gap-2">
        <TextField
          label="Time taken"
          type="datetime-local"
          value={takenAt}
          onValueChange={setTakenAt}
          error={errors.takenAt}
          disabled={busy}
        />
        <TextField
          label="Signal column"
          value={signal}
          onValueChange={setSignal}
          error={errors.signal}
          hint="Only for files with several."
          disabled={busy}
        />
      </div>
      <TextField
        label="Method note"
        value={methodNote}
        onValueChange={setMethodNote}
        error={errors.methodNote}
        placeholder="Column, gradient, wavelength"
        maxLength={CHROMATOGRAM_LIMITS.methodNoteMax}
        disabled={busy}
      />
      {upload.progress !== null ? (
        <div className="space-y-0.5">
          <label htmlFor={progressId} className="text-caption text-ink-muted">
            {upload.progress < 1
              ? `Uploading… ${Math.round(upload.progress * 100)} %`
              : 'Reading and integrating…'}
          </label>
          <progress
            id={progressId}
            max={1}
            value={upload.progress < 1 ? upload.progress : undefined}
            className="block h-2 w-full accent-accent"
          />
        </div>
      ) : null}
      {failure ? (
        <p
          role="alert"
          className="rounded-control border border-caution-hazard/40 bg-caution-hazard-soft px-2 py-1.5 text-small text-caution-hazard-deep"
        >
          {failure}
        </p>
      ) : null}
      <Button type="submit" size="sm" busy={busy}>
        Upload sample
      </Button>
    </form>
  );
}
