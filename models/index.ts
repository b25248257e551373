import 'server-only';
import { User } from './User';
import { Studio } from './Studio';
import { Membership } from './Membership';
import { Invitation } from './Invitation';
import { EmailMessage } from './EmailMessage';
import { AuditEvent } from './AuditEvent';
import { SignInThrottle } from './SignInThrottle';
import { Show } from './Show';
import { Scene } from './Scene';
import { SceneRevision } from './SceneRevision';
import { RenderJob } from './RenderJob';
import { Frame } from './Frame';
import { Delivery } from './Delivery';
import { Review } from './Review';
import { ReviewNote } from './ReviewNote';
import { Approval } from './Approval';

// Associations live here, once, so every importer sees the same graph.
if (!Membership.associations.user) {
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Studio.hasMany(Membership, { foreignKey: 'studioId', as: 'memberships' });
  Membership.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });
  Invitation.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });
  Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' });
  EmailMessage.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });
  AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
  Show.hasMany(Scene, { foreignKey: 'showId', as: 'scenes' });
  Scene.belongsTo(Show, { foreignKey: 'showId', as: 'show' });
  Scene.hasMany(SceneRevision, { foreignKey: 'sceneId', as: 'revisions' });
  SceneRevision.belongsTo(Scene, { foreignKey: 'sceneId', as: 'scene' });
  RenderJob.belongsTo(Scene, { foreignKey: 'sceneId', as: 'scene' });
  RenderJob.belongsTo(SceneRevision, { foreignKey: 'revisionId', as: 'revision' });
  RenderJob.hasMany(Frame, { foreignKey: 'renderJobId', as: 'frames' });
  Delivery.belongsTo(RenderJob, { foreignKey: 'renderJobId', as: 'renderJob' });
  Review.belongsTo(Scene, { foreignKey: 'sceneId', as: 'scene' });
  Review.belongsTo(SceneRevision, { foreignKey: 'revisionId', as: 'revision' });
  Review.hasMany(ReviewNote, { foreignKey: 'reviewId', as: 'notes' });
  ReviewNote.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  Approval.belongsTo(User, { foreignKey: 'approvedById', as: 'approvedBy' });
}

export { sequelize } from '@/lib/db/connection';
export { User, Studio, Membership, Invitation, EmailMessage, AuditEvent, SignInThrottle, Show, Scene, SceneRevision, RenderJob, Frame, Delivery, Review, ReviewNote, Approval };
