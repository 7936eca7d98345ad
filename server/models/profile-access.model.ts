import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { ProfileAccessRole } from '../../shared/schemas/auth';
import type { GrantPermission } from '../../shared/schemas/profile-actions';

/** Who may reach a profile, and as what (owner, carer, clinician). */
export class ProfileAccessModel extends Model<
  InferAttributes<ProfileAccessModel>,
  InferCreationAttributes<ProfileAccessModel>
> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare userId: number;
  declare role: ProfileAccessRole;
  declare grantedByUserId: number | null;
  /** Extra permissions beyond the role (carer: settings; clinician: ratios). */
  declare permissions: CreationOptional<GrantPermission[]>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ProfileAccessModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        role: { type: DataTypes.ENUM('owner', 'carer', 'clinician'), allowNull: false },
        grantedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        permissions: { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false, defaultValue: [] },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'profile_access', underscored: true },
    );
  }
}
