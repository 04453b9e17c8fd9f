import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../shared/drafting/schedule-csv.drafting';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// The schedule as JSON and CSV, read against the stored design.

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
  kind: string;
  level: string;
  shape: string;
  span_ft: number;
  reactions: Record<'start' | 'end', { D_kip: number; L_kip: number }>;
}

describe('GET /api/schemes/:id/schedule.csv?by=mark', () => {
  it('when a drafter downloads it by mark, then it is a plain table: header first, one row per mark with its quantity and envelope reactions', async () => {
    const { schemeId } = await makeScheme(t, { designed: true, name: 'By mark' });
    const design = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/schedule.csv?by=mark`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toBe('attachment; filename="by-mark-schedule-by-mark-r1.csv"');
    const [header, ...records] = parseCsv(res.text);
    expect(header.slice(0, 6)).toEqual(['level', 'level_name', 'mark', 'kind', 'size', 'quantity']);
    const members = design.body.members as DesignMember[];
    const marks = new Set(members.map((m) => `${m.level} ${m.mark}`));
    expect(records).toHaveLength(marks.size);
    const rows = records.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
    expect(rows.reduce((n, r) => n + Number(r.quantity), 0)).toBe(members.length);
    for (const row of rows) {
      const mine = members.filter((m) => m.mark === row.mark && m.level === row.level);
      expect(Number(row.quantity)).toBe(mine.length);
      const maxD = Math.max(...mine.flatMap((m) => [m.reactions.start.D_kip, m.reactions.end.D_kip]));
      expect(Number(row.R_envelope_D_kip)).toBeCloseTo(maxD, 3);
    }
  });

  it('when "by" is neither member nor mark, then 400 names the field', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/schedule.csv?by=level`);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields ?? {})).toContain('by');
  });
});

describe('GET /api/schemes/:id/schedule.csv', () => {
  it('when a drafter downloads it, then it matches the stored design row for row, with units in the headers', async () => {
    const { schemeId } = await makeScheme(t, { designed: true, name: 'Scheme A, "north" bays' });
    const design = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    expect(design.status).toBe(200);
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/schedule.csv`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toBe('attachment; filename="scheme-a-north-bays-schedule-r1.csv"');
    expect(res.headers['x-baywright-caution']).toContain('licensed engineer');
    const text = res.text;
    expect(text.split('\r\n')[0].startsWith('level,level_name,mark,member_id,kind,size,')).toBe(true);
    const [header, ...records] = parseCsv(text);
    expect(header).toEqual(expect.arrayContaining(['span_ft', 'R_start_D_kip', 'R_start_L_kip', 'R_end_D_kip', 'R_end_L_kip', 'R_start_factored_kip']));
    const members = design.body.members as DesignMember[];
    expect(records).toHaveLength(members.length);
    const rows = records.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
    for (const m of members) {
      const row = rows.find((r) => r.member_id === m.id)!;
      expect(row).toBeDefined();
      expect(row.mark).toBe(m.mark);
      expect(row.size).toBe(m.shape);
      expect(row.kind).toBe(m.kind);
      expect(row.level).toBe(m.level);
      expect(Number(row.span_ft)).toBeCloseTo(m.span_ft, 3);
      expect(Number(row.R_start_D_kip)).toBeCloseTo(m.reactions.start.D_kip, 3);
      expect(Number(row.R_start_L_kip)).toBeCloseTo(m.reactions.start.L_kip, 3);
      expect(Number(row.R_end_D_kip)).toBeCloseTo(m.reactions.end.D_kip, 3);
      expect(Number(row.R_end_L_kip)).toBeCloseTo(m.reactions.end.L_kip, 3);
      // LRFD floor: ASCE 7-16 §2.3.1 comb. 2
      expect(Number(row.R_end_factored_kip)).toBeCloseTo(1.2 * m.reactions.end.D_kip + 1.6 * m.reactions.end.L_kip, 2);
      expect(row.camber_in).toBe('');
      expect(row.studs).toBe('');
    }
  });
});

describe('GET /api/schemes/:id/schedule', () => {
  it('when the design is stale, then the scheme is designed first and the rows are of the current revision', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const plan = twoBayPlan() as { members: { id: string; shape: string | null }[] };
    plan.members.find((m) => m.id === 'b2')!.shape = 'W24X62';
    expect((await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan })).status).toBe(200);
    const res = await t.agents.manager.get(`/api/schemes/${schemeId}/schedule`);
    expect(res.status).toBe(200);
    expect(res.body.design.revision).toBe(2);
    expect(res.body.scheme.revision).toBe(2);
    expect(res.body.rows.find((r: { memberId: string }) => r.memberId === 'b2').size).toBe('W24X62');
    expect(res.body.basis).toMatchObject({ method: 'LRFD', floorCombination: '1.2D+1.6L' });
    expect(res.body.caution).toContain('licensed engineer');
    expect(res.body.rows.find((r: { memberId: string }) => r.memberId === 'gA12').gridLocation).toBe('1–2 / A');
  });

  it('when the demo clinic building is read, then every level has rows', async () => {
    const schemes = await t.agents.drafter.get(`/api/projects/${t.seed.projectId}/schemes`);
    const first = schemes.body.schemes[0];
    const res = await t.agents.drafter.get(`/api/schemes/${first.id}/schedule`);
    expect(res.status).toBe(200);
    expect(res.body.levels.length).toBeGreaterThanOrEqual(3);
    for (const level of res.body.levels) expect(res.body.rows.some((r: { level: string }) => r.level === level.id)).toBe(true);
    // Composite: studs in the rows, and no note that the camber and studs columns stay empty.
    expect(res.body.rows.some((r: { studs: number | null }) => (r.studs ?? 0) > 0)).toBe(true);
    expect(res.body.compositeNote).toBeNull();
  });

  it('when no member is composite (the bare-steel fixture), then the schedule says why camber and studs stay empty', async () => {
    const { schemeId } = await makeScheme(t, { designed: true, name: 'Bare steel' });
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/schedule`);
    expect(res.status).toBe(200);
    expect(res.body.rows.every((r: { studs: number | null; camber_in: number | null }) => r.studs == null && r.camber_in == null)).toBe(true);
    expect(res.body.compositeNote).toMatch(/^Camber and studs: no member of this scheme is designed composite/);
  });
});
