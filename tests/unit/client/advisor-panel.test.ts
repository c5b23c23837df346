import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { SolventAlternative } from '@shared/schemas/solvent-alternatives';
import { AlternativesList, formatSpread } from '@/features/assistant/components/advisor-panel';

// The advisor's list, rendered as a component: a substitute that is not ranked
// with those keeping yield and purity says which figure lost and by how much,
// also when both purities read "> 99.99 %"; a spread whose ends read the same is
// printed once. (Before, the line said "loses yield or purity" with no figure,
// and the spread read "> 99.99–> 99.99 %".)
const percentiles = (p5: number, p95: number) => ({ p5, p50: (p5 + p95) / 2, p95 });

function alternative(
  name: string,
  figures: { yieldPct: number; purityPct: number; dYield: number; dPurity: number },
  keeps: boolean,
): SolventAlternative {
  return {
    solventId: name.toLowerCase(),
    name,
    totals: {
      yieldPct: figures.yieldPct,
      solventFreePurityPct: figures.purityPct,
      pmi: 42,
    } as SolventAlternative['totals'],
    deltaVsCurrent: {
      yieldPct: figures.dYield,
      solventFreePurityPct: figures.dPurity,
      pmi: -3,
      solventUseLPerKg: -1,
    },
    ich: { class: 3, limitPpm: 5000 },
    guideCategory: 'recommended',
    boilingPointC: 80,
    flashPointC: 10,
    cautions: ['A model result: confirm at the bench and through the process-safety review.'],
    keepsYieldAndPurity: keeps,
    waterMiscibility: 'partial',
    heteroazeotropeWithWater: null,
    uncertainty: {
      draws: 8,
      seed: 1,
      failedDraws: 0,
      yieldPct: percentiles(figures.yieldPct - 1, figures.yieldPct + 1),
      solventFreePurityPct: percentiles(99.9991, 99.9996),
      pmi: percentiles(41, 43),
    },
  };
}

const render = (items: SolventAlternative[]) =>
  renderToStaticMarkup(
    createElement(AlternativesList, { items, role: 'swap-target', onTry: () => {}, busy: false }),
  ).replace(/<!-- -->/g, '');

describe('solvent alternatives list', () => {
  it('names the impurities gained when both purities read "> 99.99 %"', () => {
    // Current route 99.9995 % (5 ppm impurities), substitute 99.9991 % (9 ppm): the purity is lower.
    const html = render([
      alternative(
        'Heptane',
        { yieldPct: 90, purityPct: 99.9991, dYield: -0.5, dPurity: -0.0004 },
        false,
      ),
    ]);
    expect(html).toContain('purity &gt; 99.99 %');
    expect(html).toContain('loses purity: impurities 5 → 9 ppm');
    expect(html).not.toContain('loses yield or purity');
    expect(html).not.toContain('yield: 0.5 points lower');
  });

  it('names the yield lost beyond the window, and both when both are lost', () => {
    const html = render([
      alternative(
        'Toluene',
        { yieldPct: 85.6, purityPct: 99.5, dYield: -3.4, dPurity: 0.1 },
        false,
      ),
      alternative('Anisole', { yieldPct: 80, purityPct: 99.2, dYield: -10, dPurity: -0.3 }, false),
    ]);
    expect(html).toContain('loses yield: 3.4 points lower (at most 2 allowed)');
    expect(html).toContain(
      'loses yield: 10.0 points lower (at most 2 allowed); purity: impurities 0.50 → 0.80 %',
    );
  });

  it('prints a spread whose ends read the same once', () => {
    const html = render([
      alternative(
        'Heptane',
        { yieldPct: 90, purityPct: 99.9991, dYield: 0.1, dPurity: 0.0001 },
        true,
      ),
    ]);
    expect(html).toContain('keeps yield and purity');
    expect(html).toContain('purity &gt; 99.99 %');
    expect(html).not.toContain('99.99–');
    expect(html).toMatch(
      /Spread p5–p95: PMI 41\.0–43\.0, yield 89\.0–91\.0 %, purity &gt; 99\.99 %/,
    );
    expect(formatSpread('99.98', '> 99.99', ' %')).toBe('99.98 % to > 99.99 %');
    expect(formatSpread('1.0', '1.0')).toBe('1.0');
  });
});
