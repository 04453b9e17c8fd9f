import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeScheme } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// The design read, the schedule and the plan save after the load work (issue 17): bodies
// serialised once per design run are the same bytes res.json would send, carry a validator
// (304 when the client holds them) and a gzip encoding; anything that changes what they are
// made of (a new run, a save, a rename) gives a new body; a save that changes one table
// leaves the rows of the others as they were and the plan whole.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

async function exportOf(schemeId: string) {
  return (await t.agents.engineer.get(`/api/schemes/${schemeId}/export`)).body;
}

describe('design read', () => {
  it('when a design is posted and then read, then both bodies are the same bytes, JSON.stringify of the view, with a validator that answers 304 and a gzip encoding of the same bytes', async () => {
    const { schemeId } = await makeScheme(t);
    const posted = await t.agents.engineer.post(`/api/schemes/${schemeId}/design`);
    expect(posted.status).toBe(200);
    expect(posted.headers['content-type']).toBe('application/json; charset=utf-8');
    const first = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    const second = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    expect(first.status).toBe(200);
    // Same run: the POST answer and every read are the one body, and it is what res.json gives of the view.
    expect(first.text).toBe(posted.text);
    expect(second.text).toBe(first.text);
    expect(first.text).toBe(JSON.stringify(JSON.parse(first.text)));
    expect(Object.keys(first.body).slice(-3)).toEqual(['revision', 'designedAt', 'stale']);
    expect(first.body).toMatchObject({ revision: 1, stale: false });
    expect(first.body.members).toHaveLength(11);

    const etag = first.headers.etag as string;
    expect(etag).toMatch(/^W\/"[A-Za-z0-9_-]{27}"$/);
    const notModified = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`).set('If-None-Match', etag);
    expect(notModified.status).toBe(304);
    expect(notModified.text ?? '').toBe('');

    // supertest decodes gzip itself: the decoded text is the identity body, and what was sent is far smaller.
    const gz = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`).set('Accept-Encoding', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.text).toBe(first.text);
    expect(Number(gz.headers['content-length'])).toBeLessThan(Buffer.byteLength(first.text) / 4);
    const plain = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`).set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(Number(plain.headers['content-length'])).toBe(Buffer.byteLength(first.text));
    expect(plain.text).toBe(first.text);
  });

  it('when the scheme is saved after its design, then the read says stale under a different validator, and a new design gives a new body', async () => {
    const { schemeId } = await makeScheme(t);
    await t.agents.engineer.post(`/api/schemes/${schemeId}/design`);
    const before = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    const plan = await exportOf(schemeId);
    plan.zones[0].superimposedDead_psf += 5;
    const saved = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    expect(saved.status).toBe(200);
    const stale = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    expect(stale.body).toMatchObject({ revision: 1, stale: true });
    expect(stale.headers.etag).not.toBe(before.headers.etag);
    // The validator of the current body no longer matches: a full answer, not 304.
    expect((await t.agents.drafter.get(`/api/schemes/${schemeId}/design`).set('If-None-Match', before.headers.etag as string)).status).toBe(200);
    await t.agents.engineer.post(`/api/schemes/${schemeId}/design`);
    const fresh = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    expect(fresh.body).toMatchObject({ revision: 2, stale: false });
  });

  it('when two designs of one revision are asked for at once, then one run is stored and both get its body', async () => {
    const { schemeId } = await makeScheme(t);
    const [a, b] = await Promise.all([
      t.agents.engineer.post(`/api/schemes/${schemeId}/design`),
      t.agents.engineer.post(`/api/schemes/${schemeId}/design`),
    ]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect(a.text).toBe(b.text);
    expect(await t.ctx.db.models.DesignRun.count({ where: { schemeId } })).toBe(1);
  });
});

describe('schedule', () => {
  it('when the schedule is read twice, then the same bytes come back; after a save or a rename the schedule follows', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const first = await t.agents.drafter.get(`/api/schemes/${schemeId}/schedule`);
    const again = await t.agents.drafter.get(`/api/schemes/${schemeId}/schedule`);
    expect(first.status).toBe(200);
    expect(again.text).toBe(first.text);
    expect(first.body.scheme).toMatchObject({ revision: 1, name: 'Fixture scheme' });
    expect(first.body.rows).toHaveLength(11);

    const plan = await exportOf(schemeId);
    plan.zones[0].live_psf += 20;
    expect((await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan })).status).toBe(200);
    const saved = await t.agents.drafter.get(`/api/schemes/${schemeId}/schedule`);
    expect(saved.body.scheme.revision).toBe(2);
    expect(saved.body.design.revision).toBe(2);

    expect((await t.agents.engineer.patch(`/api/schemes/${schemeId}`).send({ name: 'Renamed scheme' })).status).toBe(200);
    const renamed = await t.agents.drafter.get(`/api/schemes/${schemeId}/schedule`);
    expect(renamed.body.scheme).toMatchObject({ revision: 2, name: 'Renamed scheme' });
    expect(renamed.body.rows).toEqual(saved.body.rows);
  });
});

describe('plan save', () => {
  it('when a save changes one zone, then only the zone rows are rewritten, the others keep their rows, and the export is the plan sent', async () => {
    const { schemeId } = await makeScheme(t);
    const { Member, Zone, Level } = t.ctx.db.models;
    const ids = async (model: typeof Member) => (await model.findAll({ where: { schemeId }, order: [['position', 'ASC']], attributes: ['id'] })).map((r) => r.getDataValue('id') as string);
    // First save from revision 1 rewrites everything (this process has no record of revision 1's rows).
    let plan = await exportOf(schemeId);
    expect((await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan })).status).toBe(200);
    const members = await ids(Member);
    const levels = await ids(Level as unknown as typeof Member);
    const zones = await ids(Zone as unknown as typeof Member);

    plan = await exportOf(schemeId);
    plan.zones[0].superimposedDead_psf += 0.5;
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan });
    expect(res.status).toBe(200);
    expect(res.body.revision).toBe(3);
    expect(await ids(Member)).toEqual(members);
    expect(await ids(Level as unknown as typeof Member)).toEqual(levels);
    expect(await ids(Zone as unknown as typeof Member)).not.toEqual(zones);
    expect(await exportOf(schemeId)).toEqual(plan);

    // A member edit next: the members are rewritten and the export still equals what was sent.
    plan.members[0].maxDepth_in = 18;
    expect((await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 3, plan })).status).toBe(200);
    expect(await ids(Member)).not.toEqual(members);
    expect(await exportOf(schemeId)).toEqual(plan);
  });
});
