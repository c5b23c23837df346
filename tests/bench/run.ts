/**
 * Benchmark runner: `npm run bench` (node --import tsx tests/bench/run.ts).
 *
 * Finds every tests/bench/*.bench.ts module that exports
 * `run(): Promise<BenchResult[]>`, runs them one after another, prints a table
 * per module, and rewrites that module's section of docs/performance.md
 * between the markers `<!-- bench:<module>:start -->` and
 * `<!-- bench:<module>:end -->` (added at the end if missing), with the date
 * and the machine (OS, CPU model, Node version). Optional argument: a module
 * name to run only that one (`npm run bench -- thermo`).
 */
import { readdirSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import os from 'node:os';
import type { BenchResult } from './harness';

const here = dirname(fileURLToPath(import.meta.url));
const performanceDoc = join(here, '..', '..', 'docs', 'performance.md');

function machine(): string {
  const cpu = os.cpus()[0]?.model?.trim() ?? 'unknown CPU';
  return `${os.type()} ${os.release()} (${os.arch()}), ${cpu} × ${os.cpus().length}, Node ${process.version}`;
}

function format(us: number): string {
  return us >= 100 ? us.toFixed(0) : us >= 10 ? us.toFixed(1) : us.toFixed(2);
}

function table(results: BenchResult[]): string {
  const lines = [
    '| Benchmark | Median (µs) | p95 (µs) | Calls | Target | Met | Note |',
    '|---|---:|---:|---:|---|---|---|',
  ];
  for (const r of results) {
    const met = r.meetsTarget === undefined ? '' : r.meetsTarget ? 'yes' : 'NO';
    lines.push(
      `| ${r.name} | ${format(r.medianUs)} | ${format(r.p95Us)} | ${r.iterations} | ${r.target ?? ''} | ${met} | ${r.note ?? ''} |`,
    );
  }
  return lines.join('\n');
}

function rewriteSection(moduleName: string, body: string): void {
  const start = `<!-- bench:${moduleName}:start -->`;
  const end = `<!-- bench:${moduleName}:end -->`;
  const block = `${start}\n${body}\n${end}`;
  let doc = existsSync(performanceDoc)
    ? readFileSync(performanceDoc, 'utf8')
    : '# Performance\n\nNumbers written by `npm run bench` (tests/bench/run.ts); each section is rewritten by its benchmark module.\n';
  const i = doc.indexOf(start);
  const j = doc.indexOf(end);
  if (i >= 0 && j > i) doc = doc.slice(0, i) + block + doc.slice(j + end.length);
  else doc = `${doc.trimEnd()}\n\n## ${moduleName}\n\n${block}\n`;
  writeFileSync(performanceDoc, doc);
}

async function main(): Promise<void> {
  const only = process.argv[2];
  const modules = readdirSync(here)
    .filter((f) => f.endsWith('.bench.ts'))
    .map((f) => f.replace(/\.bench\.ts$/, ''))
    .filter((m) => !only || m === only)
    .sort();
  let failures = 0;
  for (const name of modules) {
    const mod = (await import(pathToFileURL(join(here, `${name}.bench.ts`)).href)) as {
      run?: () => Promise<BenchResult[]>;
    };
    if (typeof mod.run !== 'function') {
      console.warn(`${name}.bench.ts exports no run(); skipped.`);
      continue;
    }
    const results = await mod.run();
    const when = new Date().toISOString().slice(0, 16).replace('T', ' ') + ' UTC';
    const body = `Measured ${when} on ${machine()}.\n\n${table(results)}`;
    console.log(`\n## ${name}\n\n${body}\n`);
    rewriteSection(name, body);
    failures += results.filter((r) => r.meetsTarget === false).length;
  }
  if (failures > 0) console.log(`${failures} benchmark(s) above target.`);
}

main().catch((error) => {
  console.error(error);
  process.exitCode = 1;
});
