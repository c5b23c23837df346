/**
 * The evaluation worker answers an edit with only what changed since its previous
 * answer (src/workers/result-delta.ts); the page rebuilds the whole result from it.
 * The rebuilt result must be the engine's result number for number (−0, NaN and ±∞
 * told apart), and a step whose own result did not change must keep the very object
 * the page already had, so its card is not drawn again.
 */
import { describe, expect, it } from 'vitest';
import { evaluateRoute, type RouteResult } from '@shared/engine/route/evaluate';
import { createStepMemo } from '@shared/engine/route/step-memo';
import { applyResultDelta, resultDelta, sameValue } from '@/workers/result-delta';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';

/** JSON in which every number is written exactly (−0, NaN, ±∞ kept apart). */
function exact(value: unknown): string {
  return JSON.stringify(value, (_k, v: unknown) =>
    typeof v === 'number' ? `#${Object.is(v, -0) ? '-0' : String(v)}` : v,
  );
}

type Doc = {
  steps: Array<{ id: string; kind: string; params: Record<string, unknown> }>;
  connections: unknown[];
};

/** The demo route with the brine wash's volume set to `vol` volumes. */
function withBrineVolume(vol: number): Doc {
  const doc = structuredClone(demoAmideIsolation) as unknown as Doc;
  const brine = doc.steps.find((s) => s.id === 'brine-wash')!;
  (brine.params.addedLiquid as { volume: { value: number } }).volume.value = vol;
  return doc;
}

/** What the page holds after the worker's answers in order (each copied as postMessage copies). */
function replay(results: RouteResult[]): RouteResult[] {
  let sent: RouteResult | null = null;
  let page: RouteResult | null = null;
  const out: RouteResult[] = [];
  for (const r of results) {
    const delta = structuredClone(resultDelta(sent, r));
    sent = r;
    page = applyResultDelta(page, delta);
    out.push(page);
  }
  return out;
}

describe('evaluation answers as changes', () => {
  const memo = createStepMemo();
  const first = evaluateRoute(withBrineVolume(2), { memo });
  const second = evaluateRoute(withBrineVolume(4), { memo });

  it('rebuilds each result exactly, and keeps the objects of the steps before the edit', () => {
    const [a, b] = replay([first, second]);
    expect(exact(a)).toBe(exact(first));
    expect(exact(b)).toBe(exact(second));
    // Steps before the edited wash are the page's own objects; the wash and those after it are new.
    for (const id of ['crude', 'acid-wash', 'base-wash']) expect(b.steps[id]).toBe(a.steps[id]);
    for (const id of ['brine-wash', 'swap', 'dry']) expect(b.steps[id]).not.toBe(a.steps[id]);
    expect(Object.keys(b.steps)).toEqual(Object.keys(second.steps));
    expect(Object.keys(b)).toEqual(Object.keys(second));
  });

  it('sends only the steps and streams that changed', () => {
    const delta = resultDelta(first, second);
    const changed = Object.keys(delta.steps.changed);
    expect(changed).toContain('brine-wash');
    expect(changed).not.toContain('crude');
    expect(changed).not.toContain('acid-wash');
    expect(changed.length).toBeLessThan(Object.keys(second.steps).length);
    expect(delta.rest.processSafetyNote).toBeUndefined();
    // The same result again sends no step, stream or field at all.
    const again = resultDelta(second, structuredClone(second));
    expect(Object.keys(again.steps.changed)).toEqual([]);
    expect(Object.keys(again.streams.changed)).toEqual([]);
    expect(again.rest).toEqual({});
  });

  it('follows steps removed and added between answers, in the new order', () => {
    const other = structuredClone(second);
    const [firstId] = Object.keys(other.steps);
    const moved = other.steps[firstId];
    delete other.steps[firstId];
    other.steps['added-step'] = structuredClone(moved);
    other.steps[firstId] = moved;
    const [, b, c] = replay([first, second, other]);
    expect(exact(c)).toBe(exact(other));
    expect(Object.keys(c.steps)).toEqual(Object.keys(other.steps));
    expect(c.steps[firstId]).toBe(b.steps[firstId]);
  });

  it('tells apart the numbers a copy between threads keeps apart', () => {
    expect(sameValue({ x: NaN }, { x: NaN })).toBe(true);
    expect(sameValue({ x: 0 }, { x: -0 })).toBe(false);
    expect(sameValue({ x: Infinity }, { x: null })).toBe(false);
    expect(sameValue({ x: undefined }, {})).toBe(false);
    expect(sameValue({ a: 1, b: 2 }, { b: 2, a: 1 })).toBe(false);
    expect(sameValue([1, [2, 3]], [1, [2, 3]])).toBe(true);
    expect(sameValue([1, 2], { 0: 1, 1: 2 })).toBe(false);
    const withNaN = structuredClone(second);
    const step = Object.values(withNaN.steps)[0];
    const [k] = Object.keys(step.summary);
    step.summary[k] = NaN;
    const [, b, c] = replay([first, second, withNaN]);
    expect(Number.isNaN(c.steps[step.stepId].summary[k])).toBe(true);
    expect(c.steps[step.stepId]).not.toBe(b.steps[step.stepId]);
  });

  it('refuses an answer that leaves out something the page does not have', () => {
    const delta = resultDelta(first, second);
    expect(() => applyResultDelta(null, delta)).toThrow(/left out/);
  });
});
