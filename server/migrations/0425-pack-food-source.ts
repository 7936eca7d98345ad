import type { Migration } from '../db';

/** A food typed from a package is a "pack food": the source value `label` becomes `pack` ("label" is kept for printed container labels). */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TYPE enum_foods_source RENAME VALUE 'label' TO 'pack'`);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TYPE enum_foods_source RENAME VALUE 'pack' TO 'label'`);
};
