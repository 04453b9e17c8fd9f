import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE_NAME } from '../../server/auth/lucia';
import { createTestApp, setCookies, type TestApp } from './helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const newFirm = {
  firmName: 'Brackenridge Steel Design',
  name: 'Anselm Voss',
  email: 'anselm@brackenridge.example',
  password: 'girders-and-beams',
};

describe('POST /api/firms (sign-up)', () => {
  it('when the form is valid, then 201 with the session body, the creator is owner and signed in', async () => {
    const agent = t.anonymous();
    const res = await agent.post('/api/firms').send(newFirm);
    expect(res.status).toBe(201);
    expect(res.body.role).toBe('owner');
    expect(res.body.user).toEqual({
      id: expect.any(String),
      email: newFirm.email,
      name: newFirm.name,
    });
    expect(res.body.firm).toEqual({ id: expect.any(String), name: newFirm.firmName });
    expect(setCookies(res)[SESSION_COOKIE_NAME]).toMatch(/HttpOnly/);

    // Stored: firm, user with an Argon2id hash (never the password), owner membership.
    const { Firm, User, Membership } = t.ctx.db.models;
    const firm = await Firm.findByPk(res.body.firm.id);
    expect(firm?.getDataValue('name')).toBe(newFirm.firmName);
    const user = await User.findOne({ where: { email: newFirm.email } });
    expect(user?.getDataValue('passwordHash')).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(user?.getDataValue('passwordHash')).not.toContain(newFirm.password);
    const membership = await Membership.findOne({
      where: { firmId: res.body.firm.id, userId: res.body.user.id },
    });
    expect(membership?.getDataValue('role')).toBe('owner');

    // The new owner sees an empty firm, not the demo firm's projects.
    const me = await agent.get('/api/session');
    expect(me.status).toBe(200);
    expect(me.body.firm.id).toBe(res.body.firm.id);
    const projects = await agent.get('/api/projects');
    expect(projects.body).toEqual({ projects: [] });
  });

  it('when the email is already registered (any case), then 409 email_taken with fields.email', async () => {
    const res = await t
      .anonymous()
      .post('/api/firms')
      .send({ ...newFirm, firmName: 'Second try', email: 'OWNER@example.com' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('email_taken');
    expect(res.body.error.fields.email).toBeTruthy();
    expect(await t.ctx.db.models.Firm.count({ where: { name: 'Second try' } })).toBe(0);
  });

  it('when the password has fewer than 10 characters, then 400 with fields.password', async () => {
    const res = await t
      .anonymous()
      .post('/api/firms')
      .send({ ...newFirm, email: 'short@example.org', password: 'nine-char' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields).toEqual({ password: 'Password must be at least 10 characters' });
    expect(await t.ctx.db.models.User.count({ where: { email: 'short@example.org' } })).toBe(0);
  });

  it('when fields are missing, then 400 naming each missing field', async () => {
    const res = await t.anonymous().post('/api/firms').send({});
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'firmName', 'name', 'password']);
  });
});
