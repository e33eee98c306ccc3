import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { SizeCategory } from '@shared/schemas/blanket';
import type { Recipient } from './recipient';

/** "The newborn unit wants 40 preemie blankets by 1 March": one line of a recipient's wish list. */
export class Need extends Model<InferAttributes<Need>, InferCreationAttributes<Need>> {
  declare id: CreationOptional<number>;
  declare recipientId: ForeignKey<number>;
  declare sizeCategory: SizeCategory;
  declare quantity: number;
  declare deadline: string;
  declare preferences: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare recipient?: NonAttribute<Recipient>;
}

export function initNeed(sequelize: Sequelize) {
  Need.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      sizeCategory: { type: DataTypes.STRING(20), allowNull: false },
      quantity: { type: DataTypes.INTEGER, allowNull: false },
      deadline: { type: DataTypes.DATEONLY, allowNull: false },
      preferences: { type: DataTypes.TEXT, allowNull: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'needs', version: true },
  );
}
