/**
 * npm start's preparation step: migrate, create the admin from ADMIN_EMAIL/ADMIN_PASSWORD when given,
 * then the later steps (default dataset, demo) each issue adds here. Every step is idempotent.
 */
import { loadConfig } from '../config';
import { createSequelize, migrate } from '../db';
import { ensureAdmin } from '../services/auth.service';
import { ensureDefaultDatasets } from '../services/imports.service';
import { runDemoStep } from '../seed/demo';

/** Migrates, creates the configured admin, imports the default food tables and seeds the demo; idempotent. */
export async function prepare(): Promise<void> {
  const config = loadConfig();
  const sequelize = createSequelize(config.DATABASE_URL, { poolMax: 4 });
  try {
    const applied = await migrate(sequelize);
    console.log(applied.length ? `Migrations applied: ${applied.join(', ')}` : 'Database schema is up to date.');
    if (config.ADMIN_EMAIL && config.ADMIN_PASSWORD) {
      if (config.ADMIN_PASSWORD.length < 10) throw new Error('ADMIN_PASSWORD must have at least 10 characters.');
      const { created } = await ensureAdmin(config, config.ADMIN_EMAIL, config.ADMIN_PASSWORD);
      console.log(`Admin ${config.ADMIN_EMAIL} ${created ? 'created' : 'updated'}.`);
    }
    if (process.env.SKIP_DEFAULT_DATASET === '1') console.log('Default food table skipped (SKIP_DEFAULT_DATASET=1).');
    else {
      const started = Date.now();
      for (const d of await ensureDefaultDatasets(sequelize)) {
        const name = d.dataset === 'ifct2017' ? 'IFCT 2017' : 'USDA SR28';
        const r = d.result;
        console.log(r ? `Food table: ${name} imported (${r.rowsInserted} new, ${r.rowsUpdated} updated, ${r.rowsUnchanged} unchanged).` : `Food table: ${name} already imported.`);
      }
      console.log(`Food tables ready in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
    }
    await runDemoStep(config);
  } finally {
    await sequelize.close();
  }
}

