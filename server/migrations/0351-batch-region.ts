import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/** A batch remembers whose food-safety advice set its use-by date, so moving it keeps the same advice. */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('batches', 'food_safety_region', {
    type: DataTypes.ENUM('uk', 'us'),
    allowNull: false,
    defaultValue: 'uk',
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('batches', 'food_safety_region');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_batches_food_safety_region;');
};
