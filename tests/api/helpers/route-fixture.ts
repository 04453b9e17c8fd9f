import { createProject } from '../../../server/services/projects.service';
import type { RouteFixture } from './route-table';
import type { TestApp } from './test-app';

/** The fixture the route table's path and body builders draw on (role matrix, fuzz suite). */
export async function makeRouteFixture(t: TestApp): Promise<RouteFixture> {
  const otherOwnerId = (await t.ctx.db.models.User.findOne({ where: { email: 'rosalind@quillon.example' } }))!.getDataValue('id');
  let emailCounter = 0;
  return {
    t,
    async ownProjectId() {
      const p = await createProject(t.ctx.db, { firmId: t.seed.firmId!, userId: t.seed.userIds.engineer! }, { name: 'Matrix fixture project' });
      return p.id;
    },
    async foreignProjectId() {
      const p = await createProject(t.ctx.db, { firmId: t.otherFirmId, userId: otherOwnerId }, { name: 'Other firm project' });
      return p.id;
    },
    uniqueEmail: () => `matrix-${Date.now()}-${++emailCounter}@example.org`,
  };
}
