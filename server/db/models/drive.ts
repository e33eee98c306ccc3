import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The drive this installation runs: one per installation. */
export class Drive extends Model<InferAttributes<Drive>, InferCreationAttributes<Drive>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare town: string;
  declare summary: string;
  declare startsOn: string;
  declare endsOn: string;
  /** IANA name; every time and every "today" in the drive is read in this zone. */
  declare timeZone: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initDrive(sequelize: Sequelize) {
  Drive.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(200), allowNull: false },
      town: { type: DataTypes.STRING(120), allowNull: false },
      summary: { type: DataTypes.TEXT, allowNull: false },
      startsOn: { type: DataTypes.DATEONLY, allowNull: false },
      endsOn: { type: DataTypes.DATEONLY, allowNull: false },
      timeZone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'Europe/London' },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'drives' },
  );
}
