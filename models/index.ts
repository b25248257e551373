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

// Associations live here, once per model class, so every importer sees the same graph
// (and a model module that Next's dev server reloads gets its associations again).
function associate(model: { associations: Record<string, unknown> }, alias: string, define: () => void): void {
  if (!model.associations[alias]) define();
}
associate(User, 'memberships', () => User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' }));
associate(Membership, 'user', () => Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' }));
associate(Studio, 'memberships', () => Studio.hasMany(Membership, { foreignKey: 'studioId', as: 'memberships' }));
associate(Membership, 'studio', () => Membership.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' }));
associate(Invitation, 'studio', () => Invitation.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' }));
associate(Invitation, 'invitedBy', () => Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' }));
associate(EmailMessage, 'studio', () => EmailMessage.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' }));
associate(AuditEvent, 'actor', () => AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' }));
associate(Show, 'scenes', () => Show.hasMany(Scene, { foreignKey: 'showId', as: 'scenes' }));
associate(Scene, 'show', () => Scene.belongsTo(Show, { foreignKey: 'showId', as: 'show' }));
associate(Scene, 'revisions', () => Scene.hasMany(SceneRevision, { foreignKey: 'sceneId', as: 'revisions' }));
associate(SceneRevision, 'scene', () => SceneRevision.belongsTo(Scene, { foreignKey: 'sceneId', as: 'scene' }));
associate(RenderJob, 'scene', () => RenderJob.belongsTo(Scene, { foreignKey: 'sceneId', as: 'scene' }));
associate(RenderJob, 'revision', () => RenderJob.belongsTo(SceneRevision, { foreignKey: 'revisionId', as: 'revision' }));
associate(RenderJob, 'frames', () => RenderJob.hasMany(Frame, { foreignKey: 'renderJobId', as: 'frames' }));
associate(Delivery, 'renderJob', () => Delivery.belongsTo(RenderJob, { foreignKey: 'renderJobId', as: 'renderJob' }));
associate(Review, 'scene', () => Review.belongsTo(Scene, { foreignKey: 'sceneId', as: 'scene' }));
associate(Review, 'revision', () => Review.belongsTo(SceneRevision, { foreignKey: 'revisionId', as: 'revision' }));
associate(Review, 'notes', () => Review.hasMany(ReviewNote, { foreignKey: 'reviewId', as: 'notes' }));
associate(ReviewNote, 'author', () => ReviewNote.belongsTo(User, { foreignKey: 'authorId', as: 'author' }));
associate(Approval, 'approvedBy', () => Approval.belongsTo(User, { foreignKey: 'approvedById', as: 'approvedBy' }));

export { sequelize } from '@/lib/db/connection';
export { User, Studio, Membership, Invitation, EmailMessage, AuditEvent, SignInThrottle, Show, Scene, SceneRevision, RenderJob, Frame, Delivery, Review, ReviewNote, Approval };
