import type { Sequelize } from 'sequelize';
import { defineAuditEventModel } from './audit-event.model';
import { defineFirmModel } from './firm.model';
import { defineInvitationModel } from './invitation.model';
import { defineMembershipModel } from './membership.model';
import { defineNotificationPreferenceModel } from './notification-preference.model';
import { defineOutboxMessageModel } from './outbox-message.model';
import { definePasswordResetModel } from './password-reset.model';
import { defineProjectModel } from './project.model';
import { defineSessionModel } from './session.model';
import { defineUserModel } from './user.model';

// Models are defined per Sequelize instance (tests run many in-memory databases), so the
// app passes this object around instead of importing model classes globally.
export function defineModels(sequelize: Sequelize) {
  return {
    Firm: defineFirmModel(sequelize),
    User: defineUserModel(sequelize),
    Membership: defineMembershipModel(sequelize),
    Session: defineSessionModel(sequelize),
    Project: defineProjectModel(sequelize),
    Invitation: defineInvitationModel(sequelize),
    PasswordReset: definePasswordResetModel(sequelize),
    OutboxMessage: defineOutboxMessageModel(sequelize),
    AuditEvent: defineAuditEventModel(sequelize),
    NotificationPreference: defineNotificationPreferenceModel(sequelize),
  };
}

export type Models = ReturnType<typeof defineModels>;

export interface Db {
  sequelize: Sequelize;
  models: Models;
}
