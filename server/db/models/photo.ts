import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A photo of a blanket; files live under UPLOAD_DIR with generated names and are served only through the API. */
export class Photo extends Model<InferAttributes<Photo>, InferCreationAttributes<Photo>> {
  declare id: CreationOptional<number>;
  declare blanketId: ForeignKey<number>;
  declare fileName: string;
  declare thumbName: string;
  declare mime: string;
  declare bytes: number;
  declare width: CreationOptional<number | null>;
  declare height: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initPhoto(sequelize: Sequelize) {
  Photo.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      fileName: { type: DataTypes.STRING(80), allowNull: false },
      thumbName: { type: DataTypes.STRING(80), allowNull: false },
      mime: { type: DataTypes.STRING(40), allowNull: false },
      bytes: { type: DataTypes.INTEGER, allowNull: false },
      width: { type: DataTypes.INTEGER, allowNull: true },
      height: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'photos', updatedAt: false },
  );
}
