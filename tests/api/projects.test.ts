import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PROJECT_NAME } from '../../server/db/seed-demo';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

describe('projects API', () => {
  it('when a firm lists projects, then it sees its own (the demo project) and not another firm\'s', async () => {
    await t.otherOwner.post('/api/projects').send({ name: 'Quillon depot' }).expect(201);
    const res = await t.agents.drafter.get('/api/projects');
    expect(res.status).toBe(200);
    const names = res.body.projects.map((p: { name: string }) => p.name);
    expect(names).toContain(DEMO_PROJECT_NAME);
    expect(names).not.toContain('Quillon depot');
  });

  it('when an engineer creates a project, then 201 and the row is stored for the firm with its creator', async () => {
    const res = await t.agents.engineer.post('/api/projects').send({
      name: '  Saltmarsh Library Annex ',
      number: 'LSP-2502',
      client: 'Saltmarsh Borough Libraries',
      address: '3 Ferrier Lane',
      description: '',
    });
    expect(res.status).toBe(201);
    expect(res.body.project).toMatchObject({
      name: 'Saltmarsh Library Annex',
      number: 'LSP-2502',
      client: 'Saltmarsh Borough Libraries',
      address: '3 Ferrier Lane',
      description: null,
      createdBy: t.seed.userIds.engineer,
    });
    const row = await t.ctx.db.models.Project.findByPk(res.body.project.id);
    expect(row?.getDataValue('firmId')).toBe(t.seed.firmId);
    expect(row?.getDataValue('createdBy')).toBe(t.seed.userIds.engineer);
    expect(row?.getDataValue('name')).toBe('Saltmarsh Library Annex');

    const got = await t.agents.manager.get(`/api/projects/${res.body.project.id}`);
    expect(got.status).toBe(200);
    expect(got.body.project).toEqual(res.body.project);
  });

  it('when the name is blank, then 400 with fields.name and nothing is stored', async () => {
    const before = await t.ctx.db.models.Project.count();
    const res = await t.agents.owner.post('/api/projects').send({ name: '   ' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ name: 'Project name is required' });
    expect(await t.ctx.db.models.Project.count()).toBe(before);
  });

  it('when a field is too long, then 400 naming it', async () => {
    const res = await t.agents.owner
      .post('/api/projects')
      .send({ name: 'Ok', number: 'x'.repeat(51) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.number).toBe('Project number is at most 50 characters');
  });

  it('when an owner patches a project, then only the given fields change and null clears one', async () => {
    const created = await t.agents.owner
      .post('/api/projects')
      .send({ name: 'Tern Point Lab', client: 'Tern Point Labs', address: '9 Gull Quay' });
    const id = created.body.project.id;
    const res = await t.agents.owner.patch(`/api/projects/${id}`).send({ name: 'Tern Point Lab B', address: null });
    expect(res.status).toBe(200);
    expect(res.body.project).toMatchObject({ name: 'Tern Point Lab B', client: 'Tern Point Labs', address: null });
    const row = await t.ctx.db.models.Project.findByPk(id);
    expect(row?.get({ plain: true })).toMatchObject({
      name: 'Tern Point Lab B',
      client: 'Tern Point Labs',
      address: null,
    });
  });

  it('when a patch is empty, then 400', async () => {
    const id = t.seed.projectId!;
    const res = await t.agents.owner.patch(`/api/projects/${id}`).send({});
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
  });

  it('when a drafter tries to patch, then 403 and the stored row is unchanged', async () => {
    const id = t.seed.projectId!;
    const res = await t.agents.drafter.patch(`/api/projects/${id}`).send({ name: 'Hijacked' });
    expect(res.status).toBe(403);
    const row = await t.ctx.db.models.Project.findByPk(id);
    expect(row?.getDataValue('name')).toBe(DEMO_PROJECT_NAME);
  });

  it('when an engineer deletes a project, then 204 and the row is gone; again gives 404', async () => {
    const created = await t.agents.engineer.post('/api/projects').send({ name: 'Short-lived' });
    const id = created.body.project.id;
    expect((await t.agents.engineer.delete(`/api/projects/${id}`)).status).toBe(204);
    expect(await t.ctx.db.models.Project.findByPk(id)).toBeNull();
    const again = await t.agents.engineer.delete(`/api/projects/${id}`);
    expect(again.status).toBe(404);
  });

  it("when a manager deletes, then 403 and the project stays", async () => {
    const id = t.seed.projectId!;
    expect((await t.agents.manager.delete(`/api/projects/${id}`)).status).toBe(403);
    expect(await t.ctx.db.models.Project.findByPk(id)).not.toBeNull();
  });

  it("when another firm patches our project, then 404 and the row is unchanged", async () => {
    const id = t.seed.projectId!;
    const res = await t.otherOwner.patch(`/api/projects/${id}`).send({ name: 'Taken over' });
    expect(res.status).toBe(404);
    const row = await t.ctx.db.models.Project.findByPk(id);
    expect(row?.getDataValue('name')).toBe(DEMO_PROJECT_NAME);
  });

  it.each(['not-a-uuid', '1', "1' OR '1'='1", '%00'])(
    'when the id is malformed (%s), then 400 with fields.id, never 500',
    async (bad) => {
      const res = await t.agents.owner.get(`/api/projects/${encodeURIComponent(bad)}`);
      expect(res.status).toBe(400);
      expect(res.body.error.fields.id).toBe('Must be a valid id');
    },
  );

  it('when the id is well formed but unknown, then 404', async () => {
    const res = await t.agents.owner.get('/api/projects/00000000-0000-4000-8000-000000000000');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
