import { buildingModel, type BuildingDesignInput } from '../../shared/drafting/building-model.drafting';
import { SCHEME_CAUTION } from '../../shared/engine/index';
import { AppError } from '../errors/app-error';
import { writeFramingIfc } from '../ifc/framing-model.ifc';
import { findOwnScheme, readPlan, type SchemeServiceContext } from './plan-store.service';
import { getSchemeDesign } from './scheme-design.service';
import { fileSlug } from './schemes.service';

// GET /api/schemes/:id/model.ifc: the scheme's framing as an IFC4 model (ISO 16739).
// A scheme that has never been designed is refused (409 not_designed): the model carries
// sizes, and it must not be produced from sizes nobody has seen. A design older than the
// current plan is redone first (as the Schedule does), so geometry and sizes agree.

export async function getSchemeIfc(ctx: SchemeServiceContext, schemeId: string): Promise<{ filename: string; ifc: Uint8Array; caution: string }> {
  let design;
  try {
    design = await getSchemeDesign(ctx, schemeId, { designIfStale: false });
  } catch (error) {
    if (error instanceof AppError && error.code === 'not_designed') {
      throw new AppError(409, 'not_designed', 'This scheme has never been designed, so there are no sizes to put in a model. Open it on the Plan (or design it) first, then export the IFC model.');
    }
    throw error;
  }
  if (design.stale) design = await getSchemeDesign(ctx, schemeId, { designIfStale: true });

  const row = await findOwnScheme(ctx, schemeId);
  const attrs = row.get({ plain: true });
  const plan = await readPlan(ctx.db, attrs);
  const model = buildingModel(plan, design as unknown as BuildingDesignInput);
  if (model.members.length === 0 && model.columns.length === 0) {
    throw new AppError(422, 'empty_model', 'This scheme has no members or columns on its levels yet, so there is nothing to put in an IFC model.', {
      fields: { members: 'Draw members or columns on a level first' },
    });
  }
  const project = await ctx.db.models.Project.findByPk(attrs.projectId, { attributes: ['name'] });
  const caution = typeof design.caution === 'string' ? design.caution : SCHEME_CAUTION;
  const ifc = await writeFramingIfc({
    projectName: project?.getDataValue('name') ?? 'Project',
    schemeId,
    schemeName: attrs.name,
    revision: attrs.revision,
    method: design.method === 'ASD' ? 'ASD' : 'LRFD',
    caution,
    model,
  });
  return { filename: `${fileSlug(attrs.name)}-r${attrs.revision}.ifc`, ifc, caution };
}
