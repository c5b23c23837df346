import { describe, expect, it } from 'vitest';
import { andiTimestamp, isNetcdfClassic, parseAndi, processTrace } from '@shared/chromatography';
import { writeAndiChromatogram, writeNetcdfClassic } from '../../support/netcdf-classic';
import { gaussianArea } from './synthetic';

// An ANDI/AIA (ASTM E1947) chromatogram written by our own netCDF classic writer:
// 20 Hz for 10 min, one Gaussian at 300 s of height 50 mAU and σ = 3 s (0.05 min).
const intervalS = 0.05;
const signal = Array.from({ length: 12001 }, (_, i) => {
  const t = i * intervalS;
  return 2 + 50 * Math.exp(-((t - 300) ** 2) / (2 * 3 * 3));
});

describe('ANDI/AIA netCDF chromatograms', () => {
  it('recognises the netCDF classic magic number', () => {
    const bytes = writeAndiChromatogram({ signal, intervalS, retentionUnit: 'seconds' });
    expect(isNetcdfClassic(bytes)).toBe(true);
    expect(isNetcdfClassic(new TextEncoder().encode('Time,Signal'))).toBe(false);
  });

  it('reads the signal and converts seconds to minutes; the area comes out in signal × min', () => {
    const r = parseAndi(
      writeAndiChromatogram({
        signal,
        intervalS,
        retentionUnit: 'seconds',
        sampleName: 'IPC 3 (invented)',
        injectionStamp: '20261130143000+0100',
      }),
    );
    expect(r.timeMin).toHaveLength(12001);
    expect(r.timeMin[1200]).toBeCloseTo(1, 6);
    expect(r.detectorUnit).toBe('mAU');
    expect(r.sampleName).toBe('IPC 3 (invented)');
    expect(r.injectedAt).toBe('2026-11-30T13:30:00.000Z');
    const peaks = processTrace(r).peaks;
    expect(peaks).toHaveLength(1);
    expect(peaks[0].retentionMin).toBeCloseTo(5, 3);
    // 50 × 0.05 min × √(2π) = 6.2666 mAU·min (float32 storage: within 0.1 %).
    expect(Math.abs(peaks[0].area / gaussianArea({ tR: 5, h: 50, sigma: 0.05 }) - 1)).toBeLessThan(
      1e-3,
    );
  });

  it('uses raw_data_retention when present, a delay time, and minutes when the file says so', () => {
    const r = parseAndi(
      writeAndiChromatogram({
        signal: signal.slice(0, 100),
        intervalS: 0.5,
        delayS: 1,
        retentionUnit: 'minutes',
        withRetentionArray: true,
      }),
    );
    expect(r.timeMin[0]).toBeCloseTo(1, 12);
    expect(r.timeMin[2]).toBeCloseTo(2, 12);
  });

  it('reads seconds when the file names no unit, and says so', () => {
    const r = parseAndi(writeAndiChromatogram({ signal: signal.slice(0, 100), intervalS: 6 }));
    expect(r.timeMin[10]).toBeCloseTo(1, 12);
    expect(r.warnings.join(' ')).toMatch(/no retention unit/);
  });

  it('a file cut short is refused with a plain message', () => {
    const bytes = writeAndiChromatogram({ signal, intervalS, retentionUnit: 'seconds' });
    expect(() => parseAndi(bytes.slice(0, bytes.length / 2))).toThrow(/cut short or damaged/);
    expect(() => parseAndi(bytes.slice(0, 40))).toThrow(/cut short or damaged/);
  });

  it('a netCDF file that is not a chromatogram is refused', () => {
    const bytes = writeNetcdfClassic({
      dimensions: { x: 3 },
      attributes: { title: 'not a chromatogram' },
      variables: [{ name: 'temperature', dims: ['x'], type: 'double', values: [1, 2, 3] }],
    });
    expect(() => parseAndi(bytes)).toThrow(/ordinate_values/);
  });

  it('reads the injection stamp format YYYYMMDDhhmmss±hhmm', () => {
    expect(andiTimestamp('20260102030405-0500')).toBe('2026-01-02T08:04:05.000Z');
    expect(andiTimestamp('garbage')).toBeNull();
  });
});
