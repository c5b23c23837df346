import { useState } from 'react';
import {
  createTokenSchema,
  TOKEN_EXPIRY_DAYS,
  TOKEN_SCOPE_LABELS,
  TOKEN_SCOPES,
  type ApiToken,
  type CreatedToken,
  type TokenScope,
} from '@shared/schemas/tokens';
import { useTokens } from '../api/get-tokens';
import { useCreateToken } from '../api/create-token';
import { useRevokeToken } from '../api/revoke-token';
import { Button } from '@/components/button';
import { Select } from '@/components/select';
import { TextField } from '@/components/text-field';
import { Table, Td, Th } from '@/components/table';
import { EmptyState } from '@/components/empty-state';
import { ErrorState, FormMessage } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { useForm } from '@/lib/use-form';
import { formatDateTime } from '@/lib/format';
import { toast } from '@/stores/toasts';

/** Lifetimes offered for a new token, days (the API accepts 1 to 365). */
const EXPIRY_CHOICES = [7, 30, 90, 365] as const;

export function TokensPanel() {
  const [created, setCreated] = useState<CreatedToken | null>(null);
  return (
    <div className="space-y-4">
      <CreateTokenForm onCreated={setCreated} />
      {created ? <NewTokenNotice token={created} onDismiss={() => setCreated(null)} /> : null}
      <TokenList />
    </div>
  );
}

function CreateTokenForm({ onCreated }: { onCreated: (t: CreatedToken) => void }) {
  const create = useCreateToken();
  const form = useForm(createTokenSchema, {
    name: '',
    scope: 'read',
    expiresInDays: TOKEN_EXPIRY_DAYS.default,
  });
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const input = form.validate();
    if (!input) return;
    create.mutate(input, {
      onSuccess: (token) => {
        form.reset();
        onCreated(token);
      },
      onError: form.showServerError,
    });
  };
  return (
    <form noValidate onSubmit={submit} className="space-y-2" aria-label="Create an API token">
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      <div className="flex items-start gap-2">
        <TextField
          label="Token name"
          hint="Say what will use it, e.g. “ELN export script”."
          className="max-w-form flex-1"
          value={form.values.name}
          onValueChange={(v) => form.setField('name', v)}
          error={form.errors.name}
        />
        <Select
          label="Access"
          className="w-40"
          value={form.values.scope ?? 'read'}
          options={TOKEN_SCOPES.map((scope) => ({
            value: scope,
            label: TOKEN_SCOPE_LABELS[scope],
          }))}
          onValueChange={(v) => form.setField('scope', v as TokenScope)}
        />
        <Select
          label="Works for"
          className="w-32"
          value={String(form.values.expiresInDays ?? TOKEN_EXPIRY_DAYS.default)}
          options={EXPIRY_CHOICES.map((days) => ({ value: String(days), label: `${days} days` }))}
          onValueChange={(v) => form.setField('expiresInDays', Number(v))}
        />
        <Button type="submit" className="mt-[1.375rem]" busy={create.isPending}>
          Create token
        </Button>
      </div>
    </form>
  );
}

function NewTokenNotice({ token, onDismiss }: { token: CreatedToken; onDismiss: () => void }) {
  const [copied, setCopied] = useState(false);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(token.token);
      setCopied(true);
    } catch {
      toast.error('The browser refused to copy. Select the token and copy it by hand.');
    }
  };
  return (
    <div
      role="status"
      className="rounded-card border border-caution-advisory/50 bg-caution-advisory-soft p-4"
    >
      <p className="font-medium text-caution-advisory-deep">
        Token “{token.name}” created. Copy it now: it is shown only this once.
      </p>
      <div className="mt-2 flex items-center gap-2">
        <code
          aria-label="New API token"
          className="flex-1 overflow-x-auto rounded-control border border-rule bg-paper-raised px-2.5 py-1.5 font-mono text-small whitespace-nowrap text-ink select-all"
        >
          {token.token}
        </code>
        <Button variant="secondary" onClick={copy}>
          {copied ? 'Copied' : 'Copy'}
        </Button>
        <Button variant="quiet" onClick={onDismiss}>
          Done
        </Button>
      </div>
      <p className="mt-2 text-caption text-ink-muted">
        Send it as <code className="font-mono">Authorization: Bearer &lt;token&gt;</code>. It acts
        with your roles{token.scope === 'read' ? ', reading only,' : ''} until{' '}
        {formatDateTime(token.expiresAt)} or until you revoke it. Changing your password revokes it.
      </p>
    </div>
  );
}

function TokenList() {
  const tokens = useTokens();
  const revoke = useRevokeToken();
  const [revoking, setRevoking] = useState<ApiToken | null>(null);

  if (tokens.isPending) return <Loading label="Loading tokens…" />;
  if (tokens.isError)
    return (
      <ErrorState
        error={tokens.error}
        title="Tokens could not be loaded"
        onRetry={() => tokens.refetch()}
      />
    );
  if (tokens.data.length === 0) {
    return (
      <EmptyState title="No API tokens">
        Create a token when a script or another system needs to read or write Phasewright data on
        your behalf.
      </EmptyState>
    );
  }
  return (
    <>
      <Table caption="Your API tokens">
        <thead>
          <tr>
            <Th>Name</Th>
            <Th>Access</Th>
            <Th>Created</Th>
            <Th>Expires</Th>
            <Th>Last used</Th>
            <Th className="text-right">
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {tokens.data.map((t) => (
            <tr key={t.id}>
              <Td className="font-medium">{t.name}</Td>
              <Td>{TOKEN_SCOPE_LABELS[t.scope]}</Td>
              <Td className="text-ink-muted">{formatDateTime(t.createdAt)}</Td>
              <Td
                className={
                  Date.parse(t.expiresAt) <= Date.now()
                    ? 'text-caution-hazard-deep'
                    : 'text-ink-muted'
                }
              >
                {Date.parse(t.expiresAt) <= Date.now() ? 'Expired ' : ''}
                {formatDateTime(t.expiresAt)}
              </Td>
              <Td className="text-ink-muted">
                {t.lastUsedAt ? formatDateTime(t.lastUsedAt) : 'Never'}
              </Td>
              <Td className="text-right">
                <Button
                  variant="quiet"
                  size="sm"
                  className="text-caution-hazard-deep"
                  onClick={() => setRevoking(t)}
                  aria-label={`Revoke ${t.name}`}
                >
                  Revoke
                </Button>
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
      <ConfirmDialog
        open={revoking !== null}
        title={revoking ? `Revoke “${revoking.name}”?` : ''}
        confirmLabel="Revoke token"
        busy={revoke.isPending}
        onCancel={() => setRevoking(null)}
        onConfirm={() => {
          if (!revoking) return;
          const t = revoking;
          revoke.mutate(t.id, {
            onSuccess: () => toast.success(`Token “${t.name}” revoked.`),
            onError: (e) => toast.error(e.message),
            onSettled: () => setRevoking(null),
          });
        }}
      >
        Anything still using this token is refused from now on. This cannot be undone; create a new
        token if you need one.
      </ConfirmDialog>
    </>
  );
}
