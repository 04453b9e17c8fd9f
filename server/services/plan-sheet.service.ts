import { SCHEME_CAUTION } from '../../shared/engine/index';
import { buildPlanSheets, type PlanSheet } from '../../shared/drafting/plan-sheet.drafting';
import { AppError } from '../errors/app-error';
import { renderSheetsPdf } from '../pdf/plan-sheet.pdf';
import type { SchemeServiceContext } from './plan-store.service';
import { loadSchemeDrafting } from './schedule.service';
import { fileSlug } from './schemes.service';

// Framing plan sheets of a scheme: one per level (or the one asked for), drawn from the
// current design. The same sheet model feeds the PDF and the in-app SVG.

export interface PlanSheetOptions {
  levelId?: string;
  showReactions: boolean;
  /** The signed-in person, for "prepared by". */
  preparedBy: string;
  /** Issue date; today when absent. */
  date?: Date;
}

export interface PlanSheetsView {
  scheme: { id: string; name: string; revision: number };
  sheets: PlanSheet[];
  caution: string;
}

export async function getPlanSheets(ctx: SchemeServiceContext, schemeId: string, options: PlanSheetOptions): Promise<PlanSheetsView> {
  const { scheme, plan, design } = await loadSchemeDrafting(ctx, schemeId);
  if (options.levelId !== undefined && !plan.levels.some((l) => l.id === options.levelId)) {
    throw new AppError(404, 'not_found', `Level "${options.levelId}" is not a level of this scheme.`);
  }
  const project = await ctx.db.models.Project.findByPk(scheme.projectId);
  const p = project?.get({ plain: true });
  const caution = design.caution ?? SCHEME_CAUTION;
  const sheets = buildPlanSheets({
    plan,
    design,
    levelIds: options.levelId ? [options.levelId] : undefined,
    showReactions: options.showReactions,
    caution,
    titleBlock: {
      project: p?.name ?? '',
      projectNumber: p?.number ?? null,
      client: p?.client ?? null,
      address: p?.address ?? null,
      scheme: scheme.name,
      revision: scheme.revision,
      date: (options.date ?? new Date()).toISOString().slice(0, 10),
      preparedBy: options.preparedBy,
      sheetIndex: 1,
      sheetCount: 1,
    },
  });
  return { scheme: { id: scheme.id, name: scheme.name, revision: scheme.revision }, sheets, caution };
}

export async function getPlanSheetPdf(
  ctx: SchemeServiceContext,
  schemeId: string,
  options: PlanSheetOptions,
): Promise<{ filename: string; pdf: Buffer; caution: string }> {
  const view = await getPlanSheets(ctx, schemeId, options);
  const levelPart = options.levelId ? `-${fileSlug(options.levelId)}` : '';
  const pdf = await renderSheetsPdf(view.sheets, {
    title: `${view.scheme.name} — framing plan`,
    author: options.preparedBy,
    subject: view.caution,
  });
  return { filename: `${fileSlug(view.scheme.name)}-plan-sheet${levelPart}-r${view.scheme.revision}.pdf`, pdf, caution: view.caution };
}
