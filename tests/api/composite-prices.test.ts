import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getWShape } from '../../shared/catalog/w-shapes.catalog';
import { createTestApp, type TestApp } from './helpers/test-app';

// Unit prices for shear studs (each) and camber (per cambered piece), and the Tonnage cost
// that prices them (issue 11). Prices are our own invented figures, not a quotation.
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
}, 120_000); // the demo seed designs both schemes; a loaded machine needs the room
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const PRICES = { steel_usd_per_ton: 5000, connection_usd_each: 200, stud_usd_each: 4.5, camber_usd_each: 350 };

interface Figures {
  steelWeight_lb: number;
  connections: number;
  studs: number;
  camberedPieces: number;
  steel_usd: number | null;
  connections_usd: number | null;
  studs_usd: number | null;
  camber_usd: number | null;
  cost_usd: number | null;
}

describe('stud and camber prices', () => {
  it('when the owner sets a stud and a camber price, then both are stored on the new row, returned, and nothing is left unpriced', async () => {
    const res = await t.agents.owner.put('/api/unit-prices').send(PRICES);
    expect(res.status).toBe(200);
    expect(res.body.prices).toMatchObject(PRICES);
    expect(res.body.notYetPriced).toEqual([]);
    const row = await t.ctx.db.models.UnitPrice.findOne({ where: { firmId: t.seed.firmId }, order: [['createdAt', 'DESC']] });
    expect(row!.getDataValue('studUsdEach')).toBe(4.5);
    expect(row!.getDataValue('camberUsdEach')).toBe(350);
    const history = await t.agents.drafter.get('/api/unit-prices/history');
    // The demo's earlier example row stays unpriced for studs and camber.
    expect(history.body.history.map((h: { stud_usd_each: number | null }) => h.stud_usd_each)).toEqual([4.5, null]);
  });

  it('when the manager reads Tonnage, then studs and cambered pieces of the composite demo are priced: studs × $4.50 and pieces × $350, inside the cost', async () => {
    const res = await t.agents.manager.get(`/api/projects/${t.seed.projectId}/comparison`);
    expect(res.status).toBe(200);
    for (const s of res.body.schemes as { id: string; totals: Figures; byLevel: Figures[] }[]) {
      const design = await t.agents.manager.get(`/api/schemes/${s.id}/design`);
      const members = design.body.members as { shape: string; span_ft: number; studs?: number | null; camber_in?: number | null }[];
      const studs = members.reduce((a, m) => a + (typeof m.studs === 'number' && m.studs > 0 ? m.studs : 0), 0);
      const cambered = members.filter((m) => typeof m.camber_in === 'number' && m.camber_in > 0).length;
      // The demo is composite (issue 11 item 7): it has studs and cambered pieces to price.
      expect(studs).toBeGreaterThan(0);
      expect(cambered).toBeGreaterThan(0);
      expect(s.totals.studs).toBe(studs);
      expect(s.totals.camberedPieces).toBe(cambered);
      // Hand arithmetic: cost = tons × $5,000 + connections × $200 + studs × $4.50 + cambered pieces × $350.
      expect(s.totals.studs_usd).toBeCloseTo(studs * 4.5, 9);
      expect(s.totals.camber_usd).toBeCloseTo(cambered * 350, 9);
      expect(s.totals.steel_usd).toBeCloseTo((s.totals.steelWeight_lb / 2000) * 5000, 6);
      expect(s.totals.connections_usd).toBe(s.totals.connections * 200);
      expect(s.totals.cost_usd).toBeCloseTo(s.totals.steel_usd! + s.totals.connections_usd! + studs * 4.5 + cambered * 350, 6);
      // The beam and girder steel is the designed shapes' weight (shape weight × span).
      const memberLb = members.reduce((a, m) => a + getWShape(m.shape).W_plf * m.span_ft, 0);
      expect(s.totals.steelWeight_lb).toBeGreaterThan(memberLb - 1e-6);
      expect(s.byLevel.reduce((a, l) => a + (l.studs_usd ?? 0), 0)).toBeCloseTo(studs * 4.5, 9);
    }
  });

  it('when the CSV is exported, then it names the stud and camber prices and carries the studs and camber columns', async () => {
    const res = await t.agents.manager.get(`/api/projects/${t.seed.projectId}/comparison.csv`);
    expect(res.status).toBe(200);
    const lines = res.text.replace(/^\uFEFF/, '').split('\r\n');
    expect(lines.find((l) => l.startsWith('# Unit prices'))).toContain('$4.5 per shear stud; $350 per cambered piece');
    const header = lines.find((l) => l.startsWith('scheme,'))!.split(',');
    expect(header.slice(-4)).toEqual(['studs', 'camberedPieces', 'studs_usd', 'camber_usd']);
    const total = lines[lines.indexOf(header.join(',')) + 1].split(',');
    const json = (await t.agents.manager.get(`/api/projects/${t.seed.projectId}/comparison`)).body.schemes[0].totals as Figures;
    expect(Number(total[header.indexOf('studs')])).toBe(json.studs);
    expect(Number(total[header.indexOf('studs_usd')])).toBe(Math.round(json.studs_usd!));
  });

  it('when the stud price is cleared, then studs read not priced (null, never $0) and the cost leaves them out', async () => {
    const res = await t.agents.manager.put('/api/unit-prices').send({ ...PRICES, stud_usd_each: null });
    expect(res.status).toBe(200);
    expect(res.body.notYetPriced).toEqual(['Shear studs']);
    const cmp = await t.agents.manager.get(`/api/projects/${t.seed.projectId}/comparison`);
    const totals = cmp.body.schemes[0].totals as Figures;
    expect(totals.studs).toBeGreaterThan(0);
    expect(totals.studs_usd).toBeNull();
    expect(totals.cost_usd).toBeCloseTo(totals.steel_usd! + totals.connections_usd! + totals.camber_usd!, 6);
  });

  it('when a stud or camber price is negative or text, then 400 naming the field and nothing is stored', async () => {
    const before = await t.ctx.db.models.UnitPrice.count();
    const bad = await t.agents.owner.put('/api/unit-prices').send({ ...PRICES, stud_usd_each: -1, camber_usd_each: 'lots' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({
      stud_usd_each: 'Price per shear stud cannot be negative',
      camber_usd_each: 'Price per cambered piece must be a number of US dollars',
    });
    const engineer = await t.agents.engineer.put('/api/unit-prices').send(PRICES);
    expect(engineer.status).toBe(403);
    expect(await t.ctx.db.models.UnitPrice.count()).toBe(before);
  });
});
