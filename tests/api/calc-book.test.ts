import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CALC_BOOK_CAUTION } from '../../shared/report/calc-book.report';
import { makeScheme } from './helpers/schemes-fixture';
import { binary, pdfPages } from './helpers/pdf-response';
import { createTestApp, type TestApp } from './helpers/test-app';

// Calc book PDF: the printable calculation report of a scheme, for every role of the firm.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});


/** Extracted text with line breaks and runs of spaces made single spaces. */
const flat = (s: string) => s.replace(/\s+/g, ' ');

async function demoSchemeId(): Promise<string> {
  const schemes = await t.agents.drafter.get(`/api/projects/${t.seed.projectId}/schemes`);
  return schemes.body.schemes[0].id as string;
}

describe('GET /api/schemes/:id/calc-book.pdf', () => {
  it('when a drafter downloads the demo scheme, then the PDF states the codes, the caution on every page and every distinct mark', async () => {
    const schemeId = await demoSchemeId();
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/calc-book.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename=".+-calc-book-r\d+\.pdf"$/);
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const pages = await pdfPages(body);
    expect(pages.length).toBeGreaterThan(2);
    const text = flat(pages.join('\n'));
    expect(text).toContain('AISC 360-16');
    expect(text).toContain('ASCE 7-16');
    expect(text).toContain('IBC Table 1604.3');
    expect(text).toContain(CALC_BOOK_CAUTION);
    pages.forEach((p, i) => {
      expect(flat(p)).toContain(CALC_BOOK_CAUTION);
      expect(flat(p)).toContain(`page ${i + 1} of ${pages.length}`);
    });
    const design = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    const marks = new Set((design.body.members as { mark: string }[]).map((m) => m.mark));
    expect(marks.size).toBeGreaterThan(3);
    for (const mark of marks) expect(text).toContain(mark);
    // Downloaded by: the signed-in drafter (Prepared by names the scheme's engineer).
    expect(text).toContain('Downloaded by Priya Calloway');
  }, 90_000);

  it('when a manager downloads a fixture scheme with members=all, then it has more pages than the distinct book and a section for every member by grid location', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const all = await t.agents.manager.get(`/api/schemes/${schemeId}/calc-book.pdf?members=all`).buffer(true).parse(binary);
    const distinct = await t.agents.manager.get(`/api/schemes/${schemeId}/calc-book.pdf?members=distinct`).buffer(true).parse(binary);
    expect(all.status).toBe(200);
    expect(distinct.status).toBe(200);
    expect(all.headers['content-disposition']).toBe('attachment; filename="fixture-scheme-calc-book-all-r1.pdf"');
    const allPages = await pdfPages(all.body as Buffer);
    const distinctPages = await pdfPages(distinct.body as Buffer);
    expect(allPages.length).toBeGreaterThan(distinctPages.length);
    const text = flat(allPages.join('\n'));
    // Every member's section title names it by kind and grid location (never its id).
    for (const where of ['girder at 1–2 / A', 'girder at 2–3 / A', 'girder at 1–2 / B', 'girder at 2–3 / B', 'beam at A–B / 1)', `beam at A–B / 1+10'-0"`, `beam at A–B / 1+20'-0"`, 'beam at A–B / 2)', `beam at A–B / 2+10'-0"`, `beam at A–B / 2+20'-0"`, 'beam at A–B / 3)']) expect(text).toContain(where);
    expect(text).not.toMatch(/\b(gA12|gB23|b[1-7])\b/);
  });

  it('when the scheme has no current design, then the calc book designs it first', async () => {
    const { schemeId } = await makeScheme(t, { designed: false });
    const res = await t.agents.engineer.get(`/api/schemes/${schemeId}/calc-book.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const design = await t.agents.engineer.get(`/api/schemes/${schemeId}/design`);
    expect(design.status).toBe(200);
    expect(design.body.stale).toBe(false);
  });

  it('when the scheme belongs to another firm, then 404', async () => {
    const { schemeId } = await makeScheme(t, { firm: 'foreign', designed: true });
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/calc-book.pdf`);
    expect(res.status).toBe(404);
  });

  it('when members or level are bad, then 400 naming members, and 404 naming the level', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const bad = await t.agents.drafter.get(`/api/schemes/${schemeId}/calc-book.pdf?members=some`);
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain('members must be all or distinct');
    const level = await t.agents.drafter.get(`/api/schemes/${schemeId}/calc-book.pdf?level=L9`);
    expect(level.status).toBe(404);
    expect(level.body.error.message).toBe('Level "L9" is not a level of this scheme.');
  });

  it('when a drafter downloads the calc book of a scheme an engineer started, then "Prepared by" names the scheme’s engineer and "Downloaded by" the drafter and the time, apart', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const engineer = await t.ctx.db.models.User.findByPk(t.seed.userIds.engineer!);
    const engineerName = engineer!.getDataValue('name');
    const before = new Date();
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/calc-book.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const cover = flat((await pdfPages(res.body as Buffer))[0]);
    expect(cover).toContain(`Prepared by ${engineerName} (the scheme’s engineer)`);
    expect(cover).not.toMatch(/Prepared by Priya Calloway/);
    const m = /Downloaded by Priya Calloway, (\d{4}-\d\d-\d\d \d\d:\d\d) UTC/.exec(cover);
    expect(m).not.toBeNull();
    const at = new Date(`${m![1].replace(' ', 'T')}:00Z`).getTime();
    expect(at).toBeGreaterThanOrEqual(Math.floor(before.getTime() / 60000) * 60000);
    expect(at).toBeLessThanOrEqual(Date.now());
    // The caution once on the cover (plus the page footer), not a second engine notice beside it.
    expect(cover).not.toContain('Engine notice');
  });
});
