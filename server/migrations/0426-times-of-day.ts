import type { Migration, MigrationContext } from '../db';

/** Renames the top-level key `from` to `to` in the stored day-kind snapshots of the history (old_value, new_value). */
async function renameHistoryKey(qi: MigrationContext, from: string, to: string) {
  for (const column of ['old_value', 'new_value']) {
    await qi.sequelize.query(
      `UPDATE settings_changes SET ${column} = (${column} - '${from}') || jsonb_build_object('${to}', ${column} -> '${from}')
        WHERE subject = 'day_kind' AND ${column} ? '${from}'`,
    );
  }
}

/** Renames a times-of-day table with its sequence, index and constraints (all named after the table). */
async function renameTable(qi: MigrationContext, from: string, to: string) {
  await qi.sequelize.query(`ALTER TABLE ${from} RENAME TO ${to}`);
  await qi.sequelize.query(`ALTER SEQUENCE ${from}_id_seq RENAME TO ${to}_id_seq`);
  await qi.sequelize.query(`ALTER INDEX ${from}_kind_start RENAME TO ${to}_kind_start`);
  for (const suffix of ['pkey', 'day_kind_id_fkey', 'sane']) {
    await qi.sequelize.query(`ALTER TABLE ${to} RENAME CONSTRAINT ${from}_${suffix} TO ${to}_${suffix}`);
  }
}

/** A day kind's time-of-day parts are "times of day": table ratio_blocks becomes times_of_day, and the history follows. */
export const up: Migration = async ({ context: qi }) => {
  await renameTable(qi, 'ratio_blocks', 'times_of_day');
  await renameHistoryKey(qi, 'blocks', 'timesOfDay');
};

export const down: Migration = async ({ context: qi }) => {
  await renameHistoryKey(qi, 'timesOfDay', 'blocks');
  await renameTable(qi, 'times_of_day', 'ratio_blocks');
};
