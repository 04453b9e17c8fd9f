import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_SCHEMES } from '../../server/db/seed-demo-building';
import { designScheme } from '../../shared/engine/index';
import { parsePlanFile } from '../../shared/schemas/plan.schema';
import { packDesignResult, PRUNED_RESULT, unpackDesignResult } from '../../server/services/design-run-storage';
import { makeScheme } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// Stored design runs: packed (each distinct sizing record once) and pruned to the newest
// DESIGN_RUNS_KEPT results per scheme, without losing anything a screen reads.

const KEPT = 2;
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ designRunsKept: KEPT });
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const VIEW_KEYS = ['revision', 'designedAt', 'stale'];
const withoutViewKeys = (body: Record<string, unknown>) => Object.fromEntries(Object.entries(body).filter(([k]) => !VIEW_KEYS.includes(k)));
const storedText = (v: unknown) => (typeof v === 'string' ? v : JSON.stringify(v));

async function demoSchemeId(): Promise<string> {
  const row = await t.ctx.db.models.Scheme.findOne({ where: { name: DEMO_SCHEMES[1].name } });
  return row!.getDataValue('id');
}

describe('stored design runs', () => {
  it('when the demo scheme is designed, then GET /design returns the engine output for its plan byte for byte, from a row holding each distinct design once', async () => {
    const schemeId = await demoSchemeId();
    const posted = await t.agents.engineer.post(`/api/schemes/${schemeId}/design`);
    expect(posted.status).toBe(200);
    const got = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    expect(got.status).toBe(200);
    const plan = parsePlanFile((await t.agents.engineer.get(`/api/schemes/${schemeId}/export`)).body).plan!;
    // Everything a screen reads (schedule, member sheet, plan sheet, calc book, tonnage) comes from this document.
    expect(JSON.stringify(withoutViewKeys(got.body))).toBe(JSON.stringify(designScheme(plan)));
    expect(got.body).toMatchObject({ stale: false });

    const run = await t.ctx.db.models.DesignRun.findOne({ where: { schemeId }, order: [['createdAt', 'DESC']] });
    const stored = run!.getDataValue('result') as unknown as { designs: unknown[]; result: { members: { design: unknown }[] } };
    const members = got.body.members as { design: unknown }[];
    const distinct = new Set(members.map((m) => JSON.stringify(m.design))).size;
    expect(stored.designs).toHaveLength(distinct);
    expect(distinct).toBeLessThan(members.length / 2); // the demo floors repeat their bays
    expect(stored.result.members.every((m) => typeof m.design === 'number')).toBe(true);
    expect(storedText(stored).length).toBeLessThan(0.6 * JSON.stringify(withoutViewKeys(got.body)).length);
  });

  it('when a row was stored before packing (the plain output), then it reads as it was', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const run = await t.ctx.db.models.DesignRun.findOne({ where: { schemeId } });
    const plain = unpackDesignResult(run!.getDataValue('result'));
    await run!.update({ result: plain });
    const got = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    expect(withoutViewKeys(got.body)).toEqual(plain);
    expect(got.body.members).toHaveLength(11);
  });

  it('when a scheme is designed many times, then only the newest results are kept, the table stops growing and the activity still lists every run', async () => {
    const { schemeId } = await makeScheme(t);
    const bytes: number[] = [];
    for (let i = 0; i < 5; i++) {
      expect((await t.agents.engineer.post(`/api/schemes/${schemeId}/design`)).status).toBe(200);
      const rows = await t.ctx.db.models.DesignRun.findAll({ where: { schemeId } });
      bytes.push(rows.reduce((s, r) => s + storedText(r.getDataValue('result')).length, 0));
    }
    // From the KEPT-th run on, each new result replaces an older one: the stored size stays put.
    expect(bytes[KEPT]).toBe(bytes[KEPT - 1] + storedText(PRUNED_RESULT).length);
    expect(bytes[4]).toBe(bytes[KEPT - 1] + (5 - KEPT) * storedText(PRUNED_RESULT).length);
    const rows = await t.ctx.db.models.DesignRun.findAll({ where: { schemeId }, order: [['createdAt', 'DESC']] });
    expect(rows).toHaveLength(5);
    const full = rows.filter((r) => (r.getDataValue('result') as { pruned?: boolean }).pruned !== true);
    expect(full.map((r) => r.getDataValue('id'))).toEqual(rows.slice(0, KEPT).map((r) => r.getDataValue('id')));
    // Summary columns stay on pruned rows: the activity feed lists all five runs with their weight.
    const activity = await t.agents.manager.get(`/api/schemes/${schemeId}/activity`);
    const designed = activity.body.activity.filter((e: { kind: string }) => e.kind === 'designed');
    expect(designed).toHaveLength(5);
    for (const e of designed) expect(e.summary).toMatch(/^Designed revision 1: \d+\.\d tons, 11 pieces/);
    // The latest run still reads in full.
    const got = await t.agents.manager.get(`/api/schemes/${schemeId}/design`);
    expect(got.body.members).toHaveLength(11);
    expect(got.body.members[0].design.checks.length).toBeGreaterThan(0);
  });

  it('when a result is packed, then unpacking gives the same text, and packing twice changes nothing', () => {
    const shared = { shape: 'W16X26', checks: [{ name: 'flexure', ratio: 0.8 }] };
    const result = { name: 'x', members: [{ id: 'a', design: shared, z: 1 }, { id: 'b', design: { ...shared }, z: 2 }, { id: 'c', design: null, z: 3 }], totals: { pieces: 3 } };
    const packed = packDesignResult(result);
    expect(packed.designs).toHaveLength(1);
    expect(JSON.stringify(unpackDesignResult(packed))).toBe(JSON.stringify(result));
    expect(packDesignResult(packed)).toBe(packed);
    expect(unpackDesignResult(JSON.stringify(packed))).toEqual(result);
  });
});
