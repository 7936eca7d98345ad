import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { AccessEventKind } from '../../shared/schemas/access';
import type { ProfileAccessRole } from '../../shared/schemas/auth';
import type { GrantPermission } from '../../shared/schemas/profile-actions';
import type { UserModel } from './user.model';

/** One line of a profile's access audit: an invitation, a grant, a change of permissions, a revocation. */
export class AccessEventModel extends Model<InferAttributes<AccessEventModel>, InferCreationAttributes<AccessEventModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare actorUserId: number | null;
  declare subjectUserId: number | null;
  declare subjectEmail: string | null;
  declare kind: AccessEventKind;
  declare role: ProfileAccessRole | null;
  declare permissions: CreationOptional<GrantPermission[]>;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<UserModel | null>;
  declare subject?: NonAttribute<UserModel | null>;

  static initModel(sequelize: Sequelize) {
    AccessEventModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        actorUserId: { type: DataTypes.INTEGER, allowNull: true },
        subjectUserId: { type: DataTypes.INTEGER, allowNull: true },
        subjectEmail: { type: DataTypes.STRING(254), allowNull: true },
        kind: { type: DataTypes.ENUM('invited', 'invitation_cancelled', 'granted', 'changed', 'revoked', 'handed_over'), allowNull: false },
        role: { type: DataTypes.ENUM('owner', 'carer', 'clinician'), allowNull: true },
        permissions: { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false, defaultValue: [] },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'access_events', underscored: true, updatedAt: false },
    );
  }
}
