/**
 * ENGINE_VERSION is stored with every revision's results and in its signed
 * content hash, so it must change whenever the engine's answers change —
 * otherwise two revisions computed by different engines look alike. This
 * test pins a fingerprint of the engine's answers (the route corpus and a
 * seeded Monte Carlo run, every number to 9 significant digits, messages
 * included) to the version. When it fails, the engine's answers changed:
 * raise ENGINE_VERSION in shared/engine/version.ts, say why in the
 * commit, and pin the new fingerprint below under the new version.
 */
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { ENGINE_VERSION, evaluateRoute } from '../../../shared/engine/route/evaluate';
import { monteCarlo } from '../../../shared/engine/route/monte-carlo';
import { routeCorpus } from '../../fixtures/routes/corpus';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';

/** The fingerprint of each engine version's answers (the latest is the one checked). */
const FINGERPRINTS: Record<string, string> = {
  '1.2.0': '7a08d8adb5cb8fced4c7dad60deaaf4ee75e223ae7a48adecebf9ad4cb9d3c29',
  '1.3.0': 'f766efa0e0af86307153b2b106971b4194d3a7834ef10189213e039ef5e3d1be',
  '1.4.0': '01a00a2e3138ea0ba1ad31044bdcfbed0ad6d84c9cda5c8b39f52f6e4f84a128',
  '1.5.0': '4b946f1ea8578798af4c707546c1dd25c44a34fec28005467ad9b936c0586b3d',
  '1.6.0': '9e59630262f34b611d8d5b593ce35d108b98bf9723daf2f255f4165ab7ef1ed7',
  '1.7.0': '3702075dad87565effb28d496fd1cd57cd6a8bdbf5bd00a3c35ab996ba45f6e7',
  '1.8.0': '16c9920614ee0ff59ff820a2398a0ee6c396e4c38e2e19005316612c022a8a96',
  '1.9.0': '7f33f72de28333da41370198ae50844574da49822d988f1d01a36544de979c35',
  '1.10.0': '5fc2cf714e0a2af3992a3940bf61921c64af715418321ed61bbcf553d5adf1e2',
  '1.11.0': '0cfe0c85fff4eaf1ddaa1a0f3e9b7c6408a12c9fc662b1ac90056aae00483cfd',
  '1.12.0': '224e5166830cceede2bafad33bdb13eddc7bad80b39f2b04ab2080bedcc4822b',
  '1.13.0': '7deff65f352f82d167fc2f508196d315429dd42f5e3164a08b71519e91cf29ec',
  '1.14.0': '0b595a1e8f12a0dff9a3c91f3101cc3a0c03d7c9fe36c35059d62719afe755b8',
  '1.15.0': '3367700afec4128d384c0572d5f2c9721aa3d579189b950de73d84876dfa290f',
  '1.16.0': 'b4de09bc245d24f35acd54816615b417f1674a52fb4d18105d0ab73e2c43d42d',
  '1.17.0': 'f0d200b79ad0cbda23a86bd308ed624add94c28592663d03cc072fb84f45dd13',
};

/** JSON with every number to 9 significant digits (−0 written as 0; NaN and ±∞ kept apart). */
function rounded(value: unknown): string {
  return JSON.stringify(value, (_k, v: unknown) => {
    if (typeof v !== 'number') return v;
    if (!Number.isFinite(v)) return `#${String(v)}`;
    return v === 0 ? 0 : Number(v.toPrecision(9));
  });
}

function fingerprint(): string {
  const hash = createHash('sha256');
  for (const [name, doc] of routeCorpus()) hash.update(name).update(rounded(evaluateRoute(doc)));
  hash.update(rounded(monteCarlo(demoAmideIsolation, { draws: 40, seed: 7 })));
  return hash.digest('hex');
}

describe('the engine version', () => {
  it('has a pinned fingerprint', () => {
    expect(Object.keys(FINGERPRINTS)).toContain(ENGINE_VERSION);
  });

  it("changes when the engine's answers change", () => {
    const found = fingerprint();
    expect(
      found,
      `The engine's answers changed but ENGINE_VERSION is still ${ENGINE_VERSION}: raise it and pin ${found}`,
    ).toBe(FINGERPRINTS[ENGINE_VERSION]);
  });

  it('gives the same fingerprint twice (the check is deterministic)', () => {
    expect(fingerprint()).toBe(fingerprint());
  });
});
