import type { Transporter } from 'nodemailer';
import { failAbandonedRuns, failRunsWithoutQueueEntry } from './job-runs';
import { jobQueue, QUEUES } from './jobs';
import { startMonteCarloWorker } from './monte-carlo-jobs';
import { startOptimiseWorker } from './optimise-jobs';
import { createMailTransport, deliverMail, type MailMessage, type MailSettings } from './mail';

/** Starts the background workers of this process. Returns a function that stops them. */
export async function startWorkers(options: {
  mail: MailSettings;
  pollSeconds: number;
  /** A running job silent for this long is marked failed (failAbandonedRuns). */
  staleSeconds: number;
}): Promise<() => Promise<void>> {
  const boss = jobQueue();
  // Runs left "running" by a stop or a crash would count against their owner's
  // open-job limit for good: fail them at start, then keep sweeping, for runs
  // abandoned by another instance that went away while this one runs.
  // Runs left "queued" whose queue entry ran out of retries are failed the same way.
  const sweepOnce = async () => {
    await failAbandonedRuns(options.staleSeconds);
    await failRunsWithoutQueueEntry(options.staleSeconds);
  };
  await sweepOnce();
  const sweep = setInterval(
    () => {
      sweepOnce().catch((error: unknown) => console.error('[jobs] sweeping abandoned runs', error));
    },
    Math.min(60, options.staleSeconds / 2) * 1000,
  );
  sweep.unref();
  // The SMTP client is made at the first message, not at boot (an idle server sends no mail).
  let transport: Promise<Transporter> | null = null;
  await boss.work<MailMessage>(
    QUEUES.mailSend,
    { pollingIntervalSeconds: options.pollSeconds, batchSize: 5 },
    async (jobs) => {
      // A thrown error fails the whole batch and pg-boss retries it with backoff.
      transport ??= createMailTransport(options.mail);
      const smtp = await transport;
      for (const job of jobs) await deliverMail(smtp, options.mail, job.data);
    },
  );
  const stopMonteCarlo = await startMonteCarloWorker(options.pollSeconds);
  const stopOptimise = await startOptimiseWorker(options.pollSeconds);
  return async () => {
    clearInterval(sweep);
    await stopOptimise();
    await stopMonteCarlo();
    await boss.offWork(QUEUES.mailSend);
    (await transport?.catch(() => null))?.close();
  };
}
