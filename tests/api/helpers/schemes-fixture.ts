import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { designSchemeNow } from '../../../server/services/scheme-design.service';
import { createScheme } from '../../../server/services/schemes.service';
import { createProject } from '../../../server/services/projects.service';
import { OTHER_FIRM, type TestApp } from './test-app';

// Schemes made straight through the services for API tests (role matrix and schemes tests):
// each call gets its own project and scheme, so destructive calls never share one.

const FIXTURE_PATH = fileURLToPath(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url));

/** The two-bay fixture plan file as JSON (a fresh copy each call). */
export function twoBayPlan(): Record<string, unknown> {
  return JSON.parse(readFileSync(FIXTURE_PATH, 'utf8')) as Record<string, unknown>;
}

async function actorFor(t: TestApp, firm: 'own' | 'foreign') {
  if (firm === 'own') return { firmId: t.seed.firmId!, userId: t.seed.userIds.engineer! };
  const other = await t.ctx.db.models.User.findOne({ where: { email: OTHER_FIRM.email } });
  return { firmId: t.otherFirmId, userId: other!.getDataValue('id') };
}

/** A new scheme (two-bay fixture plan, revision 1) in a new project; designed when asked. */
export async function makeScheme(
  t: TestApp,
  options: { firm?: 'own' | 'foreign'; designed?: boolean; name?: string } = {},
): Promise<{ schemeId: string; projectId: string }> {
  const actor = await actorFor(t, options.firm ?? 'own');
  const project = await createProject(t.ctx.db, actor, { name: 'Scheme fixture project' });
  const ctx = { db: t.ctx.db, actor };
  const scheme = await createScheme(ctx, project.id, { name: options.name ?? 'Fixture scheme', plan: twoBayPlan() });
  if (options.designed) await designSchemeNow(ctx, scheme.id);
  return { schemeId: scheme.id, projectId: project.id };
}
