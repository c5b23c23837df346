/**
 * Counter-current cascade: the first pass gives every stage the same liquid and no warm start, so
 * the stages after the first take the first stage's equilibrium (coldStageMemo). The cascade must
 * come out the same to the bit as when every stage is equilibrated, warm starts included, and a
 * stage is equilibrated afresh whenever its amounts differ or it has a warm start.
 */
import { describe, expect, it } from 'vitest';
import { acidBaseInEthylAcetate } from '../../fixtures/routes/acid-base-wash';
import { buildContext } from '../../../shared/engine/route/context';
import type { EngineWarning, MethodUsed } from '../../../shared/engine/route/types';
import type { LiquidSplitStart } from '../../../shared/engine/unitops/equilibria';
import {
  coldStageMemo,
  counterCurrentCascade,
  equilibrate,
} from '../../../shared/engine/unitops/wash';

// An ethyl acetate solution of an acid and a base (invented test compounds; groups as in the UNIFAC
// subgroup table) washed counter-currently with water at pH from the charge balance.
const doc = acidBaseInEthylAcetate;

const T = 298.15;
const feed = { water: 0.02, etoac: 0.9, acid: 0.01, amine: 0.004 };
const added = { water: 0.5, etoac: 0, acid: 0, amine: 0 };

function cascade(N: number, shared: boolean) {
  const { ctx } = buildContext(doc);
  const starts: LiquidSplitStart[] = Array.from({ length: N }, () => ({}));
  let equilibrations = 0;
  const stage = (mix: Record<string, number>, w: EngineWarning[], m: MethodUsed[], n: number) => {
    equilibrations++;
    return equilibrate(ctx, mix, T, undefined, w, m, false, starts[n]);
  };
  const memo = coldStageMemo(ctx, stage);
  const cc = counterCurrentCascade(ctx, feed, added, N, false, (mix, w, m, n) =>
    shared ? memo(mix, w, m, starts[n], n) : stage(mix, [], [], n),
  );
  return { cc, starts, equilibrations };
}

describe('counter-current cascade, first pass shared between stages', () => {
  it('gives the same outlets, stage liquids and warm starts to the bit as every stage equilibrated', () => {
    for (const N of [2, 3]) {
      const plain = cascade(N, false);
      const shared = cascade(N, true);
      expect(shared.cc.converged).toBe(true);
      expect(shared.cc).toEqual(plain.cc);
      expect(shared.starts).toEqual(plain.starts);
      expect(shared.starts[N - 1].phases).toBeDefined();
      // Only the first pass's repeats are skipped; the warm-started passes all run.
      expect(shared.equilibrations).toBe(plain.equilibrations - (N - 1));
    }
  });

  it('equilibrates a stage afresh when its amounts differ or it has a warm start', () => {
    const { ctx } = buildContext(doc);
    let equilibrations = 0;
    const memo = coldStageMemo(ctx, (mix, w, m) => {
      equilibrations++;
      return equilibrate(ctx, mix, T, undefined, w, m, false, undefined);
    });
    const mix = { ...feed, water: 0.52 };
    const first = memo(mix, [], [], {}, 0);
    expect(memo({ ...mix }, [], [], {}, 1)).toBe(first);
    expect(equilibrations).toBe(1);
    const other = memo({ ...mix, acid: 0.011 }, [], [], {}, 2);
    expect(equilibrations).toBe(2);
    expect(other.toOrganic.acid).not.toBe(first.toOrganic.acid);
    memo({ ...mix }, [], [], { key: 'warm' }, 3);
    expect(equilibrations).toBe(3);
  });
});
