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
import { defineSchemeModel } from './scheme.model';
import { defineLevelModel } from './level.model';
import { defineGridLineModel } from './grid-line.model';
import { defineColumnModel } from './column.model';
import { defineMemberModel } from './member.model';
import { defineZoneModel } from './zone.model';
import { defineDeckModel } from './deck.model';
import { definePointLoadModel } from './point-load.model';
import { defineLineLoadModel } from './line-load.model';
import { defineOpeningModel } from './opening.model';
import { definePlanRevisionModel } from './plan-revision.model';
import { defineDesignRunModel } from './design-run.model';
import { defineSchemeCommentModel } from './scheme-comment.model';
import { defineSchemeActivityModel } from './scheme-activity.model';
import { defineUnitPriceModel } from './unit-price.model';
import { defineUnderlayModel } from './underlay.model';
import { defineBayStudyModel } from './bay-study.model';
import { defineDeckProfileModel } from './deck-profile.model';

// Models are defined per Sequelize instance (tests run many in-memory databases), so the
// app passes this object around instead of importing model classes globally.
export function defineModels(sequelize: Sequelize) {
  return {
    Firm: defineFirmModel(sequelize),
    User: defineUserModel(sequelize),
    Membership: defineMembershipModel(sequelize),
    Session: defineSessionModel(sequelize),
    Project: defineProjectModel(sequelize),
    // Schemes and their plans (0003-schemes-plans).
    Scheme: defineSchemeModel(sequelize),
    Level: defineLevelModel(sequelize),
    GridLine: defineGridLineModel(sequelize),
    Column: defineColumnModel(sequelize),
    Member: defineMemberModel(sequelize),
    Zone: defineZoneModel(sequelize),
    Deck: defineDeckModel(sequelize),
    PointLoad: definePointLoadModel(sequelize),
    LineLoad: defineLineLoadModel(sequelize),
    Opening: defineOpeningModel(sequelize),
    PlanRevision: definePlanRevisionModel(sequelize),
    DesignRun: defineDesignRunModel(sequelize),
    Invitation: defineInvitationModel(sequelize),
    PasswordReset: definePasswordResetModel(sequelize),
    OutboxMessage: defineOutboxMessageModel(sequelize),
    AuditEvent: defineAuditEventModel(sequelize),
    NotificationPreference: defineNotificationPreferenceModel(sequelize),
    // Scheme comments, activity and the firm's unit prices (0006-scheme-status-prices).
    SchemeComment: defineSchemeCommentModel(sequelize),
    SchemeActivity: defineSchemeActivityModel(sequelize),
    UnitPrice: defineUnitPriceModel(sequelize),
    // Plan images under a level (0005-underlays).
    Underlay: defineUnderlayModel(sequelize),
    // Bay studies of a scheme (0009-bay-studies).
    BayStudy: defineBayStudyModel(sequelize),
    // The firm's slab build-ups on deck (0010-stud-camber-prices-deck-profiles).
    DeckProfile: defineDeckProfileModel(sequelize),
  };
}

export type Models = ReturnType<typeof defineModels>;

export interface Db {
  sequelize: Sequelize;
  models: Models;
}
