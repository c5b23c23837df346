import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { ConfigError, loadConfig } from './config';
import { printSignIns } from './db/migrator';
import { startRuntime } from './runtime';

async function main() {
  const config = loadConfig();
  const runtime = await startRuntime(config);
  const { app, close: closeApp } = createApp(config);
  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  console.log(`Phasewright is running at http://${config.host}:${port}`);
  if (runtime.smtpFake)
    console.log(
      `Mail goes to the built-in fake (${runtime.smtpFake.url}); read it on the Outbox page.`,
    );
  // The sign-ins come from the seed run (seeders are loaded only when the demo is seeded).
  if (runtime.seeded) printSignIns(runtime.seeded.signIns);

  let stopping = false;
  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal} received, shutting down`);
    // Stop taking connections and let the requests in flight finish (their engine work
    // included); after the grace period, close what is still open. Then wait for handlers
    // whose clients hung up (they still read the session and write a reply to nothing),
    // and only then release the session pool, the engine pool, the job queue and the database.
    const closed = new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeIdleConnections();
    const grace = setTimeout(() => {
      console.error(
        `Requests still open after ${config.shutdownGraceSeconds} s; closing their connections.`,
      );
      server.closeAllConnections();
    }, config.shutdownGraceSeconds * 1000);
    grace.unref();
    await closed;
    clearTimeout(grace);
    await closeApp({ drainMs: config.shutdownGraceSeconds * 1000 });
    await runtime.close();
    process.exit(0);
  };
  process.on('SIGINT', () => void shutdown('SIGINT'));
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
}

function describeStartFailure(error: unknown): unknown {
  if (error instanceof ConfigError) return error.message;
  const code = (error as NodeJS.ErrnoException | null)?.code;
  if (code === 'EADDRINUSE') {
    const { address, port } = error as NodeJS.ErrnoException & { address?: string; port?: number };
    return `Port ${port} on ${address} is already in use: stop the program that holds it, or start with another port (PORT=${(port ?? 3000) + 1} npm start).`;
  }
  return error;
}

main().catch((error: unknown) => {
  console.error(describeStartFailure(error));
  process.exit(1);
});
