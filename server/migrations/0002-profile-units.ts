import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/** The units every screen needs from a profile; the dose settings come in later migrations. */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('profiles', 'glucose_unit', {
    type: DataTypes.ENUM('mmol_l', 'mg_dl'),
    allowNull: false,
    defaultValue: 'mmol_l',
  });
  await qi.addColumn('profiles', 'carb_basis', {
    type: DataTypes.ENUM('available', 'total'),
    allowNull: false,
    defaultValue: 'available',
  });
  await qi.addColumn('profiles', 'carb_unit', {
    type: DataTypes.ENUM('g', 'portion10', 'unit12', 'exchange15'),
    allowNull: false,
    defaultValue: 'g',
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('profiles', 'carb_unit');
  await qi.removeColumn('profiles', 'carb_basis');
  await qi.removeColumn('profiles', 'glucose_unit');
  await qi.sequelize.query(
    'DROP TYPE IF EXISTS enum_profiles_carb_unit; DROP TYPE IF EXISTS enum_profiles_carb_basis; DROP TYPE IF EXISTS enum_profiles_glucose_unit;',
  );
};
