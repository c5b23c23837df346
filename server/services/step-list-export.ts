/**
 * The human formats of a step list: CSV, XLSX and PDF, each opening with the
 * same header (route, revision, approval signature or a DRAFT mark, batch
 * size, date). Numbers are rounded here, for reading; the JSON keeps them
 * unrounded.
 */
import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import { stringify } from 'csv-stringify/sync';
import {
  STEP_LIST_BASIS_LABELS,
  type StepListDocument,
  type StepListOperation,
} from '@shared/schemas/step-list';
import { neutraliseFormula } from '@shared/csv';

export const DRAFT_MARK = 'DRAFT — not approved: not for use in the plant';

const round = (x: number, digits: number) => {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
};
const when = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;

/** The header lines every format opens with, as label and value. */
export function headerLines(list: StepListDocument): Array<[string, string]> {
  return [
    ['Route', list.route.name],
    ['Revision', String(list.revision)],
    [
      'Approval',
      list.approval
        ? `Approved: signed by ${list.approval.signer.name} (${list.approval.signer.email}) on ${when(list.approval.signedAt)}. ${list.approval.meaning} Content hash ${list.approval.contentHash}.`
        : DRAFT_MARK,
    ],
    [
      'Batch size',
      `${round(list.batchKg, 3)} ${STEP_LIST_BASIS_LABELS[list.basis]} (${round(list.scaleFactor, 4)} × the route as drawn)`,
    ],
    ['Date', when(list.exportedAt)],
    ...(list.engineVersion ? [calculationsLine(list)] : []),
  ];
}

/**
 * Which version of the calculations made the numbers: the step list is computed now, by today's
 * engine, while the revision (and its signature) carries the figures of the engine it was saved
 * with; after an upgrade the two may differ, and the plant must be able to see it.
 */
function calculationsLine(list: StepListDocument): [string, string] {
  const now = list.engineVersion ?? '';
  const then = list.revisionEngineVersion ?? now;
  return [
    'Calculations',
    now === then
      ? `Version ${now}, the same as the revision's.`
      : `Version ${now}; the revision was saved and signed with version ${then}, so these numbers may differ from its stored figures.`,
  ];
}

export function fileName(list: StepListDocument, extension: string): string {
  const slug = list.route.name
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .replace(/\s+/g, '-')
    .slice(0, 60);
  return `${slug || 'route'}-rev${list.revision}-${round(list.batchKg, 3)}kg${list.draft ? '-DRAFT' : ''}.${extension}`;
}

const chargeText = (op: StepListOperation) =>
  op.charges
    .map((c) => `${c.name}: ${round(c.kg, 3)} kg${c.L === null ? '' : ` / ${round(c.L, 3)} L`}`)
    .join('; ');
const sum = (values: number[]) => values.reduce((a, b) => a + b, 0);
const chargeKg = (op: StepListOperation) =>
  op.charges.length ? round(sum(op.charges.map((c) => c.kg)), 3) : null;
const chargeL = (op: StepListOperation) => {
  const litres = op.charges.filter((c) => c.L !== null).map((c) => c.L!);
  return litres.length ? round(sum(litres), 3) : null;
};
const stepNames = (list: StepListDocument) =>
  new Map(list.route.document.steps.map((s) => [s.id, s.name || s.id]));
const equipmentOf = (list: StepListDocument) =>
  new Map(list.equipment.map((e) => [e.stepId, e.name]));

export const TABLE_HEADER = [
  'No.',
  'Step',
  'Equipment',
  'Operation',
  'Charges',
  'Charge kg',
  'Charge L',
  'Temperature °C',
  'Pressure mbar',
  'Duration h',
  'Volume after L',
  'Vessel check',
  'Cautions',
];

function tableRows(list: StepListDocument): Array<Array<string | number | null>> {
  const steps = stepNames(list);
  const equipment = equipmentOf(list);
  return list.operations.map((op) => [
    op.number,
    steps.get(op.stepId) ?? op.stepId,
    equipment.get(op.stepId) ?? '',
    op.text,
    chargeText(op),
    chargeKg(op),
    chargeL(op),
    op.temperatureC === undefined ? null : round(op.temperatureC, 1),
    op.pressureMbar === undefined ? null : round(op.pressureMbar, 0),
    op.durationH === undefined ? null : round(op.durationH, 2),
    round(op.volumeAfterL, 1),
    op.vesselCheck ? `${op.vesselCheck.ok ? 'OK' : 'CHECK'}: ${op.vesselCheck.message}` : '',
    op.cautions.join(' | '),
  ]);
}

/**
 * CSV (csv-stringify): the header block, a blank line, then one row per
 * operation. Text cells are neutralised against formula injection; numbers
 * stay numbers (a temperature of −10 is written -10, not as text).
 */
export function renderCsv(list: StepListDocument): string {
  const cell = (value: string | number | null) =>
    typeof value === 'number' ? value : neutraliseFormula(value);
  const records: Array<Array<string | number>> = [
    ['Plant step list'],
    ...headerLines(list).map(([label, value]) => [label, value].map(cell)),
    ['Process safety', cell(list.processSafetyNote)],
    [],
    TABLE_HEADER,
    ...tableRows(list).map((row) => row.map(cell)),
  ];
  return stringify(records, { record_delimiter: 'windows', quoted_match: /[\r\n]/ });
}

/** XLSX (exceljs): one sheet, the header block above the table; numbers as numbers with display formats. */
export async function renderXlsx(list: StepListDocument): Promise<Buffer> {
  // Loaded at the first export, not at boot: an idle server need not hold a spreadsheet writer.
  const { default: ExcelJS } = await import('exceljs');
  const book = new ExcelJS.Workbook();
  book.creator = 'Phasewright';
  book.created = new Date(list.exportedAt);
  const sheet = book.addWorksheet('Step list', {
    pageSetup: { orientation: 'landscape', fitToPage: true, fitToWidth: 1, fitToHeight: 0 },
  });
  sheet.addRow(['Plant step list']).font = { bold: true, size: 14 };
  for (const [label, value] of headerLines(list)) {
    const row = sheet.addRow([label, value]);
    row.getCell(1).font = { bold: true };
    if (label === 'Approval' && list.draft)
      row.getCell(2).font = { bold: true, color: { argb: 'FFB42318' }, size: 13 };
  }
  sheet.addRow(['Process safety', list.processSafetyNote]);
  sheet.addRow([]);
  const header = sheet.addRow(TABLE_HEADER);
  header.font = { bold: true };
  header.eachCell((c) => {
    c.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE9EDF2' } };
  });
  for (const values of tableRows(list)) {
    const row = sheet.addRow(values);
    row.alignment = { vertical: 'top', wrapText: true };
    if (values[11] && String(values[11]).startsWith('CHECK'))
      row.getCell(12).font = { color: { argb: 'FFB42318' }, bold: true };
  }
  const widths = [6, 22, 18, 60, 36, 11, 11, 13, 13, 11, 14, 48, 60];
  widths.forEach((width, i) => (sheet.getColumn(i + 1).width = width));
  const formats: Record<number, string> = {
    6: '0.00',
    7: '0.0',
    8: '0.0',
    9: '0',
    10: '0.00',
    11: '0.0',
  };
  for (const [column, format] of Object.entries(formats))
    sheet.getColumn(Number(column)).numFmt = format;
  return Buffer.from(await book.xlsx.writeBuffer());
}

// ------------------------------------------------------------------ PDF

const require = createRequire(import.meta.url);
const font = (weight: number) =>
  readFileSync(require.resolve(`@fontsource/lexend/files/lexend-latin-${weight}-normal.woff`));
let fonts: { regular: Buffer; bold: Buffer } | null = null;
const lexend = () => (fonts ??= { regular: font(400), bold: font(600) });

/**
 * The Lexend files the app ships carry the Latin subset: characters outside
 * it are written in words the font has (CO₂ → CO2, ≈ → ~), so the PDF never
 * shows an empty box.
 */
export function pdfText(text: string): string {
  return text
    .replace(/[₀-₉]/g, (c) => String(c.charCodeAt(0) - 0x2080))
    .replace(/≈/g, '~')
    .replace(/≤/g, '<=')
    .replace(/≥/g, '>=')
    .replace(/→/g, '->')
    .replace(/−/g, '-')
    .replace(/[^\t\n\r\u0020-\u00ff\u0131\u0152\u0153\u2000-\u206f\u20ac\u2122]/g, '?');
}

const INK = '#1d2733';
const MUTED = '#5b6673';
const HAZARD = '#b42318';

/** PDF (pdfkit) with Lexend embedded: header, the numbered operations, the safety note; DRAFT on every page of a draft. */
export async function renderPdf(list: StepListDocument): Promise<Buffer> {
  // Loaded at the first export, like exceljs above.
  const { default: PDFDocument } = await import('pdfkit');
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: 50, bottom: 56, left: 50, right: 50 },
    bufferPages: true,
    info: {
      Title: `Step list: ${list.route.name}, revision ${list.revision}`,
      Author: 'Phasewright',
      Subject: list.draft ? DRAFT_MARK : 'Approved plant step list',
    },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const { regular, bold } = lexend();
  doc.registerFont('Lexend', regular);
  doc.registerFont('Lexend-SemiBold', bold);
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;

  doc.font('Lexend-SemiBold').fontSize(18).fillColor(INK).text('Plant step list');
  if (list.draft) {
    doc.moveDown(0.2);
    doc.font('Lexend-SemiBold').fontSize(14).fillColor(HAZARD).text(DRAFT_MARK);
  }
  doc.moveDown(0.4);
  for (const [label, value] of headerLines(list)) {
    if (label === 'Approval' && list.draft) continue;
    doc
      .font('Lexend-SemiBold')
      .fontSize(9)
      .fillColor(MUTED)
      .text(`${label}: `, { continued: true });
    doc.font('Lexend').fillColor(INK).text(pdfText(value));
  }
  doc.moveDown(0.3);
  doc.font('Lexend').fontSize(8).fillColor(MUTED).text(pdfText(list.processSafetyNote));
  doc.moveDown(0.6);

  const steps = stepNames(list);
  const equipment = equipmentOf(list);
  let currentStep = '';
  for (const op of list.operations) {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 80) doc.addPage();
    if (op.stepId !== currentStep) {
      currentStep = op.stepId;
      doc.moveDown(0.4);
      const eq = equipment.get(op.stepId);
      doc
        .font('Lexend-SemiBold')
        .fontSize(10)
        .fillColor(INK)
        .text(pdfText(`${steps.get(op.stepId) ?? op.stepId}${eq ? ` — in ${eq}` : ''}`));
      doc.moveDown(0.15);
    }
    doc
      .font('Lexend-SemiBold')
      .fontSize(9)
      .fillColor(INK)
      .text(`${op.number}. `, { continued: true });
    doc.font('Lexend').text(pdfText(op.text), { width });
    const facts = [
      op.temperatureC !== undefined ? `${round(op.temperatureC, 0)} °C` : null,
      op.pressureMbar !== undefined ? `${round(op.pressureMbar, 0)} mbar` : null,
      op.durationH !== undefined ? `${round(op.durationH, 2)} h` : null,
      `volume after ${round(op.volumeAfterL, 1)} L`,
    ].filter(Boolean);
    doc
      .fontSize(8)
      .fillColor(MUTED)
      .text(pdfText(facts.join(' · ')), { indent: 14 });
    if (op.vesselCheck)
      doc
        .fillColor(op.vesselCheck.ok ? MUTED : HAZARD)
        .font(op.vesselCheck.ok ? 'Lexend' : 'Lexend-SemiBold')
        .text(
          pdfText(`${op.vesselCheck.ok ? 'Vessel OK' : 'Vessel CHECK'}: ${op.vesselCheck.message}`),
          {
            indent: 14,
          },
        );
    for (const caution of op.cautions)
      doc
        .font('Lexend')
        .fillColor(HAZARD)
        .text(pdfText(`Caution: ${caution}`), { indent: 14 });
    doc.moveDown(0.25);
  }

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.height - 36;
    // Writing in the bottom margin must not start a new page.
    const margin = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc
      .font('Lexend')
      .fontSize(7)
      .fillColor(list.draft ? HAZARD : MUTED)
      .text(
        pdfText(
          `${list.route.name} · revision ${list.revision} · ${list.draft ? 'DRAFT' : 'approved'} · page ${i + 1} of ${range.count}`,
        ),
        doc.page.margins.left,
        bottom,
        { width, align: 'center', lineBreak: false },
      );
    doc.page.margins.bottom = margin;
  }
  doc.end();
  return done;
}
