import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { User, UserRole } from '../../shared/schemas/auth';

export class UserModel extends Model<InferAttributes<UserModel>, InferCreationAttributes<UserModel>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare displayName: string;
  declare passwordHash: string;
  declare role: CreationOptional<UserRole>;
  declare tokenVersion: CreationOptional<number>;
  declare disabledAt: CreationOptional<Date | null>;
  declare disabledReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** The public shape of a user (never the hash). */
  toUser(): User {
    return {
      id: this.id,
      email: this.email,
      displayName: this.displayName,
      role: this.role,
      createdAt: this.createdAt.toISOString(),
    };
  }

  static initModel(sequelize: Sequelize) {
    UserModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        displayName: { type: DataTypes.STRING(80), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false },
        role: { type: DataTypes.ENUM('member', 'clinician', 'admin'), allowNull: false, defaultValue: 'member' },
        tokenVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        disabledAt: { type: DataTypes.DATE, allowNull: true },
        disabledReason: { type: DataTypes.STRING(500), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', underscored: true },
    );
  }
}
