import type { Migration } from '../db';

/** An import can be run as a preview: it reads the files and records the diff, and writes no food. */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TYPE enum_dataset_imports_status ADD VALUE IF NOT EXISTS 'previewed'`);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DELETE FROM dataset_imports WHERE status = 'previewed';
    ALTER TYPE enum_dataset_imports_status RENAME TO enum_dataset_imports_status_old;
    CREATE TYPE enum_dataset_imports_status AS ENUM ('running', 'succeeded', 'failed');
    ALTER TABLE dataset_imports ALTER COLUMN status DROP DEFAULT,
      ALTER COLUMN status TYPE enum_dataset_imports_status USING status::text::enum_dataset_imports_status,
      ALTER COLUMN status SET DEFAULT 'running';
    DROP TYPE enum_dataset_imports_status_old;`);
};
