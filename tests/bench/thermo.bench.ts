/**
 * Thermodynamics benchmarks: UNIFAC activity coefficients of a 10-component
 * mixture and the bubble point of a 5-component mixture, each against a
 * straightforward implementation of the same equations (to show what the
 * optimisation bought). Targets from the project issue: UNIFAC ≤ 20 µs,
 * bubble point ≤ 200 µs (medians).
 */
import { measure, type BenchResult } from './harness';
import { createUnifac } from '../../shared/engine/thermo/unifac';
import { referenceLnGammas } from '../../shared/engine/thermo/unifac-reference';
import { bubblePoint, createVleSystem, type VleComponent } from '../../shared/engine/thermo/vle';
import { vapourPressure } from '../../shared/engine/thermo/antoine';
import * as F from '../reference/thermo/fixtures';

const tenComponents: VleComponent[] = [
  F.ethanol,
  F.water,
  F.toluene,
  F.acetone,
  F.ethylAcetate,
  F.heptane,
  F.thf,
  F.dichloromethane,
  F.acetonitrile,
  F.isopropanol,
];
const tenX = [0.05, 0.2, 0.1, 0.1, 0.15, 0.05, 0.1, 0.05, 0.1, 0.1];
const fiveComponents: VleComponent[] = [F.ethanol, F.water, F.acetone, F.ethylAcetate, F.toluene];
const fiveX = [0.3, 0.3, 0.1, 0.2, 0.1];
const P = 101325;

/** Straightforward bubble point: reference UNIFAC, general vapour-pressure routine, Newton with a numerical derivative. */
function straightforwardBubblePoint(components: VleComponent[], x: number[], P_Pa: number): number {
  const groups = components.map((c) => c.unifac);
  const f = (T: number) => {
    const lnG = referenceLnGammas(groups, x, T);
    const sum = components.reduce(
      (acc, c, i) => acc + x[i] * Math.exp(lnG[i]) * vapourPressure(c.antoine, T).pressurePa,
      0,
    );
    return Math.log(sum / P_Pa);
  };
  let T = 350;
  for (let iter = 0; iter < 50; iter++) {
    const value = f(T);
    if (Math.abs(value) < 1e-10) break;
    const d = (f(T + 1e-4) - f(T - 1e-4)) / 2e-4;
    T -= value / d;
  }
  return T;
}

export async function run(): Promise<BenchResult[]> {
  const results: BenchResult[] = [];
  const model = createUnifac(tenComponents.map((c) => c.unifac));
  const out = new Float64Array(10);
  let T = 300;
  // Varying T defeats the Ψ(T) cache: the worst case for the optimised model.
  results.push(
    measure(
      'UNIFAC γ, 10 components, new T each call (optimised)',
      () => {
        T = T === 300 ? 300.5 : 300;
        return model.gammas(tenX, T, out)[0];
      },
      { targetUs: 20, samples: 300, batch: 50 },
    ),
  );
  results.push(
    measure(
      'UNIFAC γ, 10 components, repeated T (optimised, Ψ cached)',
      () => model.gammas(tenX, 300, out)[0],
      {
        targetUs: 20,
        samples: 300,
        batch: 50,
      },
    ),
  );
  results.push(
    measure(
      'UNIFAC γ, 10 components (straightforward reference)',
      () =>
        referenceLnGammas(
          tenComponents.map((c) => c.unifac),
          tenX,
          300,
        )[0],
      {
        samples: 100,
        batch: 10,
        warmup: 50,
      },
    ),
  );
  const sys = createVleSystem(fiveComponents);
  results.push(
    measure('Bubble point, 5 components, 1 atm (optimised)', () => bubblePoint(sys, fiveX, P).T_K, {
      targetUs: 200,
      samples: 200,
      batch: 10,
      warmup: 100,
    }),
  );
  results.push(
    measure(
      'Bubble point, 5 components, 1 atm (straightforward)',
      () => straightforwardBubblePoint(fiveComponents, fiveX, P),
      {
        samples: 50,
        batch: 5,
        warmup: 10,
      },
    ),
  );
  const a = bubblePoint(sys, fiveX, P).T_K;
  const b = straightforwardBubblePoint(fiveComponents, fiveX, P);
  results[results.length - 1].note = `same answer: |ΔT| = ${Math.abs(a - b).toExponential(1)} K`;
  return results;
}
