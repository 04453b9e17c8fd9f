import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// The audit log records scheme writes, plan revisions and design runs: who (user and actor
// label), when, and the scheme and revision in detail. Each case goes through the API and
// reads the owner's GET /api/audit.

let t: TestApp;
let projectName: string;

beforeAll(async () => {
  t = await createTestApp();
  const project = await t.ctx.db.models.Project.findByPk(t.seed.projectId!);
  projectName = project!.getDataValue('name');
});

afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

type Event = {
  action: string;
  userId: string | null;
  actor: string | null;
  target: string | null;
  detail: Record<string, unknown> | null;
  createdAt: string;
};

async function audit(query = ''): Promise<Event[]> {
  const limited = `${query}${query ? '&' : '?'}limit=500`;
  const res = await t.agents.owner.get(`/api/audit${limited}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.events;
}

/** This scheme's events (newest first), optionally filtered through the API. */
async function eventsOf(schemeId: string, query = ''): Promise<Event[]> {
  return (await audit(query)).filter((e) => e.detail?.schemeId === schemeId);
}

/** Imports the two-bay fixture into the demo project as the engineer; returns its id. */
async function importScheme(name: string): Promise<string> {
  const res = await t.agents.engineer.post(`/api/projects/${t.seed.projectId}/schemes`).send({ name, plan: twoBayPlan() });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.scheme.id;
}

const ENGINEER = 'Tobias Renfrew <engineer@example.com>';
const OWNER = 'Imogen Ashdown <owner@example.com>';
const MANAGER = 'Dominic Hale <manager@example.com>';

describe('scheme and plan events', () => {
  it('when a scheme is imported, saved, restored, designed, cloned and deleted, then each is in the log with its user, scheme and revision', async () => {
    const started = Date.now();
    const schemeId = await importScheme('Audit scheme — beams at 8 ft');
    const target = `${projectName} / Audit scheme — beams at 8 ft`;

    const edited = twoBayPlan() as { members: unknown[] };
    edited.members = edited.members.slice(0, 5);
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: edited, note: 'fewer beams' }).expect(200);
    await t.agents.owner.post(`/api/schemes/${schemeId}/revisions/1/restore`).expect(200);
    const design = await t.agents.engineer.post(`/api/schemes/${schemeId}/design`);
    expect(design.status).toBe(200);
    const clone = await t.agents.engineer.post(`/api/schemes/${schemeId}/clone`).send({ name: 'Audit scheme, copy' });
    expect(clone.status).toBe(201);
    const cloneId: string = clone.body.scheme.id;
    await t.agents.engineer.delete(`/api/schemes/${schemeId}`).expect(204);

    const events = (await eventsOf(schemeId)).reverse();
    expect(events.map((e) => [e.action, e.userId, e.actor, e.target])).toEqual([
      ['scheme.imported', t.seed.userIds.engineer, ENGINEER, target],
      ['plan.revised', t.seed.userIds.engineer, ENGINEER, target],
      ['plan.restored', t.seed.userIds.owner, OWNER, target],
      ['design.run', t.seed.userIds.engineer, ENGINEER, target],
      ['scheme.deleted', t.seed.userIds.engineer, ENGINEER, target],
    ]);
    const [imported, revised, restored, designed, deleted] = events;
    expect(imported.detail).toEqual({ schemeId, projectId: t.seed.projectId, revision: 1, repairs: 1 }); // the version 1 → 2 migration is listed as a repair
    expect(revised.detail).toEqual({ schemeId, projectId: t.seed.projectId, revision: 2, previousRevision: 1, note: 'fewer beams' });
    expect(restored.detail).toEqual({ schemeId, projectId: t.seed.projectId, revision: 3, restoredFrom: 1, previousRevision: 2 });
    // The run is of revision 3 (the restored plan) and carries the response's totals.
    expect(designed.detail).toMatchObject({
      schemeId,
      revision: 3,
      trigger: 'requested',
      steelWeight_lb: design.body.totals.steelWeight_lb,
      pieces: design.body.totals.pieces,
    });
    expect(typeof designed.detail?.designRunId).toBe('string');
    expect(deleted.detail).toEqual({ schemeId, projectId: t.seed.projectId, revision: 3 });
    for (const e of events) {
      expect(Date.parse(e.createdAt)).toBeGreaterThanOrEqual(started - 1000);
      expect(Date.parse(e.createdAt)).toBeLessThanOrEqual(Date.now() + 1000);
    }

    const [cloned] = await eventsOf(cloneId, '?action=scheme.cloned');
    expect(cloned).toMatchObject({
      userId: t.seed.userIds.engineer,
      target: `${projectName} / Audit scheme, copy`,
      detail: {
        schemeId: cloneId,
        revision: 1,
        sourceSchemeId: schemeId,
        source: 'Audit scheme — beams at 8 ft',
        sourceRevision: 3,
        designCopied: true,
      },
    });
    expect(await t.ctx.db.models.DesignRun.count({ where: { schemeId: cloneId } })).toBe(1);
  });

  it('when the log is filtered by one of the new actions or by area, then only those events come back', async () => {
    const schemeId = await importScheme('Audit filter scheme');
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: twoBayPlan() }).expect(200);
    await t.agents.engineer.post(`/api/schemes/${schemeId}/revisions/1/restore`).expect(200);
    await t.agents.engineer.post(`/api/schemes/${schemeId}/design`).expect(200);

    for (const action of ['scheme.imported', 'plan.revised', 'plan.restored', 'design.run']) {
      const filtered = await audit(`?action=${action}`);
      expect(filtered.length).toBeGreaterThan(0);
      expect(filtered.every((e) => e.action === action)).toBe(true);
      expect(filtered.filter((e) => e.detail?.schemeId === schemeId)).toHaveLength(1);
    }
    const plan = await eventsOf(schemeId, '?action=plan');
    expect(plan.map((e) => [e.action, e.detail?.revision])).toEqual([
      ['plan.restored', 3],
      ['plan.revised', 2],
    ]);
    const byEngineer = await eventsOf(schemeId, `?userId=${t.seed.userIds.engineer}&action=scheme`);
    expect(byEngineer.map((e) => e.action)).toEqual(['scheme.imported']);
    expect(await eventsOf(schemeId, `?userId=${t.seed.userIds.owner}`)).toEqual([]);
  });

  it('when a scheme is created empty, renamed, archived and brought back, then each is recorded with from and to', async () => {
    const res = await t.agents.engineer.post(`/api/projects/${t.seed.projectId}/schemes`).send({ name: 'Audit empty scheme' });
    expect(res.status).toBe(201);
    const schemeId: string = res.body.scheme.id;
    await t.agents.engineer.patch(`/api/schemes/${schemeId}`).send({ name: 'Audit renamed scheme' }).expect(200);
    await t.agents.engineer.patch(`/api/schemes/${schemeId}`).send({ archived: true }).expect(200);
    await t.agents.engineer.patch(`/api/schemes/${schemeId}`).send({ archived: false }).expect(200);
    // Same name again: nothing changed, nothing recorded.
    await t.agents.engineer.patch(`/api/schemes/${schemeId}`).send({ name: 'Audit renamed scheme' }).expect(200);

    const events = (await eventsOf(schemeId, '?action=scheme')).reverse();
    expect(events.map((e) => [e.action, e.target])).toEqual([
      ['scheme.created', `${projectName} / Audit empty scheme`],
      ['scheme.renamed', `${projectName} / Audit renamed scheme`],
      ['scheme.archived', `${projectName} / Audit renamed scheme`],
      ['scheme.unarchived', `${projectName} / Audit renamed scheme`],
    ]);
    expect(events[1].detail).toMatchObject({ from: 'Audit empty scheme', to: 'Audit renamed scheme' });
  });

  it('when a save conflicts or is refused, then nothing is recorded for it', async () => {
    const schemeId = await importScheme('Audit conflict scheme');
    const sized = (shape: string) => {
      const plan = twoBayPlan() as { members: { id: string; shape: string | null }[] };
      plan.members = plan.members.map((m) => (m.id === 'b2' ? { ...m, shape } : m));
      return plan;
    };
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: sized('W21X44') }).expect(200);
    // Both changed beam b2 differently: a conflict (different elements would have merged).
    expect((await t.agents.owner.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: sized('W24X55') })).status).toBe(409);
    expect((await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: { format: 'nope' } })).status).toBe(422);
    const revised = await eventsOf(schemeId, '?action=plan.revised');
    expect(revised.map((e) => [e.userId, e.detail?.revision])).toEqual([[t.seed.userIds.engineer, 2]]);
  });
});

describe('implicit design runs', () => {
  it('when the demo is seeded, then its design runs are recorded for the demo engineer with trigger seed', async () => {
    const seeded = (await audit('?action=design.run')).filter((e) => e.detail?.trigger === 'seed');
    // Two demo schemes (Scheme A and Scheme B), each designed once on seeding.
    expect(seeded).toHaveLength(2);
    expect(seeded.map((e) => e.detail?.schemeId).sort()).toEqual([...((t.seed.demoSchemeIds as string[] | undefined) ?? [])].sort());
    expect(seeded.every((e) => e.userId === t.seed.userIds.engineer)).toBe(true);
  });

  it('when a stale design is read through the Tonnage comparison, then the run is recorded for the reader with trigger on_read', async () => {
    const schemeId = await importScheme('Audit on-read scheme');
    const res = await t.agents.manager.get(`/api/projects/${t.seed.projectId}/comparison?schemes=${schemeId}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const runs = await eventsOf(schemeId, '?action=design.run');
    expect(runs.map((e) => [e.userId, e.actor, e.detail?.trigger, e.detail?.revision])).toEqual([
      [t.seed.userIds.manager, MANAGER, 'on_read', 1],
    ]);
    // Read again: the design is current, no new run and no new entry.
    await t.agents.manager.get(`/api/projects/${t.seed.projectId}/comparison?schemes=${schemeId}`).expect(200);
    expect(await eventsOf(schemeId, '?action=design.run')).toHaveLength(1);
  });
});

describe('when the audit log cannot be written', () => {
  it('then the save still succeeds and is stored, and the failure is logged', async () => {
    const schemeId = await importScheme('Audit failure scheme');
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {});
    const create = vi.spyOn(t.ctx.db.models.AuditEvent, 'create').mockRejectedValueOnce(new Error('audit table locked'));
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: twoBayPlan() });
    create.mockRestore();
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.revision).toBe(2);
    const scheme = await t.ctx.db.models.Scheme.findByPk(schemeId);
    expect(scheme!.getDataValue('revision')).toBe(2);
    expect(await t.ctx.db.models.PlanRevision.count({ where: { schemeId } })).toBe(2);
    expect(logged).toHaveBeenCalledWith(expect.stringContaining('plan.revised'), expect.any(Error));
    logged.mockRestore();
    expect(await eventsOf(schemeId, '?action=plan.revised')).toEqual([]);
  });
});
