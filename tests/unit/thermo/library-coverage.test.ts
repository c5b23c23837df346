/**
 * The UNIFAC table covers the solvent library: every solvent's subgroups are
 * known, and every solvent can be modelled with water except the pairs that
 * the published table leaves without parameters (listed here explicitly, so a
 * new gap fails the test).
 */
import { describe, expect, it } from 'vitest';
import { SOLVENTS } from '@shared/engine/data/solvents';
import { createUnifac } from '@shared/engine/thermo/unifac';
import { UnifacParameterError } from '@shared/engine/errors';

describe('UNIFAC coverage of the solvent library', () => {
  it('knows every subgroup of every solvent', () => {
    for (const s of SOLVENTS) expect(() => createUnifac([s.unifac.value]), s.id).not.toThrow();
  });
  it('models every solvent with water, except the documented gaps', () => {
    const gaps: string[] = [];
    for (const s of SOLVENTS) {
      try {
        createUnifac([s.unifac.value, { 16: 1 }]);
      } catch (e) {
        if (!(e instanceof UnifacParameterError)) throw e;
        gaps.push(s.id);
      }
    }
    expect(gaps).toEqual(EXPECTED_WATER_GAPS);
  });
});

// None at present: every library solvent has parameters with water.
const EXPECTED_WATER_GAPS: string[] = [];
