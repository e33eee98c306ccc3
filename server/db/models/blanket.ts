import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { BlanketStatus, Feature, Fibre, LabelName } from '@shared/schemas/blanket';
import type { BlanketEvent } from './blanket-event';
import type { Photo } from './photo';

/** One finished (or in-progress) blanket, from the maker's log to delivery. */
export class Blanket extends Model<InferAttributes<Blanket>, InferCreationAttributes<Blanket>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare userId: ForeignKey<number>;
  declare pledgeId: ForeignKey<number | null>;
  /** Where it is meant to go (from the pledge's need), then where it is assigned. */
  declare recipientId: ForeignKey<number | null>;
  declare siteId: ForeignKey<number | null>;
  declare planId: ForeignKey<number | null>;
  declare status: CreationOptional<BlanketStatus>;
  declare widthCm: number;
  declare lengthCm: number;
  /** Re-measured at intake; null until then. The logged widthCm/lengthCm stay as the maker gave them. */
  declare measuredWidthCm: CreationOptional<number | null>;
  declare measuredLengthCm: CreationOptional<number | null>;
  declare yarnWeight: number;
  declare fibres: Fibre[];
  declare colours: CreationOptional<string>;
  declare bodyStitch: CreationOptional<string>;
  declare borderId: CreationOptional<string | null>;
  declare features: CreationOptional<Feature[]>;
  declare machineWashable: boolean;
  declare dryerSafe: CreationOptional<boolean>;
  declare smokeFree: boolean;
  declare petFree: boolean;
  declare newYarn: CreationOptional<boolean>;
  declare labelName: CreationOptional<LabelName>;
  declare notes: CreationOptional<string>;
  declare receivedAt: CreationOptional<Date | null>;
  /** When its maker's thank-you for its delivery was written to the outbox; null if none was owed yet. */
  declare thankedAt: CreationOptional<Date | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare events?: NonAttribute<BlanketEvent[]>;
  declare photos?: NonAttribute<Photo[]>;
}

export function initBlanket(sequelize: Sequelize) {
  Blanket.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      code: { type: DataTypes.STRING(12), allowNull: false, unique: true },
      status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'in_progress' },
      widthCm: { type: DataTypes.DOUBLE, allowNull: false },
      lengthCm: { type: DataTypes.DOUBLE, allowNull: false },
      measuredWidthCm: { type: DataTypes.DOUBLE, allowNull: true },
      measuredLengthCm: { type: DataTypes.DOUBLE, allowNull: true },
      yarnWeight: { type: DataTypes.INTEGER, allowNull: false },
      fibres: { type: DataTypes.JSON, allowNull: false },
      colours: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
      bodyStitch: { type: DataTypes.STRING(30), allowNull: false, defaultValue: 'other' },
      borderId: { type: DataTypes.STRING(60), allowNull: true },
      features: { type: DataTypes.JSON, allowNull: false, defaultValue: [] },
      machineWashable: { type: DataTypes.BOOLEAN, allowNull: false },
      dryerSafe: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      smokeFree: { type: DataTypes.BOOLEAN, allowNull: false },
      petFree: { type: DataTypes.BOOLEAN, allowNull: false },
      newYarn: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      labelName: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'first-name' },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      receivedAt: { type: DataTypes.DATE, allowNull: true },
      thankedAt: { type: DataTypes.DATE, allowNull: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'blankets', version: true },
  );
}
