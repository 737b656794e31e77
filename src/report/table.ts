/** A column of a plain-text table: header, and right alignment for numbers. */
export interface Column {
  header: string;
  align?: 'left' | 'right';
}

/** Renders rows as an aligned plain-text table with a rule under the header. */
export function renderTable(columns: Column[], rows: string[][]): string {
  const widths = columns.map((c) => c.header.length);
  for (const row of rows) for (let i = 0; i < widths.length; i++) widths[i] = Math.max(widths[i]!, (row[i] ?? '').length);
  const line = (cells: string[]) =>
    cells
      .map((cell, i) => (columns[i]!.align === 'right' ? cell.padStart(widths[i]!) : cell.padEnd(widths[i]!)))
      .join('  ')
      .trimEnd();
  return [line(columns.map((c) => c.header)), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}

/** A NaN is a fault upstream, never a missing value: it must not be shown as a dash. */
function checkNotNaN(value: number | undefined | null): void {
  if (Number.isNaN(value)) throw new Error('text output: a value is NaN');
}

/** Fixed decimals, or a dash for a missing or infinite value (such as σ_K without visits). */
export function fmt(value: number | undefined | null, decimals: number): string {
  checkNotNaN(value);
  return value === undefined || value === null || !Number.isFinite(value) ? '-' : value.toFixed(decimals);
}

/** A probability or fraction as a whole percentage (`42%`), or a dash for a missing value. */
export function percent(value: number | undefined): string {
  checkNotNaN(value);
  return value === undefined || !Number.isFinite(value) ? '-' : `${Math.round(value * 100)}%`;
}
