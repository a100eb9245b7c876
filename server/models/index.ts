import type { Sequelize } from 'sequelize';
import { defineUser, User } from './user.model';
import { defineTeam, Team } from './team.model';
import { defineMembership, Membership } from './membership.model';
import { defineInvite, Invite } from './invite.model';
import { definePart, Part } from './part.model';
import { defineStudy, Study } from './study.model';
import { defineRevision, Revision } from './revision.model';
import { defineMaterial, Material } from './material.model';
import { defineUpload, Upload } from './upload.model';
import { defineReview, Review } from './review.model';
import { defineAuditEvent, AuditEvent } from './audit-event.model';

export { User, Team, Membership, Invite, Part, Study, Revision, Material, Upload, Review, AuditEvent };
export { TEAM_ROLES, type TeamRole } from './membership.model';

export interface Models {
  User: typeof User;
  Team: typeof Team;
  Membership: typeof Membership;
  Invite: typeof Invite;
  Part: typeof Part;
  Study: typeof Study;
  Revision: typeof Revision;
  Material: typeof Material;
  Upload: typeof Upload;
  Review: typeof Review;
  AuditEvent: typeof AuditEvent;
}

/**
 * Define every model on the given connection and wire all associations here,
 * in one place. Model classes are module singletons, so one process holds one
 * live connection for them (the last one passed in).
 */
export function initModels(sequelize: Sequelize): Models {
  defineUser(sequelize);
  defineTeam(sequelize);
  defineMembership(sequelize);
  defineInvite(sequelize);
  definePart(sequelize);
  defineStudy(sequelize);
  defineRevision(sequelize);
  defineMaterial(sequelize);
  defineUpload(sequelize);
  defineReview(sequelize);
  defineAuditEvent(sequelize);

  Team.hasMany(Membership, { foreignKey: 'teamId', as: 'memberships' });
  Membership.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });

  Invite.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
  Invite.belongsTo(User, { foreignKey: 'invitedBy', as: 'inviter' });

  Team.hasMany(Part, { foreignKey: 'teamId', as: 'parts' });
  Part.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
  Part.belongsTo(Revision, { foreignKey: 'baselineRevisionId', as: 'baseline', constraints: false });
  Part.belongsTo(User, { foreignKey: 'baselinePinnedBy', as: 'baselinePinner' });
  Part.hasMany(Study, { foreignKey: 'partId', as: 'studies' });

  Study.belongsTo(Part, { foreignKey: 'partId', as: 'part' });
  Study.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
  Study.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
  Study.belongsTo(Revision, { foreignKey: 'forkedFromRevisionId', as: 'forkedFrom', constraints: false });
  Study.hasMany(Revision, { foreignKey: 'studyId', as: 'revisions' });

  Revision.belongsTo(Study, { foreignKey: 'studyId', as: 'study' });
  Revision.belongsTo(User, { foreignKey: 'authorId', as: 'author' });

  Team.hasMany(Material, { foreignKey: 'teamId', as: 'materials' });
  Material.belongsTo(User, { foreignKey: 'createdBy', as: 'creator' });
  Team.hasMany(Upload, { foreignKey: 'teamId', as: 'uploads' });
  Upload.belongsTo(User, { foreignKey: 'uploadedBy', as: 'uploader' });
  Upload.hasMany(Review, { foreignKey: 'uploadId', as: 'reviews' });
  Review.belongsTo(Upload, { foreignKey: 'uploadId', as: 'upload' });
  Review.belongsTo(User, { foreignKey: 'decidedBy', as: 'decider' });

  AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });

  return { User, Team, Membership, Invite, Part, Study, Revision, Material, Upload, Review, AuditEvent };
}
