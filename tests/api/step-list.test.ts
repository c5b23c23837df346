import request from 'supertest';
import { Sequelize } from 'sequelize';
import ExcelJS from 'exceljs';
import { parse as parseCsv } from 'csv-parse/sync';
import { beforeAll, describe, expect, it } from 'vitest';
import { routeDetailSchema } from '@shared/schemas/routes';
import { stepListDocumentSchema, type StepListDocument } from '@shared/schemas/step-list';
import { parseExact } from '@shared/schemas/exact';
import { ENGINE_VERSION, evaluateRoute, parseRoute } from '@shared/engine/route/evaluate';
import { applyEquipment, scaleDocument } from '@shared/steplist';
import { demoAmideIsolation } from '../../seeders/data/demo-route';
import { DEMO_EQUIPMENT } from '../../seeders/20261203130100-demo-equipment';
import type { Workspace } from '../../server/models';
import { clusterAdminUrl, useTestServer } from '../support/app';
import {
  buildMember,
  buildWorkspace,
  DEFAULT_PASSWORD,
  signIn,
  type SignedIn,
} from '../support/factories';

const server = useTestServer();
const ROLES = ['admin', 'chemist', 'reviewer', 'engineer'] as const;

const post = (who: SignedIn, url: string, body: unknown) =>
  who.agent
    .post(url)
    .set('X-CSRF-Token', who.csrfToken)
    .send(body as object);

/** Reads a binary reply into a Buffer. */
const binary = (call: request.Test) =>
  call.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });

async function pdfText(pdf: Buffer): Promise<string> {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  const document = await pdfjs.getDocument({ data: new Uint8Array(pdf), useSystemFonts: false })
    .promise;
  const pages: string[] = [];
  for (let i = 1; i <= document.numPages; i++) {
    const content = await (await document.getPage(i)).getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  return pages.join('\n');
}

describe('plant step list export and import', () => {
  let workspace: Workspace;
  const as = {} as Record<(typeof ROLES)[number] | 'outsider' | 'reviewer2', SignedIn>;
  let routeId = '';
  let base = '';
  const equipment: Record<string, string> = {};

  beforeAll(async () => {
    workspace = await buildWorkspace({ name: 'Plant group (invented)' });
    const other = await buildWorkspace();
    for (const role of ROLES)
      as[role] = await signIn(
        server.app,
        (await buildMember(workspace, [role], { name: `Demo ${role}` })).email,
      );
    as.outsider = await signIn(server.app, (await buildMember(other, ['engineer', 'admin'])).email);
    const created = await post(as.chemist, `/api/v1/workspaces/${workspace.id}/routes`, {
      name: 'Amide isolation (invented)',
      document: structuredClone(demoAmideIsolation),
    });
    routeId = created.body.id;
    base = `/api/v1/workspaces/${workspace.id}/routes/${routeId}/revisions`;
    // Revision 1, approved by the reviewer; revision 2, saved only.
    for (const message of ['For the plant', 'A later draft']) {
      const draftVersion = (
        await as.chemist.agent.get(`/api/v1/workspaces/${workspace.id}/routes/${routeId}`)
      ).body.draftVersion;
      expect(
        (await post(as.chemist, base, { message, baseDraftVersion: draftVersion })).status,
      ).toBe(201);
      if (message === 'For the plant') {
        const reviewerId = as.reviewer.session.user.id;
        expect(
          (
            await post(as.chemist, `${base}/1/review-requests`, {
              reviewerIds: [reviewerId],
              note: 'Please',
            })
          ).status,
        ).toBe(201);
        expect(
          (
            await post(as.reviewer, `${base}/1/decisions`, {
              decision: 'approve',
              password: DEFAULT_PASSWORD,
            })
          ).status,
        ).toBe(201);
      }
    }
    for (const item of DEMO_EQUIPMENT) {
      const reply = await post(as.engineer, `/api/v1/workspaces/${workspace.id}/equipment`, item);
      equipment[item.name] = reply.body.id;
    }
  }, 120_000);

  const plantEquipment = () => ({
    crude: equipment['R-102 (invented)'],
    'acid-wash': equipment['R-102 (invented)'],
    swap: equipment['R-101 (invented)'],
    filter: equipment['F-301 Nutsche filter (invented)'],
    dry: equipment['D-401 Conical vacuum dryer (invented)'],
  });
  const ask = (who: SignedIn, number: number, body: object) =>
    post(who, `${base}/${number}/step-list`, body);

  it('requires authentication', async () => {
    const reply = await request(server.app)
      .post(`${base}/1/step-list`)
      .send({ batchKg: 50, basis: 'input', format: 'json' });
    expect(reply.status).toBe(401);
  });

  let approved: StepListDocument;
  it('JSON: the approved revision at 50 kg with the signature, vessel checks and unrounded numbers', async () => {
    const reply = await ask(as.engineer, 1, {
      batchKg: 50,
      basis: 'input',
      equipment: plantEquipment(),
      format: 'json',
    });
    expect(reply.status, JSON.stringify(reply.body).slice(0, 500)).toBe(200);
    expect(reply.headers['content-type']).toMatch(/^application\/json/);
    const checked = parseExact(stepListDocumentSchema, reply.body);
    expect(checked.success).toBe(true);
    approved = stepListDocumentSchema.parse(reply.body);
    expect(approved).toMatchObject({
      route: { id: routeId, name: 'Amide isolation (invented)' },
      revision: 1,
      draft: false,
      batchKg: 50,
      basis: 'input',
      scaleFactor: 50,
    });
    expect(approved.approval).toMatchObject({
      signer: { name: 'Demo reviewer' },
      meaning: expect.stringMatching(/^Approved as technical reviewer/),
      contentHash: expect.stringMatching(/^[0-9a-f]{64}$/),
    });
    expect(approved.approval!.signedAt).toMatch(/^\d{4}-\d\d-\d\dT/);
    const [first] = approved.operations;
    expect(first).toMatchObject({ number: 1, stepId: 'crude', temperatureC: 20 });
    expect(first.charges[0].name).toBe('2-Methyltetrahydrofuran');
    // Unrounded: the engine's own density gives a kg that is not a round number.
    expect(Number.isInteger(first.charges[0].kg * 1000)).toBe(false);
    // Every operation of a step with equipment carries a check; the acid wash overfills R-102.
    for (const op of approved.operations)
      expect(op.vesselCheck !== undefined).toBe(op.stepId in plantEquipment());
    const acid = approved.operations.find((op) => op.stepId === 'acid-wash')!;
    expect(acid.vesselCheck).toEqual({
      ok: false,
      message: expect.stringMatching(
        /above its maximum working volume of 560 L\. Suggested: R-101/,
      ),
    });
    expect(approved.equipment).toHaveLength(5);
    expect(approved.engineVersion).toBe(ENGINE_VERSION);
    expect(approved.revisionEngineVersion).toBe(ENGINE_VERSION);
    expect(approved.processSafetyNote).toMatch(/process-safety review/);
  });

  it("says when the revision was signed with an earlier version of the calculations than the list's", async () => {
    const csvOf = async () => {
      const reply = await ask(as.engineer, 2, { batchKg: 50, basis: 'input', format: 'csv' });
      expect(reply.status).toBe(200);
      const rows = parseCsv(reply.text, { relax_column_count: true }) as string[][];
      return rows.find((row) => row[0] === 'Calculations')?.[1];
    };
    expect(await csvOf()).toBe(`Version ${ENGINE_VERSION}, the same as the revision's.`);
    // Revisions cannot be changed, so the earlier engine's revision is a copy of revision 2 made
    // by the database owner as revision 3, stored with version 1.1.0.
    const admin = new Sequelize(
      clusterAdminUrl(new URL(process.env.DATABASE_URL!).pathname.slice(1)),
      {
        dialect: 'postgres',
        logging: false,
      },
    );
    try {
      const [columns] = (await admin.query(
        `SELECT column_name FROM information_schema.columns
          WHERE table_name = 'route_revisions' AND column_name NOT IN ('id', 'number', 'engine_version')`,
      )) as [Array<{ column_name: string }>, unknown];
      const list = columns.map((c) => `"${c.column_name}"`).join(', ');
      await admin.query(
        `INSERT INTO route_revisions (id, number, engine_version, ${list})
           SELECT gen_random_uuid(), 3, '1.1.0', ${list} FROM route_revisions
            WHERE route_id = :routeId AND number = 2`,
        { replacements: { routeId } },
      );
    } finally {
      await admin.close();
    }
    const earlier = await ask(as.engineer, 3, { batchKg: 50, basis: 'input', format: 'csv' });
    expect(earlier.status).toBe(200);
    const rows = parseCsv(earlier.text, { relax_column_count: true }) as string[][];
    expect(rows.find((row) => row[0] === 'Calculations')?.[1]).toBe(
      `Version ${ENGINE_VERSION}; the revision was saved and signed with version 1.1.0, so these numbers may differ from its stored figures.`,
    );
    const json = await ask(as.engineer, 3, { batchKg: 50, basis: 'input', format: 'json' });
    expect(json.body.revisionEngineVersion).toBe('1.1.0');
    expect(json.body.engineVersion).toBe(ENGINE_VERSION);
  });

  it('a revision that is not approved exports with draft: true, approval null and the DRAFT mark', async () => {
    const json = await ask(as.admin, 2, { batchKg: 20, basis: 'input', format: 'json' });
    expect(json.status).toBe(200);
    expect(json.body).toMatchObject({ revision: 2, draft: true, approval: null });
    const csv = await ask(as.admin, 2, { batchKg: 20, basis: 'input', format: 'csv' });
    expect(csv.text).toMatch(/DRAFT — not approved/);
    const pdf = await binary(ask(as.engineer, 2, { batchKg: 20, basis: 'input', format: 'pdf' }));
    expect(pdf.status).toBe(200);
    const text = await pdfText(pdf.body as Buffer);
    expect(text).toMatch(/DRAFT/);
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(
      (await binary(ask(as.engineer, 2, { batchKg: 20, basis: 'input', format: 'xlsx' })))
        .body as never,
    );
    expect(String(book.getWorksheet('Step list')!.getCell('B4').value)).toMatch(/^DRAFT/);
  });

  it('CSV: header block and one row per operation; numbers stay numbers, text that looks like a formula is neutralised', async () => {
    const reply = await ask(as.engineer, 1, {
      batchKg: 50,
      basis: 'input',
      equipment: plantEquipment(),
      format: 'csv',
    });
    expect(reply.status).toBe(200);
    expect(reply.headers['content-type']).toMatch(/^text\/csv/);
    expect(reply.headers['content-disposition']).toMatch(
      /^attachment; filename="?[\w-]+-rev1-50kg\.csv"?$/,
    );
    const rows = parseCsv(reply.text, { relax_column_count: true }) as string[][];
    expect(rows[0]).toEqual(['Plant step list']);
    expect(rows[1]).toEqual(['Route', 'Amide isolation (invented)']);
    expect(rows[2]).toEqual(['Revision', '1']);
    expect(rows[3][1]).toMatch(/^Approved: signed by Demo reviewer/);
    expect(rows[4][1]).toMatch(/^50 kg of the route's reference input/);
    const headerAt = rows.findIndex((row) => row[0] === 'No.');
    const body = rows.slice(headerAt + 1);
    expect(body).toHaveLength(approved.operations.length);
    expect(body[0][3]).toBe(approved.operations[0].text);
    // Numbers are written as numbers: unquoted in the file and readable as numbers.
    const line = reply.text.split('\r\n')[headerAt + 1];
    expect(line).toMatch(/^1,/);
    expect(Number(body[0][5])).toBeCloseTo(approved.operations[0].charges[0].kg, 2);
    expect(Number(body[0][7])).toBe(20);
    // The dash-led text of a charge name would be neutralised: every text cell that starts with = + - @ gets an apostrophe.
    for (const row of body)
      for (const cell of [row[1], row[2], row[3], row[4], row[11], row[12]])
        expect(cell).not.toMatch(/^[=+\-@]/);
  });

  it('XLSX: read back with exceljs, the header and the operations with numbers as numbers', async () => {
    const reply = await binary(
      ask(as.engineer, 1, {
        batchKg: 50,
        basis: 'input',
        equipment: plantEquipment(),
        format: 'xlsx',
      }),
    );
    expect(reply.status).toBe(200);
    expect(reply.headers['content-type']).toBe(
      'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    );
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(reply.body as never);
    const sheet = book.getWorksheet('Step list')!;
    expect(sheet.getCell('A1').value).toBe('Plant step list');
    expect(sheet.getCell('B2').value).toBe('Amide isolation (invented)');
    expect(String(sheet.getCell('B4').value)).toMatch(/^Approved: signed by Demo reviewer/);
    let headerRow = 0;
    sheet.eachRow((row, n) => {
      if (row.getCell(1).value === 'No.') headerRow = n;
    });
    expect(headerRow).toBeGreaterThan(0);
    const first = sheet.getRow(headerRow + 1);
    expect(first.getCell(1).value).toBe(1);
    expect(first.getCell(4).value).toBe(approved.operations[0].text);
    expect(typeof first.getCell(6).value).toBe('number');
    expect(first.getCell(8).value).toBe(20);
    expect(sheet.rowCount).toBe(headerRow + approved.operations.length);
    const flagged = sheet.getRow(
      headerRow + approved.operations.findIndex((op) => op.stepId === 'acid-wash') + 1,
    );
    expect(String(flagged.getCell(12).value)).toMatch(/^CHECK: R-102/);
  });

  it('PDF: Lexend embedded, the header and every operation in the extracted text', async () => {
    const reply = await binary(
      ask(as.engineer, 1, {
        batchKg: 50,
        basis: 'input',
        equipment: plantEquipment(),
        format: 'pdf',
      }),
    );
    expect(reply.status).toBe(200);
    expect(reply.headers['content-type']).toBe('application/pdf');
    const pdf = reply.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdf.toString('latin1')).toMatch(/\/BaseFont \/[A-Z]{6}\+Lexend-Regular/);
    expect(pdf.toString('latin1')).toMatch(/\/FontFile2/);
    const text = (await pdfText(pdf)).replace(/\s+/g, ' ');
    expect(text).toMatch(/Plant step list/);
    expect(text).toMatch(/Route: Amide isolation \(invented\)/);
    expect(text).toMatch(/Revision: 1/);
    expect(text).toMatch(/signed by Demo reviewer/);
    expect(text).toMatch(/Batch size: 50 kg of the route's reference input/);
    expect(text).not.toMatch(/DRAFT/);
    expect(text).toMatch(/Charge 428 kg \(500 L\) of 2-Methyltetrahydrofuran at 20 °C\./);
    expect(text).toMatch(/Vessel CHECK: R-102 \(invented\)/);
    expect(text).toMatch(/process-safety review/);
  });

  it('the product basis sizes the batch by isolated product', async () => {
    const reply = await ask(as.engineer, 1, { batchKg: 50, basis: 'product', format: 'json' });
    expect(reply.status).toBe(200);
    const discharge = (reply.body as StepListDocument).operations.at(-1)!;
    expect(discharge.text).toMatch(/about 50\.\d kg of PW-417 amide/);
    expect(reply.body.scaleFactor).toBeGreaterThan(50);
  });

  it('refuses bad requests on their fields', async () => {
    const bad = await ask(as.engineer, 1, { batchKg: -5, basis: 'tonnes', format: 'docx' });
    expect(bad.status).toBe(400);
    const paths = bad.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['batchKg', 'basis', 'format']));
    const unknownStep = await ask(as.engineer, 1, {
      batchKg: 50,
      basis: 'input',
      format: 'json',
      equipment: { 'no-such-step': equipment['R-101 (invented)'] },
    });
    expect(unknownStep.status).toBe(400);
    expect(unknownStep.body.error.details).toEqual([
      {
        path: 'equipment.no-such-step',
        message: 'This revision has no step "no-such-step": choose equipment for its own steps.',
      },
    ]);
    const foreignEquipment = await ask(as.engineer, 1, {
      batchKg: 50,
      basis: 'input',
      format: 'json',
      equipment: { crude: '00000000-0000-4000-8000-000000000000' },
    });
    expect(foreignEquipment.status).toBe(400);
    expect(foreignEquipment.body.error.details[0].path).toBe('equipment.crude');
    expect(
      (await ask(as.engineer, 9, { batchKg: 50, basis: 'input', format: 'json' })).status,
    ).toBe(404);
  });

  it('only scale-up engineers and admins export; another workspace gets 404', async () => {
    const body = { batchKg: 10, basis: 'input', format: 'json' };
    expect((await ask(as.chemist, 1, body)).status).toBe(403);
    expect((await ask(as.reviewer, 1, body)).status).toBe(403);
    expect((await ask(as.admin, 1, body)).status).toBe(200);
    expect((await ask(as.outsider, 1, body)).status).toBe(404);
  });

  it('the JSON imports back into a new route (chemists and admins) whose document evaluates to the same totals', async () => {
    const url = `/api/v1/workspaces/${workspace.id}/routes/import`;
    expect((await post(as.engineer, url, approved)).status).toBe(403);
    expect((await post(as.reviewer, url, approved)).status).toBe(403);
    const foreignUrl = `/api/v1/workspaces/${as.outsider.session.workspaces[0].id}/routes/import`;
    expect((await post(as.chemist, foreignUrl, approved)).status).toBe(404);
    const reply = await post(as.chemist, url, approved);
    expect(reply.status, JSON.stringify(reply.body).slice(0, 400)).toBe(201);
    const created = routeDetailSchema.parse(reply.body);
    expect(created.id).not.toBe(routeId);
    expect(created.name).toBe('Amide isolation (invented) — step list of revision 1, 50 kg');
    expect(created.draft.document).toEqual(approved.route.document);
    const draft = { body: { document: created.draft.document } };
    // The same totals as the step list's own evaluation: the revision scaled to 50 kg in the chosen filter.
    const scaled = evaluateRoute(
      applyEquipment(scaleDocument(parseRoute(demoAmideIsolation), 50), {
        filter: { kind: 'filter', areaM2: 0.6 },
      }),
    ).totals;
    const imported = evaluateRoute(draft.body.document).totals;
    expect(imported).toEqual(scaled);
    // And the revision's totals, up to the cake wash at the plant filter's area.
    const original = evaluateRoute(demoAmideIsolation).totals;
    expect(Math.abs(imported.yieldPct! - original.yieldPct!)).toBeLessThan(0.05);
    for (const id of Object.keys(original.purge))
      expect(imported.purge[id].inKg).toBeCloseTo(50 * original.purge[id].inKg, 6);
    const admin = await post(as.admin, url, approved);
    expect(admin.status).toBe(201);
    // A changed document is refused on its field.
    const broken = structuredClone(approved) as unknown as {
      route: { document: { steps: unknown } };
    };
    broken.route.document.steps = 'none';
    const refused = await post(as.chemist, url, broken);
    expect(refused.status).toBe(400);
    expect(refused.body.error.details[0].path).toMatch(/^route\.document\.steps/);
  });
});
