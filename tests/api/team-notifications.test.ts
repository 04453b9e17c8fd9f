import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { notifySchemeStatus, schemeStatusEvent } from '../../server/services/notifications.service';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;

beforeAll(async () => {
  t = await createTestApp();
});

afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const notice = (status: string) => ({
  firmId: t.seed.firmId!,
  schemeId: '11111111-1111-4111-8111-111111111111',
  schemeName: 'Scheme B — 9 m beams',
  projectName: 'Harrow Quay Clinic',
  status,
});

describe('GET/PUT /api/me/notifications', () => {
  it('when nothing was chosen yet, then both notifications are on', async () => {
    const res = await t.agents.manager.get('/api/me/notifications');
    expect(res.status).toBe(200);
    expect(res.body.notifications).toEqual({ schemeSubmitted: true, schemeChosen: true });
  });

  it('when a person turns one off, then it is stored for them alone', async () => {
    const put = await t.agents.engineer.put('/api/me/notifications').send({ schemeSubmitted: true, schemeChosen: false });
    expect(put.status).toBe(200);
    expect(put.body.notifications).toEqual({ schemeSubmitted: true, schemeChosen: false });
    expect((await t.agents.engineer.get('/api/me/notifications')).body.notifications.schemeChosen).toBe(false);
    expect((await t.agents.drafter.get('/api/me/notifications')).body.notifications.schemeChosen).toBe(true);
    // Back on for the tests below.
    await t.agents.engineer.put('/api/me/notifications').send({ schemeSubmitted: true, schemeChosen: true });
  });

  it('when a value is not a boolean, then 400 names the field', async () => {
    const res = await t.agents.engineer.put('/api/me/notifications').send({ schemeSubmitted: 'yes' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['schemeChosen', 'schemeSubmitted']);
  });
});

describe('notifySchemeStatus', () => {
  it('when a scheme is submitted for review, then the managers are e-mailed, and nobody else', async () => {
    const result = await notifySchemeStatus(t.ctx, notice('in_review'));
    expect(result.recipients).toEqual(['manager@example.com']);
    const mail = await t.ctx.db.models.OutboxMessage.findOne({ where: { toAddress: 'manager@example.com' } });
    expect(mail!.getDataValue('subject')).toBe('For review: Scheme B — 9 m beams (Harrow Quay Clinic)');
    expect(mail!.getDataValue('textBody')).toContain('Hello Dominic Hale');
    expect(mail!.getDataValue('firmId')).toBe(t.seed.firmId);
  });

  it('when a scheme is chosen, then its engineers are e-mailed', async () => {
    const result = await notifySchemeStatus(t.ctx, notice('chosen'));
    expect(result.recipients).toEqual(['engineer@example.com']);
    const mail = await t.ctx.db.models.OutboxMessage.findOne({ where: { toAddress: 'engineer@example.com' } });
    expect(mail!.getDataValue('subject')).toBe('Chosen: Scheme B — 9 m beams (Harrow Quay Clinic)');
  });

  it('when the scheme names its engineers, then only those are e-mailed', async () => {
    const result = await notifySchemeStatus(t.ctx, { ...notice('chosen'), engineerUserIds: [t.seed.userIds.drafter!] });
    expect(result.recipients).toEqual([]);
  });

  it('when a manager turned review notices off, then nobody is e-mailed on submit', async () => {
    await t.agents.manager.put('/api/me/notifications').send({ schemeSubmitted: false, schemeChosen: true });
    const before = await t.ctx.db.models.OutboxMessage.count();
    const result = await notifySchemeStatus(t.ctx, notice('in-review'));
    expect(result.recipients).toEqual([]);
    expect(await t.ctx.db.models.OutboxMessage.count()).toBe(before);
  });

  it('when the status goes back to draft, then nothing is sent', async () => {
    expect((await notifySchemeStatus(t.ctx, notice('draft'))).recipients).toEqual([]);
  });

  it.each([
    ['in_review', 'submitted'],
    ['In review', 'submitted'],
    ['review', 'submitted'],
    ['chosen', 'chosen'],
    ['draft', null],
  ])('when the status is %s, then the event is %s', (status, event) => {
    expect(schemeStatusEvent(status)).toBe(event);
  });
});
