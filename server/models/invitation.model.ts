import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { ProfileAccessRole } from '../../shared/schemas/auth';
import type { GrantPermission } from '../../shared/schemas/profile-actions';
import type { ProfileModel } from './profile.model';
import type { UserModel } from './user.model';

/** An invitation to a profile: single use, with an expiry; only the SHA-256 of its token is stored. */
export class InvitationModel extends Model<InferAttributes<InvitationModel>, InferCreationAttributes<InvitationModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare email: string;
  declare role: ProfileAccessRole;
  declare permissions: CreationOptional<GrantPermission[]>;
  declare tokenHash: string;
  declare invitedByUserId: number | null;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedByUserId: CreationOptional<number | null>;
  declare cancelledAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare profile?: NonAttribute<ProfileModel>;
  declare invitedBy?: NonAttribute<UserModel | null>;

  static initModel(sequelize: Sequelize) {
    InvitationModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: { type: DataTypes.ENUM('owner', 'carer', 'clinician'), allowNull: false },
        permissions: { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false, defaultValue: [] },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false },
        invitedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        acceptedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        cancelledAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'invitations', underscored: true },
    );
  }
}
