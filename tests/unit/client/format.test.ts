import { describe, expect, it } from 'vitest';
import { engineeringToE, formatEngineering, formatFactor } from '@/lib/format';
import { formatQuantity, parseNumber } from '@/lib/units';

describe('formatFactor', () => {
  it('keeps small and medium ratios as plain numbers and writes large ones as a power of ten', () => {
    expect(formatFactor(3.24)).toBe('3.2');
    expect(formatFactor(845.4)).toBe('845');
    expect(formatFactor(12_400)).toBe('12\u2009400');
    expect(formatFactor(2_417_570_030_572)).toBe('2.4 × 10¹²');
    // Below 1 the impurity is enriched, not purged: two significant digits keep that visible.
    expect(formatFactor(0.42)).toBe('0.42');
  });

  it('says plainly when there is no number', () => {
    expect(formatFactor(null)).toBe('—');
    expect(formatFactor(Number.NaN)).toBe('—');
    expect(formatFactor(Number.POSITIVE_INFINITY)).toBe('∞');
  });
});

describe('engineering notation, one formatter for fields and tables', () => {
  it('writes very large and very small numbers with a power that is a multiple of three', () => {
    expect(formatEngineering(1e10)).toBe('10 × 10⁹');
    expect(formatEngineering(3.1e12)).toBe('3.1 × 10¹²');
    expect(formatEngineering(5.6e7)).toBe('56 × 10⁶');
    expect(formatEngineering(2.5e-5)).toBe('25 × 10⁻⁶');
    expect(formatEngineering(999_999, 3)).toBe('1 × 10⁶');
    expect(formatEngineering(845.4)).toBe('845.4');
    expect(formatEngineering(0.0042)).toBe('0.0042');
    expect(formatFactor(56_000_000)).toBe('56 × 10⁶');
  });

  it('a field shows a cake resistance as 10 × 10⁹, not 10000000000, and reads it back', () => {
    expect(formatQuantity('number', 1e10)).toBe('10 × 10⁹');
    for (const v of [1e10, 3.25e11, 2.5e-5, 42, 0.5]) {
      const shown = formatQuantity('number', v);
      const read = parseNumber(shown);
      expect(read.ok && read.value).toBe(v);
    }
    expect(engineeringToE('1.5 x 10^9')).toBe('1.5e9');
    // Two washes of 100 mL stay what they say.
    expect(engineeringToE('2 x 100 mL')).toBe('2 x 100 mL');
    expect(engineeringToE('2 × 10 vol')).toBe('2 × 10 vol');
    expect(parseNumber('2 × 10⁻³')).toEqual({ ok: true, value: 0.002 });
  });
});
