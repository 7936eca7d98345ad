import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

export type AccountTokenPurpose = 'password_reset' | 'email_change';

/** A single-use link sent by e-mail (password reset, new e-mail address): the token's SHA-256, never the token. */
export class AccountTokenModel extends Model<InferAttributes<AccountTokenModel>, InferCreationAttributes<AccountTokenModel>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare purpose: AccountTokenPurpose;
  declare tokenHash: string;
  declare newEmail: CreationOptional<string | null>;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AccountTokenModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        purpose: { type: DataTypes.ENUM('password_reset', 'email_change'), allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        newEmail: { type: DataTypes.STRING(254), allowNull: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'account_tokens', underscored: true, updatedAt: false },
    );
  }
}
