import type { Transporter } from 'nodemailer';
import type { Transaction } from 'sequelize';
import { ROLE_LABELS, type Role } from '@shared/schemas/session';
import { enqueue, QUEUES } from './jobs';

export interface MailMessage {
  to: string;
  /**
   * The workspaces the message concerns (an invitation: its workspace; account mail: every
   * workspace of the account). The development outbox shows a message only to admins of all
   * of them.
   */
  workspaceIds: string[];
  subject: string;
  text: string;
  html: string;
}

export interface MailSettings {
  /** smtp://host:port of the real server, or of the built-in fake. */
  smtpUrl: string;
  from: string;
  /** The fake speaks plain SMTP only. */
  ignoreTLS: boolean;
  /** Mark each message with its workspaces (for the built-in fake's outbox only). */
  tagWorkspaces: boolean;
}

/** Header that carries a message's workspaces to the built-in mail fake. */
export const WORKSPACES_HEADER = 'X-Phasewright-Workspaces';

const escapeHtml = (value: string) =>
  value.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

export function layout(
  title: string,
  paragraphs: string[],
  action: { label: string; url: string },
  footer: string,
): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join('');
  return `<!doctype html><html><body style="font-family:sans-serif;color:#1f2a30;max-width:560px">
<h1 style="font-size:18px">${escapeHtml(title)}</h1>${body}
<p><a href="${escapeHtml(action.url)}" style="display:inline-block;padding:8px 14px;background:#1d5c63;color:#fff;text-decoration:none;border-radius:4px">${escapeHtml(action.label)}</a></p>
<p style="font-size:12px;color:#5b6770">${escapeHtml(footer)}</p></body></html>`;
}

export function invitationMail(input: {
  to: string;
  workspaceId: string;
  workspaceName: string;
  inviterName: string;
  roles: Role[];
  url: string;
  expiresAt: Date;
}): MailMessage {
  const roles = input.roles.map((role) => ROLE_LABELS[role].toLowerCase()).join(', ');
  const expiry = `The link works once and expires on ${input.expiresAt.toUTCString()}.`;
  const lines = [
    `${input.inviterName} invited you to the workspace "${input.workspaceName}" in Phasewright as ${roles}.`,
    'Open the link to choose your name and password and join.',
  ];
  return {
    to: input.to,
    workspaceIds: [input.workspaceId],
    subject: `You are invited to ${input.workspaceName} on Phasewright`,
    text: `${lines.join('\n\n')}\n\n${input.url}\n\n${expiry}\nIf you did not expect this, ignore the message.\n`,
    html: layout(
      'Join a Phasewright workspace',
      lines,
      { label: 'Accept the invitation', url: input.url },
      expiry,
    ),
  };
}

export function passwordResetMail(input: {
  to: string;
  name: string;
  url: string;
  workspaceIds: string[];
}): MailMessage {
  const lines = [
    `Hello ${input.name},`,
    'Someone asked to reset the password of your Phasewright account. Open the link to choose a new one.',
  ];
  const footer =
    'The link works once and expires in 1 hour. If you did not ask for it, ignore this message; your password stays as it is.';
  return {
    to: input.to,
    workspaceIds: input.workspaceIds,
    subject: 'Reset your Phasewright password',
    text: `${lines.join('\n\n')}\n\n${input.url}\n\n${footer}\n`,
    html: layout(
      'Reset your password',
      lines,
      { label: 'Choose a new password', url: input.url },
      footer,
    ),
  };
}

/**
 * Queues a message for delivery. Mail is only ever sent by the worker, so a
 * mail server that is down delays messages instead of losing them.
 */
export async function queueMail(
  message: MailMessage,
  transaction: Transaction | null,
): Promise<void> {
  await enqueue(
    QUEUES.mailSend,
    message,
    { retryLimit: 8, retryDelay: 15, retryBackoff: true, expireInMinutes: 5 },
    transaction,
  );
}

export async function createMailTransport(settings: MailSettings): Promise<Transporter> {
  const { default: nodemailer } = await import('nodemailer');
  return nodemailer.createTransport({ url: settings.smtpUrl, ignoreTLS: settings.ignoreTLS });
}

/** Delivers one message now; used by the mail.send worker. Throws so the job is retried. */
export async function deliverMail(
  transport: Transporter,
  settings: MailSettings,
  message: MailMessage,
): Promise<void> {
  await transport.sendMail({
    from: settings.from,
    ...(settings.tagWorkspaces
      ? { headers: { [WORKSPACES_HEADER]: (message.workspaceIds ?? []).join(',') } }
      : {}),
    to: message.to,
    subject: message.subject,
    text: message.text,
    html: message.html,
  });
}
