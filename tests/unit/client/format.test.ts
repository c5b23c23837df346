import { describe, expect, it } from 'vitest';
import { formatFactor } from '@/lib/format';

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
