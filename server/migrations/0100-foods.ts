import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

// A fresh object per column: Sequelize writes the column name into the options it is given.
const nutrient = () => ({ type: DataTypes.DOUBLE, allowNull: true });

/** Food-composition rows (open tables and label foods), their household measures and the imports that loaded them. */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('CREATE EXTENSION IF NOT EXISTS pg_trgm');
  await qi.createTable('dataset_imports', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    dataset: { type: DataTypes.ENUM('ifct2017', 'usda_sr28', 'usda_fdc'), allowNull: false },
    version: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.ENUM('running', 'succeeded', 'failed'), allowNull: false, defaultValue: 'running' },
    stage: { type: DataTypes.TEXT, allowNull: true },
    rows_read: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    rows_inserted: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    rows_updated: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    rows_unchanged: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    rows_skipped: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    report: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    error: { type: DataTypes.TEXT, allowNull: true },
    duration_ms: { type: DataTypes.INTEGER, allowNull: true },
    started_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    finished_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('foods', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    source: { type: DataTypes.ENUM('ifct2017', 'usda_sr28', 'usda_fdc', 'label'), allowNull: false },
    source_code: { type: DataTypes.TEXT, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    food_group: { type: DataTypes.TEXT, allowNull: true },
    alt_names: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
    energy_kcal: nutrient(),
    energy_kj: nutrient(),
    carb_available: nutrient(),
    carb_total: nutrient(),
    fibre: nutrient(),
    sugars: nutrient(),
    protein: nutrient(),
    fat: nutrient(),
    water: nutrient(),
    carb_measured: { type: DataTypes.ENUM('available', 'total'), allowNull: true },
    carb_note: { type: DataTypes.TEXT, allowNull: true },
    derived: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
    attribution: { type: DataTypes.TEXT, allowNull: false },
    licence: { type: DataTypes.TEXT, allowNull: false },
    rank_penalty: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    name_key: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    search_text: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    import_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'dataset_imports', key: 'id' }, onDelete: 'SET NULL' },
    owner_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    shared_profile_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'profiles', key: 'id' }, onDelete: 'SET NULL' },
    label_convention: { type: DataTypes.ENUM('eu', 'us'), allowNull: true },
    photo_path: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('foods', ['source', 'source_code'], { unique: true, name: 'foods_source_code_unique' });
  await qi.addIndex('foods', ['owner_user_id'], { name: 'foods_owner' });
  await qi.addIndex('foods', ['shared_profile_id'], { name: 'foods_shared_profile' });
  await qi.sequelize.query('CREATE INDEX foods_search_trgm ON foods USING GIN (search_text gin_trgm_ops)');
  await qi.sequelize.query('CREATE INDEX foods_name_key ON foods (name_key text_pattern_ops)');
  await qi.createTable('food_measures', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    food_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'foods', key: 'id' }, onDelete: 'CASCADE' },
    label: { type: DataTypes.TEXT, allowNull: false },
    grams: { type: DataTypes.DOUBLE, allowNull: false },
    seq: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  });
  await qi.addIndex('food_measures', ['food_id', 'seq'], { name: 'food_measures_food' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('food_measures');
  await qi.dropTable('foods');
  await qi.dropTable('dataset_imports');
  await qi.sequelize.query(
    'DROP TYPE IF EXISTS enum_foods_source; DROP TYPE IF EXISTS enum_foods_carb_measured; DROP TYPE IF EXISTS enum_foods_label_convention; DROP TYPE IF EXISTS enum_dataset_imports_dataset; DROP TYPE IF EXISTS enum_dataset_imports_status;',
  );
};
