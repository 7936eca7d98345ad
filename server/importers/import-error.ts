/** A bad input file: names the file, the line (1-based) and the column, so a person can find and fix it. */
export class ImportFileError extends Error {
  constructor(
    readonly file: string,
    readonly line: number | null,
    readonly column: string | null,
    readonly reason: string,
  ) {
    super(`${file}${line != null ? `, line ${line}` : ''}${column ? `, column ${column}` : ''}: ${reason}`);
    this.name = 'ImportFileError';
  }
}
