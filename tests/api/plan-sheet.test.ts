import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeScheme } from './helpers/schemes-fixture';
import { binary, pdfPages } from './helpers/pdf-response';
import { createTestApp, type TestApp } from './helpers/test-app';

// Plan sheets: the PDF (a page per level) and the drawing model the screen draws.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});


interface DesignMember {
  id: string;
  mark: string;
  level: string;
  shape: string;
}

describe('GET /api/schemes/:id/plan-sheet.pdf', () => {
  it('when a drafter downloads one level, then the PDF holds every mark and size of that level, the title block and the caution', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/plan-sheet.pdf?level=L2&reactions=1`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe('attachment; filename="fixture-scheme-plan-sheet-l2-r1.pdf"');
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const [page, ...rest] = await pdfPages(body);
    expect(rest).toHaveLength(0);
    const design = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    for (const m of design.body.members as DesignMember[]) {
      expect(page).toContain(m.mark);
      expect(page).toContain(m.shape);
    }
    expect(page).toContain('Priya Calloway'); // prepared by: the signed-in drafter
    expect(page).toContain('Fixture scheme');
    expect(page).toContain('CAUTION');
    expect(page).toContain('R=');
    expect(page).toMatch(/SCALE: 1\/8" = 1'-0"/);
  });

  it('when no level is given, then there is one page per level, each with its own marks', async () => {
    const schemes = await t.agents.drafter.get(`/api/projects/${t.seed.projectId}/schemes`);
    const schemeId = schemes.body.schemes[0].id as string;
    const detail = await t.agents.drafter.get(`/api/schemes/${schemeId}`);
    const levels = detail.body.scheme.plan.levels as { id: string; name: string }[];
    const res = await t.agents.manager.get(`/api/schemes/${schemeId}/plan-sheet.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const pages = await pdfPages(res.body as Buffer);
    expect(pages).toHaveLength(levels.length);
    const design = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    levels.forEach((level, i) => {
      expect(pages[i]).toContain(`FRAMING PLAN — ${level.name.toUpperCase()}`);
      for (const m of (design.body.members as DesignMember[]).filter((x) => x.level === level.id)) {
        expect(pages[i]).toContain(m.mark);
        expect(pages[i]).toContain(m.shape);
      }
    });
  });

  it('when the level is not in the scheme, then 404 naming it', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/plan-sheet.pdf?level=L9`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('Level "L9" is not a level of this scheme.');
  });
});

describe('GET /api/schemes/:id/plan-sheet', () => {
  it('when read, then it returns the same drawing model the PDF is drawn from', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/plan-sheet?level=L2`);
    expect(res.status).toBe(200);
    expect(res.body.sheets).toHaveLength(1);
    const sheet = res.body.sheets[0];
    expect([sheet.width_pt, sheet.height_pt]).toEqual([1224, 792]);
    expect(sheet.scale.label).toBe('1/8" = 1\'-0"');
    expect(sheet.drawnMarks).toContain('2G1');
    expect(sheet.primitives.length).toBeGreaterThan(100);
  });
});
