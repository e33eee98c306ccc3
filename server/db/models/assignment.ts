import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { AssignmentSource } from '@shared/schemas/assignment';
import type { Blanket } from './blanket';
import type { Need } from './need';
import type { Recipient } from './recipient';
import type { User } from './user';

/** "Blanket K7QM goes to the newborn unit's preemie need", chosen by whom and when; live until endedAt. */
export class Assignment extends Model<InferAttributes<Assignment>, InferCreationAttributes<Assignment>> {
  declare id: CreationOptional<number>;
  declare blanketId: ForeignKey<number>;
  declare needId: ForeignKey<number>;
  declare recipientId: ForeignKey<number>;
  declare assignedById: ForeignKey<number | null>;
  declare assignedAt: Date;
  declare priorRecipientId: ForeignKey<number | null>;
  declare source: CreationOptional<AssignmentSource>;
  declare endedAt: CreationOptional<Date | null>;
  declare endedById: CreationOptional<number | null>;
  declare endReason: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare blanket?: NonAttribute<Blanket>;
  declare need?: NonAttribute<Need>;
  declare recipient?: NonAttribute<Recipient>;
  declare assignedBy?: NonAttribute<User | null>;
}

export function initAssignment(sequelize: Sequelize) {
  Assignment.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      assignedAt: { type: DataTypes.DATE, allowNull: false },
      source: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'board' },
      endedAt: { type: DataTypes.DATE, allowNull: true },
      endedById: { type: DataTypes.INTEGER, allowNull: true },
      endReason: { type: DataTypes.STRING(500), allowNull: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'assignments', version: true },
  );
}
