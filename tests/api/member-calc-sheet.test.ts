import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CALC_BOOK_CAUTION } from '../../shared/report/calc-book.report';
import { binary, pdfPages } from './helpers/pdf-response';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';
import type { MemberAttributes } from '../../server/models/member.model';

// Issue 16 item 14: the Member sheet's bracing and per-member deflection limits (saved in the
// plan, engineers and owners only, enforced by the server) and the one-member calc sheet PDF.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const flat = (s: string) => s.replace(/\s+/g, ' ');

type PlanJson = { members: Record<string, unknown>[] } & Record<string, unknown>;

/** The fixture plan with b2 braced at its third points and held to live span/600. */
function withB2Settings(): PlanJson {
  const plan = twoBayPlan() as PlanJson;
  const b2 = plan.members.find((m) => m.id === 'b2')!;
  b2.bracing = { points_ft: [12, 24] };
  b2.deflectionLimits = { live: 600, total: null };
  return plan;
}

async function designOf(schemeId: string, memberId: string) {
  const res = await t.agents.engineer.post(`/api/schemes/${schemeId}/design`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  const design = await t.agents.engineer.get(`/api/schemes/${schemeId}/design`);
  return (design.body.members as { id: string; shape: string; ratio: number; Lb_ft: number; design: { checks: { name: string; limit_n?: number }[] } }[]).find((m) => m.id === memberId)!;
}

describe('bracing and deflection limits set on a member', () => {
  it('when an engineer saves b2 braced at third points with live span/600, then the plan keeps both and the design uses them', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const before = await designOf(schemeId, 'b2');
    // Fixture deck spans across the beams: b2 is continuously braced by it (design-basis §3).
    expect(before.Lb_ft).toBe(0);
    expect(before.design.checks.find((c) => c.name === 'deflectionLive')?.limit_n).toBe(360); // design basis, IBC Table 1604.3

    const put = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: withB2Settings() });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    const exported = await t.agents.drafter.get(`/api/schemes/${schemeId}/export`);
    const b2 = (JSON.parse(exported.text) as PlanJson).members.find((m) => m.id === 'b2')!;
    expect(b2.bracing).toEqual({ points_ft: [12, 24] });
    expect(b2.deflectionLimits).toEqual({ live: 600, total: null });
    const untouched = (JSON.parse(exported.text) as PlanJson).members.find((m) => m.id === 'b3')!;
    expect('deflectionLimits' in untouched).toBe(false);

    const after = await designOf(schemeId, 'b2');
    expect(after.Lb_ft).toBe(12); // 36 ft span braced at third points: 36 / 3
    expect(after.design.checks.find((c) => c.name === 'deflectionLive')?.limit_n).toBe(600);
    const b3 = await designOf(schemeId, 'b3');
    expect(b3.design.checks.find((c) => c.name === 'deflectionLive')?.limit_n).toBe(360);
    // Stricter limit and a longer Lb: the same or a heavier shape, and never a lower ratio on the old shape.
    expect(after.shape !== before.shape || after.ratio > before.ratio).toBe(true);
  });

  it.each(['drafter', 'manager'] as const)('when a %s sends the same settings, then 403 and the stored plan is unchanged', async (role) => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const res = await t.agents[role].put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: withB2Settings() });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBeTruthy();
    const rows = (await t.ctx.db.models.Member.findAll({ where: { schemeId, elementId: 'b2' }, raw: true })) as unknown as MemberAttributes[];
    expect(rows).toHaveLength(1);
    expect(rows[0].bracing).toBeNull();
    expect(rows[0].deflectionLimits).toBeNull();
    const scheme = await t.agents.engineer.get(`/api/schemes/${schemeId}`);
    expect(scheme.body.scheme?.revision ?? scheme.body.revision).toBe(1);
  });

  it('when a member limit is not a positive span/n denominator, then 422 naming the member and field, and nothing is stored', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const plan = twoBayPlan() as PlanJson;
    plan.members.find((m) => m.id === 'b2')!.deflectionLimits = { live: -600 };
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body.error)).toContain('members[5] (id b2).deflectionLimits.live');
    const rows = (await t.ctx.db.models.Member.findAll({ where: { schemeId, elementId: 'b2' }, raw: true })) as unknown as MemberAttributes[];
    expect(rows[0].deflectionLimits).toBeNull();
  });
});

describe('GET /api/schemes/:id/members/:memberId/calc-sheet.pdf', () => {
  it('when a drafter downloads b2 after an engineer set its bracing and limit, then the PDF reads its working, the limits with their source and the caution on every page', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    expect((await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: withB2Settings() })).status).toBe(200);
    const design = await designOf(schemeId, 'b2');
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/members/b2/calc-sheet.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="fixture-scheme-calc-sheet-[a-z0-9-]+-r2\.pdf"$/);
    const pages = await pdfPages(res.body as Buffer);
    expect(pages.length).toBeGreaterThanOrEqual(1);
    expect(pages.length).toBeLessThanOrEqual(4);
    const text = flat(pages.join('\n'));
    expect(text).toContain('Member calc sheet');
    expect(text).toContain('Scheme fixture project');
    expect(text).toContain('Fixture scheme');
    expect(text).toContain(design.shape);
    expect(text).toContain('Mu (required flexural strength)');
    expect(text).toContain('Vu (required shear strength)');
    expect(text).toContain('AISC 360-16 F2');
    expect(text).toContain('AISC 360-16 G2.1');
    expect(text).toContain('Eq. F1-1');
    expect(text).toContain('span/600; set on this member');
    expect(text).toContain('span/240; from the design basis');
    expect(text).toContain('at 12.00 ft, 24.00 ft; set on this member');
    expect(text).toContain('Priya Calloway'); // the seeded drafter who downloaded it
    pages.forEach((p, i) => {
      expect(flat(p)).toContain(CALC_BOOK_CAUTION);
      expect(flat(p)).toContain(`page ${i + 1} of ${pages.length}`);
    });
    // Only this member: no other member's section.
    expect(text).not.toContain('(beam b3)');
  });

  it('when the member is not in the scheme, then 404 naming it', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const res = await t.agents.engineer.get(`/api/schemes/${schemeId}/members/b99/calc-sheet.pdf`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toContain('b99');
  });

  it('when the scheme belongs to another firm, then 404', async () => {
    const { schemeId } = await makeScheme(t, { firm: 'foreign', designed: true });
    const res = await t.agents.manager.get(`/api/schemes/${schemeId}/members/b2/calc-sheet.pdf`);
    expect(res.status).toBe(404);
  });
});
