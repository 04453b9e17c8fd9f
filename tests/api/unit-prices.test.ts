import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_UNIT_PRICES } from '../../server/db/seed-demo';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

describe('unit prices', () => {
  it('when the demo firm is seeded, then its prices are the invented example, marked as such', async () => {
    const res = await t.agents.drafter.get('/api/unit-prices');
    expect(res.status).toBe(200);
    expect(res.body.prices).toMatchObject({
      steel_usd_per_ton: DEMO_UNIT_PRICES.steelUsdPerTon,
      connection_usd_each: DEMO_UNIT_PRICES.connectionUsdEach,
      example: true,
    });
    expect(res.body.notYetPriced).toEqual(['Shear studs', 'Camber']);
  });

  it('when a manager and then the owner change prices, then each change is a new row and the history lists all, newest first, with who', async () => {
    const before = await t.ctx.db.models.UnitPrice.count();
    const m = await t.agents.manager.put('/api/unit-prices').send({ steel_usd_per_ton: 5200, connection_usd_each: 240, note: 'Fabricator quote' });
    expect(m.status).toBe(200);
    expect(m.body.prices).toMatchObject({ steel_usd_per_ton: 5200, connection_usd_each: 240, example: false, note: 'Fabricator quote', setBy: { name: 'Dominic Hale' } });
    const o = await t.agents.owner.put('/api/unit-prices').send({ steel_usd_per_ton: 5100.5, connection_usd_each: 0 });
    expect(o.status).toBe(200);
    expect(await t.ctx.db.models.UnitPrice.count()).toBe(before + 2);

    const history = await t.agents.engineer.get('/api/unit-prices/history');
    expect(history.status).toBe(200);
    expect(history.body.history.map((h: { steel_usd_per_ton: number; setBy: { name: string } | null }) => [h.steel_usd_per_ton, h.setBy?.name])).toEqual([
      [5100.5, 'Imogen Ashdown'],
      [5200, 'Dominic Hale'],
      [DEMO_UNIT_PRICES.steelUsdPerTon, 'Imogen Ashdown'],
    ]);
    expect((await t.agents.engineer.get('/api/unit-prices')).body.prices.steel_usd_per_ton).toBe(5100.5);
    const audit = await t.ctx.db.models.AuditEvent.findAll({ where: { action: 'prices.changed' } });
    expect(audit.map((a) => JSON.parse(a.getDataValue('detail')!).to.steel_usd_per_ton).sort()).toEqual([5100.5, 5200]);
  });

  it('when an engineer or drafter sets prices, then 403 and nothing is stored', async () => {
    const before = await t.ctx.db.models.UnitPrice.count();
    for (const role of ['engineer', 'drafter'] as const) {
      const res = await t.agents[role].put('/api/unit-prices').send({ steel_usd_per_ton: 1, connection_usd_each: 1 });
      expect(res.status).toBe(403);
    }
    expect(await t.ctx.db.models.UnitPrice.count()).toBe(before);
  });

  it('when a price is zero, negative, text or missing, then 400 naming the field', async () => {
    const res = await t.agents.owner.put('/api/unit-prices').send({ steel_usd_per_ton: 0, connection_usd_each: -5 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      steel_usd_per_ton: 'Steel price per ton must be more than zero',
      connection_usd_each: 'Price per connection cannot be negative',
    });
    const text = await t.agents.owner.put('/api/unit-prices').send({ steel_usd_per_ton: '4800' });
    expect(text.body.error.fields).toMatchObject({
      steel_usd_per_ton: 'Steel price per ton must be a number of US dollars',
      connection_usd_each: 'Price per connection must be a number of US dollars',
    });
  });

  it("when another firm reads prices, then it sees its own (none), not the demo firm's", async () => {
    const res = await t.otherOwner.get('/api/unit-prices');
    expect(res.status).toBe(200);
    expect(res.body.prices).toBeNull();
    expect((await t.otherOwner.get('/api/unit-prices/history')).body.history).toEqual([]);
  });
});
