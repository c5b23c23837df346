/**
 * ANDI/AIA chromatography files (ASTM E1947, "Analytical Data Interchange
 * Protocol for Chromatographic Data"): netCDF classic files holding the
 * detector signal in `ordinate_values`, sampled every
 * `actual_sampling_interval` after `actual_delay_time` (or at the times in
 * `raw_data_retention`), with times in `retention_unit` (seconds by default).
 * Read with netcdfjs; pure: bytes in, arrays out.
 *
 * The variable and attribute names are those of the AIA chromatography
 * template as written by instrument exports and read by open-source readers
 * (checked against several; the standard's own text was not at hand).
 */
import { NetCDFReader } from 'netcdfjs';
import { TraceError } from './processing';

export interface ParsedAndiTrace {
  timeMin: Float64Array;
  signal: Float64Array;
  signalName: string;
  detectorUnit: string | null;
  /** `sample_name` of the file, if any. */
  sampleName: string | null;
  /** `injection_date_time_stamp` as an ISO date-time, if readable. */
  injectedAt: string | null;
  warnings: string[];
}

/** netCDF classic ("CDF\x01") or 64-bit offset ("CDF\x02") magic number. */
export function isNetcdfClassic(bytes: Uint8Array): boolean {
  return (
    bytes.length >= 4 &&
    bytes[0] === 0x43 &&
    bytes[1] === 0x44 &&
    bytes[2] === 0x46 &&
    (bytes[3] === 1 || bytes[3] === 2)
  );
}

/**
 * Reads an ANDI/AIA chromatogram.
 * @param bytes the whole file
 * @throws TraceError with a plain message when it is not a readable ANDI chromatogram
 */
export function parseAndi(bytes: Uint8Array): ParsedAndiTrace {
  let reader: NetCDFReader;
  try {
    reader = new NetCDFReader(bytes);
  } catch {
    throw new TraceError('The netCDF file could not be read; it may be cut short or damaged.');
  }
  const warnings: string[] = [];
  if (!reader.dataVariableExists('ordinate_values'))
    throw new TraceError(
      'This netCDF file holds no chromatogram: the ANDI/AIA variable “ordinate_values” is missing.',
    );
  let signal: Float64Array;
  let retention: Float64Array | null = null;
  let interval = NaN;
  let delay = 0;
  try {
    signal = Float64Array.from(reader.getDataVariable('ordinate_values') as number[]);
    if (reader.dataVariableExists('raw_data_retention')) {
      const r = reader.getDataVariable('raw_data_retention') as number[];
      if (r.length === signal.length) retention = Float64Array.from(r);
    }
    if (reader.dataVariableExists('actual_sampling_interval'))
      interval = Number(scalar(reader.getDataVariable('actual_sampling_interval')));
    if (reader.dataVariableExists('actual_delay_time'))
      delay = Number(scalar(reader.getDataVariable('actual_delay_time'))) || 0;
  } catch {
    throw new TraceError('The netCDF file could not be read; it may be cut short or damaged.');
  }
  if (signal.length === 0)
    throw new TraceError('The chromatogram in this file has no data points.');

  const unitText = String(reader.getAttribute('retention_unit') ?? '').toLowerCase();
  const toMinutes = /min/.test(unitText) ? 1 : /milli|\bms\b/.test(unitText) ? 1 / 60_000 : 1 / 60;
  if (!unitText)
    warnings.push('The file names no retention unit: times read as seconds (the ANDI default).');

  const timeMin = new Float64Array(signal.length);
  if (retention) {
    for (let i = 0; i < signal.length; i++) timeMin[i] = retention[i] * toMinutes;
  } else {
    if (!(interval > 0))
      throw new TraceError(
        'The file gives neither retention times nor a sampling interval, so the time axis is unknown.',
      );
    for (let i = 0; i < signal.length; i++) timeMin[i] = (delay + i * interval) * toMinutes;
  }

  const text = (name: string) => {
    const v = reader.getAttribute(name);
    return v === null || v === undefined ? null : String(v).replace(/\0+$/, '').trim() || null;
  };
  return {
    timeMin,
    signal,
    signalName: text('detector_name') ?? 'Detector signal',
    detectorUnit: text('detector_unit'),
    sampleName: text('sample_name'),
    injectedAt: andiTimestamp(text('injection_date_time_stamp')),
    warnings,
  };
}

function scalar(v: unknown): unknown {
  return Array.isArray(v) ? v[0] : v;
}

/** "YYYYMMDDhhmmss±hhmm" → ISO 8601, or null. */
export function andiTimestamp(stamp: string | null): string | null {
  const m = stamp?.match(/^(\d{4})(\d{2})(\d{2})(\d{2})(\d{2})(\d{2})([+-]\d{2})?(\d{2})?/);
  if (!m) return null;
  const zone = m[7] ? `${m[7]}:${m[8] ?? '00'}` : 'Z';
  const date = new Date(`${m[1]}-${m[2]}-${m[3]}T${m[4]}:${m[5]}:${m[6]}${zone}`);
  return Number.isNaN(date.getTime()) ? null : date.toISOString();
}
