/**
 * A minimal writer of netCDF classic files (format version 1, "CDF\x01"),
 * enough to make ANDI/AIA chromatography files in tests. Layout per the
 * netCDF classic format specification (Unidata, "NetCDF Classic and 64-bit
 * Offset File Formats"): magic, numrecs, dim_list, gatt_list, var_list, then
 * the data of each (non-record) variable at its `begin` offset; every name,
 * attribute value and variable block padded to 4 bytes; big-endian.
 */

const NC_DIMENSION = 0x0a;
const NC_VARIABLE = 0x0b;
const NC_ATTRIBUTE = 0x0c;
const TYPES = { char: 2, int: 4, float: 5, double: 6 } as const;
const SIZES = { char: 1, int: 4, float: 4, double: 8 } as const;
type NcType = keyof typeof TYPES;

export interface NcVariable {
  name: string;
  /** Names of the dimensions; [] for a scalar. */
  dims: string[];
  type: Exclude<NcType, 'char'>;
  values: number[];
  attributes?: Record<string, string | number>;
}

export interface NcFile {
  dimensions: Record<string, number>;
  attributes: Record<string, string | number>;
  variables: NcVariable[];
}

class Writer {
  bytes: number[] = [];
  u32(v: number) {
    this.bytes.push((v >>> 24) & 255, (v >>> 16) & 255, (v >>> 8) & 255, v & 255);
  }
  pad() {
    while (this.bytes.length % 4) this.bytes.push(0);
  }
  name(s: string) {
    const b = Buffer.from(s, 'latin1');
    this.u32(b.length);
    this.bytes.push(...b);
    this.pad();
  }
  value(type: NcType, v: number) {
    const b = Buffer.alloc(SIZES[type]);
    if (type === 'int') b.writeInt32BE(v);
    else if (type === 'float') b.writeFloatBE(v);
    else if (type === 'double') b.writeDoubleBE(v);
    else b.writeUInt8(v);
    this.bytes.push(...b);
  }
  attributes(attrs: Record<string, string | number>) {
    const entries = Object.entries(attrs);
    if (!entries.length) {
      this.u32(0);
      this.u32(0);
      return;
    }
    this.u32(NC_ATTRIBUTE);
    this.u32(entries.length);
    for (const [key, v] of entries) {
      this.name(key);
      if (typeof v === 'string') {
        const b = Buffer.from(v, 'latin1');
        this.u32(TYPES.char);
        this.u32(b.length);
        this.bytes.push(...b);
      } else {
        this.u32(TYPES.double);
        this.u32(1);
        this.value('double', v);
      }
      this.pad();
    }
  }
}

/** The bytes of a netCDF classic file. */
export function writeNetcdfClassic(file: NcFile): Uint8Array {
  const dimNames = Object.keys(file.dimensions);
  const header = (begins: number[]) => {
    const w = new Writer();
    w.bytes.push(0x43, 0x44, 0x46, 0x01);
    w.u32(0); // numrecs: no record variables
    if (dimNames.length) {
      w.u32(NC_DIMENSION);
      w.u32(dimNames.length);
      for (const d of dimNames) {
        w.name(d);
        w.u32(file.dimensions[d]);
      }
    } else {
      w.u32(0);
      w.u32(0);
    }
    w.attributes(file.attributes);
    w.u32(NC_VARIABLE);
    w.u32(file.variables.length);
    file.variables.forEach((v, k) => {
      w.name(v.name);
      w.u32(v.dims.length);
      for (const d of v.dims) w.u32(dimNames.indexOf(d));
      w.attributes(v.attributes ?? {});
      w.u32(TYPES[v.type]);
      w.u32(vsize(v));
      w.u32(begins[k]);
    });
    return w.bytes;
  };
  const vsize = (v: NcVariable) => Math.ceil((v.values.length * SIZES[v.type]) / 4) * 4;
  const headerLength = header(file.variables.map(() => 0)).length;
  const begins: number[] = [];
  let offset = headerLength;
  for (const v of file.variables) {
    begins.push(offset);
    offset += vsize(v);
  }
  const w = new Writer();
  w.bytes = header(begins);
  for (const v of file.variables) {
    for (const x of v.values) w.value(v.type, x);
    w.pad();
  }
  return Uint8Array.from(w.bytes);
}

/** An ANDI/AIA chromatogram: signal sampled every `intervalS` seconds after `delayS`. */
export function writeAndiChromatogram(options: {
  signal: number[];
  intervalS: number;
  delayS?: number;
  retentionUnit?: string;
  sampleName?: string;
  detectorUnit?: string;
  injectionStamp?: string;
  withRetentionArray?: boolean;
}): Uint8Array {
  const n = options.signal.length;
  const attributes: Record<string, string | number> = {
    dataset_completeness: 'C1+C2',
    aia_template_revision: '1.0',
    netcdf_revision: '2.3.2',
    languages: 'English',
    dataset_origin: 'Phasewright test writer (invented data)',
    detector_name: 'UV 254 nm',
    detector_unit: options.detectorUnit ?? 'mAU',
    sample_name: options.sampleName ?? 'Test sample (invented)',
  };
  if (options.retentionUnit !== undefined) attributes.retention_unit = options.retentionUnit;
  if (options.injectionStamp) attributes.injection_date_time_stamp = options.injectionStamp;
  const variables: NcVariable[] = [
    { name: 'actual_sampling_interval', dims: [], type: 'float', values: [options.intervalS] },
    { name: 'actual_delay_time', dims: [], type: 'float', values: [options.delayS ?? 0] },
    {
      name: 'actual_run_time_length',
      dims: [],
      type: 'float',
      values: [(n - 1) * options.intervalS],
    },
    { name: 'ordinate_values', dims: ['point_number'], type: 'float', values: options.signal },
  ];
  if (options.withRetentionArray)
    variables.push({
      name: 'raw_data_retention',
      dims: ['point_number'],
      type: 'double',
      values: options.signal.map((_, i) => (options.delayS ?? 0) + i * options.intervalS),
    });
  return writeNetcdfClassic({ dimensions: { point_number: n }, attributes, variables });
}
