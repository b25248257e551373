import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';

export const EMAIL_STATUSES = ['sending', 'sent', 'failed'] as const;
export type EmailStatus = (typeof EMAIL_STATUSES)[number];

/** A record of every e-mail Skywell sent or tried to send, for admins to see. */
export class EmailMessage extends Model<InferAttributes<EmailMessage>, InferCreationAttributes<EmailMessage>> {
  declare id: CreationOptional<string>;
  declare studioId: string | null;
  declare kind: string;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare status: EmailStatus;
  declare error: string | null;
  declare providerMessageId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

EmailMessage.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: true },
    kind: { type: DataTypes.STRING(60), allowNull: false },
    toAddress: { type: DataTypes.STRING(320), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    textBody: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.ENUM(...EMAIL_STATUSES), allowNull: false, defaultValue: 'sending' },
    error: { type: DataTypes.TEXT, allowNull: true },
    providerMessageId: { type: DataTypes.STRING(300), allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'email_messages' },
);
