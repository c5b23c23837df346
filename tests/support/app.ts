import type { Express } from 'express';
import { afterAll, beforeAll } from 'vitest';
import { createApp, type AppOptions } from '../../server/app';
import { loadConfig, type AppConfig } from '../../server/config';
import { startRuntime, type Runtime } from '../../server/runtime';

export interface TestServer {
  app: Express;
  config: AppConfig;
  runtime: Runtime;
  /** Another app instance on the same database (a second server, or other settings); closed after the file. */
  anotherApp(config?: AppConfig, options?: AppOptions): Express;
}

/** Environment for tests: the per-run database, the mail fake on a free port, a fast job poll. */
export function testConfig(overrides: Record<string, string> = {}): AppConfig {
  return loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: process.env.DATABASE_URL,
    DATABASE_OWNER_URL: process.env.DATABASE_OWNER_URL,
    APP_URL: 'http://app.test',
    SMTP_FAKE_PORT: '0',
    JOB_POLL_SECONDS: '0.5',
    // High enough not to trip ordinary tests; the rate-limit test builds its own app.
    SIGN_IN_RATE_LIMIT: '100000',
    RESET_RATE_LIMIT: '100000',
    // The throttle tests build their own app with the real numbers and their own addresses.
    SIGN_IN_FREE_FAILURES_PAIR: '100000',
    SIGN_IN_FREE_FAILURES_ACCOUNT: '100000',
    SIGN_IN_FREE_FAILURES_ADDRESS: '100000',
    STATIC_DIR: 'dist',
    ...overrides,
  });
}

/**
 * Starts the real runtime (database, SMTP fake, job queue and mail worker)
 * and an app for the current test file; everything stops after the file.
 * The returned object's fields are filled in by beforeAll.
 */
export function useTestServer(overrides: Record<string, string> = {}): TestServer {
  const apps: { close(): Promise<void> }[] = [];
  const build = (config: AppConfig, options: AppOptions = {}) => {
    // TEST_LOG_ERRORS=1 prints the errors behind 500 replies.
    const log = process.env.TEST_LOG_ERRORS ? (e: unknown) => console.error(e) : () => undefined;
    const built = createApp(config, { log, ...options });
    apps.push(built);
    return built.app;
  };
  const server: TestServer = {
    app: undefined as unknown as Express,
    config: undefined as unknown as AppConfig,
    runtime: undefined as unknown as Runtime,
    anotherApp: (config, options) => build(config ?? server.config, options),
  };
  beforeAll(async () => {
    server.config = testConfig(overrides);
    server.runtime = await startRuntime(server.config);
    server.app = build(server.config);
  });
  afterAll(async () => {
    for (const built of apps) await built.close();
    await server.runtime?.close();
  });
  return server;
}

/**
 * The test cluster's superuser, for tests that create whole databases: the
 * server's role and the owner role may not.
 */
export function clusterAdminUrl(database = 'postgres'): string {
  const url = new URL(process.env.DATABASE_URL!);
  url.username = 'postgres';
  url.pathname = `/${database}`;
  return url.href;
}

/** A connection as the schema owner (migrations, seeds, or editing behind the server's back). */
export const ownerDatabaseUrl = () => process.env.DATABASE_OWNER_URL!;
