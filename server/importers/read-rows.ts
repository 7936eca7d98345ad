import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { parse } from 'csv-parse';
import { ImportFileError } from './import-error';

export type Row = { fields: string[]; line: number };

type Layout = { delimiter: string; quote: string; encoding: BufferEncoding };

/** FoodData Central CSV: comma-separated, double-quoted, UTF-8. */
export const FDC_LAYOUT: Layout = { delimiter: ',', quote: '"', encoding: 'utf8' };
/** SR28 ASCII: `^`-separated, `~`-quoted, Latin-1. */
export const SR28_LAYOUT: Layout = { delimiter: '^', quote: '~', encoding: 'latin1' };

/** Path of a required file in the folder (as is, or gzipped as `name.gz`), or an error naming the missing file. */
export function requireFile(folder: string, name: string): string {
  const file = path.join(folder, name);
  if (fs.existsSync(file)) return file;
  if (fs.existsSync(`${file}.gz`)) return `${file}.gz`;
  throw new ImportFileError(name, null, null, 'the file is missing from the folder.');
}

/** Streams the records of a delimited file with their line numbers; a broken quote or encoding becomes an ImportFileError. */
export async function* readRows(file: string, layout: Layout): AsyncGenerator<Row> {
  const name = path.basename(file).replace(/\.gz$/, '');
  const raw = fs.createReadStream(file);
  const bytes = file.endsWith('.gz') ? raw.pipe(zlib.createGunzip()) : raw;
  bytes.setEncoding(layout.encoding);
  const parser = bytes.pipe(
    parse({
      delimiter: layout.delimiter,
      quote: layout.quote,
      escape: layout.quote,
      bom: true,
      relax_column_count: true,
      skip_empty_lines: true,
    }),
  );
  // Each record with the line it ends on. csv-parse's `info: true` builds a copy of its whole state for every record
  // (a quarter of the parse time of a large file); the parser pushes each record as soon as it has parsed it, so its
  // live line count at that moment is the same number.
  const push = parser.push.bind(parser);
  parser.push = (record: string[] | null) => push(record === null ? null : { fields: record, line: parser.info.lines });
  // A pipe does not pass errors on: a broken gzip stream must stop the parser.
  bytes.on('error', (err: Error) => parser.destroy(err));
  try {
    yield* parser as AsyncIterable<Row>;
  } catch (err) {
    const e = err as Error & { lines?: number; code?: string };
    const reason =
      e.code === 'CSV_QUOTE_NOT_CLOSED'
        ? `a quoted field is not closed (${layout.quote}); the file looks truncated or is not in this layout.`
        : `the file cannot be read in this layout (${e.code ?? e.message}).`;
    throw new ImportFileError(name, e.lines ?? null, null, reason);
  }
}

/** Parses a decimal as USDA writes it (`1`, `1.0`, `.333`); blank gives null; anything else is an error naming the cell. */
export function parseAmount(text: string, file: string, line: number, column: string): number | null {
  const t = text.trim();
  if (t === '') return null;
  if (!/^-?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t)) {
    throw new ImportFileError(file, line, column, `"${t.slice(0, 40)}" is not a number.`);
  }
  return Number(t);
}

/** Positions of named columns from a header row; a missing one is an error naming the file and column. */
export function headerIndex(file: string, header: Row, required: string[], optional: string[] = []): Record<string, number> {
  const names = header.fields.map((f) => f.trim());
  const out: Record<string, number> = {};
  const missing = required.filter((c) => !names.includes(c));
  if (missing.length) {
    throw new ImportFileError(
      file,
      header.line,
      missing[0],
      `missing column${missing.length > 1 ? 's' : ''} ${missing.join(', ')} — is this the FoodData Central ${file}?`,
    );
  }
  for (const c of [...required, ...optional]) if (names.includes(c)) out[c] = names.indexOf(c);
  return out;
}
