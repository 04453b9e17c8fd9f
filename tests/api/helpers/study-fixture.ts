import { runSchemeStudy } from '../../../server/services/bay-studies.service';
import { makeScheme } from './schemes-fixture';
import { OTHER_FIRM, type TestApp } from './test-app';

// Bay studies made straight through the service for API tests: the two-bay fixture's west
// bay (30 ft × 36 ft), beams running y at 10, 11 and 12 ft max spacing.

export const WEST_BAY_STUDY = {
  region: { level: 'L2', polygon: [[0, 0], [30, 0], [30, 36], [0, 36]] },
  spacing_ft: { from: 10, to: 12, step: 1 },
  directions: ['y'],
};

export async function makeStudy(t: TestApp, options: { firm?: 'own' | 'foreign' } = {}): Promise<{ schemeId: string; projectId: string; studyId: string; optionId: string }> {
  const firm = options.firm ?? 'own';
  const { schemeId, projectId } = await makeScheme(t, { firm });
  let actor = { firmId: t.seed.firmId!, userId: t.seed.userIds.engineer! };
  if (firm === 'foreign') {
    const other = await t.ctx.db.models.User.findOne({ where: { email: OTHER_FIRM.email } });
    actor = { firmId: t.otherFirmId, userId: other!.getDataValue('id') };
  }
  const study = await runSchemeStudy({ db: t.ctx.db, actor }, schemeId, { ...WEST_BAY_STUDY });
  return { schemeId, projectId, studyId: study.id, optionId: study.result.options[0].id };
}
