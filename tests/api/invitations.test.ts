import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashOneTimeToken } from '../../server/services/one-time-token.service';
import { createTestApp, setCookies, type Agent, type TestApp } from './helpers/test-app';
import { SESSION_COOKIE_NAME } from '../../server/auth/lucia';

let t: TestApp;
let counter = 0;
const newEmail = () => `invitee-${++counter}@larkspur.example`;

beforeAll(async () => {
  t = await createTestApp();
});

afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

/** The newest outbox message to an address, read the way an owner reads it. */
async function lastMailTo(email: string) {
  const res = await t.agents.owner.get('/api/outbox');
  expect(res.status).toBe(200);
  const mail = (res.body.messages as { to: string; text: string; html: string; subject: string }[]).find((m) =>
    m.to.includes(email),
  );
  if (!mail) throw new Error(`no mail to ${email}`);
  return mail;
}

function tokenFrom(text: string, kind: 'invitations' | 'password-reset'): string {
  const match = text.match(new RegExp(`/${kind}/([a-z0-9]+)`));
  if (!match) throw new Error(`no ${kind} link in: ${text}`);
  return match[1];
}

async function invite(email: string, role = 'engineer', agent: Agent = t.agents.owner) {
  const res = await agent.post('/api/invitations').send({ email, role });
  return res;
}

describe('POST /api/invitations', () => {
  it('when an owner invites an engineer, then 201, the invitation is pending and an e-mail with a link is in the outbox', async () => {
    const email = newEmail();
    const res = await invite(email);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.invitation).toMatchObject({ email, role: 'engineer', status: 'pending', expired: false, invitedBy: 'Imogen Ashdown' });
    const days = (Date.parse(res.body.invitation.expiresAt) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThanOrEqual(7);

    const mail = await lastMailTo(email);
    expect(mail.subject).toBe('Imogen Ashdown invited you to Larkspur Structural Partners on Baywright');
    expect(mail.text).toContain('as an engineer');
    expect(mail.text).toContain(`${t.origin}/invitations/`);
    const token = tokenFrom(mail.text, 'invitations');
    expect(token.length).toBeGreaterThanOrEqual(32);
    expect(mail.html).toContain(`href="${t.origin}/invitations/${token}"`);

    // Only the hash is stored.
    const row = await t.ctx.db.models.Invitation.findByPk(res.body.invitation.id);
    expect(row!.getDataValue('tokenHash')).toBe(hashOneTimeToken(token));
    expect(row!.getDataValue('tokenHash')).not.toContain(token);
    expect(JSON.stringify(row!.get({ plain: true }))).not.toContain(token);
  });

  it.each(['engineer', 'drafter', 'manager'] as const)('when a %s tries to invite, then 403 and nothing is stored', async (role) => {
    const email = newEmail();
    const res = await invite(email, 'engineer', t.agents[role]);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
    expect(await t.ctx.db.models.Invitation.count({ where: { email } })).toBe(0);
  });

  it('when the e-mail or role is wrong, then 400 names each field', async () => {
    const res = await t.agents.owner.post('/api/invitations').send({ email: 'not-an-email', role: 'boss' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'role']);
  });

  it('when the person is already in the team, then 409 already_member on the email field', async () => {
    const res = await invite('engineer@example.com');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('already_member');
    expect(res.body.error.fields.email).toMatch(/already in your team/);
  });

  it('when the address has an account in another firm, then 409 account_exists', async () => {
    const res = await invite('rosalind@quillon.example');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('account_exists');
  });

  it('when an invitation to the address is already waiting, then 409 invitation_pending', async () => {
    const email = newEmail();
    expect((await invite(email)).status).toBe(201);
    const again = await invite(email);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('invitation_pending');
  });
});

describe('GET /api/invitations', () => {
  it('when an owner lists, then pending invitations of the firm only are shown', async () => {
    const email = newEmail();
    await invite(email, 'manager');
    const foreign = await t.otherOwner.post('/api/invitations').send({ email: newEmail(), role: 'drafter' });
    expect(foreign.status).toBe(201);
    const res = await t.agents.owner.get('/api/invitations');
    expect(res.status).toBe(200);
    const emails = res.body.invitations.map((i: { email: string }) => i.email);
    expect(emails).toContain(email);
    expect(emails).not.toContain(foreign.body.invitation.email);
    expect(res.body.invitations.every((i: { status: string }) => i.status === 'pending')).toBe(true);
  });
});

describe('following the link', () => {
  it('when the link is opened, then it shows firm, email and role without signing in', async () => {
    const email = newEmail();
    await invite(email, 'drafter');
    const token = tokenFrom((await lastMailTo(email)).text, 'invitations');
    const res = await t.anonymous().get(`/api/invitations/${token}`);
    expect(res.status).toBe(200);
    expect(res.body.invitation).toMatchObject({ firmName: 'Larkspur Structural Partners', email, role: 'drafter' });
  });

  it('when accepted, then the person exists with the role, is signed in, and a second use answers 410 invitation_used', async () => {
    const email = newEmail();
    await invite(email, 'engineer');
    const token = tokenFrom((await lastMailTo(email)).text, 'invitations');
    const agent = t.anonymous();
    const res = await agent.post(`/api/invitations/${token}/accept`).send({ name: 'Wren Halloway', password: 'a-long-new-password' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ user: { email, name: 'Wren Halloway' }, firm: { name: 'Larkspur Structural Partners' }, role: 'engineer' });
    expect(setCookies(res)[SESSION_COOKIE_NAME]).toMatch(/HttpOnly/);

    const session = await agent.get('/api/session');
    expect(session.status).toBe(200);
    expect(session.body.role).toBe('engineer');

    const user = await t.ctx.db.models.User.findOne({ where: { email } });
    const membership = await t.ctx.db.models.Membership.findOne({ where: { userId: user!.getDataValue('id') } });
    expect(membership!.getDataValue('firmId')).toBe(t.seed.firmId);
    expect(membership!.getDataValue('role')).toBe('engineer');

    // The new password works for a normal sign-in.
    const { res: signIn } = await t.signIn(email, 'a-long-new-password');
    expect(signIn.status).toBe(200);

    const twice = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Someone Else', password: 'another-long-password' });
    expect(twice.status).toBe(410);
    expect(twice.body.error).toMatchObject({ code: 'invitation_used', message: 'This invitation has already been used. Sign in instead.' });
    const preview = await t.anonymous().get(`/api/invitations/${token}`);
    expect(preview.status).toBe(410);
    expect(preview.body.error.code).toBe('invitation_used');
    expect(await t.ctx.db.models.User.count({ where: { email } })).toBe(1);
  });

  it('when the invitation has expired, then opening and accepting answer 410 invitation_expired and nobody is created', async () => {
    const email = newEmail();
    const created = await invite(email);
    const token = tokenFrom((await lastMailTo(email)).text, 'invitations');
    await t.ctx.db.models.Invitation.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { id: created.body.invitation.id } },
    );
    const preview = await t.anonymous().get(`/api/invitations/${token}`);
    expect(preview.status).toBe(410);
    expect(preview.body.error.code).toBe('invitation_expired');
    const accept = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Late Comer', password: 'a-long-new-password' });
    expect(accept.status).toBe(410);
    expect(accept.body.error.code).toBe('invitation_expired');
    expect(accept.body.error.message).toMatch(/expired/);
    expect(await t.ctx.db.models.User.count({ where: { email } })).toBe(0);
    // The owner still sees it, flagged, to resend.
    const list = await t.agents.owner.get('/api/invitations');
    expect(list.body.invitations.find((i: { email: string }) => i.email === email)).toMatchObject({ expired: true });
  });

  it('when the token is unknown, then 404 invitation_not_found', async () => {
    const res = await t.anonymous().get(`/api/invitations/${'a'.repeat(52)}`);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('invitation_not_found');
  });

  it('when name or password are missing or short, then 400 names the fields and the invitation stays usable', async () => {
    const email = newEmail();
    await invite(email);
    const token = tokenFrom((await lastMailTo(email)).text, 'invitations');
    const res = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: ' ', password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({ name: 'Your name is required', password: 'Password must be at least 10 characters' });
    expect((await t.anonymous().get(`/api/invitations/${token}`)).status).toBe(200);
  });
});

describe('resend and revoke', () => {
  it('when an owner resends, then a new link works and the old one answers 410', async () => {
    const email = newEmail();
    const first = await invite(email, 'manager');
    const oldToken = tokenFrom((await lastMailTo(email)).text, 'invitations');
    const resent = await t.agents.owner.post(`/api/invitations/${first.body.invitation.id}/resend`);
    expect(resent.status).toBe(201);
    expect(resent.body.invitation.id).not.toBe(first.body.invitation.id);
    const newToken = tokenFrom((await lastMailTo(email)).text, 'invitations');
    expect(newToken).not.toBe(oldToken);

    const old = await t.anonymous().get(`/api/invitations/${oldToken}`);
    expect(old.status).toBe(410);
    expect(old.body.error.message).toMatch(/replaced by a newer invitation/);
    const fresh = await t.anonymous().get(`/api/invitations/${newToken}`);
    expect(fresh.status).toBe(200);
    expect(fresh.body.invitation.role).toBe('manager');
    // The list holds only the new one.
    const list = await t.agents.owner.get('/api/invitations');
    const ids = list.body.invitations.filter((i: { email: string }) => i.email === email).map((i: { id: string }) => i.id);
    expect(ids).toEqual([resent.body.invitation.id]);
  });

  it('when an owner revokes, then the link answers 410 invitation_revoked and it leaves the list', async () => {
    const email = newEmail();
    const created = await invite(email);
    const token = tokenFrom((await lastMailTo(email)).text, 'invitations');
    const res = await t.agents.owner.delete(`/api/invitations/${created.body.invitation.id}`);
    expect(res.status).toBe(204);
    const accept = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Too Late', password: 'a-long-new-password' });
    expect(accept.status).toBe(410);
    expect(accept.body.error.code).toBe('invitation_revoked');
    const list = await t.agents.owner.get('/api/invitations');
    expect(list.body.invitations.map((i: { email: string }) => i.email)).not.toContain(email);
    // Revoking again: it is closed.
    const again = await t.agents.owner.delete(`/api/invitations/${created.body.invitation.id}`);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('invitation_closed');
  });

  it("when an owner resends or revokes another firm's invitation, then 404", async () => {
    const foreign = await t.otherOwner.post('/api/invitations').send({ email: newEmail(), role: 'drafter' });
    const id = foreign.body.invitation.id;
    expect((await t.agents.owner.post(`/api/invitations/${id}/resend`)).status).toBe(404);
    expect((await t.agents.owner.delete(`/api/invitations/${id}`)).status).toBe(404);
  });
});

describe('a removed person invited again', () => {
  it('when their account has no firm left, then accepting sets the new name and password and restores access', async () => {
    const email = newEmail();
    await invite(email, 'drafter');
    let token = tokenFrom((await lastMailTo(email)).text, 'invitations');
    const first = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Ash Orrin', password: 'first-long-password' });
    const userId = first.body.user.id;
    expect((await t.agents.owner.delete(`/api/team/${userId}`)).status).toBe(204);

    expect((await invite(email, 'manager')).status).toBe(201);
    token = tokenFrom((await lastMailTo(email)).text, 'invitations');
    const back = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Ash Orrin-Vale', password: 'second-long-password' });
    expect(back.status).toBe(201);
    expect(back.body).toMatchObject({ user: { id: userId, name: 'Ash Orrin-Vale' }, role: 'manager' });
    expect((await t.signIn(email, 'first-long-password')).res.status).toBe(401);
    expect((await t.signIn(email, 'second-long-password')).res.status).toBe(200);
  });
});
