import nodemailer from 'nodemailer';
import type { Config } from '../config';
import type { Models } from '../models/models';

// Where Baywright's e-mail goes: an SMTP server when SMTP_HOST is configured, otherwise
// the local outbox (nodemailer's JSON transport builds the message, a row keeps it) so a
// team without a mail server still gets its invitation and reset links.

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface MailDelivery {
  kind: 'smtp' | 'outbox';
  /** Outbox row id, or the SMTP message id. */
  id: string;
}

export interface MailSender {
  readonly kind: 'smtp' | 'outbox';
  readonly from: string;
  /** firmId: whose owners may read the message in the outbox (null: nobody's). */
  send(mail: OutgoingMail, options: { firmId: string | null }): Promise<MailDelivery>;
}

export const OUTBOX_FROM = 'Baywright <no-reply@baywright.invalid>';

export function createSmtpSender(smtp: NonNullable<Config['smtp']>): MailSender {
  const transporter = nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.port === 465,
    auth: smtp.user ? { user: smtp.user, pass: smtp.password ?? '' } : undefined,
    // A stuck server must not hold a request for minutes.
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return {
    kind: 'smtp',
    from: smtp.from,
    async send(mail) {
      const info = await transporter.sendMail({ from: smtp.from, ...mail });
      return { kind: 'smtp', id: String(info.messageId ?? '') };
    },
  };
}

interface JsonMessage {
  from?: { address?: string; name?: string };
  to?: { address?: string; name?: string }[];
  subject?: string;
  text?: string;
  html?: string;
}

const addressLine = (a?: { address?: string; name?: string }) =>
  a?.address ? (a.name ? `${a.name} <${a.address}>` : a.address) : '';

export function createOutboxSender(models: Pick<Models, 'OutboxMessage'>, from = OUTBOX_FROM): MailSender {
  const transporter = nodemailer.createTransport({ jsonTransport: true });
  return {
    kind: 'outbox',
    from,
    async send(mail, { firmId }) {
      // Built by nodemailer exactly as it would be sent, then kept.
      const info = await transporter.sendMail({ from, ...mail });
      const built = JSON.parse(String(info.message)) as JsonMessage;
      const row = await models.OutboxMessage.create({
        firmId,
        fromAddress: addressLine(built.from) || from,
        toAddress: (built.to ?? []).map(addressLine).join(', ') || mail.to,
        subject: built.subject ?? mail.subject,
        textBody: built.text ?? mail.text,
        htmlBody: built.html ?? mail.html,
        sentAt: new Date(),
      });
      return { kind: 'outbox', id: row.getDataValue('id') };
    },
  };
}

/** SMTP when configured, else the local outbox. */
export function createMailSender(config: Config, models: Pick<Models, 'OutboxMessage'>): MailSender {
  return config.smtp ? createSmtpSender(config.smtp) : createOutboxSender(models);
}
