import type { Db } from '../models/models';
import type { SchemeStatus } from '../models/scheme.model';
import { recordAudit } from './audit.service';
import { findOwnScheme } from './plan-store.service';
import type { ReviewContext } from './scheme-status.service';

// A scheme's comment thread and its activity history. Comments are append-only. The history
// is assembled from the tables that already record each event: plan revisions (created,
// cloned, imported, saved, restored), design runs, comments and status changes.

export interface PersonView {
  id: string;
  name: string;
}

export interface CommentView {
  id: string;
  schemeId: string;
  body: string;
  author: PersonView | null;
  createdAt: string;
}

async function people(db: Db, ids: (string | null | undefined)[]): Promise<Map<string, PersonView>> {
  const wanted = [...new Set(ids.filter((id): id is string => typeof id === 'string'))];
  const out = new Map<string, PersonView>();
  if (wanted.length === 0) return out;
  const users = await db.models.User.findAll({ where: { id: wanted }, attributes: ['id', 'name'] });
  for (const u of users) out.set(u.getDataValue('id'), { id: u.getDataValue('id'), name: u.getDataValue('name') });
  return out;
}

/** The thread, oldest first (it reads as a conversation). */
export async function listComments(ctx: ReviewContext, schemeId: string): Promise<CommentView[]> {
  await findOwnScheme(ctx, schemeId);
  const rows = await ctx.db.models.SchemeComment.findAll({
    where: { schemeId },
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  const who = await people(ctx.db, rows.map((r) => r.getDataValue('userId')));
  return rows.map((r) => {
    const c = r.get({ plain: true });
    return {
      id: c.id,
      schemeId: c.schemeId,
      body: c.body,
      author: c.userId ? (who.get(c.userId) ?? null) : null,
      createdAt: new Date(c.createdAt).toISOString(),
    };
  });
}

export async function addComment(ctx: ReviewContext, schemeId: string, body: string): Promise<CommentView> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const row = await ctx.db.models.SchemeComment.create({
    schemeId,
    userId: ctx.actor.userId,
    body,
    createdAt: new Date(),
  });
  const c = row.get({ plain: true });
  await recordAudit(ctx, {
    firmId: ctx.actor.firmId,
    userId: ctx.actor.userId,
    action: 'scheme.commented',
    target: scheme.getDataValue('name'),
    detail: { schemeId, commentId: c.id },
  });
  const who = await people(ctx.db, [c.userId]);
  return {
    id: c.id,
    schemeId,
    body: c.body,
    author: c.userId ? (who.get(c.userId) ?? null) : null,
    createdAt: new Date(c.createdAt).toISOString(),
  };
}

export type ActivityKind =
  | 'created'
  | 'cloned'
  | 'imported'
  | 'plan_saved'
  | 'plan_restored'
  | 'designed'
  | 'commented'
  | 'status_changed';

export interface ActivityEntry {
  kind: ActivityKind;
  at: string;
  actor: PersonView | null;
  /** One line a person reads ("Status changed from draft to in review"). */
  summary: string;
  detail: Record<string, unknown>;
}

const STATUS_WORDS: Record<SchemeStatus, string> = { draft: 'draft', in_review: 'in review', chosen: 'chosen' };
const statusWord = (s: unknown) => (typeof s === 'string' && s in STATUS_WORDS ? STATUS_WORDS[s as SchemeStatus] : String(s));

function parseJson(text: string | null): Record<string, unknown> {
  if (!text) return {};
  try {
    const v = JSON.parse(text) as unknown;
    return v && typeof v === 'object' ? (v as Record<string, unknown>) : {};
  } catch {
    return {};
  }
}

const ACTIVITY_LIMIT = 300;

/** Everything that happened to a scheme, newest first. */
export async function listActivity(ctx: ReviewContext, schemeId: string): Promise<ActivityEntry[]> {
  await findOwnScheme(ctx, schemeId);
  const { models } = ctx.db;
  const [revisions, runs, comments, events] = await Promise.all([
    models.PlanRevision.findAll({ where: { schemeId }, attributes: ['revision', 'note', 'userId', 'createdAt'] }),
    models.DesignRun.findAll({
      where: { schemeId },
      attributes: ['revision', 'steelWeightLb', 'pieces', 'failingMembers', 'problemCount', 'userId', 'createdAt'],
    }),
    models.SchemeComment.findAll({ where: { schemeId } }),
    models.SchemeActivity.findAll({ where: { schemeId }, order: [['createdAt', 'ASC']] }),
  ]);
  const who = await people(ctx.db, [
    ...revisions.map((r) => r.getDataValue('userId')),
    ...runs.map((r) => r.getDataValue('userId')),
    ...comments.map((r) => r.getDataValue('userId')),
    ...events.map((r) => r.getDataValue('userId')),
  ]);
  const actor = (id: string | null) => (id ? (who.get(id) ?? null) : null);
  const out: (ActivityEntry & { order: number })[] = [];

  for (const r of revisions) {
    const v = r.get({ plain: true });
    const note = v.note ?? '';
    let kind: ActivityKind = 'plan_saved';
    let summary = `Plan saved as revision ${v.revision}${note ? `: ${note}` : ''}`;
    if (v.revision === 1) {
      if (note.startsWith('Cloned from')) {
        kind = 'cloned';
        summary = note;
      } else if (note.startsWith('Imported')) {
        kind = 'imported';
        summary = 'Scheme created from an imported plan file';
      } else {
        kind = 'created';
        summary = 'Scheme created';
      }
    } else if (note.startsWith('Restored revision')) {
      kind = 'plan_restored';
      summary = `${note} as revision ${v.revision}`;
    }
    out.push({ kind, at: new Date(v.createdAt).toISOString(), actor: actor(v.userId), summary, detail: { revision: v.revision, note: v.note }, order: 0 });
  }
  for (const r of runs) {
    const v = r.get({ plain: true });
    const tons = (v.steelWeightLb / 2000).toFixed(1);
    const failing = v.failingMembers > 0 ? `, ${v.failingMembers} failing` : '';
    out.push({
      kind: 'designed',
      at: new Date(v.createdAt).toISOString(),
      actor: actor(v.userId),
      summary: `Designed revision ${v.revision}: ${tons} tons, ${v.pieces} pieces${failing}`,
      detail: { revision: v.revision, steelWeight_lb: v.steelWeightLb, pieces: v.pieces, failingMembers: v.failingMembers, problemCount: v.problemCount },
      order: 1,
    });
  }
  for (const r of comments) {
    const v = r.get({ plain: true });
    const excerpt = v.body.length > 120 ? `${v.body.slice(0, 117)}…` : v.body;
    out.push({ kind: 'commented', at: new Date(v.createdAt).toISOString(), actor: actor(v.userId), summary: `Commented: ${excerpt}`, detail: { commentId: v.id }, order: 2 });
  }
  for (const r of events) {
    const v = r.get({ plain: true });
    const d = parseJson(v.detail);
    const because = d.because as { schemeName?: string } | undefined;
    const summary =
      `Status changed from ${statusWord(d.from)} to ${statusWord(d.to)}` +
      (because?.schemeName ? ` (because "${because.schemeName}" was chosen)` : '');
    out.push({ kind: 'status_changed', at: new Date(v.createdAt).toISOString(), actor: actor(v.userId), summary, detail: d, order: 3 });
  }
  out.sort((a, b) => (a.at === b.at ? b.order - a.order : a.at < b.at ? 1 : -1));
  return out.slice(0, ACTIVITY_LIMIT).map(({ order: _o, ...e }) => e);
}
