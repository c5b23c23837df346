import { Op } from 'sequelize';
import { OutboxMessage } from '../../server/models';

/**
 * Waits until the SMTP fake has received a message for the address (the mail
 * goes through the job queue, so it arrives a moment after the request).
 * Reads what the fake stored; `after` skips older messages.
 */
export async function waitForMail(
  to: string,
  options: { subject?: RegExp; after?: Date; timeoutMs?: number } = {},
): Promise<OutboxMessage> {
  const deadline = Date.now() + (options.timeoutMs ?? 20_000);
  for (;;) {
    const messages = await OutboxMessage.findAll({
      where: {
        to: { [Op.iLike]: `%${to}%` },
        ...(options.after ? { receivedAt: { [Op.gte]: options.after } } : {}),
      },
      order: [['receivedAt', 'DESC']],
    });
    const match = messages.find((m) => !options.subject || options.subject.test(m.subject));
    if (match) return match;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} arrived within the timeout`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

/** The token at the end of a link like APP_URL/<prefix>/<token> in a message's text. */
export function tokenFromLink(text: string, prefix: 'invitations' | 'reset-password'): string {
  const match = new RegExp(`/${prefix}/([A-Za-z0-9_-]+)`).exec(text);
  if (!match) throw new Error(`no /${prefix}/ link in the message`);
  return match[1];
}
