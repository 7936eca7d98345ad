import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

export type AccountAuditAction = 'role_changed' | 'disabled' | 'enabled';

/** One change an admin made to an account: its role, or disabling and enabling it, with the reason given. */
export class AccountAuditModel extends Model<InferAttributes<AccountAuditModel>, InferCreationAttributes<AccountAuditModel>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare actorUserId: number | null;
  declare action: AccountAuditAction;
  declare oldValue: string | null;
  declare newValue: string | null;
  declare reason: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AccountAuditModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        actorUserId: { type: DataTypes.INTEGER, allowNull: true },
        action: { type: DataTypes.ENUM('role_changed', 'disabled', 'enabled'), allowNull: false },
        oldValue: { type: DataTypes.STRING(40), allowNull: true },
        newValue: { type: DataTypes.STRING(40), allowNull: true },
        reason: { type: DataTypes.STRING(500), allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'account_audit', underscored: true, updatedAt: false },
    );
  }
}
