import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/** Recipes, their ordered ingredient lines, and who each recipe is shared with. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('recipes', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    owner_user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    title: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    method_steps: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    tags: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
    default_portions: { type: DataTypes.INTEGER, allowNull: false },
    visibility: { type: DataTypes.ENUM('private', 'shared', 'public'), allowNull: false, defaultValue: 'private' },
    photo_large_key: { type: DataTypes.TEXT, allowNull: true },
    photo_thumb_key: { type: DataTypes.TEXT, allowNull: true },
    copied_from_recipe_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'recipes', key: 'id' },
      onDelete: 'SET NULL',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.sequelize.query('ALTER TABLE recipes ADD CONSTRAINT recipes_default_portions_positive CHECK (default_portions >= 1)');
  await qi.addIndex('recipes', ['owner_user_id'], { name: 'recipes_owner' });
  await qi.addIndex('recipes', ['visibility'], { name: 'recipes_visibility' });
  await qi.sequelize.query('CREATE INDEX recipes_title_trgm ON recipes USING gin (title gin_trgm_ops)');

  await qi.createTable('recipe_ingredients', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    recipe_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.INTEGER, allowNull: false },
    food_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'foods', key: 'id' }, onDelete: 'RESTRICT' },
    grams: { type: DataTypes.DOUBLE, allowNull: false },
    measure_label: { type: DataTypes.STRING(60), allowNull: true },
    note: { type: DataTypes.STRING(200), allowNull: true },
  });
  await qi.sequelize.query('ALTER TABLE recipe_ingredients ADD CONSTRAINT recipe_ingredients_grams_positive CHECK (grams > 0)');
  await qi.addIndex('recipe_ingredients', ['recipe_id', 'position'], { unique: true, name: 'recipe_ingredients_order' });
  await qi.addIndex('recipe_ingredients', ['food_id'], { name: 'recipe_ingredients_food' });

  await qi.createTable('recipe_shares', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    recipe_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    shared_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('recipe_shares', ['recipe_id', 'user_id'], { unique: true, name: 'recipe_shares_unique' });
  await qi.addIndex('recipe_shares', ['user_id'], { name: 'recipe_shares_user' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('recipe_shares');
  await qi.dropTable('recipe_ingredients');
  await qi.dropTable('recipes');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_recipes_visibility');
};
