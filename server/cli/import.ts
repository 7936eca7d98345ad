/**
 * npm run import -- <fdc|sr28|ifct> [folder] [--preview] [--confirm]
 * Imports a food-composition dataset: a FoodData Central CSV folder, an SR28 ASCII folder, or IFCT 2017 from the
 * installed npm package (folder optional: another copy of its index.csv). All-or-nothing; prints the report.
 * --preview prints what would change (added, changed, emptied) and writes nothing; an import that would blank foods
 * (most values of a food gone, or a food with none) stops unless --confirm.
 * Needs DATABASE_URL, or a running project database (npm start).
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { loadConfig } from '../config';
import { createSequelize, migrate } from '../db';
import type { ImportDiff } from '../importers/import-diff';
import { IMPORT_KINDS, ImportNeedsConfirmation, runImport, type ImportKind } from '../services/imports.service';

/** Prints the added, changed and emptied foods of an import (counts, and the first few of each). */
function printDiff(diff: ImportDiff) {
  console.log(`  ${diff.added.count} added, ${diff.changed.count} changed, ${diff.emptied.count} emptied, ${diff.unchanged} unchanged`);
  for (const f of diff.added.examples.slice(0, 10)) console.log(`  + ${f.code} ${f.name}`);
  for (const f of diff.changed.examples.slice(0, 10)) {
    console.log(`  ~ ${f.code} ${f.name}: ${f.fields.map((c) => `${c.key} ${c.from ?? '?'} → ${c.to ?? '?'}`).join(', ')}`);
  }
  for (const f of diff.emptied.examples.slice(0, 20)) console.log(`  ! ${f.code} ${f.name}: ${f.reason}${f.lost.length ? ` (${f.lost.join(', ')})` : ''}`);
}

async function main() {
  const args = process.argv.slice(2);
  const [kind, location] = args.filter((a) => !a.startsWith('--'));
  const mode = { preview: args.includes('--preview'), confirm: args.includes('--confirm') };
  if (!kind || !(kind in IMPORT_KINDS) || (kind !== 'ifct' && !location)) {
    throw new Error('Usage: npm run import -- <fdc|sr28> <folder> [--preview] [--confirm]   or   npm run import -- ifct [index.csv]');
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
    const result = await runImport(sequelize, kind as ImportKind, location ? path.resolve(location) : undefined, mode)
      .catch((err) => {
        if (err instanceof ImportNeedsConfirmation) printDiff(err.diff);
        throw err;
      })
      .finally(() => clearInterval(ticker));
    if (result.status === 'previewed') {
      console.log(`${result.dataset} ${result.version}: preview, nothing written.`);
      printDiff(result.report.diff as ImportDiff);
      return;
    }
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
