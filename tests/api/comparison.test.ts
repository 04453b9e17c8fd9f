import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getWShape } from '../../shared/catalog/w-shapes.catalog';
import { DEMO_UNIT_PRICES } from '../../server/db/seed-demo';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

interface Figures {
  steelWeight_lb: number;
  steel_psf: number;
  pieces: number;
  connections: number;
  floorArea_ft2: number;
  cost_usd: number;
}
interface SchemeRow {
  id: string;
  name: string;
  status: string;
  totals: Figures;
  byLevel: (Figures & { level: string })[];
  byKind: (Figures & { kind: string })[];
  revision: number;
  designedAt: string;
}

describe('project comparison', () => {
  it('when the manager compares the demo project, then both seeded schemes come with totals equal to the sums over their designed members and priced at the example prices', async () => {
    const res = await t.agents.manager.get(`/api/projects/${t.seed.projectId}/comparison`);
    expect(res.status).toBe(200);
    const schemes: SchemeRow[] = res.body.schemes;
    expect(schemes.map((s) => s.name)).toEqual(['Scheme A — beams at about 10 ft', 'Scheme B — beams at about 7.5 ft']);
    expect(schemes.map((s) => s.status)).toEqual(['draft', 'in_review']);
    expect(res.body.prices.prices).toMatchObject({ steel_usd_per_ton: DEMO_UNIT_PRICES.steelUsdPerTon, example: true });

    for (const s of schemes) {
      const design = await t.agents.manager.get(`/api/schemes/${s.id}/design`);
      const members = design.body.members as { shape: string; span_ft: number }[];
      // Beams and girders, plus the gravity columns: shape weight × length of every sized length, one piece per tier
      const columns = design.body.columns as { tiers: unknown[]; levels: { shape: string | null; Lc_ft: number }[] }[];
      const columnLb = columns.reduce((sum, c) => sum + c.levels.reduce((a, l) => a + (l.shape ? getWShape(l.shape).W_plf * l.Lc_ft : 0), 0), 0);
      expect(columnLb).toBeGreaterThan(0);
      const lb = members.reduce((sum, m) => sum + getWShape(m.shape).W_plf * m.span_ft, 0) + columnLb;
      expect(s.totals.steelWeight_lb).toBeCloseTo(lb, 6);
      expect(s.totals.pieces).toBe(members.length + columns.reduce((a, c) => a + c.tiers.length, 0));
      expect(s.totals.connections).toBe(2 * members.length);
      expect(s.totals.steel_psf).toBeCloseTo(lb / s.totals.floorArea_ft2, 9);
      // cost = tons × $/ton + connections × $ each (hand formula)
      expect(s.totals.cost_usd).toBeCloseTo((lb / 2000) * DEMO_UNIT_PRICES.steelUsdPerTon + 2 * members.length * DEMO_UNIT_PRICES.connectionUsdEach, 6);
      const levelSum = s.byLevel.reduce((sum, l) => sum + l.steelWeight_lb, 0);
      expect(levelSum).toBeCloseTo(s.totals.steelWeight_lb, 6);
      expect(s.byLevel.reduce((sum, l) => sum + (l.cost_usd ?? 0), 0)).toBeCloseTo(s.totals.cost_usd, 6);
      expect(s.byKind.map((k) => k.kind)).toEqual(['girder', 'beam', 'column']);
      expect(s.revision).toBe(1);
    }
    // The two schemes differ (beam spacing), which is what a manager weighs.
    expect(schemes[0].totals.pieces).not.toBe(schemes[1].totals.pieces);
  });

  it('when a scheme was saved since its design, then the comparison designs it first (a new run of the current revision)', async () => {
    const { projectId, schemeId } = await makeScheme(t, { designed: true });
    const plan = twoBayPlan() as { members: { shape: string | null }[] };
    plan.members.forEach((m) => (m.shape = 'W24X55'));
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan }).expect(200);
    expect(await t.ctx.db.models.DesignRun.count({ where: { schemeId } })).toBe(1);

    const res = await t.agents.manager.get(`/api/projects/${projectId}/comparison`);
    expect(res.status).toBe(200);
    const [s] = res.body.schemes as SchemeRow[];
    expect(s.revision).toBe(2);
    expect(await t.ctx.db.models.DesignRun.count({ where: { schemeId, revision: 2 } })).toBe(1);
    const spans = plan.members.length;
    const design = await t.agents.manager.get(`/api/schemes/${schemeId}/design`);
    const columns = design.body.columns as { tiers: unknown[]; weight_lb: number }[];
    expect(s.totals.pieces).toBe(spans + columns.reduce((a, c) => a + c.tiers.length, 0));
    // Every member locked at W24X55: weight = 55 lb/ft × Σ span, plus the columns' weight.
    const spanSum = (design.body.members as { span_ft: number }[]).reduce((a, m) => a + m.span_ft, 0);
    expect(s.totals.steelWeight_lb).toBeCloseTo(55 * spanSum + columns.reduce((a, c) => a + c.weight_lb, 0), 6);
  });

  it('when schemes are limited by id and one is archived, then only those come back; archived ones are left out unless asked', async () => {
    const { projectId, schemeId: a } = await makeScheme(t, { name: 'Kept', designed: true });
    const b = (await t.agents.engineer.post(`/api/projects/${projectId}/schemes`).send({ name: 'Shelved', plan: twoBayPlan() })).body.scheme.id;
    const c = (await t.agents.engineer.post(`/api/projects/${projectId}/schemes`).send({ name: 'Third', plan: twoBayPlan() })).body.scheme.id;
    await t.agents.engineer.patch(`/api/schemes/${b}`).send({ archived: true }).expect(200);

    const names = async (q: string) => ((await t.agents.drafter.get(`/api/projects/${projectId}/comparison${q}`)).body.schemes as SchemeRow[]).map((s) => s.name);
    expect(await names('')).toEqual(['Kept', 'Third']);
    expect(await names('?archived=include')).toEqual(['Kept', 'Shelved', 'Third']);
    expect(await names(`?schemes=${c},${a}`)).toEqual(['Third', 'Kept']);

    const foreign = await makeScheme(t, { firm: 'foreign' });
    const bad = await t.agents.manager.get(`/api/projects/${projectId}/comparison?schemes=${a},${foreign.schemeId}`);
    expect(bad.status).toBe(404);
    const junk = await t.agents.manager.get(`/api/projects/${projectId}/comparison?schemes=nope`);
    expect(junk.status).toBe(400);
    expect(Object.keys(junk.body.error.fields)[0]).toMatch(/^schemes/);
  });

  it('when no unit prices are set, then costs are null, never zero', async () => {
    const foreign = await makeScheme(t, { firm: 'foreign', designed: true });
    const res = await t.otherOwner.get(`/api/projects/${foreign.projectId}/comparison`);
    expect(res.status).toBe(200);
    expect(res.body.prices.prices).toBeNull();
    expect(res.body.schemes[0].totals.cost_usd).toBeNull();
    expect(res.body.schemes[0].totals.steelWeight_lb).toBeGreaterThan(0);
  });

  it('when exported as CSV, then it carries the caution, the example prices and one total row per scheme matching the JSON', async () => {
    const json = (await t.agents.drafter.get(`/api/projects/${t.seed.projectId}/comparison`)).body;
    const res = await t.agents.drafter.get(`/api/projects/${t.seed.projectId}/comparison.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="harrow-quay-clinic-tonnage-\d{4}-\d{2}-\d{2}\.csv"/);
    const lines = res.text.split('\r\n');
    expect(lines[1]).toMatch(/^# Caution: .*licensed engineer/);
    expect(lines[3]).toMatch(/invented example/);
    const totals = lines.filter((l) => l.includes(',"total","all",'));
    expect(totals).toHaveLength(2);
    const cells = totals[0].split(',');
    expect(Number(cells[4])).toBe(Math.round(json.schemes[0].totals.steelWeight_lb));
    expect(Number(cells[12])).toBe(Math.round(json.schemes[0].totals.cost_usd));
  });

  it('when exported as PDF, then it is a PDF with a dated title, the caution and both schemes', async () => {
    const res = await t.agents.manager.get(`/api/projects/${t.seed.projectId}/comparison.pdf`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    const text = (await new PDFParse({ data: new Uint8Array(body) }).getText()).text;
    expect(text).toContain('Tonnage comparison: Harrow Quay Clinic');
    expect(text).toMatch(/Issued \d{4}-\d{2}-\d{2}/);
    expect(text).toContain('licensed engineer');
    expect(text).toContain('Scheme B — beams at about 7.5 ft');
    expect(text).toMatch(/than Scheme A — beams at about 10 ft\./);
  });
});
