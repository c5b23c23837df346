import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  compoundListSchema,
  compoundSchema,
  structurePreviewSchema,
} from '@shared/schemas/compounds';
import { compoundSnapshotSchema } from '@shared/schemas/route';
import { apiErrorSchema } from '@shared/schemas/errors';
import { AuditEvent, Compound, Workspace, type User } from '../../server/models';
import { toCompoundSnapshot } from '../../server/services/compounds';
import { up as seedDemoWorkspaces } from '../../seeders/20261201000000-demo-workspaces';
import {
  DEMO_COMPOUNDS,
  up as seedDemoCompounds,
} from '../../seeders/20261202000000-demo-compounds';
import { DEMO_WORKSPACES } from '../../seeders/data/demo-accounts';
import { database } from '../../server/db/sequelize';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

const ACID = 'COc1ccc(CC(=O)O)cc1';

describe('workspace compounds', () => {
  let workspace: Workspace;
  let chemist: User;
  let asChemist: SignedIn;
  let asAdmin: SignedIn;
  let asReviewer: SignedIn;
  let asEngineer: SignedIn;
  let asOutsider: SignedIn;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    const other = await buildWorkspace();
    chemist = await buildMember(workspace, ['chemist']);
    asChemist = await signIn(server.app, chemist.email);
    asAdmin = await signIn(server.app, (await buildMember(workspace, ['admin'])).email);
    asReviewer = await signIn(server.app, (await buildMember(workspace, ['reviewer'])).email);
    asEngineer = await signIn(server.app, (await buildMember(workspace, ['engineer'])).email);
    asOutsider = await signIn(server.app, (await buildMember(other, ['chemist', 'admin'])).email);
  });

  const listPath = () => `/api/v1/workspaces/${workspace.id}/compounds`;
  const post = (who: SignedIn, body: unknown) =>
    who.agent
      .post(listPath())
      .set('X-CSRF-Token', who.csrfToken)
      .send(body as object);
  // Edits name the version they were based on: the current one, unless the body gives another.
  const patch = async (who: SignedIn, id: string, body: unknown) => {
    const current = await who.agent.get(`${listPath()}/${id}`);
    return who.agent
      .patch(`${listPath()}/${id}`)
      .set('X-CSRF-Token', who.csrfToken)
      .send({ baseVersion: current.body.version ?? 1, ...(body as object) });
  };

  it('refuses an edit based on an older version with 409, changing nothing', async () => {
    const created = await post(asChemist, {
      name: 'Versioned compound (invented)',
      smiles: 'CCO',
      role: 'impurity',
    });
    expect(created.body.version).toBe(1);
    const send = (body: object) =>
      asChemist.agent
        .patch(`${listPath()}/${created.body.id}`)
        .set('X-CSRF-Token', asChemist.csrfToken)
        .send(body);
    const first = await send({ notes: 'Mine', baseVersion: 1 });
    expect(first.body).toMatchObject({ version: 2, notes: 'Mine' });
    const stale = await send({ notes: 'Theirs, on the old version', baseVersion: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatchObject({ code: 'version_conflict', details: { version: 2 } });
    expect((await asChemist.agent.get(`${listPath()}/${created.body.id}`)).body.notes).toBe('Mine');
  });

  it('requires authentication', async () => {
    expect((await request(server.app).get(listPath())).status).toBe(401);
    expect(
      (
        await request(server.app)
          .post(listPath())
          .send({ name: 'x', smiles: 'CCO', role: 'product' })
      ).status,
    ).toBe(401);
    expect(
      (await request(server.app).post('/api/v1/structures/preview').send({ smiles: 'CCO' })).status,
    ).toBe(401);
  });

  it('previews a structure: formula, molar mass, drawing, UNIFAC groups and estimates marked with their method', async () => {
    const response = await asChemist.agent
      .post('/api/v1/structures/preview')
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ smiles: ACID });
    expect(response.status).toBe(200);
    const preview = structurePreviewSchema.parse(response.body);
    expect(preview.formula).toBe('C9H10O3');
    // IUPAC atomic weights: 9 × 12.011 + 10 × 1.008 + 3 × 15.999 = 166.176
    expect(preview.molarMassGmol).toBeCloseTo(166.18, 1);
    expect(preview.svg).toMatch(/^<svg/);
    expect(preview.svg).not.toMatch(/<script|on\w+=/i);
    expect(preview.unifac.groups).toEqual({ '9': 4, '10': 1, '12': 1, '24': 1, '42': 1 });
    expect(preview.unifac.summary.map((g) => g.name)).toEqual([
      'ACH',
      'AC',
      'ACCH2',
      'CH3O',
      'COOH',
    ]);
    expect(preview.unifac.unassignedAtoms).toEqual([]);
    expect(preview.estimates.logP!.method).toMatch(/UNIFAC/);
    expect(preview.estimates.logP!.value).toBeCloseTo(2.123, 2);
    expect(preview.librarySolventId).toBeNull();
  });

  it('previews a library solvent as that solvent, and lists atoms no group covers', async () => {
    const ethanol = structurePreviewSchema.parse(
      (
        await asReviewer.agent
          .post('/api/v1/structures/preview')
          .set('X-CSRF-Token', asReviewer.csrfToken)
          .send({ smiles: 'OCC' })
      ).body,
    );
    expect(ethanol.librarySolventId).toBe('ethanol');
    const anilide = structurePreviewSchema.parse(
      (
        await asReviewer.agent
          .post('/api/v1/structures/preview')
          .set('X-CSRF-Token', asReviewer.csrfToken)
          .send({ smiles: 'CC(=O)Nc1ccccc1' })
      ).body,
    );
    expect(anilide.unifac.unassignedAtoms.map((a) => a.element).sort()).toEqual(['C', 'N', 'O']);
    // No UNIFAC group for the anilide: logP by atom-type increments instead, marked as the fallback.
    expect(anilide.estimates.logP!.method).toMatch(/^fallback: atom-type increments/);
    expect(anilide.estimates.logP!.warnings.join(' ')).toMatch(/anilide link/);
    expect(anilide.estimates.logP!.warnings.join(' ')).not.toMatch(/carbonate|N-oxide/);
    expect(anilide.estimates.hansen!.warnings[0]).toMatch(/Fallback for the amide link/);
  });

  it('answers an unparsable structure with 422 naming the problem', async () => {
    const response = await asChemist.agent
      .post('/api/v1/structures/preview')
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ smiles: 'c1ccccc' });
    expect(response.status).toBe(422);
    const error = apiErrorSchema.parse(response.body).error;
    expect(error.code).toBe('structure_unparsable');
    expect(error.message).toMatch(/c1ccccc/);
    const molfile = await asChemist.agent
      .post('/api/v1/structures/preview')
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ molfile: 'not a molfile' });
    expect(molfile.status).toBe(422);
    expect(molfile.body.error.message).toMatch(/molfile/i);
  });

  it('a chemist adds a compound: derived data stored, estimates marked estimated, the creation audited', async () => {
    const response = await post(asChemist, {
      name: 'Test acid (invented)',
      smiles: ACID,
      role: 'impurity',
      pKa: [{ value: 4.4, type: 'acid' }],
      meltingPointC: 86,
      enthalpyFusionKJmol: 25,
      solubility: [{ solventId: 'toluene', temperatureC: 20, value: 12, unit: 'g/L' }],
      partition: [{ organicSolventId: 'ethyl-acetate', pH: 2, temperatureC: 20, D: 30 }],
    });
    expect(response.status).toBe(201);
    const compound = compoundSchema.parse(response.body);
    expect(compound).toMatchObject({
      formula: 'C9H10O3',
      role: 'impurity',
      workspaceId: workspace.id,
      createdBy: { id: chemist.id },
    });
    expect(compound.logP).toMatchObject({ source: 'estimated' });
    expect(compound.logP!.method).toMatch(/UNIFAC/);
    expect(compound.hansen?.source ?? 'none').not.toBe('entered');
    expect(compound.unifac.source).toBe('assigned');
    const stored = await Compound.findByPk(compound.id);
    expect(stored!.canonicalSmiles).toBe(compound.canonicalSmiles);
    const audit = await AuditEvent.findOne({
      where: { entityType: 'compound', entityId: compound.id, action: 'compound.create' },
    });
    expect(audit!.actorId).toBe(chemist.id);
    expect((audit!.after as { formula: string }).formula).toBe('C9H10O3');
  });

  it('a measured logP and entered Hansen parameters win over the estimates; clearing them brings the estimate back', async () => {
    const created = compoundSchema.parse(
      (
        await post(asAdmin, {
          name: 'Measured one',
          smiles: 'CCCCCCO',
          role: 'reagent',
          logP: { value: 2.03, method: 'shake flask' },
          hansen: { d: 15.9, p: 5.8, h: 12.5 },
        })
      ).body,
    );
    expect(created.logP).toEqual({
      value: 2.03,
      source: 'measured',
      method: 'shake flask',
      warnings: [],
    });
    expect(created.hansen).toMatchObject({ d: 15.9, p: 5.8, h: 12.5, source: 'entered' });
    const cleared = compoundSchema.parse(
      (await patch(asChemist, created.id, { logP: null, hansen: null })).body,
    );
    expect(cleared.logP!.source).toBe('estimated');
    expect(cleared.logP!.value).not.toBe(2.03);
    expect(cleared.hansen!.source).toBe('estimated');
    expect(cleared.hansen!.method).toMatch(/Hoftyzer–Van Krevelen/);
  });

  it('edited UNIFAC groups override the assignment; a new structure goes back to the automatic groups', async () => {
    const created = compoundSchema.parse(
      (
        await post(asChemist, {
          name: 'Anilide (test)',
          smiles: 'CC(=O)Nc1ccccc1',
          role: 'by-product',
        })
      ).body,
    );
    expect(created.unifac.unassignedAtoms).toHaveLength(3);
    expect(created.logP).toMatchObject({ source: 'estimated' });
    expect(created.logP!.method).toMatch(/^fallback/);
    const edited = compoundSchema.parse(
      (await patch(asChemist, created.id, { unifacGroups: { '1': 1, '9': 5, '10': 1, '94': 1 } }))
        .body,
    );
    expect(edited.unifac.source).toBe('edited');
    expect(edited.unifac.groups).toEqual({ '1': 1, '9': 5, '10': 1, '94': 1 });
    expect(edited.unifac.unassignedAtoms).toEqual([]);
    const restructured = compoundSchema.parse(
      (await patch(asChemist, created.id, { smiles: 'CCOC(=O)CC' })).body,
    );
    expect(restructured.unifac.source).toBe('assigned');
    expect(restructured.formula).toBe('C5H10O2');
    const unknown = await patch(asChemist, created.id, { unifacGroups: { '9999': 1 } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details[0].path).toBe('unifacGroups.9999');
  });

  it('refuses bad payloads with 400 and every field path', async () => {
    const response = await post(asChemist, {
      name: '',
      role: 'solvent',
      meltingPointC: 'hot',
      pKa: [{ value: 99, type: 'acid' }],
      solubility: [{ solventId: 'toluene', temperatureC: 20, value: -1, unit: 'g/L' }],
    });
    expect(response.status).toBe(400);
    const paths = response.body.error.details.map((d: { path: string }) => d.path);
    for (const p of ['name', 'role', 'meltingPointC', 'pKa.0.value', 'solubility.0.value'])
      expect(paths).toContain(p);
    const noStructure = await post(asChemist, { name: 'No structure', role: 'product' });
    expect(noStructure.status).toBe(400);
    expect(noStructure.body.error.details.map((d: { path: string }) => d.path)).toContain('smiles');
    const unknownSolvent = await post(asChemist, {
      name: 'x',
      smiles: 'CCO',
      role: 'product',
      solubility: [{ solventId: 'no-such', temperatureC: 20, value: 1, unit: 'g/L' }],
    });
    expect(unknownSolvent.status).toBe(400);
    expect(unknownSolvent.body.error.details[0].path).toBe('solubility.0.solventId');
  });

  it('an unparsable SMILES on save is a 422 with the field named', async () => {
    const response = await post(asChemist, { name: 'Broken', smiles: 'C1CC', role: 'impurity' });
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('structure_unparsable');
    expect(response.body.error.details[0].path).toBe('smiles');
    expect(response.body.error.message).toMatch(/ring closure/);
  });

  it('reviewers and engineers read but may not write (403)', async () => {
    const list = compoundListSchema.parse((await asReviewer.agent.get(listPath())).body).items;
    expect(list.length).toBeGreaterThan(0);
    const names = list.map((c) => c.name.toLowerCase());
    expect([...names].sort()).toEqual(names);
    expect((await asEngineer.agent.get(`${listPath()}/${list[0].id}`)).status).toBe(200);
    for (const who of [asReviewer, asEngineer]) {
      expect((await post(who, { name: 'x', smiles: 'CCO', role: 'product' })).status).toBe(403);
      expect((await patch(who, list[0].id, { name: 'renamed' })).status).toBe(403);
      expect(
        (await who.agent.delete(`${listPath()}/${list[0].id}`).set('X-CSRF-Token', who.csrfToken))
          .status,
      ).toBe(403);
    }
  });

  it("another workspace's compounds answer 404, exactly like missing ones", async () => {
    const list = compoundListSchema.parse((await asChemist.agent.get(listPath())).body).items;
    const foreign = await asOutsider.agent.get(`${listPath()}/${list[0].id}`);
    const missing = await asOutsider.agent.get(
      `${listPath()}/00000000-0000-4000-8000-000000000000`,
    );
    expect(foreign.status).toBe(404);
    expect(foreign.body).toEqual(missing.body);
    expect((await asOutsider.agent.get(listPath())).status).toBe(404);
    expect((await patch(asOutsider, list[0].id, { name: 'taken' })).status).toBe(404);
    // The outsider's own workspace id with this workspace's compound id is also a 404.
    const ownWorkspace = asOutsider.session.workspaces[0].id;
    expect(
      (await asOutsider.agent.get(`/api/v1/workspaces/${ownWorkspace}/compounds/${list[0].id}`))
        .status,
    ).toBe(404);
  });

  it('renames and deletes, auditing both', async () => {
    const created = compoundSchema.parse(
      (await post(asChemist, { name: 'Short-lived', smiles: 'CCCO', role: 'reagent' })).body,
    );
    const renamed = compoundSchema.parse(
      (await patch(asChemist, created.id, { name: 'Short-lived (renamed)' })).body,
    );
    expect(renamed.name).toBe('Short-lived (renamed)');
    const update = await AuditEvent.findOne({
      where: { entityId: created.id, action: 'compound.update' },
    });
    expect((update!.before as { name: string }).name).toBe('Short-lived');
    expect((update!.after as { name: string }).name).toBe('Short-lived (renamed)');
    expect(
      (
        await asChemist.agent
          .delete(`${listPath()}/${created.id}`)
          .set('X-CSRF-Token', asChemist.csrfToken)
      ).status,
    ).toBe(204);
    expect((await asChemist.agent.get(`${listPath()}/${created.id}`)).status).toBe(404);
    expect(
      await AuditEvent.count({ where: { entityId: created.id, action: 'compound.delete' } }),
    ).toBe(1);
  });

  it('produces the self-contained snapshot a route document carries', async () => {
    const created = compoundSchema.parse(
      (
        await post(asChemist, {
          name: 'Snapshot acid',
          smiles: ACID,
          role: 'impurity',
          pKa: [{ value: 4.4, type: 'acid' }],
          meltingPointC: 86,
          enthalpyFusionKJmol: 25,
        })
      ).body,
    );
    const snapshot = toCompoundSnapshot(created);
    expect(compoundSnapshotSchema.safeParse(snapshot).success).toBe(true);
    expect(snapshot).toMatchObject({
      kind: 'compound',
      id: created.id,
      role: 'impurity',
      meltingPointC: 86,
      pKa: [{ value: 4.4, type: 'acid' }],
    });
    expect(snapshot.logP).toBeCloseTo(created.logP!.value, 10);
    expect(snapshot.unifac).toEqual(created.unifac.groups);
    expect(snapshot.note).toMatch(/logP estimated/);
  });

  it('lists the ionisable groups with estimated pKa and the method; the route uses the estimate until a measured pKa is entered', async () => {
    const UREA = 'CCNC(=O)NCCCN(C)C';
    const preview = structurePreviewSchema.parse(
      (
        await asChemist.agent
          .post('/api/v1/structures/preview')
          .set('X-CSRF-Token', asChemist.csrfToken)
          .send({ smiles: UREA })
      ).body,
    );
    expect(preview.ionisableGroups).toHaveLength(1);
    expect(preview.ionisableGroups[0]).toMatchObject({
      group: 'tertiary aliphatic amine',
      type: 'base',
      typicalError: 1,
    });
    expect(preview.ionisableGroups[0].pKa).toBeCloseTo(10, 5);
    expect(preview.ionisableGroups[0].method).toMatch(/Perrin, Dempsey & Serjeant/);

    const created = compoundSchema.parse(
      (await post(asChemist, { name: 'Urea by-product', smiles: UREA, role: 'by-product' })).body,
    );
    expect(created.pKa).toEqual([]);
    expect(created.ionisableGroups.map((g) => g.pKa)).toEqual([10]);
    expect(toCompoundSnapshot(created).pKa).toEqual([
      { value: 10, type: 'base', source: 'estimated' },
    ]);
    const measured = compoundSchema.parse(
      (await patch(asChemist, created.id, { pKa: [{ value: 9.4, type: 'base' }] })).body,
    );
    expect(toCompoundSnapshot(measured).pKa).toEqual([
      { value: 9.4, type: 'base', source: 'measured' },
    ]);

    // A group the method does not cover is named, and the chemist is asked for a measured value.
    const guanidine = compoundSchema.parse(
      (await post(asChemist, { name: 'Guanidine', smiles: 'CNC(=N)N', role: 'impurity' })).body,
    );
    expect(guanidine.ionisableGroups).toMatchObject([{ group: 'guanidine', pKa: null }]);
    expect(guanidine.estimateNotes.join(' ')).toMatch(/ionisable group \(guanidine\) with no pKa/);
  });

  it('keeps the specification limit and the incorporation, and carries them into the snapshot', async () => {
    const created = compoundSchema.parse(
      (
        await post(asChemist, {
          name: 'Des-chloro analogue',
          smiles: 'O=C(NC)c1cccc(OC)c1',
          role: 'impurity',
          specLimitPct: 0.15,
        })
      ).body,
    );
    expect(created).toMatchObject({ specLimitPct: 0.15, solidIncorporation: null });
    expect(created.fingerprint).toMatch(/^[0-9a-f]{128}$/);
    const updated = compoundSchema.parse(
      (await patch(asChemist, created.id, { solidIncorporation: 0.02, specLimitPct: null })).body,
    );
    expect(updated).toMatchObject({ specLimitPct: null, solidIncorporation: 0.02 });
    const snapshot = toCompoundSnapshot(updated);
    expect(snapshot.solidIncorporation).toBe(0.02);
    expect(snapshot.specLimitPct).toBeUndefined();
    expect(snapshot.fingerprint).toBe(created.fingerprint);

    const bad = await post(asChemist, {
      name: 'Bad limit',
      smiles: 'CCO',
      role: 'impurity',
      specLimitPct: -1,
      solidIncorporation: 11,
    });
    expect(bad.status).toBe(400);
    const paths = bad.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['specLimitPct', 'solidIncorporation']));
  });

  it('seeds the invented demo compounds once, each marked invented', async () => {
    const context = { sequelize: database(), queryInterface: database().getQueryInterface() };
    await seedDemoWorkspaces({ context });
    await seedDemoCompounds({ context });
    await seedDemoCompounds({ context });
    const demo = await Workspace.findOne({ where: { slug: DEMO_WORKSPACES[0].slug } });
    const seeded = await Compound.findAll({
      where: { workspaceId: demo!.id },
      order: [['name', 'ASC']],
    });
    expect(seeded.map((c) => c.name).sort()).toEqual(DEMO_COMPOUNDS.map((c) => c.name).sort());
    for (const c of seeded) {
      expect(c.name).toMatch(/\(invented\)$/);
      expect(c.notes).toMatch(/invented/i);
    }
    expect(new Set(seeded.map((c) => c.role))).toEqual(
      new Set(['product', 'impurity', 'reagent', 'by-product']),
    );
    const product = seeded.find((c) => c.role === 'product')!;
    expect(product.logP).toMatchObject({ source: 'measured', method: 'invented demo value' });
    // The urea's pKa is the server's estimate, not seeded as measured.
    const urea = seeded.find((c) => c.name.startsWith('Coupling-agent urea'))!;
    expect(urea.pKa).toEqual([]);
    expect(seeded.find((c) => c.name.startsWith('Des-chloro'))!.specLimitPct).toBe(0.15);
    expect(product.unifac.unassignedAtoms).toEqual([]);
  });
});
