import { DataTypes, Model } from 'sequelize';
import type { InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

/** Tokens signed out before they expire (one row per token id, pruned after expiry). */
export class RevokedTokenModel extends Model<
  InferAttributes<RevokedTokenModel>,
  InferCreationAttributes<RevokedTokenModel>
> {
  declare jti: string;
  declare expiresAt: Date;

  static initModel(sequelize: Sequelize) {
    RevokedTokenModel.init(
      {
        jti: { type: DataTypes.STRING(64), primaryKey: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'revoked_tokens', underscored: true, timestamps: false },
    );
  }
}
