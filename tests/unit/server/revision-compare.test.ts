import { describe, expect, it } from 'vitest';
import {
  compareRevisions,
  diffValues,
  flattenTotals,
} from '../../../server/services/revision-compare';

describe('revision comparison', () => {
  it('matches list items by id, reports leaves old → new, and ignores where a card sits', () => {
    const before = {
      steps: [
        {
          id: 's1',
          kind: 'charge',
          name: 'Charge',
          position: { x: 0, y: 0 },
          params: {
            contents: [
              { componentId: 'a', amount: 1 },
              { componentId: 'b', amount: 2 },
            ],
          },
        },
        { id: 's2', kind: 'wash', name: 'Wash', params: { stages: 1 } },
      ],
      connections: [{ id: 'c1', from: { stepId: 's1' }, to: { stepId: 's2' } }],
      referenceInput: { massKg: 1 },
    };
    const after = {
      steps: [
        {
          id: 's1',
          kind: 'charge',
          name: 'Charge',
          position: { x: 300, y: 40 },
          params: {
            contents: [
              { componentId: 'b', amount: 2 },
              { componentId: 'a', amount: 1.5 },
            ],
          },
        },
        { id: 's3', kind: 'drying', name: 'Dry', params: {} },
      ],
      connections: [],
      referenceInput: { massKg: 2 },
    };
    const result = compareRevisions(
      {
        number: 1,
        document: before,
        totals: { yieldPct: 90, purge: { b: { inKg: 1, outKg: 0.1, purgeFactor: 10 } } },
      },
      {
        number: 2,
        document: after,
        totals: { yieldPct: 85, purge: { b: { inKg: 1, outKg: 0, purgeFactor: null } } },
      },
    );
    expect(result.stepsAdded).toEqual([{ id: 's3', kind: 'drying', name: 'Dry' }]);
    expect(result.stepsRemoved).toEqual([{ id: 's2', kind: 'wash', name: 'Wash' }]);
    // Reordering the contents is not a change; the amount of "a" is.
    expect(result.stepsChanged).toEqual([
      {
        stepId: 's1',
        name: 'Charge',
        kind: 'charge',
        changes: [{ path: 'params.contents[a].amount', from: 1, to: 1.5 }],
      },
    ]);
    expect(result.connectionsRemoved).toEqual(['c1']);
    expect(result.documentChanges).toEqual([{ path: 'referenceInput.massKg', from: 1, to: 2 }]);
    expect(result.totals).toEqual({
      yieldPct: { from: 90, to: 85 },
      'purge.b': { from: 10, to: null },
    });
  });

  it('reports a value that appears or disappears with null on the other side', () => {
    expect(diffValues({ a: 1 }, { b: 2 })).toEqual([
      { path: 'a', from: 1, to: null },
      { path: 'b', from: null, to: 2 },
    ]);
    expect(diffValues([1, 2], [1, 2])).toEqual([]);
    expect(flattenTotals(null)).toEqual({});
  });
});
