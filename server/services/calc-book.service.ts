import { buildCalcBook, buildMemberCalcSheet, type CalcBook, type CalcBookMembers } from '../../shared/report/calc-book.report';
import { AppError } from '../errors/app-error';
import { renderCalcBookPdf } from '../pdf/calc-book.pdf';
import type { SchemeServiceContext } from './plan-store.service';
import { loadSchemeDrafting } from './schedule.service';
import { fileSlug } from './schemes.service';

// The calc book of a scheme: its current design (designed first when stale) written up as
// the calculation report an engineer checks before sealing, as a document model and a PDF.

export interface CalcBookOptions {
  members: CalcBookMembers;
  levelId?: string;
  /** The signed-in person downloading the book (printed as "Downloaded by", apart from "Prepared by"). */
  downloadedBy: string;
  /** Issue date; today when absent. */
  date?: Date;
}

/**
 * The scheme's engineer for "Prepared by": the person who started the scheme, else the last
 * to save it. Projects keep no engineer-of-record field yet, so the book names this person
 * as the scheme's engineer, never as the engineer of record.
 */
async function schemeEngineer(ctx: SchemeServiceContext, schemeId: string): Promise<string> {
  const row = await ctx.db.models.Scheme.findByPk(schemeId);
  const ids = [row?.getDataValue('createdBy'), row?.getDataValue('updatedBy')].filter((v): v is string => typeof v === 'string');
  for (const id of ids) {
    const user = await ctx.db.models.User.findByPk(id);
    if (user) return `${user.getDataValue('name')} (the scheme’s engineer)`;
  }
  return 'not recorded (the scheme has no engineer on record)';
}

/** The title block of the Calc book and of a one-member calc sheet: project, scheme, dates, people. */
async function titleBlock(
  ctx: SchemeServiceContext,
  schemeId: string,
  scheme: { projectId: string; name: string; revision: number },
  design: { revision: number; designedAt: string },
  options: { downloadedBy: string; date?: Date },
) {
  const project = await ctx.db.models.Project.findByPk(scheme.projectId);
  const p = project?.get({ plain: true });
  const date = options.date ?? new Date();
  return {
    project: { name: p?.name ?? '', number: p?.number ?? null, client: p?.client ?? null, address: p?.address ?? null },
    scheme: { name: scheme.name, revision: scheme.revision },
    designedRevision: design.revision,
    designedAt: design.designedAt,
    date: date.toISOString().slice(0, 10),
    preparedBy: await schemeEngineer(ctx, schemeId),
    downloadedBy: { name: options.downloadedBy, at: date.toISOString() },
  };
}

export async function getCalcBook(
  ctx: SchemeServiceContext,
  schemeId: string,
  options: CalcBookOptions,
): Promise<{ scheme: { id: string; name: string; revision: number }; book: CalcBook; preparedBy: string }> {
  const { scheme, plan, design } = await loadSchemeDrafting(ctx, schemeId);
  if (options.levelId !== undefined && !plan.levels.some((l) => l.id === options.levelId)) {
    throw new AppError(404, 'not_found', `Level "${options.levelId}" is not a level of this scheme.`);
  }
  const head = await titleBlock(ctx, schemeId, scheme, design, options);
  const preparedBy = head.preparedBy;
  const book = buildCalcBook({ plan, design, ...head, options: { members: options.members, levelId: options.levelId } });
  return { scheme: { id: scheme.id, name: scheme.name, revision: scheme.revision }, book, preparedBy };
}

export async function getCalcBookPdf(
  ctx: SchemeServiceContext,
  schemeId: string,
  options: CalcBookOptions,
): Promise<{ filename: string; pdf: Buffer; caution: string }> {
  const { scheme, book, preparedBy } = await getCalcBook(ctx, schemeId, options);
  const levelPart = options.levelId ? `-${fileSlug(options.levelId)}` : '';
  const membersPart = options.members === 'all' ? '-all' : '';
  const pdf = await renderCalcBookPdf(book, { author: preparedBy });
  return { filename: `${fileSlug(scheme.name)}-calc-book${levelPart}${membersPart}-r${scheme.revision}.pdf`, pdf, caution: book.caution };
}

/**
 * One member's calc sheet (the Member sheet's download), from the scheme's current design
 * (designed first when stale). A member the scheme does not have is a 404 naming it.
 */
export async function getMemberCalcSheetPdf(
  ctx: SchemeServiceContext,
  schemeId: string,
  memberId: string,
  options: { downloadedBy: string; date?: Date },
): Promise<{ filename: string; pdf: Buffer; caution: string }> {
  const { scheme, plan, design } = await loadSchemeDrafting(ctx, schemeId);
  // As the Calc book: prepared by the scheme's engineer; who downloaded it is printed apart.
  const head = await titleBlock(ctx, schemeId, scheme, design, options);
  const preparedBy = head.preparedBy;
  const sheet = buildMemberCalcSheet({ plan, design, ...head, memberId });
  if (!sheet) throw new AppError(404, 'not_found', `Member "${memberId.slice(0, 60)}" is not a designed member of this scheme.`);
  const mark = sheet.marks[0] || memberId;
  const pdf = await renderCalcBookPdf(sheet, { author: preparedBy });
  return { filename: `${fileSlug(scheme.name)}-calc-sheet-${fileSlug(mark)}-r${scheme.revision}.pdf`, pdf, caution: sheet.caution };
}
