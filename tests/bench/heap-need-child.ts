/**
 * Child process of the route benchmark's heap measurement (route.bench.ts, heapNeededMB): loads the
 * engine, evaluates the 200-step benchmark route once, collects, prints the heap then in use, and
 * evaluates the route `runs` more times. Started with --max-old-space-size, it exits with V8's
 * out-of-memory error when the route needs more heap than the cap allows.
 */
import { benchRoute } from '../fixtures/routes/corpus';
import { evaluatePrepared, parseRoute, prepareRoute } from '../../shared/engine/route/evaluate';

const runs = Number(process.argv[2] ?? 10);
const prepared = prepareRoute(parseRoute(benchRoute(200, 10, 5)));
evaluatePrepared(prepared, null);
(globalThis as { gc?: () => void }).gc?.();
const baselineMB = process.memoryUsage().heapUsed / 2 ** 20;
for (let i = 0; i < runs; i++) evaluatePrepared(prepared, null);
process.stdout.write(JSON.stringify({ baselineMB }) + '\n');
