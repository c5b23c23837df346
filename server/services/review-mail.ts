/** E-mails of the review workflow; each links to the revision in the product. */
import { layout, type MailMessage } from './mail';

const footer = (workspaceName: string) =>
  `You receive this because of your part in a review in "${workspaceName}" on Phasewright.`;

function message(
  to: string,
  subject: string,
  title: string,
  lines: string[],
  action: { label: string; url: string },
  workspaceName: string,
  workspaceId: string,
): MailMessage {
  return {
    to,
    workspaceIds: [workspaceId],
    subject,
    text: `${lines.join('\n\n')}\n\n${action.label}: ${action.url}\n\n${footer(workspaceName)}\n`,
    html: layout(title, lines, action, footer(workspaceName)),
  };
}

export function reviewRequestMail(input: {
  to: string;
  reviewerName: string;
  authorName: string;
  routeName: string;
  revisionNumber: number;
  note: string;
  workspaceName: string;
  workspaceId: string;
  url: string;
}): MailMessage {
  const lines = [
    `Hello ${input.reviewerName},`,
    `${input.authorName} asks you to review revision ${input.revisionNumber} of the route "${input.routeName}".`,
    ...(input.note ? [`Their note: ${input.note}`] : []),
    'Comment on the route or on a step, then approve with your signature or return it with a reason.',
  ];
  return message(
    input.to,
    `Review requested: ${input.routeName}, revision ${input.revisionNumber}`,
    'A revision waits for your review',
    lines,
    { label: 'Open the revision', url: input.url },
    input.workspaceName,
    input.workspaceId,
  );
}

export function commentMail(input: {
  to: string;
  recipientName: string;
  authorName: string;
  routeName: string;
  revisionNumber: number;
  stepName: string | null;
  body: string;
  reply: boolean;
  workspaceName: string;
  workspaceId: string;
  url: string;
}): MailMessage {
  const where = input.stepName ? `on the step "${input.stepName}"` : 'on the route';
  const lines = [
    `Hello ${input.recipientName},`,
    `${input.authorName} ${input.reply ? 'replied to a comment' : 'commented'} ${where} in revision ${input.revisionNumber} of "${input.routeName}":`,
    input.body,
  ];
  return message(
    input.to,
    `New comment: ${input.routeName}, revision ${input.revisionNumber}`,
    'A new comment on your revision',
    lines,
    { label: 'Read the comment', url: input.url },
    input.workspaceName,
    input.workspaceId,
  );
}

export function decisionMail(input: {
  to: string;
  authorName: string;
  signerName: string;
  decision: 'approve' | 'return';
  status: string;
  routeName: string;
  revisionNumber: number;
  reason: string | null;
  signedAt: Date;
  workspaceName: string;
  workspaceId: string;
  url: string;
}): MailMessage {
  const when = `${input.signedAt.toISOString().replace('T', ' ').slice(0, 19)} UTC`;
  const approved = input.decision === 'approve';
  const lines = [
    `Hello ${input.authorName},`,
    approved
      ? `${input.signerName} approved revision ${input.revisionNumber} of "${input.routeName}" with an electronic signature on ${when}.`
      : `${input.signerName} returned revision ${input.revisionNumber} of "${input.routeName}" on ${when}.`,
    ...(input.reason ? [`Reason: ${input.reason}`] : []),
    approved
      ? input.status === 'approved'
        ? 'Every reviewer has signed: the revision is approved.'
        : 'Other reviewers have still to sign.'
      : 'Make the changes in the draft and save a new revision for review.',
  ];
  return message(
    input.to,
    `${approved ? 'Approved' : 'Returned'}: ${input.routeName}, revision ${input.revisionNumber}`,
    approved ? 'Your revision was approved' : 'Your revision was returned',
    lines,
    { label: 'Open the revision', url: input.url },
    input.workspaceName,
    input.workspaceId,
  );
}
