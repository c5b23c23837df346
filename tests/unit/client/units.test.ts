import { describe, expect, it } from 'vitest';
import {
  formatQuantity,
  parseCount,
  parseEquiv,
  parseFraction,
  parseMassKg,
  parsePercent,
  parsePressureMbar,
  parseTemperatureC,
  parseUncertain,
  parseUncertainVolume,
  parseVolume,
} from '../../../src/lib/units';

const ok = <T>(value: T) => ({ ok: true, value });

describe('quantities typed the way chemists write them', () => {
  it('reads volumes: absolute ones in litres, relative ones in vol (L per kg of the reference input)', () => {
    expect(parseVolume('250 mL')).toEqual(ok({ value: 0.25, unit: 'L' }));
    expect(parseVolume('2 L')).toEqual(ok({ value: 2, unit: 'L' }));
    expect(parseVolume('10 vol')).toEqual(ok({ value: 10, unit: 'vol' }));
    expect(parseVolume('10 vols')).toEqual(ok({ value: 10, unit: 'vol' }));
    expect(parseVolume('7,5 V')).toEqual(ok({ value: 7.5, unit: 'vol' }));
    // A bare number is a charge in vol, the usual way of writing it.
    expect(parseVolume('12')).toEqual(ok({ value: 12, unit: 'vol' }));
  });

  it('reads temperatures in °C, from °C, kelvin or a bare number', () => {
    expect(parseTemperatureC('45 °C')).toEqual(ok(45));
    expect(parseTemperatureC('45°C')).toEqual(ok(45));
    expect(parseTemperatureC('-10 °C')).toEqual(ok(-10));
    expect(parseTemperatureC('318.15 K')).toEqual(ok(45));
    expect(parseTemperatureC('45')).toEqual(ok(45));
  });

  it('reads pressures in mbar', () => {
    expect(parsePressureMbar('150 mbar')).toEqual(ok(150));
    expect(parsePressureMbar('0.2 bar')).toEqual(ok(200));
    expect(parsePressureMbar('15 kPa')).toEqual(ok(150));
    expect(parsePressureMbar('150')).toEqual(ok(150));
  });

  it('reads equivalents, masses, percentages, fractions and counts', () => {
    expect(parseEquiv('1.2 equiv')).toEqual(ok(1.2));
    expect(parseEquiv('1.2 eq')).toEqual(ok(1.2));
    expect(parseEquiv('1.2')).toEqual(ok(1.2));
    expect(parseMassKg('250 g')).toEqual(ok(0.25));
    expect(parseMassKg('2.5 kg')).toEqual(ok(2.5));
    expect(parseMassKg('2.5')).toEqual(ok(2.5));
    expect(parsePercent('12 %')).toEqual(ok(12));
    expect(parseFraction('80 %')).toEqual(ok(0.8));
    expect(parseFraction('0.8')).toEqual(ok(0.8));
    expect(parseCount('3')).toEqual(ok(3));
  });

  it('reads a ± range, converting the half-width with the value’s unit', () => {
    expect(parseUncertainVolume('10 ± 1 vol')).toEqual(
      ok({ value: { value: 10, plusMinus: 1 }, unit: 'vol' }),
    );
    expect(parseUncertainVolume('10 vol ± 1')).toEqual(
      ok({ value: { value: 10, plusMinus: 1 }, unit: 'vol' }),
    );
    expect(parseUncertainVolume('10 +/- 1 vol')).toEqual(
      ok({ value: { value: 10, plusMinus: 1 }, unit: 'vol' }),
    );
    expect(parseUncertainVolume('250 ± 10 mL')).toEqual(
      ok({ value: { value: 0.25, plusMinus: 0.01 }, unit: 'L' }),
    );
    expect(parseUncertainVolume('10 vol')).toEqual(ok({ value: 10, unit: 'vol' }));
    expect(parseUncertain('45 ± 2 °C', parseTemperatureC)).toEqual(ok({ value: 45, plusMinus: 2 }));
    expect(parseUncertain('318.15 ± 2 K', parseTemperatureC)).toEqual(
      ok({ value: 45, plusMinus: 2 }),
    );
    expect(parseUncertain('0.2 ± 0.02 bar', parsePressureMbar)).toEqual(
      ok({ value: 200, plusMinus: 20 }),
    );
    expect(parseUncertain('1.2 equiv', parseEquiv)).toEqual(ok(1.2));
  });

  it('shows stored values back the way they are typed', () => {
    expect(formatQuantity('volume', { value: 10, unit: 'vol' })).toBe('10 vol');
    expect(formatQuantity('volume', { value: { value: 10, plusMinus: 1 }, unit: 'vol' })).toBe(
      '10 ± 1 vol',
    );
    expect(formatQuantity('temperature', 45)).toBe('45 °C');
    expect(formatQuantity('pressure', 150)).toBe('150 mbar');
    expect(formatQuantity('equiv', 1.2)).toBe('1.2 equiv');
  });
});

describe('bad input', () => {
  const error = (r: { ok: boolean; error?: string }) => (r.ok ? null : r.error);

  it('says the quantity is of the wrong kind and how to write it', () => {
    expect(error(parseVolume('2 kg'))).toBe(
      '“2 kg” is not a volume. Write it as “250 mL”, “2 L” or “10 vol”.',
    );
    expect(error(parseTemperatureC('150 mbar'))).toMatch(
      /^“150 mbar” is not a temperature\. Write it as “45 °C”/,
    );
    expect(error(parsePressureMbar('45 °C'))).toMatch(/^“45 °C” is not a pressure\./);
    expect(error(parseMassKg('250 mL'))).toMatch(
      /^“250 mL” is not a mass\. Write it as “2.5 kg” or “250 g”\./,
    );
  });

  it('says what could not be read, and asks for a value when the field is empty', () => {
    expect(error(parseVolume('lots'))).toMatch(/^“lots” could not be read\. Write it as “250 mL”/);
    expect(error(parseEquiv('1.2 mol'))).toBe(
      '“1.2 mol” could not be read. Write it as “1.2 equiv”.',
    );
    expect(error(parsePercent('twelve'))).toMatch(/could not be read/);
    expect(error(parseCount('2.5'))).toBe('Enter a whole number such as “3”.');
    expect(error(parseVolume(''))).toMatch(/^Enter a value, for example/);
  });

  it('refuses negative volumes and malformed ranges', () => {
    expect(error(parseVolume('-5 vol'))).toBe('Enter a value of zero or more.');
    expect(error(parseUncertainVolume('10 ± vol'))).toBe('Write the range as “10 ± 1 vol”.');
    expect(error(parseUncertainVolume('10 ± 1 ± 2 vol'))).toBe('Write the range as “10 ± 1 vol”.');
    expect(error(parseUncertainVolume('10 vol ± 1 L'))).toBe(
      'Write the unit once, for example “10 ± 1 vol”.',
    );
  });
});
