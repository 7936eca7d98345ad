/**
 * npm run import -- <fdc|sr28|ifct> [folder]
 * Imports a food-composition dataset: a FoodData Central CSV folder, an SR28 ASCII folder, or IFCT 2017 from the
 * installed npm package (folder optional: another copy of its index.csv). All-or-nothing; prints the report.
 * Needs DATABASE_URL, or a running project database (npm start).
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { loadConfig } from '../config';
import { createSequelize, migrate } from '../db';
import { IMPORT_KINDS, runImport, type ImportKind } from '../services/imports.service';

async function main() {
  const [kind, location] = process.argv.slice(2);
  if (!kind || !(kind in IMPORT_KINDS) || (kind !== 'ifct' && !location)) {
    throw new Error('Usage: npm run import -- <fdc|sr28> <folder>   or   npm run import -- ifct [index.csv]');
  }
  if (!process.env.DATABASE_URL) {
    process.env.DATABASE_URL = execFileSync('bash', [path.join(__dirname, '../scripts/pg.sh'), 'start']).toString().trim();
  }
  const config = loadConfig();
  const sequelize = createSequelize(config.DATABASE_URL, { poolMax: 2 });
  try {
    await migrate(sequelize);
    let last = '';
    const ticker = setInterval(async () => {
      const [rows] = await sequelize.query('SELECT stage, rows_read FROM dataset_imports ORDER BY id DESC LIMIT 1');
      const r = (rows as { stage: string; rows_read: number }[])[0];
      const line = r ? `${r.stage} (${r.rows_read} rows read)` : '';
      if (line && line !== last) console.log(`  … ${line}`);
      last = line;
    }, 1000);
    const result = await runImport(sequelize, kind as ImportKind, location ? path.resolve(location) : undefined).finally(() => clearInterval(ticker));
    console.log(`${result.dataset} ${result.version}: ${result.rowsInserted} inserted, ${result.rowsUpdated} updated, ` +
      `${result.rowsUnchanged} unchanged, ${result.rowsSkipped} skipped, in ${result.durationMs} ms.`);
    const skipped = (result.report.skipped ?? []) as { reason: string; count: number; examples: string[] }[];
    for (const s of skipped) console.log(`  skipped ${s.count}: ${s.reason} (e.g. ${s.examples.join('; ')})`);
  } finally {
    await sequelize.close();
  }
}

main().catch((err) => {
  console.error(`Import failed: ${err instanceof Error ? err.message : err}`);
  console.error('The food table was left exactly as it was.');
  process.exit(1);
});
