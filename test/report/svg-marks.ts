// Test helpers: cut the report into figures and count the items of a named vega mark in an SVG.

/** The figures of one kind, as `{ id, html }`, in page order. */
export function figures(page: string, kind: string): { id: string; html: string }[] {
  const re = new RegExp(`<figure class="chart chart-${kind}" id="([^"]+)"[\\s\\S]*?</figure>`, 'g');
  return [...page.matchAll(re)].map((m) => ({ id: m[1]!, html: m[0] }));
}

/**
 * Items drawn by the mark named `name` (vega writes `<g class="mark-<type> role-mark <name>_marks">`
 * and one element per item inside it; 0 when the mark is absent). Marks of these types hold no
 * nested groups, so the first `</g>` closes the container.
 */
export function markCount(svg: string, name: string): number {
  const open = new RegExp(`<g class="mark-[a-z]+ role-mark ${name}_marks"[^>]*>`, 'g');
  let total = 0;
  for (const m of svg.matchAll(open)) {
    const start = m.index! + m[0].length;
    const inner = svg.slice(start, svg.indexOf('</g>', start));
    total += (inner.match(/<(path|line|text|rect)\b/g) ?? []).length;
  }
  return total;
}

/** The cells of a figure's data table, row by row. */
export function tableRows(html: string): string[][] {
  const body = html.slice(html.indexOf('<tbody>'), html.indexOf('</tbody>'));
  return [...body.matchAll(/<tr>([\s\S]*?)<\/tr>/g)].map((r) => [...r[1]!.matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((c) => c[1]!));
}
