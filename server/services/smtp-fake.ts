import type { AddressInfo } from 'node:net';
import type { AddressObject } from 'mailparser';
import { OutboxMessage } from '../models';
import { WORKSPACES_HEADER } from './mail';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export interface SmtpFake {
  port: number;
  url: string;
  close(): Promise<void>;
}

const addressesOf = (field: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(field) ? field : field ? [field] : []).map((a) => a.text).join(', ');

/**
 * A local SMTP server for development, tests and the demo: it accepts every
 * message on 127.0.0.1 and keeps it in outbox_messages, where the outbox page
 * and the tests read it back. Never exposed beyond loopback.
 */
export async function startSmtpFake(port = 0): Promise<SmtpFake> {
  // Loaded here, not at boot: a server with a real SMTP server configured never needs them,
  // and the message parser only once the first message arrives.
  const { SMTPServer } = await import('smtp-server');
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    banner: 'Phasewright mail fake',
    onData(stream, session, callback) {
      import('mailparser')
        .then(({ simpleParser }) => simpleParser(stream))
        .then(async (mail) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address).join(', ');
          const tagged = String(mail.headers.get(WORKSPACES_HEADER.toLowerCase()) ?? '');
          await OutboxMessage.create({
            workspaceIds: tagged
              .split(',')
              .filter((id) => UUID.test(id.trim()))
              .map((id) => id.trim()),
            to: addressesOf(mail.to) || envelopeTo,
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const actualPort = (server.server.address() as AddressInfo).port;
  return {
    port: actualPort,
    url: `smtp://127.0.0.1:${actualPort}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
