/**
 * Straightforward UNIFAC implementation, kept as a reference for the optimised
 * one in unifac.ts: same equations (Fredenslund et al. 1975; Poling et al. 5th
 * ed. §8-10), written term by term with plain arrays and recomputing Ψ(T) and
 * the pure-component ln Γ_k^(i) on every call. Used by tests (agreement to
 * 1e-12) and by the benchmark (to show what the optimisation bought). Not for
 * production paths.
 */
import type { UnifacGroups } from '../data/types';
import { UNIFAC_SUBGROUPS, mainGroupInteraction } from '../data/unifac';
import { indexUnifacGroups } from './unifac';

/**
 * ln γ_i [–] by the textbook equations.
 *
 * Source: Fredenslund, Jones & Prausnitz, AIChE J. 1975, 21, 1086; parameters
 * Hansen et al. 1991 (data/unifac.ts). Validity: as createUnifac.
 *
 * @param components  subgroup counts per component (subgroup number → count [–])
 * @param x           mole fractions [–], summing to 1
 * @param T_K         temperature [K]
 * @returns ln γ_i [–]
 */
export function referenceLnGammas(
  components: readonly UnifacGroups[],
  x: readonly number[],
  T_K: number,
): number[] {
  const { subgroups } = indexUnifacGroups(components);
  const R = subgroups.map((s) => UNIFAC_SUBGROUPS.get(s)!.R);
  const Q = subgroups.map((s) => UNIFAC_SUBGROUPS.get(s)!.Q);
  const main = subgroups.map((s) => UNIFAC_SUBGROUPS.get(s)!.mainGroup);
  const nu = components.map((c) => subgroups.map((s) => c[s] ?? 0));
  const psi = main.map((m) => main.map((n) => Math.exp(-mainGroupInteraction(m, n)! / T_K)));

  const lnGammaGroups = (groupAmounts: number[]): number[] => {
    const total = groupAmounts.reduce((a, b) => a + b, 0);
    const X = groupAmounts.map((v) => v / total);
    const sumQX = X.reduce((acc, Xm, m) => acc + Q[m] * Xm, 0);
    const theta = X.map((Xm, m) => (Q[m] * Xm) / sumQX);
    return subgroups.map((_, k) => {
      const sumThetaPsiMK = theta.reduce((acc, th, m) => acc + th * psi[m][k], 0);
      let last = 0;
      for (let m = 0; m < subgroups.length; m++) {
        const denom = theta.reduce((acc, th, nIdx) => acc + th * psi[nIdx][m], 0);
        last += (theta[m] * psi[k][m]) / denom;
      }
      return Q[k] * (1 - Math.log(sumThetaPsiMK) - last);
    });
  };

  const r = nu.map((v) => v.reduce((acc, c, k) => acc + c * R[k], 0));
  const q = nu.map((v) => v.reduce((acc, c, k) => acc + c * Q[k], 0));
  const sumXR = x.reduce((acc, xi, i) => acc + xi * r[i], 0);
  const sumXQ = x.reduce((acc, xi, i) => acc + xi * q[i], 0);
  const mixtureAmounts = subgroups.map((_, k) => x.reduce((acc, xi, i) => acc + xi * nu[i][k], 0));
  const lnGammaMix = lnGammaGroups(mixtureAmounts);

  return components.map((_, i) => {
    const V = r[i] / sumXR;
    const F = q[i] / sumXQ;
    const combinatorial = 1 - V + Math.log(V) - 5 * q[i] * (1 - V / F + Math.log(V / F));
    const lnGammaPure = lnGammaGroups(nu[i]);
    let residual = 0;
    for (let k = 0; k < subgroups.length; k++) {
      if (nu[i][k] > 0) residual += nu[i][k] * (lnGammaMix[k] - lnGammaPure[k]);
    }
    return combinatorial + residual;
  });
}
