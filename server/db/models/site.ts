import type { Closure, OpeningHours } from '@shared/schemas/schedule';
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A drop-off point with its opening hours, slot length, visits per slot and closures. */
export class Site extends Model<InferAttributes<Site>, InferCreationAttributes<Site>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare address: string;
  declare lat: number | null;
  declare lng: number | null;
  declare notes: CreationOptional<string | null>;
  declare active: CreationOptional<boolean>;
  /** Null until a coordinator sets hours: a site without hours offers no slots. */
  declare openingHours: CreationOptional<OpeningHours | null>;
  declare slotMinutes: CreationOptional<number>;
  declare slotCapacity: CreationOptional<number>;
  declare closures: CreationOptional<Closure[] | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initSite(sequelize: Sequelize) {
  Site.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(200), allowNull: false },
      address: { type: DataTypes.STRING(400), allowNull: false },
      lat: { type: DataTypes.DOUBLE, allowNull: true },
      lng: { type: DataTypes.DOUBLE, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      openingHours: { type: DataTypes.JSON, allowNull: true },
      slotMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 },
      slotCapacity: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 2 },
      closures: { type: DataTypes.JSON, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'sites' },
  );
}
