import type { Sequelize } from 'sequelize';
import { DatasetImportModel } from './dataset-import.model';
import { FoodMeasureModel } from './food-measure.model';
import { FoodModel } from './food.model';
import { BatchIngredientModel } from './batch-ingredient.model';
import { BatchModel } from './batch.model';
import { ContainerModel } from './container.model';
import { PortionModel } from './portion.model';
import { ProfileAccessModel } from './profile-access.model';
import { ProfileModel } from './profile.model';
import { RecipeIngredientModel } from './recipe-ingredient.model';
import { RecipeShareModel } from './recipe-share.model';
import { RecipeModel } from './recipe.model';
import { RevokedTokenModel } from './revoked-token.model';
import { UserModel } from './user.model';
import { DayKindModel } from './day-kind.model';
import { ProfileSettingsModel } from './profile-settings.model';
import { RatioBlockModel } from './ratio-block.model';
import { SettingsChangeModel } from './settings-change.model';

export { DatasetImportModel, FoodMeasureModel, FoodModel };
export { ProfileAccessModel, ProfileModel, RevokedTokenModel, UserModel };
export { DayKindModel, ProfileSettingsModel, RatioBlockModel, SettingsChangeModel };
export { BatchIngredientModel, BatchModel, ContainerModel, PortionModel };
export { RecipeIngredientModel, RecipeModel, RecipeShareModel };

/** Initialises every model once, then wires every association in one place. */
export function initModels(sequelize: Sequelize): void {
  UserModel.initModel(sequelize);
  ProfileModel.initModel(sequelize);
  ProfileAccessModel.initModel(sequelize);
  RevokedTokenModel.initModel(sequelize);
  ProfileSettingsModel.initModel(sequelize);
  DayKindModel.initModel(sequelize);
  RatioBlockModel.initModel(sequelize);
  SettingsChangeModel.initModel(sequelize);
  ContainerModel.initModel(sequelize);
  BatchModel.initModel(sequelize);
  BatchIngredientModel.initModel(sequelize);
  PortionModel.initModel(sequelize);
  RecipeModel.initModel(sequelize);
  RecipeIngredientModel.initModel(sequelize);
  RecipeShareModel.initModel(sequelize);
  FoodModel.initModel(sequelize);
  FoodMeasureModel.initModel(sequelize);
  DatasetImportModel.initModel(sequelize);

  ProfileModel.belongsTo(UserModel, { as: 'owner', foreignKey: 'ownerUserId' });
  ProfileAccessModel.belongsTo(ProfileModel, { as: 'profile', foreignKey: 'profileId' });
  ProfileAccessModel.belongsTo(UserModel, { as: 'user', foreignKey: 'userId' });
  ProfileModel.hasMany(ProfileAccessModel, { as: 'accesses', foreignKey: 'profileId' });
  DayKindModel.hasMany(RatioBlockModel, { as: 'blocks', foreignKey: 'dayKindId' });
  SettingsChangeModel.belongsTo(UserModel, { as: 'user', foreignKey: 'userId' });
  RecipeModel.belongsTo(UserModel, { as: 'owner', foreignKey: 'ownerUserId' });
  RecipeModel.hasMany(RecipeIngredientModel, { as: 'ingredients', foreignKey: 'recipeId' });
  RecipeIngredientModel.belongsTo(RecipeModel, { as: 'recipe', foreignKey: 'recipeId' });
  RecipeIngredientModel.belongsTo(FoodModel, { as: 'food', foreignKey: 'foodId' });
  RecipeModel.hasMany(RecipeShareModel, { as: 'shares', foreignKey: 'recipeId' });
  RecipeShareModel.belongsTo(UserModel, { as: 'user', foreignKey: 'userId' });
  FoodModel.hasMany(FoodMeasureModel, { as: 'measures', foreignKey: 'foodId' });
  FoodMeasureModel.belongsTo(FoodModel, { as: 'food', foreignKey: 'foodId' });
  FoodModel.belongsTo(DatasetImportModel, { as: 'import', foreignKey: 'importId' });
  BatchModel.hasMany(BatchIngredientModel, { as: 'ingredients', foreignKey: 'batchId' });
  BatchModel.hasMany(PortionModel, { as: 'portions', foreignKey: 'batchId' });
  BatchModel.belongsTo(UserModel, { as: 'cookedBy', foreignKey: 'cookedByUserId' });
  PortionModel.belongsTo(BatchModel, { as: 'batch', foreignKey: 'batchId' });
}
