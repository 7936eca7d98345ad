import type { Sequelize } from 'sequelize';
import { ProfileAccessModel } from './profile-access.model';
import { ProfileModel } from './profile.model';
import { RevokedTokenModel } from './revoked-token.model';
import { UserModel } from './user.model';

export { ProfileAccessModel, ProfileModel, RevokedTokenModel, UserModel };

/** Initialises every model once, then wires every association in one place. */
export function initModels(sequelize: Sequelize): void {
  UserModel.initModel(sequelize);
  ProfileModel.initModel(sequelize);
  ProfileAccessModel.initModel(sequelize);
  RevokedTokenModel.initModel(sequelize);

  ProfileModel.belongsTo(UserModel, { as: 'owner', foreignKey: 'ownerUserId' });
  ProfileAccessModel.belongsTo(ProfileModel, { as: 'profile', foreignKey: 'profileId' });
  ProfileAccessModel.belongsTo(UserModel, { as: 'user', foreignKey: 'userId' });
  ProfileModel.hasMany(ProfileAccessModel, { as: 'accesses', foreignKey: 'profileId' });
}
