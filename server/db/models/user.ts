import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role } from '@shared/schemas/user';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare email: string;
  declare passwordHash: string;
  declare role: CreationOptional<Role>;
  declare active: CreationOptional<boolean>;
  declare town: CreationOptional<string | null>;
  /** Whether a reminder goes out the day before each drop-off this person books. */
  declare bookingReminders: CreationOptional<boolean>;
  /** Whether this person is e-mailed a thank-you saying where their blankets went once delivered (opt-in). */
  declare thankYouMail: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare version: CreationOptional<number>;

  toPublic() {
    return { id: this.id, name: this.name, email: this.email, role: this.role, active: this.active };
  }
}

export function initUser(sequelize: Sequelize) {
  User.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      passwordHash: { type: DataTypes.STRING(300), allowNull: false },
      role: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'volunteer' },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      town: { type: DataTypes.STRING(120), allowNull: true },
      bookingReminders: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      thankYouMail: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    },
    { sequelize, tableName: 'users', version: true },
  );
}
