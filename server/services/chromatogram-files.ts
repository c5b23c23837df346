/**
 * What an uploaded file is, from its content (never its name): an ANDI/AIA
 * netCDF chromatogram, a delimited-text trace, or a PDF or image kept as it
 * is. Anything else is refused (415); a file of a known kind that cannot be
 * read, or holds no data rows, is refused with the reason (422).
 */
import { apiError } from '../errors';

export type ReadUpload =
  | {
      kind: 'trace';
      format: 'andi' | 'csv';
      contentType: string;
      timeMin: Float64Array;
      signal: Float64Array;
      signalName: string;
      signals: string[];
      /** From the file itself (ANDI injection time stamp), when it says. */
      takenAt: string | null;
      warnings: string[];
    }
  | { kind: 'document'; format: string; contentType: string };

/** Documents kept as they are, by the type their content shows. */
const DOCUMENT_TYPES: Record<string, { contentType: string; complete: (b: Buffer) => boolean }> = {
  pdf: {
    contentType: 'application/pdf',
    // A PDF ends with its %%EOF marker (possibly followed by a line end); a cut-off copy does not.
    complete: (b) => b.subarray(Math.max(0, b.length - 1024)).includes('%%EOF'),
  },
  png: {
    contentType: 'image/png',
    complete: (b) => b.subarray(Math.max(0, b.length - 12)).includes('IEND'),
  },
  jpg: {
    contentType: 'image/jpeg',
    complete: (b) => {
      const end = b.subarray(Math.max(0, b.length - 64));
      return end.includes(Buffer.from([0xff, 0xd9]));
    },
  },
  gif: { contentType: 'image/gif', complete: (b) => b[b.length - 1] === 0x3b },
  webp: { contentType: 'image/webp', complete: (b) => b.length >= 8 + b.readUInt32LE(4) },
  tif: { contentType: 'image/tiff', complete: () => true },
};

const unsupported = (what: string) =>
  apiError(
    'unsupported_file',
    `${what} Upload a chromatogram as CSV or TSV text (time and signal columns) or as an ANDI/AIA netCDF file (.cdf), or a PDF or image of one.`,
  );
const unreadable = (message: string) => apiError('unreadable_file', message);

/**
 * Reads an uploaded file.
 * @param content the whole file
 * @param wantedSignal the signal column to read from a multi-signal text file
 * @throws AppError 415 unsupported_file or 422 unreadable_file with a plain message
 */
export async function readUpload(
  content: Buffer,
  wantedSignal: string | null,
): Promise<ReadUpload> {
  if (content.length === 0) throw unreadable('The file is empty.');
  // The readers come with the trace processing, loaded at the first upload (chromatograms.ts).
  const { isNetcdfClassic, parseAndi, parseDelimitedText, TraceError } =
    await import('@shared/chromatography');
  const bytes = new Uint8Array(content.buffer, content.byteOffset, content.byteLength);

  if (isNetcdfClassic(bytes)) {
    try {
      const andi = parseAndi(bytes);
      return {
        kind: 'trace',
        format: 'andi',
        contentType: 'application/x-netcdf',
        timeMin: andi.timeMin,
        signal: andi.signal,
        signalName: andi.signalName,
        signals: [andi.signalName],
        takenAt: andi.injectedAt ?? null,
        warnings: andi.warnings,
      };
    } catch (error) {
      if (error instanceof TraceError) throw unreadable(error.message);
      throw error;
    }
  }
  // netCDF-4 files are HDF5 inside.
  if (content.subarray(0, 8).equals(Buffer.from([0x89, 0x48, 0x44, 0x46, 0x0d, 0x0a, 0x1a, 0x0a])))
    throw unsupported(
      'This is a netCDF-4 (HDF5) file; ANDI/AIA chromatograms are netCDF classic files.',
    );

  const { fileTypeFromBuffer } = await import('file-type');
  const detected = await fileTypeFromBuffer(bytes);
  if (detected) {
    const document = DOCUMENT_TYPES[detected.ext];
    if (!document) throw unsupported(`This file is ${describe(detected.ext)}, not a chromatogram.`);
    if (!document.complete(content))
      throw unreadable(
        `The ${detected.ext.toUpperCase()} file is incomplete (it ends too soon); upload it again from the original.`,
      );
    return { kind: 'document', format: detected.ext, contentType: document.contentType };
  }

  const text = decodeText(content);
  if (text === null)
    throw unsupported('This file is neither text nor a file type the server reads.');
  try {
    const parsed = parseDelimitedText(text, wantedSignal ?? undefined);
    return {
      kind: 'trace',
      format: 'csv',
      contentType: 'text/csv',
      timeMin: parsed.timeMin,
      signal: parsed.signal,
      signalName: parsed.signalName,
      signals: parsed.signals,
      takenAt: null,
      warnings: parsed.warnings,
    };
  } catch (error) {
    if (error instanceof TraceError) throw unreadable(error.message);
    throw error;
  }
}

const describe = (ext: string) =>
  /^[aeiou]/i.test(ext) ? `an ${ext.toUpperCase()} file` : `a ${ext.toUpperCase()} file`;

/**
 * The file as text, or null when it is binary: UTF-8 (with or without a
 * byte-order mark), UTF-16 with a byte-order mark, else Windows-1252 when
 * control characters are rare (instrument exports with "µV" or "°C").
 */
export function decodeText(content: Buffer): string | null {
  if (content[0] === 0xff && content[1] === 0xfe)
    return new TextDecoder('utf-16le').decode(content);
  if (content[0] === 0xfe && content[1] === 0xff)
    return new TextDecoder('utf-16be').decode(content);
  const sample = content.subarray(0, 64 * 1024);
  let control = 0;
  for (const byte of sample) {
    if (byte === 0) return null;
    if (
      (byte < 0x20 && byte !== 0x09 && byte !== 0x0a && byte !== 0x0d && byte !== 0x0c) ||
      byte === 0x7f
    )
      control++;
  }
  if (control > sample.length * 0.01) return null;
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(content);
  } catch {
    return new TextDecoder('windows-1252').decode(content);
  }
}
