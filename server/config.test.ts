import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from './config';

describe('loadConfig', () => {
  it('has safe development defaults', () => {
    const config = loadConfig({});
    expect(config).toMatchObject({
      env: 'development',
      host: '127.0.0.1',
      port: 3000,
      appUrl: 'http://127.0.0.1:3000',
      sessionIdleMinutes: 120,
      trustProxy: false,
      smtpUrl: null,
      mailFrom: 'Phasewright <no-reply@phasewright.invalid>',
      seedDemo: false,
      outboxEnabled: true,
    });
  });

  it('retires idle engine threads after ENGINE_IDLE_SECONDS (default 60; 0 keeps them)', () => {
    expect(loadConfig({}).pool.idleMs).toBe(60_000);
    expect(loadConfig({ ENGINE_IDLE_SECONDS: '0.5' }).pool.idleMs).toBe(500);
    expect(loadConfig({ ENGINE_IDLE_SECONDS: '0' }).pool.idleMs).toBe(0);
    expect(() => loadConfig({ ENGINE_IDLE_SECONDS: '-1' })).toThrow(ConfigError);
  });

  it('requires SESSION_SECRET in production and refuses to seed there', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(ConfigError);
    const problems = (() => {
      try {
        loadConfig({ NODE_ENV: 'production', PHASEWRIGHT_SEED_DEMO: '1' });
        return [];
      } catch (error) {
        return (error as ConfigError).problems;
      }
    })();
    expect(problems).toEqual([
      'SESSION_SECRET: SESSION_SECRET is required in production.',
      'PHASEWRIGHT_SEED_DEMO: The demo data is never seeded in production.',
    ]);
    const production = loadConfig({
      NODE_ENV: 'production',
      SESSION_SECRET: 'a-long-enough-production-secret',
    });
    expect(production.outboxEnabled).toBe(false);
  });

  it('reads numbers, trust proxy and the public URL from the environment', () => {
    const config = loadConfig({
      PORT: '3999',
      TRUST_PROXY: '2',
      APP_URL: 'https://phasewright.example.com/',
      SESSION_IDLE_MINUTES: '30',
    });
    expect(config.port).toBe(3999);
    expect(config.trustProxy).toBe(2);
    expect(config.appUrl).toBe('https://phasewright.example.com');
    expect(config.sessionIdleMinutes).toBe(30);
    expect(loadConfig({ TRUST_PROXY: 'loopback' }).trustProxy).toBe('loopback');
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/PORT/);
  });

  it('takes a running job as abandoned only after twice the engine time limit without progress', () => {
    expect(loadConfig({}).jobStaleSeconds).toBe(600);
    expect(loadConfig({ JOB_STALE_MINUTES: '2', ENGINE_TASK_SECONDS: '60' }).jobStaleSeconds).toBe(
      120,
    );
    expect(() => loadConfig({ JOB_STALE_MINUTES: '1', ENGINE_TASK_SECONDS: '60' })).toThrow(
      /JOB_STALE_MINUTES/,
    );
  });
});
