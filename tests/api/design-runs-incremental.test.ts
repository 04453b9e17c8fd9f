/**
 * Design runs re-designed from the worker's last result of the scheme (server/services/design-runs):
 * after an edit, only members whose design input changed are sized again, and the result is the
 * same text, byte for byte, as a fresh design of the saved plan. The demo schemes are invented of our own.
 */
import { describe, expect, it } from 'vitest';
import { DEMO_SCHEMES } from '../../server/db/seed-demo-building';
import { designScheme } from '../../shared/engine/index';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';
import { DesignPool, DEFAULT_DESIGN_BUDGET } from '../../server/services/design-runs/design-pool';
import { KEPT_RESULTS } from '../../server/services/design-runs/kept-results';
import { useTestApp } from './helpers/test-app';

const server = useTestApp();

const VIEW_KEYS = ['revision', 'designedAt', 'stale'];
const withoutViewKeys = (body: Record<string, unknown>) => Object.fromEntries(Object.entries(body).filter(([k]) => !VIEW_KEYS.includes(k)));
const text = (bytes: Uint8Array) => Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('utf8');

async function schemeIdOf(name: string): Promise<string> {
  const row = await server.app.ctx.db.models.Scheme.findOne({ where: { name } });
  return row!.getDataValue('id');
}

async function exported(schemeId: string): Promise<Plan> {
  return parsePlanFile((await server.app.agents.engineer.get(`/api/schemes/${schemeId}/export`)).body).plan!;
}

describe('design runs from the last result of the scheme', () => {
  it('when a scheme is edited and designed again, several times and between two schemes, then each stored result equals a fresh design of the saved plan', async () => {
    const ids = [await schemeIdOf(DEMO_SCHEMES[0].name), await schemeIdOf(DEMO_SCHEMES[1].name)];
    for (const id of ids) expect((await server.app.agents.engineer.post(`/api/schemes/${id}/design`)).status).toBe(200);
    const edits: ((p: Plan) => void)[] = [
      (p) => { p.members.find((m) => m.kind === 'beam' && m.shape === null)!.shape = 'W21X44'; },
      (p) => { p.pointLoads.push({ id: 'bench-unit', level: p.levels[0].id, x_ft: p.columns[1].x_ft + 4, y_ft: p.columns[1].y_ft + 9, D_kip: 4, L_kip: 2 }); },
      (p) => { p.zones[0].live_psf += 25; },
    ];
    for (const [k, edit] of edits.entries()) {
      for (const id of ids) {
        const plan = await exported(id);
        edit(plan);
        const revision = (await server.app.agents.engineer.get(`/api/schemes/${id}`)).body.scheme.revision as number;
        const put = await server.app.agents.engineer.put(`/api/schemes/${id}/plan`).send({ revision, plan });
        expect(put.status, `edit ${k} of scheme ${id}: ${JSON.stringify(put.body)}`).toBe(200);
        expect((await server.app.agents.engineer.post(`/api/schemes/${id}/design`)).status).toBe(200);
        const got = await server.app.agents.drafter.get(`/api/schemes/${id}/design`);
        expect(got.body.stale).toBe(false);
        expect(JSON.stringify(withoutViewKeys(got.body))).toBe(JSON.stringify(designScheme(await exported(id))));
      }
    }
  }, 180_000);

  it('when the pool designs a scheme twice, then the second run starts from the first; another scheme starts from the newest kept result; each gives the bytes of a fresh design', async () => {
    const pool = new DesignPool({ ...DEFAULT_DESIGN_BUDGET, workers: 1 });
    try {
      const plan = await exported(await schemeIdOf(DEMO_SCHEMES[1].name));
      const other = await exported(await schemeIdOf(DEMO_SCHEMES[0].name));
      const first = await pool.run(plan, 'scheme-a');
      expect(first.startedFrom).toBe(null);
      expect(text(first.json)).toBe(JSON.stringify(designScheme(plan)));
      const edited = structuredClone(plan);
      edited.members.find((m) => m.kind === 'beam' && m.shape === null)!.shape = 'W18X40';
      const second = await pool.run(edited, 'scheme-a');
      expect(second.startedFrom).toBe('this scheme');
      expect(text(second.json)).toBe(JSON.stringify(designScheme(edited)));
      // A different scheme (other framing, other ids) from scheme-a's result: only equal inputs are reused.
      const b = await pool.run(other, 'scheme-b');
      expect(b.startedFrom).toBe('another scheme');
      expect(text(b.json)).toBe(JSON.stringify(designScheme(other)));
      // KEPT_RESULTS other schemes push scheme-a out of the worker's keeping.
      for (let i = 0; i < KEPT_RESULTS; i++) expect((await pool.run(other, `other-${i}`)).startedFrom).toBe('another scheme');
      const again = await pool.run(plan, 'scheme-a');
      expect(again.startedFrom).toBe('another scheme');
      expect(text(again.json)).toBe(JSON.stringify(designScheme(plan)));
      expect((await pool.run(other, `other-${KEPT_RESULTS - 1}`)).startedFrom).toBe('this scheme');
    } finally {
      await pool.close();
    }
  }, 180_000);
});
