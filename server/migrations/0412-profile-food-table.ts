import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/** Which open food table a profile's search shows first when both have a match: USDA SR28 (default) or IFCT 2017. */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('profiles', 'preferred_food_table', {
    type: DataTypes.ENUM('usda_sr28', 'ifct2017'),
    allowNull: false,
    defaultValue: 'usda_sr28',
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('profiles', 'preferred_food_table');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_profiles_preferred_food_table;');
};
