/**
 * UNIFAC activity coefficients (original VLE version).
 *
 * Source: Fredenslund, Jones & Prausnitz, "Group-contribution estimation of
 * activity coefficients in nonideal liquid mixtures", AIChE J. 1975, 21, 1086
 * (doi:10.1002/aic.690210607); parameters as revised by Hansen et al., Ind.
 * Eng. Chem. Res. 1991, 30, 2352 (doi:10.1021/ie00058a017). The equations are
 * as printed in Poling, Prausnitz & O'Connell, The Properties of Gases and
 * Liquids, 5th ed., §8-10 (Eqs. 8-10.1 to 8-10.17).
 *
 *   ln γ_i = ln γ_i^C + ln γ_i^R
 *   combinatorial (Staverman–Guggenheim, z = 10):
 *     r_i = Σ_k ν_ki R_k,  q_i = Σ_k ν_ki Q_k
 *     V_i = r_i / Σ_j x_j r_j,  F_i = q_i / Σ_j x_j q_j
 *     ln γ_i^C = 1 − V_i + ln V_i − 5 q_i (1 − V_i/F_i + ln(V_i/F_i))
 *   residual:
 *     ln γ_i^R = Σ_k ν_ki (ln Γ_k − ln Γ_k^(i))
 *     ln Γ_k = Q_k [1 − ln(Σ_m θ_m Ψ_mk) − Σ_m θ_m Ψ_km / Σ_n θ_n Ψ_nm]
 *     θ_m = Q_m X_m / Σ_n Q_n X_n,  X_m = Σ_j ν_mj x_j / Σ_j Σ_n ν_nj x_j
 *     Ψ_mn = exp(−a_mn / T)   (a_mn of the main groups of m and n)
 *   ln Γ_k^(i) is the same expression evaluated in pure component i.
 *
 * This module is the optimised implementation: all group bookkeeping is done
 * once in createUnifac; Ψ(T) and the pure-component ln Γ_k^(i) are cached for
 * the last temperature; a call allocates nothing when `out` is given. The
 * straightforward implementation in unifac-reference.ts is kept for the tests
 * (agreement to 1e-12) and the benchmark.
 */
import { EngineError, UnifacParameterError, type UnifacParameterGap } from '../errors';
import type { UnifacGroups } from '../data/types';
import { UNIFAC_MAIN_GROUPS, UNIFAC_SUBGROUPS, mainGroupInteraction } from '../data/unifac';

/** A UNIFAC model for a fixed list of components. */
export interface UnifacModel {
  /** Number of components. */
  readonly n: number;
  /**
   * Activity coefficients γ_i [–] (mole-fraction scale, pure-liquid standard state).
   * @param x    mole fractions [–], length n, each ≥ 0, summing to 1 (±1e-6; normalised inside)
   * @param T_K  temperature [K]
   * @param out  optional array of length n to write into
   */
  gammas(x: ArrayLike<number>, T_K: number, out?: Float64Array): Float64Array;
  /** ln γ_i [–]; same arguments as gammas. */
  lnGammas(x: ArrayLike<number>, T_K: number, out?: Float64Array): Float64Array;
}

/** Subgroups in a stable order, with validation of the parameter table. */
export interface UnifacGroupIndex {
  subgroups: number[];
  mainGroups: number[];
}

/**
 * Collects the distinct subgroups of the components and checks that every
 * subgroup is known and every pair of main groups has parameters in both
 * directions. Throws UnifacParameterError (code 'unifac-missing-parameters')
 * naming each missing pair and unknown subgroup.
 *
 * Source: Fredenslund, Jones & Prausnitz, AIChE J. 1975, 21, 1086; parameters
 * Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352 (data/unifac.ts).
 *
 * @param components  UNIFAC subgroup counts per component (subgroup number → count [–])
 * @returns the distinct subgroups and their main groups, in a stable order
 *
 * Validity: any subgroups of the original UNIFAC table.
 */
export function indexUnifacGroups(components: readonly UnifacGroups[]): UnifacGroupIndex {
  const subgroupSet = new Set<number>();
  const unknownSubgroups: number[] = [];
  components.forEach((groups, i) => {
    const entries = Object.entries(groups);
    if (entries.length === 0) {
      throw new EngineError('invalid-input', `Component ${i + 1} has no UNIFAC groups.`, {
        component: i,
      });
    }
    for (const [key, count] of entries) {
      const id = Number(key);
      if (!Number.isFinite(count) || count < 0) {
        throw new EngineError(
          'invalid-input',
          `Component ${i + 1}: subgroup ${key} has count ${count}.`,
          { component: i },
        );
      }
      if (count === 0) continue;
      if (!UNIFAC_SUBGROUPS.has(id)) {
        if (!unknownSubgroups.includes(id)) unknownSubgroups.push(id);
      } else subgroupSet.add(id);
    }
  });
  const subgroups = [...subgroupSet].sort((a, b) => a - b);
  const mainGroups = subgroups.map((s) => UNIFAC_SUBGROUPS.get(s)!.mainGroup);
  const distinctMain = [...new Set(mainGroups)].sort((a, b) => a - b);
  const missingPairs: UnifacParameterGap['missingPairs'] = [];
  for (let a = 0; a < distinctMain.length; a++) {
    for (let b = a + 1; b < distinctMain.length; b++) {
      const m = distinctMain[a];
      const n = distinctMain[b];
      if (mainGroupInteraction(m, n) === undefined || mainGroupInteraction(n, m) === undefined) {
        missingPairs.push({
          mainGroupA: m,
          mainGroupB: n,
          names: [UNIFAC_MAIN_GROUPS[m] ?? String(m), UNIFAC_MAIN_GROUPS[n] ?? String(n)],
        });
      }
    }
  }
  if (unknownSubgroups.length > 0 || missingPairs.length > 0) {
    const parts: string[] = [];
    if (unknownSubgroups.length > 0)
      parts.push(`unknown UNIFAC subgroup(s) ${unknownSubgroups.join(', ')}`);
    if (missingPairs.length > 0) {
      parts.push(
        'no published interaction parameters for main-group pair(s) ' +
          missingPairs
            .map((p) => `${p.names[0]} (${p.mainGroupA}) – ${p.names[1]} (${p.mainGroupB})`)
            .join(', '),
      );
    }
    throw new UnifacParameterError(`UNIFAC cannot be evaluated: ${parts.join('; ')}.`, {
      missingPairs,
      unknownSubgroups,
    });
  }
  return { subgroups, mainGroups };
}

/**
 * Checks a composition and returns 1/Σx (the normalising factor).
 *
 * Source: definition of mole fractions (no model). Formula: each x_i finite
 * and ≥ 0, Σx within 1 ± 1e-6; returns 1/Σx.
 *
 * @param x  mole fractions [–]
 * @param n  number of components expected [–]
 * @returns 1/Σx [–]; throws EngineError 'invalid-input' otherwise
 *
 * Validity: any composition vector.
 */
export function checkComposition(x: ArrayLike<number>, n: number): number {
  if (x.length !== n) {
    throw new EngineError(
      'invalid-input',
      `Composition has ${x.length} entries; the mixture has ${n} components.`,
      { length: x.length, n },
    );
  }
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const xi = x[i];
    if (!Number.isFinite(xi) || xi < 0) {
      throw new EngineError(
        'invalid-input',
        `Mole fraction ${i + 1} is ${xi}; it must be finite and ≥ 0.`,
        { index: i },
      );
    }
    sum += xi;
  }
  if (Math.abs(sum - 1) > 1e-6) {
    throw new EngineError('invalid-input', `Mole fractions sum to ${sum}; they must sum to 1.`, {
      sum,
    });
  }
  return 1 / sum;
}

function checkTemperature(T_K: number): void {
  if (!Number.isFinite(T_K) || T_K <= 0) {
    throw new EngineError(
      'invalid-input',
      `Temperature must be a finite number of kelvin above 0; got ${T_K}.`,
      { T_K },
    );
  }
}

/**
 * Builds a UNIFAC model for the given components.
 *
 * Purpose: activity coefficients of any liquid mixture whose molecules are
 * described by original-UNIFAC subgroups (shared/engine/data/unifac.ts).
 *
 * @param components  UNIFAC subgroup counts per component (subgroup number → count [–])
 * @returns a model whose gammas/lnGammas take mole fractions [–] and T [K]
 *
 * Source: Fredenslund, Jones & Prausnitz, AIChE J. 1975, 21, 1086; parameters
 * Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352 (data/unifac.ts).
 *
 * Validity: the parameters were regressed on VLE data, roughly 275–425 K
 * (Fredenslund et al. 1975); outside that range, and for liquid–liquid
 * equilibria, results are qualitative. Errors: UnifacParameterError for an
 * unknown subgroup or a main-group pair with no parameters; EngineError
 * 'invalid-input' for an empty group list.
 *
 * Example: ethanol {1:1, 2:1, 14:1} + water {16:1}, x = [0.5, 0.5], 298.15 K
 * → γ ≈ [1.2, 1.6] (see tests/reference/thermo for checked values).
 */
export function createUnifac(components: readonly UnifacGroups[]): UnifacModel {
  const n = components.length;
  if (n === 0)
    throw new EngineError('invalid-input', 'A UNIFAC model needs at least one component.');
  const { subgroups, mainGroups } = indexUnifacGroups(components);
  const K = subgroups.length;
  const Qk = new Float64Array(K);
  const aMatrix = new Float64Array(K * K);
  for (let k = 0; k < K; k++) {
    Qk[k] = UNIFAC_SUBGROUPS.get(subgroups[k])!.Q;
    for (let m = 0; m < K; m++)
      aMatrix[k * K + m] = mainGroupInteraction(mainGroups[k], mainGroups[m])!;
  }
  // ν_ki stored component-major: nu[i*K + k].
  const nu = new Float64Array(n * K);
  const r = new Float64Array(n);
  const q = new Float64Array(n);
  const groupsPerComponent = new Float64Array(n);
  // Lists of groups present in each component (sparse loop in the residual sum).
  const presentStart = new Int32Array(n + 1);
  const presentList: number[] = [];
  for (let i = 0; i < n; i++) {
    presentStart[i] = presentList.length;
    for (let k = 0; k < K; k++) {
      const count = components[i][subgroups[k]] ?? 0;
      nu[i * K + k] = count;
      if (count > 0) {
        const sg = UNIFAC_SUBGROUPS.get(subgroups[k])!;
        r[i] += count * sg.R;
        q[i] += count * sg.Q;
        groupsPerComponent[i] += count;
        presentList.push(k);
      }
    }
  }
  presentStart[n] = presentList.length;
  const present = Int32Array.from(presentList);

  // Ψ_mn depends on the main groups of m and n only: exp(−a/T) is taken once per distinct
  // interaction energy a (the same a gives the same Ψ, so the matrix is identical to one exp per
  // entry; a cold temperature costs far fewer exponentials).
  const energyOf = new Map<number, number>();
  const energyIndex = new Int32Array(K * K);
  for (let j = 0; j < K * K; j++) {
    let e = energyOf.get(aMatrix[j]);
    if (e === undefined) {
      e = energyOf.size;
      energyOf.set(aMatrix[j], e);
    }
    energyIndex[j] = e;
  }
  const energies = Float64Array.from(energyOf.keys());
  const psiOfEnergy = new Float64Array(energies.length);

  // Combinatorial part: ln V_i = ln r_i − ln Σx r and ln(V_i/F_i) = ln(r_i/q_i) − ln(Σx r/Σx q), so a
  // call takes two logarithms for it instead of two per component.
  const lnR = new Float64Array(n);
  const lnRQ = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    lnR[i] = Math.log(r[i]);
    lnRQ[i] = Math.log(r[i] / q[i]);
  }

  // Temperature cache: Ψ (row-major psi[m*K + n] = Ψ_mn), and per component
  // Σ_k ν_ki ln Γ_k^(i) (the pure-component residual terms, summed once per temperature).
  let cachedT = NaN;
  const psi = new Float64Array(K * K);
  const pureResidual = new Float64Array(n);

  // Scratch.
  const X = new Float64Array(K);
  const theta = new Float64Array(K);
  const S = new Float64Array(K);
  const ratio = new Float64Array(K);
  const lnGammaMix = new Float64Array(K);

  /** ln Γ_k for group mole numbers in X (overwrites theta, S, ratio); writes into target[offset + k]. */
  function groupLnGammas(target: Float64Array, offset: number): void {
    let sumQX = 0;
    for (let k = 0; k < K; k++) sumQX += Qk[k] * X[k];
    const inv = 1 / sumQX;
    for (let k = 0; k < K; k++) theta[k] = Qk[k] * X[k] * inv;
    for (let k = 0; k < K; k++) {
      let s = 0;
      for (let m = 0; m < K; m++) s += theta[m] * psi[m * K + k];
      S[k] = s;
    }
    for (let m = 0; m < K; m++) ratio[m] = theta[m] / S[m];
    for (let k = 0; k < K; k++) {
      let t = 0;
      const row = k * K;
      for (let m = 0; m < K; m++) t += psi[row + m] * ratio[m];
      target[offset + k] = Qk[k] * (1 - Math.log(S[k]) - t);
    }
  }

  /**
   * ln Γ_k^(i) of pure component i for its own groups only (the groups absent from i have
   * θ_m = 0 and add nothing), at (groups of i)² instead of K² operations.
   */
  function pureGroupLnGammas(i: number): void {
    const start = presentStart[i];
    const end = presentStart[i + 1];
    const base = i * K;
    let sumQX = 0;
    for (let p = start; p < end; p++) {
      const k = present[p];
      sumQX += Qk[k] * nu[base + k];
    }
    const inv = 1 / sumQX;
    for (let p = start; p < end; p++) {
      const k = present[p];
      theta[k] = Qk[k] * nu[base + k] * inv;
    }
    for (let p = start; p < end; p++) {
      const k = present[p];
      let s = 0;
      for (let pm = start; pm < end; pm++) {
        const m = present[pm];
        s += theta[m] * psi[m * K + k];
      }
      S[k] = s;
    }
    for (let p = start; p < end; p++) {
      const m = present[p];
      ratio[m] = theta[m] / S[m];
    }
    let sum = 0;
    for (let p = start; p < end; p++) {
      const k = present[p];
      let t = 0;
      const row = k * K;
      for (let pm = start; pm < end; pm++) {
        const m = present[pm];
        t += psi[row + m] * ratio[m];
      }
      sum += nu[base + k] * Qk[k] * (1 - Math.log(S[k]) - t);
    }
    pureResidual[i] = sum;
  }

  function setTemperature(T_K: number): void {
    checkTemperature(T_K);
    for (let e = 0; e < energies.length; e++) psiOfEnergy[e] = Math.exp(-energies[e] / T_K);
    for (let j = 0; j < K * K; j++) psi[j] = psiOfEnergy[energyIndex[j]];
    for (let i = 0; i < n; i++) pureGroupLnGammas(i);
    cachedT = T_K;
  }

  function lnGammas(x: ArrayLike<number>, T_K: number, out?: Float64Array): Float64Array {
    if (x.length !== n) checkComposition(x, n);
    // The checks of checkComposition, fused with the first pass (it throws the error when any fails).
    let sum = 0;
    for (let i = 0; i < n; i++) {
      const xi = x[i];
      if (!(xi >= 0 && xi < Infinity)) checkComposition(x, n);
      sum += xi;
    }
    if (Math.abs(sum - 1) > 1e-6) checkComposition(x, n);
    const scale = 1 / sum;
    if (T_K !== cachedT) setTemperature(T_K);
    const result = out ?? new Float64Array(n);
    let sumXR = 0;
    let sumXQ = 0;
    for (let k = 0; k < K; k++) X[k] = 0;
    for (let i = 0; i < n; i++) {
      const xi = x[i] * scale;
      sumXR += xi * r[i];
      sumXQ += xi * q[i];
      if (xi === 0) continue;
      for (let p = presentStart[i]; p < presentStart[i + 1]; p++) {
        const k = present[p];
        X[k] += xi * nu[i * K + k];
      }
    }
    groupLnGammas(lnGammaMix, 0);
    const lnSumXR = Math.log(sumXR);
    const lnRatio = Math.log(sumXR / sumXQ);
    for (let i = 0; i < n; i++) {
      const V = r[i] / sumXR;
      const VF = V / (q[i] / sumXQ);
      const lnV = lnR[i] - lnSumXR;
      const lnVF = lnRQ[i] - lnRatio;
      let value = 1 - V + lnV - 5 * q[i] * (1 - VF + lnVF) - pureResidual[i];
      for (let p = presentStart[i]; p < presentStart[i + 1]; p++) {
        const k = present[p];
        value += nu[i * K + k] * lnGammaMix[k];
      }
      result[i] = value;
    }
    return result;
  }

  return {
    n,
    lnGammas,
    gammas(x, T_K, out) {
      const result = lnGammas(x, T_K, out);
      for (let i = 0; i < n; i++) result[i] = Math.exp(result[i]);
      return result;
    },
  };
}

/**
 * Reusable UNIFAC models, keyed by the components' subgroup counts (in
 * component order), for callers that evaluate the same mixture many times
 * (one route evaluation, or the draws of a Monte Carlo run). A cached model
 * gives exactly the numbers of a freshly built one: createUnifac is
 * deterministic and its only state is the Ψ(T) of the last temperature.
 * Bounded: the cache is emptied when it holds more than `maxModels` models.
 * Models that fail to build (missing parameters) are not cached; the error
 * is thrown again on each request.
 */
export interface UnifacModelCache {
  /** The model for these components (subgroup number → count [–] each), built on first use. */
  model(components: readonly UnifacGroups[]): UnifacModel;
}

function groupsKey(components: readonly UnifacGroups[]): string {
  let key = '';
  for (const g of components) {
    const ks = Object.keys(g).sort((a, b) => Number(a) - Number(b));
    for (const k of ks) key += `${k}:${g[Number(k)]},`;
    key += '|';
  }
  return key;
}

/**
 * A bounded cache of UNIFAC models keyed by their components' groups (pure
 * memoisation of createUnifac; least recently built dropped first).
 *
 * Source: Fredenslund, Jones & Prausnitz, AIChE J. 1975, 21, 1086; parameters
 * Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352 (data/unifac.ts).
 *
 * @param maxModels  bound on the number of models held [–], default 256
 * @returns a cache whose model(components) equals createUnifac(components)
 *
 * Validity: as createUnifac.
 *
 * Example: const c = createUnifacModelCache(); c.model([{16: 1}, {1: 2, 2: 1}]).gammas([0.5, 0.5], 298.15)
 */
export function createUnifacModelCache(maxModels = 256): UnifacModelCache {
  const models = new Map<string, UnifacModel>();
  // Fast path by object identity of the group records (weakly held), then by content.
  type Node = { model?: UnifacModel; next?: WeakMap<object, Node> };
  let root: Node = {};
  return {
    model(components) {
      let node = root;
      for (const g of components) {
        let next = node.next?.get(g);
        if (!next) {
          next = {};
          (node.next ??= new WeakMap()).set(g, next);
        }
        node = next;
      }
      if (node.model) return node.model;
      const key = groupsKey(components);
      let m = models.get(key);
      if (!m) {
        m = createUnifac(components);
        if (models.size >= maxModels) {
          models.clear();
          root = {};
        }
        models.set(key, m);
      }
      node.model = m;
      return m;
    },
  };
}

/**
 * Activity coefficients in one call (builds the model each time; for repeated
 * use call createUnifac once).
 *
 * @param components  UNIFAC subgroup counts per component
 * @param x           mole fractions [–], summing to 1
 * @param T_K         temperature [K]
 * @returns γ_i [–]
 *
 * Source: Fredenslund, Jones & Prausnitz, AIChE J. 1975, 21, 1086; parameters
 * Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352 (data/unifac.ts).
 * Validity: as createUnifac.
 *
 * Example: activityCoefficients([{1:2, 2:5}, {1:1, 3:1, 18:1}], ...) — see createUnifac.
 */
export function activityCoefficients(
  components: readonly UnifacGroups[],
  x: readonly number[],
  T_K: number,
): number[] {
  return Array.from(createUnifac(components).gammas(x, T_K));
}

/**
 * The subgroups of a molecule with their names and main groups, for display.
 *
 * @param groups  subgroup number → count [–]
 * @returns one row per subgroup, in subgroup-number order; throws
 *          UnifacParameterError for an unknown subgroup
 *
 * Source: the subgroup table of Hansen et al., Ind. Eng. Chem. Res. 1991, 30,
 * 2352 (data/unifac.ts). Validity: subgroups of that table.
 */
export function unifacGroupsSummary(groups: UnifacGroups): Array<{
  subgroup: number;
  name: string;
  mainGroup: number;
  mainGroupName: string;
  count: number;
}> {
  const rows: Array<{
    subgroup: number;
    name: string;
    mainGroup: number;
    mainGroupName: string;
    count: number;
  }> = [];
  const unknown: number[] = [];
  for (const [key, count] of Object.entries(groups)) {
    const id = Number(key);
    const sg = UNIFAC_SUBGROUPS.get(id);
    if (!sg) {
      unknown.push(id);
      continue;
    }
    rows.push({
      subgroup: id,
      name: sg.name,
      mainGroup: sg.mainGroup,
      mainGroupName: UNIFAC_MAIN_GROUPS[sg.mainGroup],
      count,
    });
  }
  if (unknown.length > 0) {
    throw new UnifacParameterError(`Unknown UNIFAC subgroup(s) ${unknown.join(', ')}.`, {
      missingPairs: [],
      unknownSubgroups: unknown,
    });
  }
  return rows.sort((a, b) => a.subgroup - b.subgroup);
}
