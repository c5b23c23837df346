import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import { RouteValidationError } from '../../../shared/engine/route/errors';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

/**
 * Azeotropic drying of wet toluene with a decanter (Dean–Stark trap): the condensate separates,
 * the water-rich layer is taken off and the toluene layer returns to the pot. Against the same
 * concentration without the trap, the pot keeps its toluene and loses its water. A route invented
 * for the test.
 */
function dryingRoute(
  decanter: boolean | undefined,
  mode: 'concentrate' | 'swap' = 'concentrate',
  targetL = 10.15,
) {
  const doc: RouteDocumentInput = {
    schemaVersion: 1,
    referenceInput: { componentId: 'p', massKg: 0.1 },
    components: [
      { kind: 'solvent', id: 'toluene', solventId: 'toluene' },
      { kind: 'solvent', id: 'w', solventId: 'water' },
      {
        kind: 'compound',
        id: 'p',
        name: 'Product P',
        role: 'product',
        molarMassGmol: 250,
        solubility: [
          { solventId: 'toluene', temperatureC: 20, value: 200, unit: 'g/L' },
          { solventId: 'toluene', temperatureC: 80, value: 400, unit: 'g/L' },
        ],
      },
    ],
    steps: [
      {
        id: 'c',
        kind: 'charge',
        name: 'feed',
        params: {
          temperatureC: 20,
          contents: [
            { kind: 'component', componentId: 'toluene', amount: 10, unit: 'L' },
            { kind: 'component', componentId: 'w', amount: 0.3, unit: 'L' },
            { kind: 'component', componentId: 'p', amount: 0.1, unit: 'kg' },
          ],
        },
      },
      {
        id: 'd',
        kind: 'distillation',
        name: 'dry',
        params: {
          mode:
            mode === 'concentrate'
              ? { kind: 'concentrate', targetVolume: { value: targetL, unit: 'L' } }
              : {
                  kind: 'constant-volume',
                  addSolventId: 'toluene',
                  addVolume: { value: 2, unit: 'L' },
                },
          condition: { kind: 'pressure', pressureMbar: 1013 },
          ...(decanter === undefined ? {} : { decanter }),
        },
      },
    ],
    connections: [
      { id: 'a', from: { stepId: 'c', port: 'out' }, to: { stepId: 'd', port: 'feed' } },
    ],
  };
  return evaluateRoute(doc);
}

function streams(r: ReturnType<typeof evaluateRoute>) {
  const out = (port: string) =>
    r.terminals.find((t) => t.stepId === 'd' && t.port === port)!.stream.kg;
  return { pot: out('pot'), distillate: out('distillate'), result: r.steps.d };
}

describe('distillation with a decanter (Dean–Stark trap)', () => {
  it('takes off the water-rich layer and returns the toluene: the pot keeps its toluene and loses its water', () => {
    const plain = streams(dryingRoute(undefined));
    const trap = streams(dryingRoute(true));
    const potPlain = plain.pot;
    const potTrap = trap.pot;
    const distTrap = trap.distillate;
    // 0.3 L of water in about 10.4 L, distilled to 10.15 L: with the trap what is taken off is the
    // water-rich layer (toluene dissolves in water to about 0.05 wt %); without it the condensate is
    // the heteroazeotrope, mostly toluene.
    expect(distTrap.w).toBeGreaterThan(0.2);
    expect(distTrap.toluene).toBeLessThan(0.005 * distTrap.w);
    expect(trap.result.warnings.find((w) => w.code === 'decanter')?.severity).toBe('info');
    expect(plain.distillate.toluene).toBeGreaterThan(plain.distillate.w);
    expect(potTrap.w).toBeLessThan(potPlain.w);
    expect(potTrap.toluene).toBeGreaterThan(potPlain.toluene);
    // Mass is conserved.
    for (const id of ['toluene', 'w'])
      expect(potTrap[id] + distTrap[id]).toBeCloseTo(potPlain[id] + plain.distillate[id], 9);
    expect(trap.result.methods.some((m) => /Dean–Stark/.test(m.method))).toBe(true);
    expect(plain.result.methods.some((m) => /Dean–Stark/.test(m.method))).toBe(false);
  });

  it('says when the condensate stops separating (the water is off) and takes it off whole from there', () => {
    const trap = streams(dryingRoute(true, 'concentrate', 9.5));
    const warning = trap.result.warnings.find((w) => w.code === 'decanter');
    expect(warning?.severity).toBe('warning');
    expect(warning?.message).toMatch(/stopped separating/);
    // Essentially all of the water is in the distillate, and toluene distilled after it.
    expect(trap.pot.w).toBeLessThan(0.01 * 0.3);
    expect(trap.distillate.toluene).toBeGreaterThan(0.3);
  });

  it('is refused with a solvent swap, naming the field', () => {
    let error: unknown;
    try {
      dryingRoute(true, 'swap');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(RouteValidationError);
    expect((error as RouteValidationError).issues[0].field).toBe('params.decanter');
    expect((error as RouteValidationError).issues[0].message).toMatch(/Concentrate to a volume/);
  });
});
