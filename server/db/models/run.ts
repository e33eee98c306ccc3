import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Recipient } from './recipient';
import type { Site } from './site';
import type { User } from './user';
import type { Blanket } from './blanket';

/** One delivery run: a day, a driver, a start site and its stops. */
export class Run extends Model<InferAttributes<Run>, InferCreationAttributes<Run>> {
  declare id: CreationOptional<number>;
  declare runDate: string;
  declare driverId: ForeignKey<number>;
  declare startSiteId: ForeignKey<number>;
  declare createdById: ForeignKey<number | null>;
  declare notes: CreationOptional<string>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare driver?: NonAttribute<User>;
  declare startSite?: NonAttribute<Site>;
  declare stops?: NonAttribute<RunStop[]>;
}

/** A recipient on a run, at its place in the driving order. */
export class RunStop extends Model<InferAttributes<RunStop>, InferCreationAttributes<RunStop>> {
  declare id: CreationOptional<number>;
  declare runId: ForeignKey<number>;
  declare recipientId: ForeignKey<number>;
  declare position: number;
  declare packedAt: CreationOptional<Date | null>;
  declare deliveredAt: CreationOptional<Date | null>;
  declare receivedCount: CreationOptional<number | null>;
  declare signedBy: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare recipient?: NonAttribute<Recipient>;
  declare items?: NonAttribute<RunBlanket[]>;
}

/** A blanket on a stop of a run, in a numbered box. */
export class RunBlanket extends Model<InferAttributes<RunBlanket>, InferCreationAttributes<RunBlanket>> {
  declare id: CreationOptional<number>;
  declare runId: ForeignKey<number>;
  declare stopId: ForeignKey<number>;
  declare blanketId: ForeignKey<number>;
  declare box: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare blanket?: NonAttribute<Blanket>;
}

/** A manifest written to the export folder: what, how big, who made it. */
export class Export extends Model<InferAttributes<Export>, InferCreationAttributes<Export>> {
  declare id: CreationOptional<number>;
  declare kind: 'run' | 'recipient';
  declare runId: ForeignKey<number | null>;
  declare recipientId: ForeignKey<number | null>;
  declare title: string;
  declare fileName: string;
  declare bytes: number;
  declare rows: number;
  declare bom: boolean;
  declare createdById: ForeignKey<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<User | null>;
}

export function initRuns(sequelize: Sequelize) {
  Run.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      runDate: { type: DataTypes.DATEONLY, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'runs', version: true },
  );
  RunStop.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      position: { type: DataTypes.INTEGER, allowNull: false },
      packedAt: { type: DataTypes.DATE, allowNull: true },
      deliveredAt: { type: DataTypes.DATE, allowNull: true },
      receivedCount: { type: DataTypes.INTEGER, allowNull: true },
      signedBy: { type: DataTypes.STRING(120), allowNull: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'run_stops', version: true },
  );
  RunBlanket.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      box: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'run_blankets' },
  );
  Export.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      kind: { type: DataTypes.STRING(20), allowNull: false },
      title: { type: DataTypes.STRING(300), allowNull: false },
      fileName: { type: DataTypes.STRING(200), allowNull: false, unique: true },
      bytes: { type: DataTypes.INTEGER, allowNull: false },
      rows: { type: DataTypes.INTEGER, allowNull: false },
      bom: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'exports', updatedAt: false },
  );
}
