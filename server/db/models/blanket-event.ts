import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Every step of a blanket's life, with who took it and when: the history shown on the blanket. */
export class BlanketEvent extends Model<InferAttributes<BlanketEvent>, InferCreationAttributes<BlanketEvent>> {
  declare id: CreationOptional<number>;
  declare blanketId: ForeignKey<number>;
  declare actorId: ForeignKey<number | null>;
  declare kind: string;
  declare fromStatus: string | null;
  declare toStatus: string | null;
  declare reason: CreationOptional<string | null>;
  declare data: CreationOptional<Record<string, unknown> | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initBlanketEvent(sequelize: Sequelize) {
  BlanketEvent.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      kind: { type: DataTypes.STRING(30), allowNull: false },
      fromStatus: { type: DataTypes.STRING(20), allowNull: true },
      toStatus: { type: DataTypes.STRING(20), allowNull: true },
      reason: { type: DataTypes.TEXT, allowNull: true },
      data: { type: DataTypes.JSON, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'blanket_events', updatedAt: false },
  );
}
