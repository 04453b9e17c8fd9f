import type { AppContext } from '../app-context';
import type { AuthContext } from '../auth/auth-context';
import type { Role } from '../auth/policy';
import { schemeStatusMail } from '../mail/mail-templates';
import type { NotificationPrefs } from '../schemas/team.schema';
import { sendMail } from './mail.service';

export const DEFAULT_NOTIFICATION_PREFS: NotificationPrefs = { schemeSubmitted: true, schemeChosen: true };

type NotifyCtx = Pick<AppContext, 'config' | 'db'>;

export async function getNotificationPrefs(
  ctx: NotifyCtx,
  who: Pick<AuthContext, 'userId' | 'firmId'>,
): Promise<NotificationPrefs> {
  const row = await ctx.db.models.NotificationPreference.findOne({
    where: { userId: who.userId, firmId: who.firmId },
  });
  if (!row) return { ...DEFAULT_NOTIFICATION_PREFS };
  return { schemeSubmitted: row.getDataValue('schemeSubmitted'), schemeChosen: row.getDataValue('schemeChosen') };
}

export async function setNotificationPrefs(
  ctx: NotifyCtx,
  who: Pick<AuthContext, 'userId' | 'firmId'>,
  prefs: NotificationPrefs,
): Promise<NotificationPrefs> {
  const { NotificationPreference } = ctx.db.models;
  const row = await NotificationPreference.findOne({ where: { userId: who.userId, firmId: who.firmId } });
  if (row) await row.update(prefs);
  else await NotificationPreference.create({ userId: who.userId, firmId: who.firmId, ...prefs });
  return getNotificationPrefs(ctx, who);
}

export interface SchemeStatusNotice {
  firmId: string;
  schemeId: string;
  schemeName: string;
  projectName: string;
  /** The scheme's new status; only "in review" (submitted) and "chosen" send mail. */
  status: string;
  /** For the link in the e-mail (needs APP_URL). */
  projectId?: string;
  /** The scheme's engineers; all the firm's engineers when not given. */
  engineerUserIds?: string[];
}

/** Which event a status is, accepting the spellings a status field may use. */
export function schemeStatusEvent(status: string): 'submitted' | 'chosen' | null {
  const s = status.trim().toLowerCase().replace(/[\s-]+/g, '_');
  if (s === 'in_review' || s === 'review' || s === 'submitted') return 'submitted';
  if (s === 'chosen') return 'chosen';
  return null;
}

/**
 * E-mails the firm's managers when a scheme is submitted for review, and its engineers when
 * it is chosen, each only if their preference is on. Returns the addresses written to.
 */
export async function notifySchemeStatus(ctx: NotifyCtx, notice: SchemeStatusNotice): Promise<{ recipients: string[] }> {
  const event = schemeStatusEvent(notice.status);
  if (!event) return { recipients: [] };
  const { Membership, User, Firm, NotificationPreference } = ctx.db.models;
  const role: Role = event === 'submitted' ? 'manager' : 'engineer';
  let memberships = await Membership.findAll({ where: { firmId: notice.firmId, role } });
  if (event === 'chosen' && notice.engineerUserIds) {
    const wanted = new Set(notice.engineerUserIds);
    memberships = memberships.filter((m) => wanted.has(m.getDataValue('userId')));
  }
  const userIds = memberships.map((m) => m.getDataValue('userId'));
  if (userIds.length === 0) return { recipients: [] };
  const [users, prefs, firm] = await Promise.all([
    User.findAll({ where: { id: userIds } }),
    NotificationPreference.findAll({ where: { firmId: notice.firmId, userId: userIds } }),
    Firm.findByPk(notice.firmId),
  ]);
  const prefOf = new Map(prefs.map((p) => [p.getDataValue('userId'), p.get({ plain: true })]));
  const link =
    ctx.config.appUrl && notice.projectId ? `${ctx.config.appUrl}/projects/${notice.projectId}` : undefined;
  const recipients: string[] = [];
  for (const user of users) {
    const pref = prefOf.get(user.getDataValue('id'));
    const wants = event === 'submitted' ? (pref?.schemeSubmitted ?? true) : (pref?.schemeChosen ?? true);
    if (!wants) continue;
    const email = user.getDataValue('email');
    const mail = schemeStatusMail({
      recipientName: user.getDataValue('name'),
      firmName: firm?.getDataValue('name') ?? 'your firm',
      projectName: notice.projectName,
      schemeName: notice.schemeName,
      event,
      link,
    });
    await sendMail(ctx, { to: email, ...mail }, { firmId: notice.firmId });
    recipients.push(email);
  }
  return { recipients: recipients.sort() };
}
