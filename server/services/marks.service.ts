import { SCHEME_CAUTION, type SchemeResult } from '../../shared/engine/index';
import { assignMarks, withIssuedMarks } from '../../shared/engine/scheme/member-marks.scheme';
import type { Plan, PlanMember } from '../../shared/schemas/plan.schema';
import { formatFeetInches, gridLocation } from '../../shared/drafting/grid-location.drafting';
import { AppError } from '../errors/app-error';
import {
  commitPlanRevision,
  findOwnScheme,
  readPlan,
  RevisionConflict,
  type SchemeRow,
  type SchemeServiceContext,
} from './plan-store.service';
import { getSchemeDesign, storeDesignRun } from './scheme-design.service';

// Piece marks: drafters, engineers and owners set marks by hand (they lock) or renumber.
// Either way the plan is saved as a new revision through the plan store. Marks do not change
// any size, so when the design was current it is carried to the new revision with the marks
// re-assigned by the engine's own rule instead of being re-run.

export interface MarkEdit {
  memberId: string;
  /** The new mark (locked), or null to release a manual mark back to the rule. */
  mark: string | null;
}

export interface MemberMark {
  memberId: string;
  level: string;
  mark: string;
  /** True when set by hand (kept by renumbering unless asked otherwise). */
  manual: boolean;
}

export interface MarksResult {
  revision: number;
  /** False when nothing changed (no revision was written). */
  changed: boolean;
  marks: MemberMark[];
  caution: string;
}

type DesignView = SchemeResult & { revision: number };

/** Span and size agree for a shared mark: same kind, same shape, span within 0.01 ft (the engine's grouping). */
const SPAN_TOLERANCE_FT = 0.005;

function marksInvalid(message: string, memberId: string, mark: string | null): AppError {
  return new AppError(422, 'marks_invalid', message, { details: { memberId, mark }, fields: { [`marks.${memberId}`]: message } });
}

/** A member as the drawing places it: "beam at A–B / 1+10'-0"" (its kind and grid location; the mark is what is in question). */
function memberWhere(plan: Plan, m: PlanMember): string {
  const where = gridLocation(m.start, m.end, plan.grids);
  return `${m.kind} ${where ? `at ${where}` : `from (${m.start[0].toFixed(1)}, ${m.start[1].toFixed(1)}) to (${m.end[0].toFixed(1)}, ${m.end[1].toFixed(1)}) ft`}`;
}

function conflict(current: number, yours: number): AppError {
  return new AppError(
    409,
    'revision_conflict',
    `This scheme was saved since revision ${yours} (it is now at revision ${current}). Your marks were not saved; reload and edit them again.`,
    { details: { current: { revision: current } } },
  );
}

/**
 * A manual mark on one level may be shared only by members of the same kind, size and span
 * (one piece mark = one fabricated piece): neither by other members locked to it, nor by the
 * members that already carry it as issued (`current`, the marks before the edit). Each level
 * is checked on its own.
 */
export function checkManualMarks(
  plan: Plan,
  design: Pick<SchemeResult, 'members'>,
  levelName: (id: string) => string,
  current: ReadonlyMap<string, string> = new Map(),
): void {
  const designed = new Map(design.members.map((m) => [m.id, m]));
  const carriers = new Map<string, PlanMember[]>();
  const add = (key: string, m: PlanMember) => {
    const list = carriers.get(key);
    if (list) list.push(m);
    else carriers.set(key, [m]);
  };
  for (const m of plan.members) {
    const mark = m.markLocked && m.mark ? m.mark : current.get(m.id);
    if (mark) add(`${m.level}\u0000${mark}`, m);
  }
  for (const list of carriers.values()) {
    // The holder is a member already carrying the mark as issued, else the first locked to it.
    const holder = list.find((m) => !(m.markLocked && m.mark)) ?? list[0];
    const a = designed.get(holder.id);
    for (const m of list) {
      if (m === holder || !(m.markLocked && m.mark)) continue;
      const b = designed.get(m.id);
      const same =
        a && b && a.kind === b.kind && a.shape !== null && a.shape === b.shape && Math.abs(a.span_ft - b.span_ft) <= SPAN_TOLERANCE_FT;
      if (same) continue;
      const describe = (d: typeof a) => (d ? `${d.shape ?? 'not sized'}, span ${formatFeetInches(d.span_ft)}` : 'not designed');
      throw marksInvalid(
        `Mark ${m.mark} on ${levelName(m.level)} is already used by the ${memberWhere(plan, holder)} (${describe(a)}); the ${memberWhere(plan, m)} is ${describe(b)}. A mark can be shared only by members of the same size and span.`,
        m.id,
        m.mark!,
      );
    }
  }
}

/** The design's members with marks re-assigned by the engine's rule for this plan. */
function remark(design: DesignView, plan: Plan): SchemeResult {
  const planMember = new Map(plan.members.map((m) => [m.id, m]));
  const marks = assignMarks(
    design.members.map((d) => {
      const m = planMember.get(d.id)!;
      return {
        id: d.id,
        level: d.level,
        kind: d.kind,
        shape: d.shape,
        span_ft: d.span_ft,
        midpoint: [(m.start[0] + m.end[0]) / 2, (m.start[1] + m.end[1]) / 2] as const,
        lockedMark: m.markLocked && m.mark ? m.mark : null,
        issuedMark: m.markLocked ? null : (m.mark ?? null),
      };
    }),
    plan.levels,
  );
  const { revision: _r, designedAt: _d, stale: _s, ...result } = design as DesignView & { designedAt?: string; stale?: boolean };
  return { ...(result as SchemeResult), members: design.members.map((d) => ({ ...d, mark: marks.get(d.id) ?? d.mark })) };
}

function memberMarks(result: Pick<SchemeResult, 'members'>, plan: Plan): MemberMark[] {
  const locked = new Set(plan.members.filter((m) => m.markLocked && m.mark).map((m) => m.id));
  return result.members.map((m) => ({ memberId: m.id, level: m.level, mark: m.mark, manual: locked.has(m.id) }));
}

async function saveMarks(
  ctx: SchemeServiceContext,
  scheme: SchemeRow,
  edited: Plan,
  design: DesignView,
  expectedRevision: number,
  note: string,
): Promise<MarksResult> {
  const result = remark(design, edited);
  // The marks given are stored on the members, so later designs keep them.
  const plan = withIssuedMarks(edited, new Map(result.members.map((m) => [m.id, m.mark])));
  let revision: number;
  try {
    revision = await commitPlanRevision(ctx.db, scheme, { plan, userId: ctx.actor.userId, note, expectedRevision });
  } catch (err) {
    if (err instanceof RevisionConflict) {
      const now = await ctx.db.models.Scheme.findByPk(scheme.getDataValue('id'), { attributes: ['revision'] });
      throw conflict(now?.getDataValue('revision') ?? expectedRevision, expectedRevision);
    }
    throw err;
  }
  if (design.revision === expectedRevision) {
    await storeDesignRun(ctx.db, { schemeId: scheme.getDataValue('id'), revision, result, userId: ctx.actor.userId });
  }
  return { revision, changed: true, marks: memberMarks(result, plan), caution: result.caution ?? SCHEME_CAUTION };
}

/** PATCH /api/schemes/:id/marks: set (lock) or release marks; 409 on a stale revision, 422 naming the member. */
export async function editMarks(
  ctx: SchemeServiceContext,
  schemeId: string,
  input: { revision: number; marks: MarkEdit[] },
): Promise<MarksResult> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const currentRevision = scheme.getDataValue('revision');
  if (currentRevision !== input.revision) throw conflict(currentRevision, input.revision);
  const design = (await getSchemeDesign(ctx, schemeId, { designIfStale: true })) as unknown as DesignView;
  // Marks as they stand are issued onto the members first, so the members not edited keep theirs.
  const current = new Map(design.members.map((m) => [m.id, m.mark]));
  const plan = withIssuedMarks(await readPlan(ctx.db, scheme.get({ plain: true })), current);
  const seen = new Set<string>();
  const byId = new Map(plan.members.map((m) => [m.id, m]));
  for (const edit of input.marks) {
    const member = byId.get(edit.memberId);
    if (!member) throw marksInvalid(`A member of this mark edit is not in this scheme (deleted since it was opened?); reload the plan and edit the marks again.`, edit.memberId, edit.mark);
    if (seen.has(edit.memberId)) throw marksInvalid(`The ${memberWhere(plan, member)} is given a mark twice in one edit.`, edit.memberId, edit.mark);
    seen.add(edit.memberId);
    if (edit.mark === null) {
      delete member.mark;
      delete member.markLocked;
    } else {
      member.mark = edit.mark;
      member.markLocked = true;
    }
  }
  const names = new Map(plan.levels.map((l) => [l.id, l.name]));
  const edited = new Set(input.marks.map((e) => e.memberId));
  checkManualMarks(plan, design, (id) => names.get(id) ?? id, new Map([...current].filter(([id]) => !edited.has(id))));
  const list = input.marks.map((e) => `${memberWhere(plan, byId.get(e.memberId)!)} → ${e.mark ?? 'by the rule'}`).join(', ');
  return saveMarks(ctx, scheme, plan, design, input.revision, `Marks edited: ${list}`.slice(0, 500));
}

/**
 * POST /api/schemes/:id/marks/renumber: the one place marks move. Issued marks are cleared and
 * every design numbered afresh in plan order; manual ones stay unless keepManual is false.
 */
export async function renumberMarks(ctx: SchemeServiceContext, schemeId: string, input: { keepManual: boolean }): Promise<MarksResult> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const revision = scheme.getDataValue('revision');
  const design = (await getSchemeDesign(ctx, schemeId, { designIfStale: true })) as unknown as DesignView;
  const stored = await readPlan(ctx.db, scheme.get({ plain: true }));
  const plan: Plan = structuredClone(stored);
  for (const m of plan.members) {
    if (input.keepManual && m.markLocked && m.mark) continue;
    delete m.mark;
    delete m.markLocked;
  }
  const result = remark(design, plan);
  const renumbered = withIssuedMarks(plan, new Map(result.members.map((m) => [m.id, m.mark])));
  const same = (a: PlanMember, b: PlanMember) => (a.mark ?? null) === (b.mark ?? null) && Boolean(a.markLocked) === Boolean(b.markLocked);
  if (renumbered.members.every((m, i) => same(m, stored.members[i]))) {
    return { revision, changed: false, marks: memberMarks(result, stored), caution: result.caution ?? SCHEME_CAUTION };
  }
  const note = input.keepManual ? 'Marks renumbered (manual marks kept)' : 'Marks renumbered (manual marks released)';
  return saveMarks(ctx, scheme, plan, design, revision, note);
}
