import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Population } from '@shared/schemas/blanket';
import type { RecipientKind } from '@shared/schemas/recipient';
import type { Need } from './need';

/** A place that receives blankets. `guidelines` holds the recipient's guideline set (shared/guidelines). */
export class Recipient extends Model<InferAttributes<Recipient>, InferCreationAttributes<Recipient>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare kind: RecipientKind;
  declare population: Population;
  declare address: string;
  declare lat: number | null;
  declare lng: number | null;
  declare contactName: CreationOptional<string | null>;
  declare contactEmail: CreationOptional<string | null>;
  declare contactPhone: CreationOptional<string | null>;
  declare deliveryNotes: CreationOptional<string | null>;
  declare guidelines: Record<string, unknown>;
  declare active: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare needs?: NonAttribute<Need[]>;
}

export function initRecipient(sequelize: Sequelize) {
  Recipient.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(200), allowNull: false },
      kind: { type: DataTypes.STRING(30), allowNull: false },
      population: { type: DataTypes.STRING(20), allowNull: false },
      address: { type: DataTypes.STRING(400), allowNull: false },
      lat: { type: DataTypes.DOUBLE, allowNull: true },
      lng: { type: DataTypes.DOUBLE, allowNull: true },
      contactName: { type: DataTypes.STRING(200), allowNull: true },
      contactEmail: { type: DataTypes.STRING(254), allowNull: true },
      contactPhone: { type: DataTypes.STRING(60), allowNull: true },
      deliveryNotes: { type: DataTypes.TEXT, allowNull: true },
      guidelines: { type: DataTypes.JSON, allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'recipients', version: true },
  );
}
