import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { database } from '../../server/db/sequelize';
import { queueMail } from '../../server/services/mail';
import { startSmtpFake } from '../../server/services/smtp-fake';
import { useTestServer } from '../support/app';
import { waitForMail } from '../support/mail';

const server = useTestServer();

const message = (to: string) => ({
  to,
  workspaceIds: [] as string[],
  subject: 'Queue check',
  text: 'Plain text body',
  html: '<p>HTML body</p>',
});

async function jobsFor(to: string) {
  return database().query<{
    id: string;
    state: string;
    retry_limit: number;
    retry_backoff: boolean;
  }>(
    `SELECT id, state, retry_limit, retry_backoff FROM pgboss.job WHERE name = 'mail.send' AND data->>'to' = :to`,
    { replacements: { to }, type: QueryTypes.SELECT },
  );
}

describe('mail queue', () => {
  it('queues mail in the caller’s transaction: nothing is sent when it rolls back', async () => {
    await database()
      .transaction(async (transaction) => {
        await queueMail(message('rolled-back@example.com'), transaction);
        throw new Error('roll back');
      })
      .catch(() => undefined);
    expect(await jobsFor('rolled-back@example.com')).toEqual([]);

    await database().transaction((transaction) =>
      queueMail(message('committed@example.com'), transaction),
    );
    const [job] = await jobsFor('committed@example.com');
    expect(job.retry_limit).toBeGreaterThan(3);
    expect(job.retry_backoff).toBe(true);
    const mail = await waitForMail('committed@example.com');
    expect(mail.text.trim()).toBe('Plain text body');
    expect(mail.html).toContain('<p>HTML body</p>');
  });

  it('keeps a message while the mail server is down and delivers it when it is back', async () => {
    const fake = server.runtime.smtpFake!;
    const port = fake.port;
    await fake.close();
    try {
      await queueMail(message('patient@example.com'), null);
      // Wait until the first delivery attempt has failed and the job awaits a retry.
      const deadline = Date.now() + 20_000;
      let state = '';
      while (state !== 'retry' && Date.now() < deadline) {
        await new Promise((resolve) => setTimeout(resolve, 250));
        state = (await jobsFor('patient@example.com'))[0]?.state ?? '';
      }
      expect(state).toBe('retry');
    } finally {
      // The mail server comes back on the same address.
      const revived = await startSmtpFake(port);
      server.runtime.smtpFake!.close = revived.close;
    }
    // Skip the backoff wait rather than sleeping through it.
    await database().query(
      `UPDATE pgboss.job SET start_after = now() WHERE name = 'mail.send' AND data->>'to' = 'patient@example.com'`,
    );
    const mail = await waitForMail('patient@example.com');
    expect(mail.subject).toBe('Queue check');
  });
});
