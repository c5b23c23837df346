import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { equipmentListSchema, equipmentSchema } from '@shared/schemas/equipment';
import { apiErrorSchema } from '@shared/schemas/errors';
import { AuditEvent, Equipment, Workspace } from '../../server/models';
import { database } from '../../server/db/sequelize';
import { up as seedDemoWorkspaces } from '../../seeders/20261201000000-demo-workspaces';
import {
  DEMO_EQUIPMENT,
  up as seedDemoEquipment,
} from '../../seeders/20261203130100-demo-equipment';
import { DEMO_WORKSPACES } from '../../seeders/data/demo-accounts';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

const vessel = {
  kind: 'vessel',
  name: 'R-1 (invented)',
  nominalL: 1000,
  minStirrableL: 100,
  maxWorkingL: 900,
  minC: -20,
  maxC: 140,
  minMbar: 20,
  maxMbar: 4000,
  material: 'Glass-lined steel',
};
const filter = { kind: 'filter', name: 'F-1 (invented)', areaM2: 0.5, capacityL: 200 };

describe('workspace equipment', () => {
  let workspace: Workspace;
  const as: Record<string, SignedIn> = {};

  beforeAll(async () => {
    workspace = await buildWorkspace();
    const other = await buildWorkspace();
    for (const role of ['admin', 'chemist', 'reviewer', 'engineer'] as const)
      as[role] = await signIn(server.app, (await buildMember(workspace, [role])).email);
    as.outsider = await signIn(server.app, (await buildMember(other, ['engineer', 'admin'])).email);
  });

  const base = () => `/api/v1/workspaces/${workspace.id}/equipment`;
  const send = (
    who: SignedIn,
    method: 'post' | 'patch' | 'delete',
    path: string,
    body?: object,
  ) => {
    const call = who.agent[method](path).set('X-CSRF-Token', who.csrfToken);
    return body ? call.send(body) : call;
  };

  it('requires authentication', async () => {
    expect((await request(server.app).get(base())).status).toBe(401);
  });

  it('engineers and admins add vessels, filters and dryers; the reply has the exact fields', async () => {
    const created = await send(as.engineer, 'post', base(), vessel);
    expect(created.status).toBe(201);
    const item = equipmentSchema.parse(created.body);
    expect(item).toMatchObject(vessel);
    const byAdmin = await send(as.admin, 'post', base(), filter);
    expect(byAdmin.status).toBe(201);
    expect(byAdmin.body).toEqual({
      ...filter,
      id: expect.any(String),
      createdAt: expect.any(String),
      updatedAt: expect.any(String),
    });
    const dryer = await send(as.engineer, 'post', base(), {
      kind: 'dryer',
      name: 'D-1 (invented)',
      areaM2: 1.2,
      capacityL: 150,
    });
    expect(dryer.status).toBe(201);
    const audit = await AuditEvent.findOne({
      where: { workspaceId: workspace.id, action: 'equipment.create', entityId: item.id },
    });
    expect(audit?.after).toMatchObject({ name: 'R-1 (invented)', maxWorkingL: 900 });
  });

  it('every member reads the list, vessels first, in the { items, nextCursor } shape', async () => {
    for (const role of ['chemist', 'reviewer', 'engineer', 'admin']) {
      const response = await as[role].agent.get(base());
      expect(response.status).toBe(200);
      const list = equipmentListSchema.parse(response.body);
      expect(list.items.map((i) => i.kind)).toEqual(['vessel', 'filter', 'dryer']);
      expect(list.nextCursor).toBeNull();
    }
    const paged = await as.chemist.agent.get(base()).query({ limit: 2 });
    expect(paged.body.items).toHaveLength(2);
    expect(paged.body.nextCursor).toEqual(expect.any(String));
    const rest = await as.chemist.agent
      .get(base())
      .query({ limit: 2, cursor: paged.body.nextCursor });
    expect(rest.body.items.map((i: { name: string }) => i.name)).toEqual(['D-1 (invented)']);
    expect(rest.body.nextCursor).toBeNull();
    const filtered = await as.chemist.agent.get(base()).query({ kind: 'filter' });
    expect(filtered.body.items.map((i: { name: string }) => i.name)).toEqual(['F-1 (invented)']);
    const searched = await as.chemist.agent.get(base()).query({ q: 'r-1' });
    expect(searched.body.items.map((i: { name: string }) => i.name)).toEqual(['R-1 (invented)']);
  });

  it('chemists and reviewers may not add, change or remove equipment (403)', async () => {
    const [item] = (await as.engineer.agent.get(base())).body.items;
    for (const role of ['chemist', 'reviewer']) {
      expect((await send(as[role], 'post', base(), { ...vessel, name: 'X' })).status).toBe(403);
      expect((await send(as[role], 'patch', `${base()}/${item.id}`, { name: 'Y' })).status).toBe(
        403,
      );
      expect((await send(as[role], 'delete', `${base()}/${item.id}`)).status).toBe(403);
    }
  });

  it("another workspace's member gets 404 and changes nothing", async () => {
    const [item] = (await as.engineer.agent.get(base())).body.items;
    expect((await as.outsider.agent.get(base())).status).toBe(404);
    expect((await send(as.outsider, 'post', base(), { ...vessel, name: 'Z' })).status).toBe(404);
    expect((await send(as.outsider, 'patch', `${base()}/${item.id}`, { name: 'Z' })).status).toBe(
      404,
    );
    expect((await send(as.outsider, 'delete', `${base()}/${item.id}`)).status).toBe(404);
    // The outsider's own workspace does not reach this item either.
    const own = as.outsider.session.workspaces[0].id;
    expect(
      (
        await send(as.outsider, 'patch', `/api/v1/workspaces/${own}/equipment/${item.id}`, {
          name: 'Z',
        })
      ).status,
    ).toBe(404);
    expect(await Equipment.count({ where: { workspaceId: workspace.id } })).toBe(3);
  });

  it('refuses inconsistent vessels with every problem named on its field, in plain words', async () => {
    const response = await send(as.engineer, 'post', base(), {
      ...vessel,
      name: 'Bad (invented)',
      minStirrableL: 950,
      minC: 200,
      maxC: 100,
      minMbar: 5000,
    });
    expect(response.status).toBe(400);
    const error = apiErrorSchema.parse(response.body).error;
    expect(error.code).toBe('validation_failed');
    const details = (error as { details: { path: string; message: string }[] }).details;
    expect(details).toEqual(
      expect.arrayContaining([
        {
          path: 'minStirrableL',
          message: 'The minimum stirrable volume must be below the maximum working volume.',
        },
        {
          path: 'minC',
          message: 'The lowest temperature must not be above the highest temperature.',
        },
        { path: 'minMbar', message: 'The lowest pressure must not be above the highest pressure.' },
      ]),
    );
    const missing = await send(as.engineer, 'post', base(), { kind: 'vessel', name: 'Half' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.details).toContainEqual({
      path: 'nominalL',
      message: 'Enter the nominal volume in L.',
    });
    const negative = await send(as.engineer, 'post', base(), { ...filter, name: 'N', areaM2: -1 });
    expect(negative.body.error.details).toContainEqual({
      path: 'areaM2',
      message: 'The area cannot be below 0 m².',
    });
    const unknownKind = await send(as.engineer, 'post', base(), { kind: 'centrifuge', name: 'C' });
    expect(unknownKind.status).toBe(400);
  });

  it('a change is checked on the record as it becomes; the kind stays', async () => {
    const items = (await as.engineer.agent.get(base())).body.items;
    const reactor = items.find((i: { kind: string }) => i.kind === 'vessel');
    const nutsche = items.find((i: { kind: string }) => i.kind === 'filter');
    const tooHigh = await send(as.engineer, 'patch', `${base()}/${reactor.id}`, {
      minStirrableL: 900,
    });
    expect(tooHigh.status).toBe(400);
    expect(tooHigh.body.error.details).toEqual([
      {
        path: 'minStirrableL',
        message: 'The minimum stirrable volume must be below the maximum working volume.',
      },
    ]);
    const changed = await send(as.admin, 'patch', `${base()}/${reactor.id}`, {
      maxWorkingL: 950,
      material: 'Hastelloy C-22',
    });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ ...vessel, maxWorkingL: 950, material: 'Hastelloy C-22' });
    const kindChange = await send(as.engineer, 'patch', `${base()}/${nutsche.id}`, {
      kind: 'dryer',
      areaM2: 1,
    });
    expect(kindChange.status).toBe(400);
    expect(kindChange.body.error.details[0].path).toBe('kind');
    const vesselField = await send(as.engineer, 'patch', `${base()}/${nutsche.id}`, {
      nominalL: 100,
    });
    expect(vesselField.status).toBe(400);
    expect(vesselField.body.error.details).toEqual([
      { path: 'nominalL', message: 'A filter has no nominal volume: give its area and capacity.' },
    ]);
    expect((await send(as.engineer, 'patch', `${base()}/${nutsche.id}`, {})).status).toBe(400);
    const audit = await AuditEvent.findOne({
      where: { action: 'equipment.update', entityId: reactor.id },
    });
    expect(audit?.before).toMatchObject({ maxWorkingL: 900 });
    expect(audit?.after).toMatchObject({ maxWorkingL: 950 });
  });

  it('names are unique in the workspace, whatever the case (409)', async () => {
    const clash = await send(as.engineer, 'post', base(), { ...filter, name: 'f-1 (INVENTED)' });
    expect(clash.status).toBe(409);
    expect(clash.body.error.code).toBe('already_exists');
  });

  it('engineers remove equipment; a second delete is 404', async () => {
    const created = await send(as.engineer, 'post', base(), {
      ...filter,
      name: 'Spare (invented)',
    });
    expect((await send(as.engineer, 'delete', `${base()}/${created.body.id}`)).status).toBe(204);
    expect((await send(as.engineer, 'delete', `${base()}/${created.body.id}`)).status).toBe(404);
    expect(
      await AuditEvent.count({ where: { action: 'equipment.delete', entityId: created.body.id } }),
    ).toBe(1);
  });

  it('the demo seed gives the demo workspace its invented vessels, a filter and a dryer, once', async () => {
    const context = { sequelize: database(), queryInterface: database().getQueryInterface() };
    await seedDemoWorkspaces({ context });
    await seedDemoEquipment({ context });
    await seedDemoEquipment({ context });
    const demo = await Workspace.findOne({ where: { slug: DEMO_WORKSPACES[0].slug } });
    const rows = await Equipment.findAll({ where: { workspaceId: demo!.id } });
    expect(rows.map((r) => r.name).sort()).toEqual(DEMO_EQUIPMENT.map((e) => e.name).sort());
    expect(rows.filter((r) => r.kind === 'vessel')).toHaveLength(3);
    expect(DEMO_EQUIPMENT.every((e) => e.name.includes('(invented)'))).toBe(true);
  });
});
