import type { Signature } from '@shared/schemas/revisions';

const utc = (iso: string) => `${iso.replace('T', ' ').slice(0, 19)} UTC`;

/** A signed decision as the record keeps it: who, when (UTC), what it means, and what was signed. */
export function SignatureRecord({ signature }: { signature: Signature }) {
  const approve = signature.decision === 'approve';
  return (
    <figure
      aria-label={`Signature of ${signature.signer.name}`}
      className={`rounded-card border p-2.5 text-small ${approve ? 'border-accent/40 bg-accent-soft' : 'border-caution-warning/50 bg-caution-warning-soft'}`}
    >
      <p className="font-medium">
        {approve ? 'Approved' : 'Returned'} — signed by {signature.signer.name}
      </p>
      <p className="text-ink-muted">
        {signature.signer.email} · {utc(signature.signedAt)}
      </p>
      <blockquote className="mt-1">“{signature.meaning}”</blockquote>
      {signature.reason ? <p className="mt-1">Reason: {signature.reason}</p> : null}
      <p
        className="mt-1 font-mono text-caption break-all text-ink-muted"
        title="Content hash of the signed revision"
      >
        Content hash {signature.contentHash}
      </p>
    </figure>
  );
}
