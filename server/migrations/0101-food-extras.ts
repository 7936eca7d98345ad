import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/** Source details that are not nutrients (scientific name, NDB number, an alternative carbohydrate) and a change hash for re-imports. */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('foods', 'extra', { type: DataTypes.JSONB, allowNull: false, defaultValue: {} });
  await qi.addColumn('foods', 'content_hash', { type: DataTypes.TEXT, allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('foods', 'content_hash');
  await qi.removeColumn('foods', 'extra');
};
