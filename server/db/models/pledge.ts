import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { SizeCategory } from '@shared/schemas/blanket';
import type { PledgeStatus } from '@shared/schemas/pledge';
import type { Need } from './need';

/** "I'll make two crib blankets by February": a promise, against a need or wherever needed most (needId null). */
export class Pledge extends Model<InferAttributes<Pledge>, InferCreationAttributes<Pledge>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<number>;
  declare needId: ForeignKey<number | null>;
  declare quantity: number;
  declare sizeCategory: SizeCategory;
  declare dueDate: string;
  declare status: CreationOptional<PledgeStatus>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare need?: NonAttribute<Need | null>;
}

export function initPledge(sequelize: Sequelize) {
  Pledge.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      quantity: { type: DataTypes.INTEGER, allowNull: false },
      sizeCategory: { type: DataTypes.STRING(20), allowNull: false },
      dueDate: { type: DataTypes.DATEONLY, allowNull: false },
      status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'active' },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'pledges', version: true },
  );
}
