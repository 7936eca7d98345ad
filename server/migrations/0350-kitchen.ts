import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

const grams = { type: DataTypes.DOUBLE, allowNull: false };
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/** Saved pots and containers with tares, cooked batches with their weighing snapshot, and portions with codes. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('containers', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'profiles', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(80), allowNull: false },
    kind: { type: DataTypes.ENUM('pot', 'container'), allowNull: false },
    tare_grams: grams,
    ...timestamps,
  });
  await qi.addIndex('containers', ['profile_id'], { name: 'containers_profile' });

  await qi.createTable('batches', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'profiles', key: 'id' }, onDelete: 'CASCADE' },
    recipe_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'recipes', key: 'id' }, onDelete: 'SET NULL' },
    recipe_title: { type: DataTypes.TEXT, allowNull: false },
    scale_factor: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
    cooked_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    cooked_on: { type: DataTypes.DATEONLY, allowNull: false },
    storage: { type: DataTypes.ENUM('fridge', 'freezer'), allowNull: false },
    use_by: { type: DataTypes.DATEONLY, allowNull: false },
    use_by_source: { type: DataTypes.TEXT, allowNull: false },
    use_by_note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    raw_grams: grams,
    cooked_gross_grams: grams,
    pot_tare_grams: grams,
    pot_container_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'containers', key: 'id' }, onDelete: 'SET NULL' },
    pot_name: { type: DataTypes.TEXT, allowNull: true },
    cooked_grams: grams,
    split_mode: { type: DataTypes.ENUM('equal', 'weighed'), allowNull: false },
    totals: { type: DataTypes.JSONB, allowNull: false },
    per100g: { type: DataTypes.JSONB, allowNull: false },
    incomplete: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...timestamps,
  });
  await qi.addIndex('batches', ['profile_id', 'cooked_on'], { name: 'batches_profile_cooked' });
  await qi.addIndex('batches', ['recipe_id', 'created_at'], { name: 'batches_recipe' });

  await qi.createTable('batch_ingredients', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    batch_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'batches', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.INTEGER, allowNull: false },
    food_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'foods', key: 'id' }, onDelete: 'SET NULL' },
    food_name: { type: DataTypes.TEXT, allowNull: false },
    food_source: { type: DataTypes.TEXT, allowNull: false },
    per100g: { type: DataTypes.JSONB, allowNull: false },
    planned_grams: grams,
    actual_grams: { type: DataTypes.DOUBLE, allowNull: true },
    omitted: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    swapped_from_food_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'foods', key: 'id' }, onDelete: 'SET NULL' },
    swapped_from_name: { type: DataTypes.TEXT, allowNull: true },
  });
  await qi.addIndex('batch_ingredients', ['batch_id', 'position'], { name: 'batch_ingredients_batch' });

  await qi.createTable('portions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    batch_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'batches', key: 'id' }, onDelete: 'CASCADE' },
    profile_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'profiles', key: 'id' }, onDelete: 'CASCADE' },
    code: { type: DataTypes.STRING(6), allowNull: false, unique: true },
    position: { type: DataTypes.INTEGER, allowNull: false },
    container_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'containers', key: 'id' }, onDelete: 'SET NULL' },
    container_name: { type: DataTypes.TEXT, allowNull: true },
    gross_grams: { type: DataTypes.DOUBLE, allowNull: true },
    tare_grams: { type: DataTypes.DOUBLE, allowNull: true },
    net_grams: grams,
    carb_available: { type: DataTypes.DOUBLE, allowNull: true },
    carb_total: { type: DataTypes.DOUBLE, allowNull: true },
    status: { type: DataTypes.ENUM('available', 'eaten', 'discarded'), allowNull: false, defaultValue: 'available' },
    status_changed_at: { type: DataTypes.DATE, allowNull: true },
    status_changed_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    ...timestamps,
  });
  await qi.addIndex('portions', ['profile_id', 'status'], { name: 'portions_profile_status' });
  await qi.addIndex('portions', ['batch_id', 'position'], { name: 'portions_batch' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('portions');
  await qi.dropTable('batch_ingredients');
  await qi.dropTable('batches');
  await qi.dropTable('containers');
  await qi.sequelize.query(
    'DROP TYPE IF EXISTS enum_portions_status; DROP TYPE IF EXISTS enum_batches_storage; DROP TYPE IF EXISTS enum_batches_split_mode; DROP TYPE IF EXISTS enum_containers_kind;',
  );
};
