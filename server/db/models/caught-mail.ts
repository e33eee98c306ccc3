import type { MailAttachment } from '../../mail/attachment';
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Mail received by the built-in local catcher, so a fresh install can show what it would have sent. */
export class CaughtMail extends Model<InferAttributes<CaughtMail>, InferCreationAttributes<CaughtMail>> {
  declare id: CreationOptional<number>;
  declare from: string;
  declare to: string;
  declare subject: string;
  declare text: string;
  declare attachments: CreationOptional<MailAttachment[] | null>;
  declare receivedAt: CreationOptional<Date>;
}

export function initCaughtMail(sequelize: Sequelize) {
  CaughtMail.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      from: { type: DataTypes.STRING(300), allowNull: false },
      to: { type: DataTypes.STRING(1000), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      attachments: { type: DataTypes.JSON, allowNull: true },
      receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'caught_mail', timestamps: false },
  );
}
