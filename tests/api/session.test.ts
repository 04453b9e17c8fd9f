import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE_NAME } from '../../server/auth/lucia';
import { DEMO_FIRM_NAME, DEMO_PASSWORD } from '../../server/db/seed-demo';
import { createTestApp, setCookies, type TestApp } from './helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

describe('POST /api/session (sign in)', () => {
  it('when the credentials are right, then it answers the session body and sets an HttpOnly Lax cookie', async () => {
    const { res } = await t.signIn('engineer@example.com', DEMO_PASSWORD);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      user: { id: t.seed.userIds.engineer, email: 'engineer@example.com', name: 'Tobias Renfrew' },
      firm: { id: t.seed.firmId, name: DEMO_FIRM_NAME },
      role: 'engineer',
    });
    const cookie = setCookies(res)[SESSION_COOKIE_NAME];
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).not.toMatch(/Secure/); // test config: COOKIE_SECURE off
  });

  it('when the email differs only in case and spaces, then it still signs in', async () => {
    const { res } = await t.signIn('  Drafter@Example.COM ', DEMO_PASSWORD);
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('drafter');
  });

  it('when the password is wrong, then 401 invalid_credentials and no cookie', async () => {
    const { res } = await t.signIn('manager@example.com', 'not-the-password');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({
      error: { code: 'invalid_credentials', message: 'Email or password is not right.' },
    });
    expect(setCookies(res)[SESSION_COOKIE_NAME]).toBeUndefined();
  });

  it('when the email is unknown, then the answer is the same as for a wrong password', async () => {
    const { res } = await t.signIn('nobody@example.com', 'whatever-password');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_credentials');
  });

  it('when the body is malformed, then 400 invalid_input naming the fields', async () => {
    const res = await t.anonymous().post('/api/session').send({ email: 'not-an-email' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'password']);
  });

  it('when the body is not JSON at all, then 400 invalid_json', async () => {
    const res = await t
      .anonymous()
      .post('/api/session')
      .set('Content-Type', 'application/json')
      .send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });

  it('when the password is not a string, then 400 with fields.password', async () => {
    const res = await t
      .anonymous()
      .post('/api/session')
      .send({ email: 'owner@example.com', password: 12345 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toBeTruthy();
  });
});

describe('GET /api/session', () => {
  it('when signed in, then it answers user, firm and role', async () => {
    const res = await t.agents.manager.get('/api/session');
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe('manager@example.com');
    expect(res.body.firm.name).toBe(DEMO_FIRM_NAME);
    expect(res.body.role).toBe('manager');
  });

  it('when anonymous, then 401 unauthenticated', async () => {
    const res = await t.anonymous().get('/api/session');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('when the cookie is forged, then 401 and the cookie is cleared', async () => {
    const agent = t.anonymous();
    const res = await agent
      .get('/api/session')
      .set('Cookie', `${SESSION_COOKIE_NAME}=forgedsessionid0000000000000000000000000`);
    expect(res.status).toBe(401);
    const cleared = setCookies(res)[SESSION_COOKIE_NAME];
    expect(cleared).toMatch(/Max-Age=0/);
  });

  it('when the stored session has expired, then 401, the row is gone and the cookie is cleared', async () => {
    const session = await t.ctx.lucia.createSession(t.seed.userIds.owner!, {
      firmId: t.seed.firmId!,
    });
    const cookie = `${SESSION_COOKIE_NAME}=${session.id}`;
    expect((await t.anonymous().get('/api/session').set('Cookie', cookie)).status).toBe(200);
    const { Session } = t.ctx.db.models;
    await Session.update({ expiresAt: new Date(Date.now() - 60_000) }, { where: { id: session.id } });

    const res = await t.anonymous().get('/api/session').set('Cookie', cookie);
    expect(res.status).toBe(401);
    expect(setCookies(res)[SESSION_COOKIE_NAME]).toMatch(/Max-Age=0/);
    expect(await Session.findByPk(session.id)).toBeNull();
  });

  it('when the membership was removed, then the session no longer works', async () => {
    const agent = await t.freshAgent('other-owner');
    expect((await agent.get('/api/session')).status).toBe(200);
    const { Membership } = t.ctx.db.models;
    const row = await Membership.findOne({ where: { firmId: t.otherFirmId } });
    const saved = row!.get({ plain: true });
    await row!.destroy();
    try {
      expect((await agent.get('/api/session')).status).toBe(401);
    } finally {
      await Membership.create(saved);
    }
  });
});

describe('DELETE /api/session (sign out)', () => {
  it('when signed in, then 204, the session row is deleted and the old cookie no longer works', async () => {
    const { agent, res: signedIn } = await t.signIn('owner@example.com', DEMO_PASSWORD);
    const cookie = setCookies(signedIn)[SESSION_COOKIE_NAME].split(';')[0];
    const sessionId = cookie.split('=')[1];
    expect(await t.ctx.db.models.Session.findByPk(sessionId)).not.toBeNull();

    const res = await agent.delete('/api/session');
    expect(res.status).toBe(204);
    expect(setCookies(res)[SESSION_COOKIE_NAME]).toMatch(/Max-Age=0/);
    expect(await t.ctx.db.models.Session.findByPk(sessionId)).toBeNull();

    const replay = await t.anonymous().get('/api/session').set('Cookie', cookie);
    expect(replay.status).toBe(401);
  });
});

describe('cookie security flag', () => {
  it('when COOKIE_SECURE is on, then the session cookie is Secure', async () => {
    const secure = await createTestApp({ cookieSecure: true });
    try {
      const { res } = await secure.signIn('owner@example.com', DEMO_PASSWORD);
      expect(res.status).toBe(200);
      expect(setCookies(res)[SESSION_COOKIE_NAME]).toMatch(/; Secure/);
    } finally {
      await secure.close();
    }
  });

});
