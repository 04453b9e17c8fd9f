import { Op, type Model, type Transaction } from 'sequelize';
import type { Config } from '../config';
import { AppError } from '../errors/app-error';
import type { Db } from '../models/models';
import { SCHEME_STATUSES, type SchemeStatus } from '../models/scheme.model';
import { recordAudit } from './audit.service';
import { notifySchemeStatus } from './notifications.service';
import { findOwnScheme } from './plan-store.service';

// A scheme's review status: draft → in review → chosen, at most one chosen per project.
// Choosing a scheme un-chooses the project's other chosen scheme in the same transaction
// (it goes back to "in review"); a partial unique index (0006) backs the rule in the
// database. Every change is kept in scheme_activity and the firm's audit log, and mail goes
// to the people who asked for it (notifications.service).

/** What review services take: the database, config (for mail links) and the caller. */
export interface ReviewContext {
  db: Db;
  config: Config;
  actor: { firmId: string; userId: string };
}

export const STATUS_LABELS: Record<SchemeStatus, string> = {
  draft: 'draft',
  in_review: 'in review',
  chosen: 'chosen',
};

/** Allowed moves. Anything else answers 409 invalid_transition. */
export const STATUS_TRANSITIONS: Readonly<Record<SchemeStatus, readonly SchemeStatus[]>> = {
  draft: ['in_review'],
  in_review: ['draft', 'chosen'],
  chosen: ['in_review', 'draft'],
};

export function isSchemeStatus(value: unknown): value is SchemeStatus {
  return typeof value === 'string' && (SCHEME_STATUSES as readonly string[]).includes(value);
}

export function canMoveStatus(from: SchemeStatus, to: SchemeStatus): boolean {
  return STATUS_TRANSITIONS[from]?.includes(to) ?? false;
}

export interface StatusChangeResult {
  scheme: { id: string; projectId: string; name: string; status: SchemeStatus; archived: boolean };
  /** Schemes of the project that were chosen and went back to "in review". */
  unchosen: { id: string; name: string }[];
  /** Addresses written to (mail outbox), empty when nobody asked for this event. */
  notified: string[];
}

/** The status the project's previously chosen scheme goes back to when another is chosen. */
export const UNCHOSEN_STATUS: SchemeStatus = 'in_review';

/** Now, or 1 ms after the scheme's last recorded event: the history keeps its order. */
async function nextActivityTime(db: Db, schemeId: string, transaction: Transaction): Promise<Date> {
  const last = await db.models.SchemeActivity.max<Date | null, Model>('createdAt', { where: { schemeId }, transaction });
  const lastMs = last ? new Date(last).getTime() : 0;
  return new Date(Math.max(Date.now(), lastMs + 1));
}

export async function setSchemeStatus(ctx: ReviewContext, schemeId: string, to: SchemeStatus): Promise<StatusChangeResult> {
  const { db, actor } = ctx;
  const outcome = await db.sequelize.transaction(async (transaction) => {
    const scheme = await findOwnScheme(ctx, schemeId, transaction);
    const from = scheme.getDataValue('status');
    const name = scheme.getDataValue('name');
    const projectId = scheme.getDataValue('projectId');
    if (to === 'chosen' && scheme.getDataValue('archived')) {
      throw new AppError(409, 'scheme_archived', `"${name}" is archived; restore it before choosing it.`, {
        details: { current: { status: from, archived: true } },
      });
    }
    if (!canMoveStatus(from, to)) {
      const allowed = STATUS_TRANSITIONS[from].map((s) => STATUS_LABELS[s]).join(' or ');
      throw new AppError(
        409,
        'invalid_transition',
        `"${name}" is ${STATUS_LABELS[from]}; it can go to ${allowed}, not ${STATUS_LABELS[to]}.`,
        { details: { current: { status: from }, allowed: STATUS_TRANSITIONS[from] } },
      );
    }
    const unchosen: { id: string; name: string }[] = [];
    if (to === 'chosen') {
      const others = await db.models.Scheme.findAll({
        where: { projectId, status: 'chosen', id: { [Op.ne]: schemeId } },
        transaction,
      });
      for (const other of others) {
        await other.update({ status: UNCHOSEN_STATUS }, { transaction });
        await db.models.SchemeActivity.create(
          {
            schemeId: other.getDataValue('id'),
            userId: actor.userId,
            kind: 'status_changed',
            detail: JSON.stringify({ from: 'chosen', to: UNCHOSEN_STATUS, because: { schemeId, schemeName: name } }),
            createdAt: await nextActivityTime(db, other.getDataValue('id'), transaction),
          },
          { transaction },
        );
        unchosen.push({ id: other.getDataValue('id'), name: other.getDataValue('name') });
      }
    }
    await scheme.update({ status: to }, { transaction });
    await db.models.SchemeActivity.create(
      {
        schemeId,
        userId: actor.userId,
        kind: 'status_changed',
        detail: JSON.stringify({ from, to }),
        createdAt: await nextActivityTime(db, schemeId, transaction),
      },
      { transaction },
    );
    return { scheme, from, unchosen, projectId, name };
  });

  const { scheme, from, unchosen, projectId, name } = outcome;
  const project = await db.models.Project.findByPk(projectId, { attributes: ['name'] });
  const projectName = project?.getDataValue('name') ?? '';
  await recordAudit(ctx, {
    firmId: actor.firmId,
    userId: actor.userId,
    action: 'scheme.status_changed',
    target: `${projectName} / ${name}`,
    detail: { schemeId, from, to },
  });
  for (const other of unchosen) {
    await recordAudit(ctx, {
      firmId: actor.firmId,
      userId: actor.userId,
      action: 'scheme.status_changed',
      target: `${projectName} / ${other.name}`,
      detail: { schemeId: other.id, from: 'chosen', to: UNCHOSEN_STATUS, because: schemeId },
    });
  }

  const notified = await notifyQuietly(ctx, { schemeId, schemeName: name, projectId, projectName, status: to });
  return {
    scheme: {
      id: schemeId,
      projectId,
      name,
      status: scheme.getDataValue('status'),
      archived: Boolean(scheme.getDataValue('archived')),
    },
    unchosen,
    notified,
  };
}

/**
 * Mail follows a committed change; a mail failure must not undo or hide the change, so it
 * is logged and the change stands (the outbox keeps what was sent).
 */
async function notifyQuietly(
  ctx: ReviewContext,
  n: { schemeId: string; schemeName: string; projectId: string; projectName: string; status: SchemeStatus },
): Promise<string[]> {
  if (n.status === 'draft') return [];
  try {
    // The scheme's engineers: whoever created it or saved a revision of it.
    const revisions = await ctx.db.models.PlanRevision.findAll({ where: { schemeId: n.schemeId }, attributes: ['userId'] });
    const scheme = await ctx.db.models.Scheme.findByPk(n.schemeId, { attributes: ['createdBy'] });
    const engineerUserIds = [
      ...new Set(
        [scheme?.getDataValue('createdBy'), ...revisions.map((r) => r.getDataValue('userId'))].filter(
          (id): id is string => typeof id === 'string',
        ),
      ),
    ];
    const { recipients } = await notifySchemeStatus(ctx, {
      firmId: ctx.actor.firmId,
      schemeId: n.schemeId,
      schemeName: n.schemeName,
      projectName: n.projectName,
      projectId: n.projectId,
      status: n.status,
      engineerUserIds,
    });
    return recipients;
  } catch (err) {
    console.error('scheme status mail failed', err);
    return [];
  }
}
