/**
 * The step-result memo (shared/engine/route/step-memo.ts) must be exact: a
 * route evaluated with it gives the same result, number for number (−0, NaN
 * and ±∞ told apart), as without it — whether the memo is empty, full of the
 * same route, or full of other routes — and any change a step can see (its own
 * parameters, its inlets, a compound's data, the reference input) makes the
 * step and those downstream of it evaluate again.
 */
import { describe, expect, it } from 'vitest';
import {
  evaluatePrepared,
  evaluateRoute,
  parseRoute,
  prepareRoute,
} from '../../../shared/engine/route/evaluate';
import {
  runMonteCarloChunk,
  startMonteCarlo,
  summariseMonteCarlo,
} from '../../../shared/engine/route/monte-carlo';
import {
  cachesFor,
  createCachePool,
  createStepMemo,
  stepIsUncertain,
} from '../../../shared/engine/route/step-memo';
import {
  runOptimiseChunk,
  setUpOptimise,
  startOptimise,
  summariseOptimise,
  type OptimiseRequest,
} from '../../../shared/engine/optimise';
import type { RouteDocument } from '../../../shared/engine/document';
import { benchRoute, routeCorpus } from '../../fixtures/routes/corpus';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';

/** JSON in which every number is written exactly (−0, NaN, ±∞ kept apart). */
function exact(value: unknown): string {
  return JSON.stringify(value, (_k, v: unknown) =>
    typeof v === 'number' ? `#${Object.is(v, -0) ? '-0' : String(v)}` : v,
  );
}

function clone<T>(v: T): T {
  return JSON.parse(JSON.stringify(v)) as T;
}

type Doc = {
  steps: Array<{ id: string; kind: string; params: Record<string, unknown> }>;
  components: Array<Record<string, unknown>>;
  referenceInput: { massKg: number };
};

const corpus = routeCorpus({ large: true });

describe('step-result memo', () => {
  it('gives every corpus route the same result as evaluating every step, cold, warm and shared between routes', () => {
    const memo = createStepMemo();
    const pool = createCachePool();
    const plain = corpus.map(([, doc]) => exact(evaluateRoute(doc)));
    for (let pass = 0; pass < 2; pass++) {
      corpus.forEach(([name, doc], i) => {
        const before = memo.hits;
        const parsed = parseRoute(doc);
        const result = evaluateRoute(parsed, { memo, caches: cachesFor(pool, parsed) });
        expect(exact(result), `${name}, pass ${pass + 1}`).toBe(plain[i]);
        // The second pass runs no step model: every step is answered from the memo.
        if (pass === 1) expect(memo.hits - before, name).toBe(parsed.steps.length);
      });
    }
    expect(corpus.length).toBeGreaterThan(20);
  }, 120_000);

  it('keeps its results apart from the caller: a result made anew may be changed, a remembered one is frozen', () => {
    const memo = createStepMemo();
    const first = evaluateRoute(demoAmideIsolation, { memo });
    const expected = exact(first);
    // The first evaluation's own objects: changing them does not reach the memo.
    for (const s of Object.values(first.steps)) {
      s.summary.changed = 1;
      for (const k in s.addedKg) s.addedKg[k] = -1;
    }
    for (const t of first.terminals) for (const k in t.stream.kg) t.stream.kg[k] = 42;
    const again = evaluateRoute(demoAmideIsolation, { memo });
    expect(exact(again)).toBe(expected);
    expect(memo.hits).toBe(Object.keys(again.steps).length);
    // Remembered results are handed out as they are, frozen through and through: a change throws.
    for (const s of Object.values(again.steps)) {
      expect(Object.isFrozen(s) && Object.isFrozen(s.summary) && Object.isFrozen(s.warnings)).toBe(
        true,
      );
      expect(() => (s.summary.changed = 1)).toThrow(TypeError);
      for (const k in s.addedKg) expect(() => (s.addedKg[k] = -1)).toThrow(TypeError);
    }
    for (const t of again.terminals)
      for (const k in t.stream.kg) expect(() => (t.stream.kg[k] = 42)).toThrow(TypeError);
    expect(exact(evaluateRoute(demoAmideIsolation, { memo }))).toBe(expected);
    // The copies keep the id records' missing prototype (no id can read a built-in).
    for (const s of Object.values(again.steps)) {
      expect(Object.getPrototypeOf(s.addedKg)).toBeNull();
      expect(Object.getPrototypeOf(s.balance!)).toBeNull();
    }
    for (const t of again.terminals) expect(Object.getPrototypeOf(t.stream.kg)).toBeNull();
  });

  it('evaluates an edited step and what is downstream of it again, and nothing upstream', () => {
    const base = clone(demoAmideIsolation) as unknown as Doc;
    const memo = createStepMemo();
    evaluateRoute(base, { memo });
    const order = prepareRoute(parseRoute(base)).graph.order;
    // Edit each step kind that has a numeric setting, one at a time.
    let edited = 0;
    for (const [position, id] of order.entries()) {
      const doc = clone(base);
      const step = doc.steps.find((s) => s.id === id)!;
      const changed = bumpFirstNumber(step.params);
      if (!changed) continue;
      let plainResult: string;
      try {
        plainResult = exact(evaluateRoute(doc));
      } catch {
        continue; // a setting the step refuses at the new value
      }
      const hits = memo.hits;
      const misses = memo.misses;
      const result = exact(evaluateRoute(doc, { memo }));
      expect(result, `${id} (${changed})`).toBe(plainResult);
      // Every step before the edited one in the order whose inlets cannot have changed is reused:
      // at least the first step (a charge) is, and the edited step is evaluated again.
      expect(memo.misses - misses, id).toBeGreaterThanOrEqual(1);
      if (position > 0) expect(memo.hits - hits, id).toBeGreaterThanOrEqual(1);
      edited++;
    }
    expect(edited).toBeGreaterThan(3);
  });

  it('gives the bench routes the same result as evaluating every step through a sequence of edits, undos and repeats', () => {
    // An inlet stream is written in a key as the number of the remembered step that made it, so a
    // step downstream of an edit must miss, and one downstream of an undone edit must hit again.
    for (const [name, doc, edits] of [
      ['30-step benchmark route', benchRoute(30, 10), 6],
      ['200-step benchmark route', benchRoute(200, 10, 5), 3],
    ] as const) {
      const prepared = prepareRoute(parseRoute(doc));
      const order = prepared.graph.order;
      const memo = createStepMemo();
      const check = (what: string) => {
        const withMemo = exact(evaluatePrepared(prepared, null, memo));
        expect(withMemo, `${name}: ${what}`).toBe(exact(evaluatePrepared(prepared, null)));
      };
      check('first evaluation');
      for (let e = 0; e < edits; e++) {
        // Steps spread through the order (the first, the middle, near the end).
        const position = Math.floor((e * (order.length - 1)) / Math.max(1, edits - 1));
        const step = prepared.doc.steps.find((s) => s.id === order[position])!;
        const saved = clone(step.params);
        if (!bumpFirstNumber(step.params)) continue;
        const misses = memo.misses;
        try {
          check(`step ${position + 1} edited`);
        } catch (err) {
          if (err instanceof Error && err.name === 'AssertionError') throw err;
          Object.assign(step.params, saved); // a setting the step refuses at the new value
          continue;
        }
        // The edited step and at least nothing upstream of it ran again.
        expect(memo.misses - misses, `${name}: step ${position + 1}`).toBeGreaterThanOrEqual(1);
        expect(memo.misses - misses).toBeLessThanOrEqual(order.length - position);
        const hits = memo.hits;
        check(`step ${position + 1} edited, repeated`);
        expect(memo.hits - hits, `${name}: repeat after step ${position + 1}`).toBe(order.length);
        // Undo: the earlier results (and those downstream, keyed on them) are found again.
        for (const k of Object.keys(step.params))
          delete (step.params as Record<string, unknown>)[k];
        Object.assign(step.params, saved);
        const undoHits = memo.hits;
        check(`step ${position + 1} edit undone`);
        expect(memo.hits - undoHits, `${name}: undo of step ${position + 1}`).toBe(order.length);
      }
    }
  }, 240_000);

  it('tells apart inlets made by different steps with the same settings (a key never stands for another stream)', () => {
    // Two charges of the same route with the same settings but different amounts downstream: the
    // stand-in for an inlet is the entry number of the step that made it, never its settings alone.
    const memo = createStepMemo();
    const base = clone(demoAmideIsolation) as unknown as Doc;
    const plain = exact(evaluateRoute(base));
    expect(exact(evaluateRoute(base, { memo }))).toBe(plain);
    const charge = base.steps.find((s) => s.kind === 'charge')!;
    const original = clone(charge.params);
    bumpFirstNumber(charge.params);
    const edited = exact(evaluateRoute(base));
    expect(edited).not.toBe(plain);
    const misses = memo.misses;
    expect(exact(evaluateRoute(base, { memo }))).toBe(edited);
    // Everything downstream of the charge ran again: its inlets stand for a new entry.
    expect(memo.misses - misses).toBeGreaterThan(1);
    charge.params = original;
    expect(exact(evaluateRoute(base, { memo }))).toBe(plain);
  });

  it("reuses the steps downstream of an edit that left the edited step's outlets as they were", () => {
    const memo = createStepMemo();
    const doc = clone(demoAmideIsolation) as unknown as Doc & { steps: Array<{ name: string }> };
    evaluateRoute(doc, { memo });
    // A new name is part of the step's key (it runs again) but not of its streams.
    doc.steps[0].name = 'Renamed first step';
    const misses = memo.misses;
    expect(exact(evaluateRoute(doc, { memo }))).toBe(exact(evaluateRoute(doc)));
    expect(memo.misses - misses).toBe(1);
  });

  it('evaluates every step again when a compound property or the reference input changes', () => {
    const memo = createStepMemo();
    const pool = createCachePool();
    evaluateRoute(demoAmideIsolation, { memo });
    const variants: Array<[string, (d: Doc) => void]> = [
      [
        'molar mass of a compound',
        (d) => (d.components.find((c) => c.kind === 'compound')!.molarMassGmol = 338.85),
      ],
      [
        'a solubility point',
        (d) => {
          const c = d.components.find((x) => Array.isArray(x.solubility))!;
          const p = (c.solubility as Array<Record<string, number>>)[0];
          for (const k in p)
            if (typeof p[k] === 'number' && k !== 'temperatureC') {
              p[k] *= 1.1;
              break;
            }
        },
      ],
      [
        'the specification limit of an impurity',
        (d) => (d.components.find((c) => typeof c.specLimitPct === 'number')!.specLimitPct = 0.1),
      ],
      ['the reference mass', (d) => (d.referenceInput.massKg *= 2)],
    ];
    for (const [what, change] of variants) {
      const doc = clone(demoAmideIsolation) as unknown as Doc;
      change(doc);
      expect(exact(doc), what).not.toBe(exact(demoAmideIsolation));
      const hits = memo.hits;
      const parsed = parseRoute(doc);
      const result = exact(evaluateRoute(parsed, { memo, caches: cachesFor(pool, parsed) }));
      expect(result, what).toBe(exact(evaluateRoute(doc)));
      expect(memo.hits - hits, what).toBe(0);
    }
  });

  it('keeps Monte Carlo draws the same number for number, reusing only steps without uncertain parameters', () => {
    for (const [name, doc] of corpus.slice(0, 4)) {
      const prepared = prepareRoute(parseRoute(doc));
      const plain = summariseMonteCarlo(
        runMonteCarloChunk(prepared, startMonteCarlo({ draws: 10, seed: 5 }), 10),
      );
      const memo = createStepMemo();
      const withMemo = summariseMonteCarlo(
        runMonteCarloChunk(prepared, startMonteCarlo({ draws: 10, seed: 5 }), 10, memo),
      );
      expect(exact(withMemo), name).toBe(exact(plain));
      const uncertain = prepared.doc.steps.filter(stepIsUncertain).length;
      if (uncertain === 0) expect(memo.hits, name).toBe(9 * prepared.doc.steps.length);
    }
  }, 60_000);

  it('gives the optimiser the same candidates and result as evaluating every step', () => {
    const request: OptimiseRequest = {
      document: demoAmideIsolation as unknown as RouteDocument,
      free: [
        { stepId: 'antisolvent', param: 'mode.volume', min: 3, max: 9 },
        { stepId: 'swap', param: 'mode.cycles', min: 2, max: 6, integer: true },
      ],
      objective: 'pmi',
      constraints: { minSolventFreePurityPct: 99.5, ichResidualSolvents: true },
      seed: 1,
      budget: { evaluations: 24 },
    };
    const run = (memoEntries: number | null) => {
      const setup = setUpOptimise(request);
      if (memoEntries !== null) setup.memo = createStepMemo(memoEntries);
      let state = startOptimise(request);
      while (state.phase !== 'done') state = runOptimiseChunk(setup, state, 10);
      return { result: exact(summariseOptimise(setup, state)), hits: setup.memo.hits };
    };
    const withMemo = run(null);
    // A memo that keeps nothing: every step of every candidate evaluated.
    const without = run(0);
    expect(without.hits).toBe(0);
    expect(withMemo.hits).toBeGreaterThan(0);
    expect(withMemo.result).toBe(without.result);
  }, 60_000);

  it('keeps at most maxEntries results, dropping the least recently used', () => {
    const memo = createStepMemo(5);
    const prepared = prepareRoute(parseRoute(demoAmideIsolation));
    evaluatePrepared(prepared, null, memo);
    expect(memo.entries.size).toBe(5);
    const misses = memo.misses;
    evaluatePrepared(prepared, null, memo);
    // The first steps were dropped, so the whole route runs again (each evaluated step pushes out an older one).
    expect(memo.misses - misses).toBe(prepared.doc.steps.length);
  });
});

/** Multiplies the first positive number found in a step's parameters by 1.05; returns its path or null. */
function bumpFirstNumber(o: unknown, path = ''): string | null {
  if (o === null || typeof o !== 'object') return null;
  for (const [k, v] of Object.entries(o as Record<string, unknown>)) {
    if (typeof v === 'number' && v > 0 && k !== 'plusMinus') {
      (o as Record<string, unknown>)[k] = v * 1.05;
      return `${path}${k}`;
    }
    const inner = bumpFirstNumber(v, `${path}${k}.`);
    if (inner) return inner;
  }
  return null;
}
