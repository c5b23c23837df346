import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

// The production server is built by server/build/server.mjs (esbuild). Its own module graph
// (the server entry and the engine worker, with every chunk they import) must hold no file of
// seeders/: the demo seed is loaded by path only when PHASEWRIGHT_SEED_DEMO asks for it, so an
// image without seeders/ starts. esbuild's metafile says which source files each output holds.
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

interface Metafile {
  outputs: Record<
    string,
    {
      entryPoint?: string;
      inputs: Record<string, unknown>;
      imports: { path: string; kind: string; external?: boolean }[];
    }
  >;
}

let outdir: string;
let meta: Metafile;

beforeAll(() => {
  outdir = mkdtempSync(path.join(tmpdir(), 'server-build-'));
  execFileSync(process.execPath, ['server/build/server.mjs', outdir], { cwd: root });
  meta = JSON.parse(readFileSync(path.join(outdir, 'meta.json'), 'utf8')) as Metafile;
}, 120_000);
afterAll(() => rmSync(outdir, { recursive: true, force: true }));

/** Every source file the output of `entry` loads, following static and dynamic imports. */
function sourcesReachedFrom(entry: string): string[] {
  const start = Object.keys(meta.outputs).find((out) => meta.outputs[out]!.entryPoint === entry);
  expect(start, `an output for ${entry}`).toBeDefined();
  const seen = new Set<string>();
  const queue = [start!];
  while (queue.length > 0) {
    const out = queue.pop()!;
    if (seen.has(out)) continue;
    seen.add(out);
    for (const imported of meta.outputs[out]!.imports)
      if (!imported.external && meta.outputs[imported.path]) queue.push(imported.path);
  }
  return [...seen].flatMap((out) => Object.keys(meta.outputs[out]!.inputs));
}

describe('the production server build', { timeout: 120_000 }, () => {
  it('holds no seeder in the server or engine worker graph', () => {
    for (const entry of ['server/index.ts', 'server/pool/worker-compiled.ts']) {
      const sources = sourcesReachedFrom(entry);
      expect(sources).toContain(entry);
      expect(sources.filter((source) => source.startsWith('seeders/'))).toEqual([]);
    }
  });

  it('still compiles the seeders on their own, for a seeded start', () => {
    const seederSources = Object.values(meta.outputs)
      .filter((out) => out.entryPoint?.startsWith('seeders/'))
      .map((out) => out.entryPoint);
    expect(seederSources).toContain('seeders/20261201000000-demo-workspaces.ts');
  });
});
