/**
 * IPC chromatograms on a route's steps, against a real PostgreSQL and both
 * file stores: the local folder and an S3-compatible fake (s3rver on
 * loopback), so the object-store code path runs in every test run. The
 * traces are Gaussian peaks with analytically known areas (invented data).
 */
import { mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  chromatogramCreatedSchema,
  chromatogramDetailSchema,
  chromatogramListSchema,
} from '@shared/schemas/chromatograms';
import { apiErrorSchema } from '@shared/schemas/errors';
import { parseExact } from '@shared/schemas/exact';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { AuditEvent, Chromatogram, Route, type Workspace } from '../../server/models';
import { testConfig, useTestServer } from '../support/app';
import {
  DEMO_PEAKS,
  gaussianCsv,
  gaussianPeakArea,
  type GaussianPeak,
} from '../support/chromatograms';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';
import { writeAndiChromatogram } from '../support/netcdf-classic';
import { startS3Fake, type S3Fake } from '../support/s3-fake';

const filesDir = mkdtempSync(path.join(tmpdir(), 'phasewright-files-'));
const server = useTestServer({ FILES_DIR: filesDir });
const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

/** Every file under the local storage folder, relative to it. */
function localFiles(dir = filesDir): string[] {
  const out: string[] = [];
  const walk = (folder: string) => {
    for (const name of readdirSync(folder)) {
      const full = path.join(folder, name);
      if (statSync(full).isDirectory()) walk(full);
      else out.push(path.relative(dir, full));
    }
  };
  walk(dir);
  return out.sort();
}

const PDF = Buffer.from(
  '%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n',
  'latin1',
);

describe('chromatograms', () => {
  let workspace: Workspace;
  let routeId: string;
  let emails: Record<'chemist' | 'admin' | 'reviewer' | 'engineer' | 'outsider', string>;
  let s3: S3Fake;
  const stores: Record<
    'local' | 's3',
    { app: Express; as: SignedIn; stored: () => Promise<string[]> }
  > = {} as never;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    const other = await buildWorkspace();
    emails = {
      chemist: (await buildMember(workspace, ['chemist'])).email,
      admin: (await buildMember(workspace, ['admin'])).email,
      reviewer: (await buildMember(workspace, ['reviewer'])).email,
      engineer: (await buildMember(workspace, ['engineer'])).email,
      outsider: (await buildMember(other, ['chemist', 'admin'])).email,
    };
    const asChemist = await signIn(server.app, emails.chemist);
    const route = await asChemist.agent
      .post(`/api/v1/workspaces/${workspace.id}/routes`)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ name: 'IPC test route (invented)', document: demo() });
    expect(route.status).toBe(201);
    routeId = route.body.id;

    s3 = await startS3Fake();
    const s3App = server.anotherApp(testConfig({ FILES_DIR: filesDir, ...s3.env }));
    stores.local = {
      app: server.app,
      as: asChemist,
      stored: async () => localFiles(),
    };
    stores.s3 = { app: s3App, as: await signIn(s3App, emails.chemist), stored: () => s3.keys() };
  }, 60_000);

  afterAll(async () => {
    await s3?.close();
    rmSync(filesDir, { recursive: true, force: true });
  });

  const base = () => `/api/v1/workspaces/${workspace.id}/routes/${routeId}/chromatograms`;
  interface UploadOptions {
    content: Buffer | string;
    name?: string;
    fields?: Record<string, string>;
  }
  const upload = (who: SignedIn, options: UploadOptions, url = base()) => {
    let call = who.agent.post(url).set('X-CSRF-Token', who.csrfToken);
    const fields = { stepId: 'base-wash', sampleName: 'After base wash', ...options.fields };
    for (const [name, value] of Object.entries(fields)) call = call.field(name, value);
    return call.attach('file', Buffer.from(options.content), options.name ?? 'sample.csv');
  };
  const rows = () => Chromatogram.count({ where: { routeId } });

  it('requires authentication', async () => {
    const { app } = stores.local;
    const { default: request } = await import('supertest');
    expect((await request(app).get(base())).status).toBe(401);
    expect((await request(app).post(base()).attach('file', PDF, 'x.pdf')).status).toBe(401);
  });

  for (const store of ['local', 's3'] as const) {
    describe(`with ${store} storage`, () => {
      it('uploads a CSV trace: 201 with the peak table, areas as the Gaussians give them', async () => {
        const { as, stored } = stores[store];
        const before = await stored();
        const response = await upload(as, {
          content: gaussianCsv({ peaks: DEMO_PEAKS }),
          fields: { takenAt: '2026-11-30T10:15:00+01:00', methodNote: 'Invented method A' },
        });
        expect(response.status).toBe(201);
        const body = parseExact(chromatogramCreatedSchema, response.body);
        expect(body.success).toBe(true);
        expect(response.body).toMatchObject({ stepId: 'base-wash', kind: 'trace' });
        const peaks = response.body.peaks as Array<Record<string, number>>;
        expect(peaks).toHaveLength(3);
        const total = DEMO_PEAKS.reduce((s, p) => s + gaussianPeakArea(p), 0);
        DEMO_PEAKS.forEach((p, i) => {
          expect(peaks[i].retentionMin).toBeCloseTo(p.tR, 2);
          // Area in signal units × minutes: h·σ·√(2π), to within 1 %.
          expect(peaks[i].area / gaussianPeakArea(p)).toBeGreaterThan(0.99);
          expect(peaks[i].area / gaussianPeakArea(p)).toBeLessThan(1.01);
          expect(peaks[i].areaPct).toBeCloseTo((100 * gaussianPeakArea(p)) / total, 0);
          // w0.5 = 2σ√(2 ln 2); N = 5.54 (tR/w0.5)².
          expect(peaks[i].widthHalfMin).toBeCloseTo(2.3548 * p.sigma, 3);
          expect(peaks[i].plates).toBeGreaterThan(0);
        });
        expect(peaks[1].resolution).toBeGreaterThan(1.5);
        expect(peaks.reduce((s, p) => s + p.areaPct, 0)).toBeCloseTo(100, 6);
        const after = await stored();
        expect(after.length).toBe(before.length + 1);
        expect(after.find((k) => !before.includes(k))).toContain(body.data!.id);

        // The list, the detail and the original file.
        const list = await as.agent.get(`${base()}?stepId=base-wash`);
        expect(list.status).toBe(200);
        expect(parseExact(chromatogramListSchema, list.body).success).toBe(true);
        const row = list.body.items.find((i: { id: string }) => i.id === body.data!.id);
        expect(row).toMatchObject({
          sampleName: 'After base wash',
          takenAt: '2026-11-30T09:15:00.000Z',
          methodNote: 'Invented method A',
          format: 'csv',
          points: 3001,
          signalName: 'UV 254 nm (mAU)',
        });
        const detail = await as.agent.get(`${base()}/${body.data!.id}`);
        expect(detail.status).toBe(200);
        expect(detail.body.trace.timeMin).toHaveLength(3001);
        expect(detail.body.decimated).toBe(false);
        expect(detail.body.limits).toHaveLength(3);
        const file = await as.agent
          .get(`${base()}/${body.data!.id}/file`)
          .buffer(true)
          .parse((res, done) => {
            const chunks: Buffer[] = [];
            res.on('data', (c: Buffer) => chunks.push(c));
            res.on('end', () => done(null, Buffer.concat(chunks)));
          });
        expect(file.status).toBe(200);
        expect(file.headers['content-type']).toMatch(/^text\/csv/);
        expect((file.body as Buffer).toString('utf8')).toBe(gaussianCsv({ peaks: DEMO_PEAKS }));
      });

      it('a refused upload stores nothing: no file and no row', async () => {
        const { as, stored } = stores[store];
        const files = await stored();
        const count = await rows();
        const junk = Buffer.from(Array.from({ length: 4096 }, (_, i) => (i * 7919 + 13) % 256));
        const refused = await upload(as, { content: junk, name: 'junk.csv' });
        expect(refused.status).toBe(415);
        const empty = await upload(as, { content: 'Time,Signal\n', name: 'empty.csv' });
        expect(empty.status).toBe(422);
        expect(await stored()).toEqual(files);
        expect(await rows()).toBe(count);
      });

      it('deletes the sample and its file', async () => {
        const { as, stored } = stores[store];
        const created = await upload(as, { content: PDF, name: 'report.pdf' });
        expect(created.status).toBe(201);
        expect(created.body).toEqual({
          id: created.body.id,
          stepId: 'base-wash',
          kind: 'document',
          peaks: [],
        });
        expect((await stored()).some((k) => k.includes(created.body.id))).toBe(true);
        const gone = await as.agent
          .delete(`${base()}/${created.body.id}`)
          .set('X-CSRF-Token', as.csrfToken);
        expect(gone.status).toBe(204);
        // The file goes after the deletion commits.
        await expect
          .poll(async () => (await stored()).some((k) => k.includes(created.body.id)))
          .toBe(false);
        expect((await as.agent.get(`${base()}/${created.body.id}`)).status).toBe(404);
        expect(
          await AuditEvent.count({
            where: { entityType: 'chromatogram', entityId: created.body.id },
          }),
        ).toBe(2);
      });
    });
  }

  describe('what the server reads, from the content and not the name', () => {
    const refuse = async (
      options: UploadOptions,
      status: number,
      code: string,
      message: RegExp,
    ) => {
      const { as } = stores.local;
      const files = localFiles();
      const count = await rows();
      const response = await upload(as, options);
      expect(response.status, JSON.stringify(response.body)).toBe(status);
      expect(apiErrorSchema.safeParse(response.body).success).toBe(true);
      expect(response.body.error.code).toBe(code);
      expect(response.body.error.message).toMatch(message);
      expect(localFiles()).toEqual(files);
      expect(await rows()).toBe(count);
    };

    it('binary junk: 415 with a plain message', async () => {
      const junk = Buffer.alloc(2000, 0);
      junk.write('\x00\x01\x02garbage', 0, 'latin1');
      await refuse({ content: junk, name: 'trace.csv' }, 415, 'unsupported_file', /neither text/);
    });

    it('a known type that is no chromatogram (a ZIP archive): 415', async () => {
      const zip = Buffer.from('504b0304140000000800', 'hex');
      await refuse(
        { content: Buffer.concat([zip, Buffer.alloc(200, 1)]), name: 'trace.csv' },
        415,
        'unsupported_file',
        /not a chromatogram/,
      );
    });

    it('an empty file, a file without data rows, a huge header line: 422', async () => {
      await refuse({ content: '' }, 422, 'unreadable_file', /empty/);
      await refuse(
        { content: 'Sample: invented\nTime (min),Signal\n' },
        422,
        'unreadable_file',
        /No data rows/,
      );
      await refuse(
        { content: `${'x'.repeat(20_000)}\n0,1\n0.1,2\n` },
        422,
        'unreadable_file',
        /characters long/,
      );
    });

    it('a truncated netCDF file and a truncated PDF: 422', async () => {
      const andi = Buffer.from(
        writeAndiChromatogram({
          signal: Array.from({ length: 600 }, (_, i) => Math.exp(-(((i - 300) / 5) ** 2))),
          intervalS: 1,
        }),
      );
      await refuse(
        { content: andi.subarray(0, 300), name: 'run.cdf' },
        422,
        'unreadable_file',
        /netCDF/,
      );
      await refuse(
        { content: PDF.subarray(0, 40), name: 'report.pdf' },
        422,
        'unreadable_file',
        /incomplete/,
      );
    });

    it('a wrong extension does not matter: CSV named .pdf is a trace, a PDF named .csv a document', async () => {
      const { as } = stores.local;
      const csv = await upload(as, {
        content: gaussianCsv({ peaks: DEMO_PEAKS }),
        name: 'looks-like.pdf',
      });
      expect(csv.status).toBe(201);
      expect(csv.body.kind).toBe('trace');
      const pdf = await upload(as, { content: PDF, name: 'looks-like.csv' });
      expect(pdf.status).toBe(201);
      expect(pdf.body.kind).toBe('document');
      const detail = await as.agent.get(`${base()}/${pdf.body.id}`);
      expect(detail.body).toMatchObject({ contentType: 'application/pdf', trace: null });
    });

    it('reads an ANDI netCDF file: seconds become minutes, the injection time is kept', async () => {
      const { as } = stores.local;
      // 5 Hz for 10 min; one Gaussian at 300 s, height 50, σ = 3 s.
      const signal = Array.from(
        { length: 3000 },
        (_, i) => 50 * Math.exp(-((i / 5 - 300) ** 2) / 18),
      );
      const file = writeAndiChromatogram({
        signal,
        intervalS: 0.2,
        retentionUnit: 'seconds',
        injectionStamp: '20261130101500+0100',
      });
      const response = await upload(as, { content: Buffer.from(file), name: 'run.cdf' });
      expect(response.status).toBe(201);
      expect(response.body.peaks).toHaveLength(1);
      expect(response.body.peaks[0].retentionMin).toBeCloseTo(5, 3);
      // area = h·σ·√(2π) with σ = 0.05 min.
      expect(response.body.peaks[0].area).toBeCloseTo(50 * 0.05 * Math.sqrt(2 * Math.PI), 2);
      const detail = await as.agent.get(`${base()}/${response.body.id}`);
      expect(detail.body).toMatchObject({ format: 'andi', takenAt: '2026-11-30T09:15:00.000Z' });
    });

    it('several signal columns: `signal` picks one; decimal commas are read', async () => {
      const { as } = stores.local;
      const second: GaussianPeak[] = [{ tR: 3, h: 100, sigma: 0.05 }];
      const csv = gaussianCsv({
        peaks: DEMO_PEAKS,
        extraSignals: { 'UV 210 nm (mAU)': second },
        decimalComma: true,
      });
      const response = await upload(as, { content: csv, fields: { signal: 'UV 210 nm (mAU)' } });
      expect(response.status).toBe(201);
      expect(response.body.peaks).toHaveLength(1);
      expect(response.body.peaks[0].retentionMin).toBeCloseTo(3, 2);
      const detail = await as.agent.get(`${base()}/${response.body.id}`);
      expect(detail.body.signals).toEqual(['UV 254 nm (mAU)', 'UV 210 nm (mAU)']);
      expect(detail.body.signalName).toBe('UV 210 nm (mAU)');
    });

    it('above the size limit: 413, nothing stored', async () => {
      const small = server.anotherApp(
        testConfig({ FILES_DIR: filesDir, CHROMATOGRAM_MAX_MB: '0.05' }),
      );
      const as = await signIn(small, emails.chemist);
      const files = localFiles();
      const count = await rows();
      const response = await upload(as, {
        content: gaussianCsv({ peaks: DEMO_PEAKS, points: 4000 }),
      });
      expect(response.status).toBe(413);
      expect(response.body.error).toMatchObject({ code: 'file_too_large' });
      expect(response.body.error.message).toMatch(/larger than 0\.05 MB/);
      expect(localFiles()).toEqual(files);
      expect(await rows()).toBe(count);
    });

    it('fields: the file, a step of the route, a revision it has, a sample name', async () => {
      const { as } = stores.local;
      const noFile = await as.agent
        .post(base())
        .set('X-CSRF-Token', as.csrfToken)
        .field('stepId', 'base-wash')
        .field('sampleName', 'x');
      expect(noFile.status).toBe(400);
      expect(noFile.body.error.details).toContainEqual({
        path: 'file',
        message: 'Choose a file to upload.',
      });
      const bad = await upload(as, {
        content: PDF,
        fields: { stepId: 'no-such-step', sampleName: '  ', revision: '7' },
      });
      expect(bad.status).toBe(400);
      const paths = bad.body.error.details.map((d: { path: string }) => d.path);
      expect(paths).toContain('sampleName');
      const step = await upload(as, { content: PDF, fields: { stepId: 'no-such-step' } });
      expect(step.body.error.details).toEqual([
        { path: 'stepId', message: 'The route has no such step.' },
      ]);
      const revision = await upload(as, { content: PDF, fields: { revision: '7' } });
      expect(revision.body.error.details).toEqual([
        { path: 'revision', message: 'This route has no revision 7.' },
      ]);
      const json = await as.agent.post(base()).set('X-CSRF-Token', as.csrfToken).send({});
      expect(json.status).toBe(400);
    });
  });

  describe('integration and assignments', () => {
    it('assigns peaks, re-integrates by hand, and later uploads pick the assignment up by retention time', async () => {
      const { as } = stores.local;
      const created = await upload(as, { content: gaussianCsv({ peaks: DEMO_PEAKS }) });
      const url = `${base()}/${created.body.id}`;
      const patch = (body: object) =>
        as.agent.patch(url).set('X-CSRF-Token', as.csrfToken).send(body);

      const assigned = await patch({
        assignments: { '0': 'deschloro-amide', '1': 'pw417-amide' },
      });
      expect(assigned.status).toBe(200);
      expect(parseExact(chromatogramDetailSchema, assigned.body).success).toBe(true);
      expect(assigned.body.peaks[0].componentId).toBe('deschloro-amide');
      expect(assigned.body.peaks[1].componentId).toBe('pw417-amide');
      expect(assigned.body.peaks[2].componentId).toBeUndefined();

      // Hand-set limits: only the first two peaks, the first one cut short.
      const manual = await patch({
        integration: [
          { startMin: 3.7, endMin: 4.3 },
          { startMin: 2.4, endMin: 2.6 },
        ],
      });
      expect(manual.status).toBe(200);
      expect(manual.body.integrationMode).toBe('manual');
      expect(manual.body.peaks).toHaveLength(2);
      expect(manual.body.limits[0]).toEqual({ startMin: 2.4, endMin: 2.6 });
      // Between ±2σ a Gaussian holds 95.45 % of its area; the straight baseline joins the
      // signal at the limits (e^−2 of the height), taking 4·e^−2/√(2π) = 21.6 % off: 73.9 %.
      const cut = 0.9545 - (4 * Math.exp(-2)) / Math.sqrt(2 * Math.PI);
      expect(manual.body.peaks[0].area / gaussianPeakArea(DEMO_PEAKS[0])).toBeCloseTo(cut, 1);
      expect(manual.body.peaks.map((p: { componentId?: string }) => p.componentId)).toEqual([
        'deschloro-amide',
        'pw417-amide',
      ]);

      const automatic = await patch({ integration: null });
      expect(automatic.body.integrationMode).toBe('automatic');
      expect(automatic.body.peaks).toHaveLength(3);

      const again = await upload(as, { content: gaussianCsv({ peaks: DEMO_PEAKS }) });
      expect(again.body.peaks.map((p: { componentId?: string }) => p.componentId)).toEqual([
        'deschloro-amide',
        'pw417-amide',
        undefined,
      ]);
    });

    it('refuses peaks that do not exist, components the route does not have, and windows the wrong way round', async () => {
      const { as } = stores.local;
      const created = await upload(as, { content: gaussianCsv({ peaks: DEMO_PEAKS }) });
      const url = `${base()}/${created.body.id}`;
      const patch = (body: object) =>
        as.agent.patch(url).set('X-CSRF-Token', as.csrfToken).send(body);
      const wrong = await patch({ assignments: { '9': 'pw417-amide', '0': 'not-in-route' } });
      expect(wrong.status).toBe(400);
      expect(wrong.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual([
        'assignments.0',
        'assignments.9',
      ]);
      const backwards = await patch({ integration: [{ startMin: 5, endMin: 4 }] });
      expect(backwards.status).toBe(400);
      expect(backwards.body.error.details[0].path).toBe('integration.0.endMin');
      const empty = await patch({ integration: [{ startMin: 8.5, endMin: 9 }] });
      expect(empty.status).toBe(200);
      expect(empty.body.peaks).toEqual([]);
      expect(empty.body.warnings.join(' ')).toMatch(/holds no peak/);
      const doc = await upload(as, { content: PDF, name: 'a.pdf' });
      const onDoc = await as.agent
        .patch(`${base()}/${doc.body.id}`)
        .set('X-CSRF-Token', as.csrfToken)
        .send({ integration: [{ startMin: 1, endMin: 2 }] });
      expect(onDoc.status).toBe(400);
    });

    it('decimates the trace to at most 5,000 points unless full=1', async () => {
      const { as } = stores.local;
      const created = await upload(as, {
        content: gaussianCsv({ peaks: DEMO_PEAKS, points: 20_001 }),
      });
      const detail = await as.agent.get(`${base()}/${created.body.id}`);
      expect(detail.body.trace.timeMin.length).toBeLessThanOrEqual(5000);
      expect(detail.body.decimated).toBe(true);
      // The peak tops survive the decimation.
      expect(Math.max(...detail.body.trace.signal)).toBeCloseTo(400, 0);
      const full = await as.agent.get(`${base()}/${created.body.id}?full=1`);
      expect(full.body.trace.timeMin).toHaveLength(20_001);
      expect(full.body.decimated).toBe(false);
    });
  });

  it('pages the list with a cursor', async () => {
    const { as } = stores.local;
    for (const name of ['P1', 'P2', 'P3'])
      expect(
        (await upload(as, { content: PDF, fields: { stepId: 'acid-wash', sampleName: name } }))
          .status,
      ).toBe(201);
    const first = await as.agent.get(`${base()}?stepId=acid-wash&limit=2`);
    expect(first.body.items.map((i: { sampleName: string }) => i.sampleName)).toEqual(['P1', 'P2']);
    expect(first.body.nextCursor).toEqual(expect.any(String));
    const second = await as.agent.get(
      `${base()}?stepId=acid-wash&limit=2&cursor=${first.body.nextCursor}`,
    );
    expect(second.body.items.map((i: { sampleName: string }) => i.sampleName)).toEqual(['P3']);
    expect(second.body.nextCursor).toBeNull();
    const bad = await as.agent.get(`${base()}?cursor=nonsense`);
    expect(bad.status).toBe(400);
  });

  it('every member reads; only chemists and admins upload, edit and delete; other workspaces see nothing', async () => {
    const { app, as } = stores.local;
    const created = await upload(as, { content: gaussianCsv({ peaks: DEMO_PEAKS }) });
    const one = `${base()}/${created.body.id}`;
    for (const role of ['reviewer', 'engineer'] as const) {
      const who = await signIn(app, emails[role]);
      expect((await who.agent.get(base())).status).toBe(200);
      expect((await who.agent.get(one)).status).toBe(200);
      expect((await who.agent.get(`${one}/file`)).status).toBe(200);
      expect((await upload(who, { content: PDF })).status).toBe(403);
      const patch = await who.agent
        .patch(one)
        .set('X-CSRF-Token', who.csrfToken)
        .send({ assignments: {} });
      expect(patch.status).toBe(403);
      expect((await who.agent.delete(one).set('X-CSRF-Token', who.csrfToken)).status).toBe(403);
    }
    const admin = await signIn(app, emails.admin);
    expect((await upload(admin, { content: PDF })).status).toBe(201);

    const outsider = await signIn(app, emails.outsider);
    const count = await rows();
    expect((await outsider.agent.get(base())).status).toBe(404);
    expect((await outsider.agent.get(one)).status).toBe(404);
    expect((await outsider.agent.get(`${one}/file`)).status).toBe(404);
    expect((await upload(outsider, { content: PDF })).status).toBe(404);
    expect(
      (await outsider.agent.patch(one).set('X-CSRF-Token', outsider.csrfToken).send({})).status,
    ).toBe(404);
    expect((await outsider.agent.delete(one).set('X-CSRF-Token', outsider.csrfToken)).status).toBe(
      404,
    );
    expect(await rows()).toBe(count);
  });

  it('an archived route keeps its samples readable and refuses changes', async () => {
    const { as } = stores.local;
    const created = await upload(as, { content: PDF });
    await Route.update({ archivedAt: new Date() }, { where: { id: routeId } });
    try {
      expect((await as.agent.get(`${base()}/${created.body.id}`)).status).toBe(200);
      const refused = await upload(as, { content: PDF });
      expect(refused.status).toBe(409);
      expect(refused.body.error.code).toBe('route_archived');
    } finally {
      await Route.update({ archivedAt: null }, { where: { id: routeId } });
    }
  });
});
