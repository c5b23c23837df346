/**
 * Small routes whose optimum is known by construction, for the optimiser's tests.
 */
import type { RouteDocument } from '../../../shared/schemas/route';

/**
 * One water wash of a toluene solution, then the solution dried down to the
 * solid. The product stays in the toluene (D = 1000); the impurity goes to
 * the water (D = 0.5, organic/aqueous). The fraction of the impurity left
 * after one wash of V litres is q = 1 / (1 + V / (D·V_org)) (cross-current
 * extraction, one stage), so the wash volume that meets an impurity limit is
 * solvable by hand.
 */
export function singleWashRoute(washL: number): RouteDocument {
  return {
    schemaVersion: 1,
    name: 'single wash',
    referenceInput: { componentId: 'prod', massKg: 1 },
    components: [
      { kind: 'solvent', id: 'water', solventId: 'water' },
      { kind: 'solvent', id: 'toluene', solventId: 'toluene' },
      {
        kind: 'compound',
        id: 'prod',
        name: 'test product',
        role: 'product',
        molarMassGmol: 300,
        partition: [{ organicSolventId: 'toluene', D: 1000 }],
      },
      {
        kind: 'compound',
        id: 'imp',
        name: 'test impurity',
        role: 'impurity',
        molarMassGmol: 200,
        partition: [{ organicSolventId: 'toluene', D: 0.5 }],
        specLimitPct: 0.15,
      },
    ],
    steps: [
      {
        id: 'feed',
        kind: 'charge',
        name: 'Feed',
        params: {
          temperatureC: 25,
          contents: [
            { kind: 'component', componentId: 'toluene', amount: 10, unit: 'L' },
            { kind: 'component', componentId: 'prod', amount: 1, unit: 'kg' },
            { kind: 'component', componentId: 'imp', amount: 0.05, unit: 'kg' },
          ],
        },
      },
      {
        id: 'wash',
        kind: 'wash',
        name: 'Water wash',
        params: {
          addedLiquid: { kind: 'solvent', solventId: 'water', volume: { value: washL, unit: 'L' } },
          stages: 1,
          mode: 'cross-current',
          temperatureC: 25,
          keep: 'organic',
        },
      },
      {
        id: 'strip',
        kind: 'crystallisation',
        name: 'Strip to dryness',
        params: {
          mode: { kind: 'evaporative', targetVolume: { value: 0, unit: 'L' }, pressureMbar: 50 },
          seeded: false,
        },
      },
      { id: 'filter', kind: 'filtration', name: 'Discharge', params: {} },
    ],
    connections: [
      { id: 'c1', from: { stepId: 'feed', port: 'out' }, to: { stepId: 'wash', port: 'feed' } },
      {
        id: 'c2',
        from: { stepId: 'wash', port: 'organic' },
        to: { stepId: 'strip', port: 'feed' },
      },
      {
        id: 'c3',
        from: { stepId: 'strip', port: 'slurry' },
        to: { stepId: 'filter', port: 'slurry' },
      },
    ],
  } as RouteDocument;
}
