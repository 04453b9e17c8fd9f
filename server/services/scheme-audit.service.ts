import { recordAudit } from './audit.service';
import type { SchemeServiceContext } from './plan-store.service';

// Audit entries for schemes, plan revisions and design runs. They are written right after
// the write they describe has committed, never inside its transaction: an audit failure is
// logged and the user's save stands (a rolled-back save would lose work over a log line).

export const SCHEME_AUDIT_ACTIONS = {
  created: 'scheme.created',
  imported: 'scheme.imported',
  cloned: 'scheme.cloned',
  renamed: 'scheme.renamed',
  archived: 'scheme.archived',
  unarchived: 'scheme.unarchived',
  deleted: 'scheme.deleted',
  planRevised: 'plan.revised',
  planRestored: 'plan.restored',
  designRun: 'design.run',
} as const;

export type SchemeAuditAction = (typeof SCHEME_AUDIT_ACTIONS)[keyof typeof SCHEME_AUDIT_ACTIONS];

export interface SchemeAuditEvent {
  action: SchemeAuditAction;
  schemeId: string;
  schemeName: string;
  projectId: string;
  detail?: Record<string, unknown>;
}

/**
 * Records one scheme event for the acting user: target "<project> / <scheme>", detail with
 * the scheme and project ids plus the event's own fields. Never throws.
 */
export async function recordSchemeAudit(
  ctx: SchemeServiceContext,
  event: SchemeAuditEvent,
  logError: (message: string, err: unknown) => void = console.error,
): Promise<void> {
  try {
    const project = await ctx.db.models.Project.findByPk(event.projectId, { attributes: ['name'] });
    const projectName = project?.getDataValue('name');
    await recordAudit(ctx, {
      firmId: ctx.actor.firmId,
      userId: ctx.actor.userId,
      action: event.action,
      target: projectName ? `${projectName} / ${event.schemeName}` : event.schemeName,
      detail: { schemeId: event.schemeId, projectId: event.projectId, ...event.detail },
    });
  } catch (err) {
    logError(`[baywright] audit entry ${event.action} for scheme ${event.schemeId} not recorded`, err);
  }
}
