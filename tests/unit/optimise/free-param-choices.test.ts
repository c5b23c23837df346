/** The parameters the optimiser's form offers: the documented paths the route gives as numbers. */
import { describe, expect, it } from 'vitest';
import { freeParamChoices, withParams } from '../../../shared/engine/optimise';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import type { RouteDocument } from '../../../shared/schemas/route';

const doc = demoAmideIsolation as unknown as RouteDocument;

describe('free-parameter choices of the demo route', () => {
  const choices = freeParamChoices(doc);
  const find = (stepId: string, param: string) =>
    choices.find((c) => c.stepId === stepId && c.param === param);

  it('offers a wash volume in the document’s unit, reading through a ± range', () => {
    expect(find('acid-wash', 'addedLiquid.volume')).toMatchObject({
      label: 'wash volume',
      value: 3,
      unit: 'vol',
      integer: false,
    });
  });

  it('marks counts as whole numbers and gives temperatures and pressures their units', () => {
    expect(find('swap', 'mode.cycles')).toMatchObject({ value: 4, integer: true, unit: '' });
    expect(find('filter', 'cakeWash.washes')).toMatchObject({ value: 2, integer: true });
    expect(find('cool', 'mode.endC')).toMatchObject({ value: 5, unit: '°C' });
    expect(find('swap', 'condition.pressureMbar')).toMatchObject({ value: 600, unit: 'mbar' });
    expect(find('antisolvent', 'mode.volume')).toMatchObject({ value: 6, unit: 'vol' });
  });

  it('offers only paths the step has: a cooling has no antisolvent volume', () => {
    expect(find('cool', 'mode.volume')).toBeUndefined();
    expect(find('crude', 'addedLiquid.volume')).toBeUndefined();
  });

  it('every offered path can be set by the optimiser', () => {
    for (const c of choices)
      expect(() =>
        withParams(doc, [{ stepId: c.stepId, param: c.param, value: c.value }]),
      ).not.toThrow();
  });
});
