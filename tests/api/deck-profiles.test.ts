import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BUILT_IN_DECK_PROFILES } from '../../shared/schemas/deck-profile.schema';
import { twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// The deck profile library (issue 11): built-ins of Baywright's own naming plus the firm's own,
// stored server-side, role rules on the server, zod messages naming the field.
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
}, 120_000);
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

// Invented profile: normal-weight concrete (145 pcf, common practice) 4 in over a 2 in deck.
const SLAB = { ribHeight_in: 2, toppingThickness_in: 4, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 145, fc_ksi: 4, deckWeight_psf: 2 };

describe('deck profile library', () => {
  it('when anyone of the firm reads the library, then the built-in profiles come first, read-only', async () => {
    const res = await t.agents.drafter.get('/api/deck-profiles');
    expect(res.status).toBe(200);
    expect(res.body.profiles.slice(0, BUILT_IN_DECK_PROFILES.length).map((p: { name: string; builtIn: boolean }) => [p.name, p.builtIn])).toEqual(
      BUILT_IN_DECK_PROFILES.map((p) => [p.name, true]),
    );
    expect(res.body.profiles[0].slab).toEqual({ ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 114, fc_ksi: 3.5, deckWeight_psf: 2.5 });
  });

  it('when an engineer adds and then changes a profile, then it is stored for the firm and listed; another firm does not see it', async () => {
    const made = await t.agents.engineer.post('/api/deck-profiles').send({ name: '  2 in deck, 4 in normal-weight topping ', slab: SLAB });
    expect(made.status).toBe(201);
    expect(made.body.profile).toMatchObject({ name: '2 in deck, 4 in normal-weight topping', slab: SLAB, builtIn: false });
    const id = made.body.profile.id as string;
    const row = await t.ctx.db.models.DeckProfile.findByPk(id);
    expect(row!.getDataValue('firmId')).toBe(t.seed.firmId);

    const changed = await t.agents.owner.put(`/api/deck-profiles/${id}`).send({ name: '2 in deck, 4 in topping, f\'c 5', slab: { ...SLAB, fc_ksi: 5 } });
    expect(changed.status).toBe(200);
    expect(changed.body.profile.slab.fc_ksi).toBe(5);
    const list = await t.agents.manager.get('/api/deck-profiles');
    expect(list.body.profiles.filter((p: { builtIn: boolean }) => !p.builtIn).map((p: { name: string }) => p.name)).toEqual(["2 in deck, 4 in topping, f'c 5"]);
    const other = await t.otherOwner.get('/api/deck-profiles');
    expect(other.body.profiles.filter((p: { builtIn: boolean }) => !p.builtIn)).toEqual([]);
    expect((await t.otherOwner.put(`/api/deck-profiles/${id}`).send({ name: 'Taken over', slab: SLAB })).status).toBe(404);
  });

  it('when a drafter or manager writes the library, then 403 and nothing is stored', async () => {
    const before = await t.ctx.db.models.DeckProfile.count();
    for (const role of ['drafter', 'manager'] as const) {
      expect((await t.agents[role].post('/api/deck-profiles').send({ name: `By ${role}`, slab: SLAB })).status).toBe(403);
    }
    expect(await t.ctx.db.models.DeckProfile.count()).toBe(before);
  });

  it('when a value is out of range, not a number, or the ribs are wider than their spacing, then 400 naming each field', async () => {
    const res = await t.agents.engineer.post('/api/deck-profiles').send({ name: '', slab: { ...SLAB, ribHeight_in: 30, fc_ksi: 'four', concreteWeight_pcf: 40 } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({
      name: 'Name is required',
      'slab.ribHeight_in': 'Rib height must be between 0.5 and 8 in',
      'slab.fc_ksi': "f'c must be a number in ksi",
      'slab.concreteWeight_pcf': 'Concrete unit weight must be between 90 and 160 pcf',
    });
    const wide = await t.agents.engineer.post('/api/deck-profiles').send({ name: 'Wide ribs', slab: { ...SLAB, ribAvgWidth_in: 14 } });
    expect(wide.status).toBe(400);
    expect(wide.body.error.fields).toEqual({ 'slab.ribAvgWidth_in': 'Average rib width must not exceed the rib spacing' });
  });

  it('when a name is taken (by a built-in or the firm) or a built-in is changed, then it is refused naming the field, never a 500', async () => {
    const dup = await t.agents.engineer.post('/api/deck-profiles').send({ name: BUILT_IN_DECK_PROFILES[0].name, slab: SLAB });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields).toEqual({ name: 'A deck profile with this name already exists' });
    const builtIn = await t.agents.engineer.put(`/api/deck-profiles/${BUILT_IN_DECK_PROFILES[0].id}`).send({ name: 'Mine now', slab: SLAB });
    expect(builtIn.status).toBe(400);
    expect(builtIn.body.error.fields).toEqual({ id: 'Built-in deck profiles cannot be changed' });
    const made = await t.agents.engineer.post('/api/deck-profiles').send({ name: 'To remove', slab: SLAB });
    expect((await t.agents.engineer.delete(`/api/deck-profiles/${made.body.profile.id}`)).status).toBe(204);
    expect(await t.ctx.db.models.DeckProfile.findByPk(made.body.profile.id)).toBeNull();
  });
});

// Renaming and deleting from the Plan's library (issue 11): the server enforces each rule, the
// refusal names the field, and a deck keeps the build-up it was set from.
describe('deck profile library: rename and delete', () => {
  const make = async (name: string) => {
    const res = await t.agents.engineer.post('/api/deck-profiles').send({ name, slab: SLAB });
    expect(res.status).toBe(201);
    return res.body.profile.id as string;
  };
  const nameOf = async (id: string) => (await t.ctx.db.models.DeckProfile.findByPk(id))?.getDataValue('name');

  it('when a profile is renamed to a blank, overlong or taken name (any letter case), then 400/409 naming "name" and the name is kept', async () => {
    const id = await make('Rename me');
    await make('Level 3 office slab');
    const refusals: [string, number, string][] = [
      ['   ', 400, 'Name is required'],
      ['x'.repeat(121), 400, 'Name is at most 120 characters'],
      ['Level 3 office slab', 409, 'A deck profile with this name already exists'],
      ['LEVEL 3 OFFICE SLAB', 409, 'A deck profile with this name already exists'],
      [BUILT_IN_DECK_PROFILES[1].name.toUpperCase(), 409, 'A deck profile with this name already exists'],
    ];
    for (const [name, status, message] of refusals) {
      const res = await t.agents.owner.patch(`/api/deck-profiles/${id}`).send({ name });
      expect([res.status, res.body.error.fields]).toEqual([status, { name: message }]);
    }
    const missing = await t.agents.owner.patch(`/api/deck-profiles/${id}`).send({});
    expect([missing.status, missing.body.error.fields]).toEqual([400, { name: 'Name is required' }]);
    // The same rules on a full change (PUT).
    const putDup = await t.agents.owner.put(`/api/deck-profiles/${id}`).send({ name: 'level 3 office slab', slab: SLAB });
    expect([putDup.status, putDup.body.error.fields]).toEqual([409, { name: 'A deck profile with this name already exists' }]);
    expect(await nameOf(id)).toBe('Rename me');
    // Its own name in another case, and the longest name allowed, are fine.
    expect((await t.agents.engineer.patch(`/api/deck-profiles/${id}`).send({ name: 'RENAME ME' })).status).toBe(200);
    expect(await nameOf(id)).toBe('RENAME ME');
    const longest = 'y'.repeat(120);
    expect((await t.agents.engineer.patch(`/api/deck-profiles/${id}`).send({ name: ` ${longest} ` })).body.profile.name).toBe(longest);
  });

  it('when a profile is renamed (PATCH), then only its name changes: a build-up another engineer saved meanwhile is kept', async () => {
    const id = await make('Renamed, build-up kept');
    expect((await t.agents.owner.put(`/api/deck-profiles/${id}`).send({ name: 'Renamed, build-up kept', slab: { ...SLAB, fc_ksi: 5 } })).status).toBe(200);
    const res = await t.agents.engineer.patch(`/api/deck-profiles/${id}`).send({ name: 'Renamed on the Plan', slab: SLAB });
    expect(res.status).toBe(200);
    expect(res.body.profile).toEqual({ id, name: 'Renamed on the Plan', slab: { ...SLAB, fc_ksi: 5 }, builtIn: false });
    const builtIn = await t.agents.engineer.patch(`/api/deck-profiles/${BUILT_IN_DECK_PROFILES[2].id}`).send({ name: 'Mine now' });
    expect([builtIn.status, builtIn.body.error.fields]).toEqual([400, { id: 'Built-in deck profiles cannot be changed' }]);
  });

  it('when a new profile takes a firm name in another letter case, then 409 naming "name"', async () => {
    await make('Roof slab, lightweight');
    const res = await t.agents.engineer.post('/api/deck-profiles').send({ name: 'roof slab, LIGHTWEIGHT', slab: SLAB });
    expect([res.status, res.body.error.fields]).toEqual([409, { name: 'A deck profile with this name already exists' }]);
    // Case is folded for every letter, not only ASCII (on SQLite as on PostgreSQL).
    await make('Dalle légère, étage 4');
    const accented = await t.agents.engineer.post('/api/deck-profiles').send({ name: 'DALLE LÉGÈRE, ÉTAGE 4', slab: SLAB });
    expect([accented.status, accented.body.error.fields]).toEqual([409, { name: 'A deck profile with this name already exists' }]);
  });

  it('when a name holds control characters (NUL included), then 400 naming "name", on create and on rename, and nothing is stored', async () => {
    const before = await t.ctx.db.models.DeckProfile.count();
    for (const name of ['Slab\u0000with NUL', 'Bell\u0007', 'Tab\there', 'DEL\u007f']) {
      const res = await t.agents.engineer.post('/api/deck-profiles').send({ name, slab: SLAB });
      expect([res.status, res.body.error.fields]).toEqual([400, { name: 'Name cannot hold control characters' }]);
    }
    expect(await t.ctx.db.models.DeckProfile.count()).toBe(before);
    const id = await make('Kept as it was');
    const rename = await t.agents.engineer.patch(`/api/deck-profiles/${id}`).send({ name: 'Kept\u0000 no more' });
    expect([rename.status, rename.body.error.fields]).toEqual([400, { name: 'Name cannot hold control characters' }]);
    expect(await nameOf(id)).toBe('Kept as it was');
    expect(t.serverErrors).toEqual([]);
  });

  it('when a built-in is deleted, the id is not a profile id, or the profile is unknown or another firm\'s, then a 4xx naming the id and nothing is removed', async () => {
    const builtIn = await t.agents.owner.delete(`/api/deck-profiles/${BUILT_IN_DECK_PROFILES[0].id}`);
    expect([builtIn.status, builtIn.body.error.fields]).toEqual([400, { id: 'Built-in deck profiles cannot be deleted' }]);
    const bad = await t.agents.owner.delete('/api/deck-profiles/not-an-id');
    expect([bad.status, bad.body.error.fields]).toEqual([400, { id: 'Not a deck profile id' }]);
    expect((await t.agents.owner.delete('/api/deck-profiles/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    const id = await make('Kept from the other firm');
    expect((await t.otherOwner.delete(`/api/deck-profiles/${id}`)).status).toBe(404);
    expect(await nameOf(id)).toBe('Kept from the other firm');
    const list = await t.agents.drafter.get('/api/deck-profiles');
    expect(list.body.profiles.filter((p: { builtIn: boolean }) => p.builtIn).length).toBe(BUILT_IN_DECK_PROFILES.length);
  });

  it('when a drafter or manager renames or deletes a firm profile, then 403 forbidden and the profile stays as it was', async () => {
    const id = await make('Not theirs to change');
    for (const role of ['drafter', 'manager'] as const) {
      const del = await t.agents[role].delete(`/api/deck-profiles/${id}`);
      expect([del.status, del.body.error.code]).toEqual([403, 'forbidden']);
      const patch = await t.agents[role].patch(`/api/deck-profiles/${id}`).send({ name: `Renamed by ${role}` });
      expect([patch.status, patch.body.error.code]).toEqual([403, 'forbidden']);
    }
    expect(await nameOf(id)).toBe('Not theirs to change');
  });

  it('when the profile a deck was set from is renamed and then deleted, then the deck keeps its own slab build-up and profile name', async () => {
    const name = 'Clinic floor slab';
    const id = await make(name);
    const raw = twoBayPlan() as { decks: Record<string, unknown>[] };
    const deckSlab = { ...SLAB, profile: name };
    raw.decks[0].slab = deckSlab;
    const created = await t.agents.engineer.post(`/api/projects/${t.seed.projectId}/schemes`).send({ name: 'Deck keeps its slab', plan: raw });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const schemeId = created.body.scheme.id as string;
    const deckId = raw.decks[0].id as string;
    const stored = async () => {
      const got = await t.agents.drafter.get(`/api/schemes/${schemeId}`);
      const row = await t.ctx.db.models.Deck.findOne({ where: { schemeId, elementId: deckId } });
      return { revision: got.body.scheme.revision, plan: got.body.scheme.plan.decks[0].slab, row: JSON.parse(JSON.stringify(row?.getDataValue('slab'))) };
    };
    const before = await stored();
    expect(before.plan).toEqual(deckSlab);

    expect((await t.agents.engineer.put(`/api/deck-profiles/${id}`).send({ name: 'Clinic floor slab, old', slab: { ...SLAB, fc_ksi: 5 } })).status).toBe(200);
    expect(await stored()).toEqual(before);
    expect((await t.agents.owner.patch(`/api/deck-profiles/${id}`).send({ name: 'Clinic floor slab, retired' })).status).toBe(200);
    expect(await stored()).toEqual(before);
    expect((await t.agents.owner.delete(`/api/deck-profiles/${id}`)).status).toBe(204);
    expect(await t.ctx.db.models.DeckProfile.findByPk(id)).toBeNull();
    expect(await stored()).toEqual(before);
  });
});
