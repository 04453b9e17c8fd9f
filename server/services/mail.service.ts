import type { AppContext } from '../app-context';
import { AppError } from '../errors/app-error';
import { createMailSender, type MailDelivery, type MailSender, type OutgoingMail } from '../mail/mail-transport';

type MailCtx = Pick<AppContext, 'config' | 'db'>;

// One sender per app (tests build one app per file, each with its own database).
const senders = new WeakMap<object, MailSender>();

export function mailSenderFor(ctx: MailCtx): MailSender {
  let sender = senders.get(ctx);
  if (!sender) {
    sender = createMailSender(ctx.config, ctx.db.models);
    senders.set(ctx, sender);
  }
  return sender;
}

/** Replaces the sender of an app (tests use it to simulate a failing mail server). */
export function setMailSenderFor(ctx: MailCtx, sender: MailSender): void {
  senders.set(ctx, sender);
}

export function isOutboxActive(ctx: MailCtx): boolean {
  return mailSenderFor(ctx).kind === 'outbox';
}

export async function sendMail(
  ctx: MailCtx,
  mail: OutgoingMail,
  options: { firmId: string | null },
): Promise<MailDelivery> {
  return mailSenderFor(ctx).send(mail, options);
}

/**
 * Base address for links in e-mails: APP_URL when set (always with SMTP, see config.ts),
 * otherwise the address the request came to (local outbox only).
 */
export function publicBaseUrl(ctx: Pick<AppContext, 'config'>, request: { protocol: string; host?: string }): string {
  if (ctx.config.appUrl) return ctx.config.appUrl;
  return `${request.protocol}://${request.host ?? 'localhost'}`;
}

export interface OutboxMessageView {
  id: string;
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  sentAt: string;
}

/** The firm's messages in the local outbox, newest first; 404 when mail goes out by SMTP. */
export async function listOutbox(
  ctx: MailCtx,
  firmId: string,
  options: { limit?: number } = {},
): Promise<OutboxMessageView[]> {
  if (!isOutboxActive(ctx)) {
    throw new AppError(404, 'not_found', 'The outbox is only kept when no mail server is configured.');
  }
  const rows = await ctx.db.models.OutboxMessage.findAll({
    where: { firmId },
    order: [
      ['sentAt', 'DESC'],
      ['id', 'ASC'],
    ],
    limit: options.limit ?? 200,
  });
  return rows.map((r) => {
    const m = r.get({ plain: true });
    return {
      id: m.id,
      from: m.fromAddress,
      to: m.toAddress,
      subject: m.subject,
      text: m.textBody,
      html: m.htmlBody,
      sentAt: new Date(m.sentAt).toISOString(),
    };
  });
}
