/**
 * Compression and the production build: API replies and the page are compressed, built
 * assets are sent from their brotli or gzip copy with a year-long immutable cache, and the
 * compiled server (no TypeScript loader) starts, migrates, serves and runs the engine pool.
 */
import { execFile } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { testConfig, useTestServer } from '../support/app';
import { buildMember, buildWorkspace, DEFAULT_PASSWORD } from '../support/factories';
import { projectRoot, startServerProcess, type ServerProcess } from '../support/server-process';

const server = useTestServer();
const run = promisify(execFile);

// A built client in miniature: the page and one hashed script with its .br and .gz copies.
const script = `export const steps = [${Array.from({ length: 400 }, (_, i) => `"step ${i}"`).join(',')}];\n`;
const page = `<!doctype html><html><head><title>Phasewright</title></head><body>${'<div class="x"></div>'.repeat(100)}</body></html>`;
const SCRIPT = 'app-3f9c2a1b.js';

let staticDir: string;
beforeAll(() => {
  mkdirSync(path.join(projectRoot, 'test-output'), { recursive: true });
  staticDir = mkdtempSync(path.join(projectRoot, 'test-output', 'static-'));
  mkdirSync(path.join(staticDir, 'assets'));
  writeFileSync(path.join(staticDir, 'index.html'), page);
  writeFileSync(path.join(staticDir, 'assets', SCRIPT), script);
  writeFileSync(path.join(staticDir, 'assets', `${SCRIPT}.br`), brotliCompressSync(script));
  writeFileSync(path.join(staticDir, 'assets', `${SCRIPT}.gz`), gzipSync(script));
});
afterAll(() => rmSync(staticDir, { recursive: true, force: true }));

describe('compression', () => {
  const app = () => server.anotherApp(testConfig({ STATIC_DIR: staticDir }));

  it('sends a built asset from its brotli copy when accepted, else gzip, else as it is, cached for a year', async () => {
    const asBrotli = await request(app())
      .get(`/assets/${SCRIPT}`)
      .set('Accept-Encoding', 'gzip, deflate, br');
    expect(asBrotli.status).toBe(200);
    expect(asBrotli.headers['content-encoding']).toBe('br');
    expect(Number(asBrotli.headers['content-length'])).toBe(brotliCompressSync(script).length);
    expect(asBrotli.headers['content-type']).toMatch(/javascript/);
    expect(asBrotli.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(asBrotli.headers.vary).toMatch(/Accept-Encoding/i);

    const asGzip = await request(app()).get(`/assets/${SCRIPT}`).set('Accept-Encoding', 'gzip');
    expect(asGzip.headers['content-encoding']).toBe('gzip');
    expect(asGzip.text).toBe(script);

    const plain = await request(app()).get(`/assets/${SCRIPT}`).set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.text).toBe(script);

    expect((await request(app()).get('/assets/missing-0000.js')).status).toBe(404);
  });

  it('compresses the page (never cached) and API replies', async () => {
    const home = await request(app()).get('/').set('Accept-Encoding', 'gzip');
    expect(home.status).toBe(200);
    expect(home.headers['content-encoding']).toBe('gzip');
    expect(home.headers['cache-control']).toBe('no-cache');
    expect(home.text).toBe(page);

    const openapi = await request(app()).get('/api/v1/openapi.json').set('Accept-Encoding', 'br');
    expect(openapi.status).toBe(200);
    expect(openapi.headers['content-encoding']).toBe('br');
    expect(openapi.body.openapi).toMatch(/^3\./);

    // Small replies are not worth compressing.
    const health = await request(app()).get('/api/v1/health').set('Accept-Encoding', 'gzip');
    expect(health.headers['content-encoding']).toBeUndefined();
  });
});

describe('the compiled server', () => {
  let outdir: string;
  let compiled: ServerProcess | null = null;
  afterAll(async () => {
    await compiled?.stop();
    if (outdir) rmSync(outdir, { recursive: true, force: true });
  });

  it('runs as plain JavaScript: migrates, serves the client and the API, and runs the engine pool', async () => {
    // Inside the project, so the compiled files find node_modules as dist-server/ does.
    outdir = mkdtempSync(path.join(projectRoot, 'test-output', 'dist-server-'));
    await run(process.execPath, ['server/build/server.mjs', outdir], { cwd: projectRoot });
    const workspace = await buildWorkspace();
    const chemist = await buildMember(workspace, ['chemist']);
    compiled = await startServerProcess({
      entry: path.join(outdir, 'index.js'),
      env: { STATIC_DIR: staticDir },
    });
    const { base } = compiled;
    expect(compiled.child.spawnargs.join(' ')).not.toMatch(/tsx|\.ts\b/);

    expect((await fetch(`${base}/api/v1/health`)).status).toBe(200);
    const asset = await fetch(`${base}/assets/${SCRIPT}`, {
      headers: { 'accept-encoding': 'br' },
    });
    expect(asset.headers.get('content-encoding')).toBe('br');
    expect(await asset.text()).toBe(script);

    const signIn = await fetch(`${base}/api/v1/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: chemist.email, password: DEFAULT_PASSWORD }),
    });
    expect(signIn.status).toBe(200);
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
    const { csrfToken } = (await signIn.json()) as { csrfToken: string };
    const evaluated = await fetch(`${base}/api/v1/evaluate`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie, 'x-csrf-token': csrfToken },
      body: JSON.stringify({ document: demoRoute }),
    });
    expect(evaluated.status).toBe(200);
    const reply = (await evaluated.json()) as { result: { order: string[] } };
    expect(reply.result.order).toContain('filter');

    // Queries that name a model's table alias in SQL text (the routes list's sort key, the
    // audit trail's clock text) work only if bundling keeps the model classes' names.
    const routes = await fetch(`${base}/api/v1/workspaces/${workspace.id}/routes`, {
      headers: { cookie },
    });
    expect(routes.status).toBe(200);
    const admin = await buildMember(workspace, ['admin']);
    const adminSignIn = await fetch(`${base}/api/v1/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: admin.email, password: DEFAULT_PASSWORD }),
    });
    const adminCookie = adminSignIn.headers.get('set-cookie')!.split(';')[0];
    const audit = await fetch(`${base}/api/v1/workspaces/${workspace.id}/audit`, {
      headers: { cookie: adminCookie },
    });
    expect(audit.status).toBe(200);
  }, 180_000);
});
