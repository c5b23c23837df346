import type { Transporter } from 'nodemailer';
import { jobQueue, QUEUES } from './jobs';
import { startMonteCarloWorker } from './monte-carlo-jobs';
import { startOptimiseWorker } from './optimise-jobs';
import { createMailTransport, deliverMail, type MailMessage, type MailSettings } from './mail';

/** Starts the background workers of this process. Returns a function that stops them. */
export async function startWorkers(options: {
  mail: MailSettings;
  pollSeconds: number;
}): Promise<() => Promise<void>> {
  const boss = jobQueue();
  const transport: Transporter = createMailTransport(options.mail);
  await boss.work<MailMessage>(
    QUEUES.mailSend,
    { pollingIntervalSeconds: options.pollSeconds, batchSize: 5 },
    async (jobs) => {
      // A thrown error fails the whole batch and pg-boss retries it with backoff.
      for (const job of jobs) await deliverMail(transport, options.mail, job.data);
    },
  );
  const stopMonteCarlo = await startMonteCarloWorker(options.pollSeconds);
  const stopOptimise = await startOptimiseWorker(options.pollSeconds);
  return async () => {
    await stopOptimise();
    await stopMonteCarlo();
    await boss.offWork(QUEUES.mailSend);
    transport.close();
  };
}
