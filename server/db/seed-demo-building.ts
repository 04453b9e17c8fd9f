import type { Db } from '../models/models';
import { designSchemeNow } from '../services/scheme-design.service';
import { createScheme } from '../services/schemes.service';
import { buildDemoBuildingPlan } from './demo-building.builder';
import type { SeedStep } from './seed-demo';

// The demo project's building: a four-storey clinic (levels 2–4 and a roof) on a 4 × 3 bay
// grid, framed two ways. Each scheme is created once (found by name afterwards) and
// designed on seeding, so the schemes list, tonnage and schedule have results to show.

export const DEMO_SCHEMES = [
  { name: 'Scheme A — beams at about 10 ft', beamSpacing_ft: 10 },
  { name: 'Scheme B — beams at about 7.5 ft', beamSpacing_ft: 7.5 },
] as const;

export const demoBuildingStep: SeedStep = {
  name: 'demo-building',
  async run(db: Db, state) {
    const firmId = state.firmId;
    const projectId = state.projectId;
    const userId = state.userIds.engineer;
    if (!firmId || !projectId || !userId) throw new Error('seed: demo-building needs the firm, project and engineer');
    const ctx = { db, actor: { firmId, userId } };
    const schemeIds: string[] = [];
    for (const demo of DEMO_SCHEMES) {
      const existing = await db.models.Scheme.findOne({ where: { projectId, name: demo.name }, attributes: ['id'] });
      let schemeId: string;
      if (existing) schemeId = existing.getDataValue('id');
      else {
        const plan = buildDemoBuildingPlan({ name: demo.name, beamSpacing_ft: demo.beamSpacing_ft });
        schemeId = (await createScheme(ctx, projectId, { name: demo.name, plan })).id;
      }
      if ((await db.models.DesignRun.count({ where: { schemeId } })) === 0) await designSchemeNow(ctx, schemeId, { trigger: 'seed' });
      schemeIds.push(schemeId);
    }
    state.demoSchemeIds = schemeIds;
  },
};
