/**
 * The engine pool's evaluation task (server/pool/tasks.ts), run in this thread as a worker runs
 * it: it trusts the schema check the web thread already made (the route document schema is not
 * run twice), which must not change one number of the reply, and it moves the reply's bytes to
 * the web thread instead of copying them.
 */
import { transferableSymbol, valueSymbol } from 'piscina';
import { describe, expect, it } from 'vitest';
import { evaluateRoute, ENGINE_VERSION } from '../../../shared/engine/route/evaluate';
import { evaluateRequestSchema } from '../../../shared/schemas/evaluate';
import { runTask, type TaskReply } from '../../../server/pool/tasks';
import { BENCH_WEIGHTS, generateRoute } from '../../fixtures/routes/generate';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';

type Movable = { [transferableSymbol]: ArrayBuffer; [valueSymbol]: TaskReply };

/** The task as the web thread hands it over: the request parsed with its schema, then cloned. */
function evaluateInTask(document: unknown): Movable {
  const body = evaluateRequestSchema.parse(JSON.parse(JSON.stringify({ document })));
  const input = structuredClone({ document: body.document, maxReplyBytes: 8e6 });
  return runTask({ name: 'route.evaluate', input }) as unknown as Movable;
}

const routes: Array<[string, unknown]> = [
  ['the demo amide isolation', demoAmideIsolation],
  [
    'a generated 30-step route',
    generateRoute({ seed: 11, steps: 30, compounds: 6, weights: BENCH_WEIGHTS }),
  ],
];

describe('the route.evaluate pool task', () => {
  it.each(routes)(
    'answers %s with the JSON of evaluating the document as written, to the last digit',
    (_name, document) => {
      const moved = evaluateInTask(document);
      const reply = moved[valueSymbol];
      expect(reply.ok).toBe(true);
      const { json } = (reply as { value: { json: Uint8Array } }).value;
      const expected = JSON.stringify({
        engineVersion: ENGINE_VERSION,
        result: evaluateRoute(structuredClone(document)),
      });
      expect(new TextDecoder().decode(json)).toBe(expected);
    },
    60_000,
  );

  it('moves the bytes of its reply to the receiving thread (the sender keeps none)', () => {
    const moved = evaluateInTask(demoAmideIsolation);
    const reply = moved[valueSymbol] as { ok: true; value: { json: Uint8Array } };
    const buffer = moved[transferableSymbol];
    expect(buffer).toBe(reply.value.json.buffer);
    const text = new TextDecoder().decode(reply.value.json);
    // What piscina does with a moved reply: post it with its buffer in the transfer list.
    const received = structuredClone(reply, { transfer: [buffer] });
    expect(buffer.byteLength).toBe(0);
    expect(new TextDecoder().decode(received.value.json)).toBe(text);
  });

  it('answers a document the engine cannot evaluate with its 422, not with bytes', () => {
    const document = structuredClone(demoAmideIsolation) as { connections: unknown[] };
    document.connections = [];
    const reply = evaluateInTask(document) as unknown as TaskReply;
    expect(transferableSymbol in (reply as object)).toBe(false);
    expect(reply.ok).toBe(false);
    if (!reply.ok) expect(reply.error.body.code).toBe('route_invalid');
  });
});
