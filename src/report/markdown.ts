import type { Column } from './table.js';

/** A GitHub-flavoured Markdown table; pipes in cells are escaped. */
export function markdownTable(columns: Column[], rows: string[][]): string {
  const cell = (text: string) => text.replace(/\|/g, '\\|');
  const header = `| ${columns.map((c) => cell(c.header)).join(' | ')} |`;
  const rule = `| ${columns.map((c) => (c.align === 'right' ? '---:' : '---')).join(' | ')} |`;
  return [header, rule, ...rows.map((r) => `| ${r.map(cell).join(' | ')} |`)].join('\n');
}
