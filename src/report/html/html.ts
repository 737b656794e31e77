import type { Column } from '../table.js';
import { htmlSymbols } from './typography.js';

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for HTML content and attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (ch) => ENTITIES[ch]!);
}

/** Text as HTML content: escaped, and σ_X with X as a subscript (typography.ts). */
export const htmlText = (text: string): string => htmlSymbols(escapeHtml(text));

/** An HTML table from the same columns and rows the text renderers use; numbers align right, σ_X subscripted. */
export function htmlTable(columns: Column[], rows: string[][], caption?: string): string {
  const cls = (c: Column) => (c.align === 'right' ? ' class="num"' : '');
  const head = columns.map((c) => `<th scope="col"${cls(c)}>${htmlText(c.header)}</th>`).join('');
  const body = rows.map((row) => `<tr>${row.map((cell, i) => `<td${cls(columns[i]!)}>${htmlText(cell)}</td>`).join('')}</tr>`).join('\n');
  const cap = caption ? `<caption>${htmlText(caption)}</caption>` : '';
  return `<table>${cap}<thead><tr>${head}</tr></thead>\n<tbody>\n${body}\n</tbody></table>`;
}

/** Tables of more columns than this are too wide for a phone (measured in Chromium at 390 px: the report's 3-column tables fit, its 6-column ones do not). */
const PHONE_COLUMNS = 4;

/** A table in a box that scrolls sideways; one too wide for a phone is marked for the narrow style's "scroll sideways" hint. */
export function scrollTable(columns: Column[], rows: string[][], caption?: string): string {
  const hint = columns.length > PHONE_COLUMNS ? ' side-scroll' : '';
  return `<div class="table-wrap${hint}">${htmlTable(columns, rows, caption)}</div>`;
}

/** A short id for anchors and aria references: `SELVA-12` → `selva-12`. */
export function anchorId(...parts: string[]): string {
  return parts
    .join('-')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
}
