// Test helpers: cut the report into figures and count the items of a named vega mark in an SVG.

/** The figures of one kind, as `{ id, html }`, in page order. */
export function figures(page: string, kind: string): { id: string; html: string }[] {
  const re = new RegExp(`<figure class="chart chart-${kind}" id="([^"]+)"[\\s\\S]*?</figure>`, 'g');
  return [...page.matchAll(re)].map((m) => ({ id: m[1]!, html: m[0] }));
}

/**
 * The elements drawn by the mark named `name` (vega writes `<g class="mark-<type> role-mark <name>_marks">`
 * and one element per item inside it; none when the mark is absent), each from its opening tag to
 * the end of its text. Marks of these types hold no nested groups, so the first `</g>` closes the container.
 */
export function markElements(svg: string, name: string): string[] {
  const open = new RegExp(`<g class="mark-[a-z]+ role-mark ${name}_marks"[^>]*>`, 'g');
  const out: string[] = [];
  for (const m of svg.matchAll(open)) {
    const start = m.index! + m[0].length;
    const inner = svg.slice(start, svg.indexOf('</g>', start));
    for (const e of inner.matchAll(/<(path|line|text|rect)\b[^>]*>([^<]*(?:<tspan[^>]*>[^<]*<\/tspan>)*[^<]*)/g)) out.push(e[0]);
  }
  return out;
}

/** How many items the mark named `name` drew (0 when it is absent). */
export const markCount = (svg: string, name: string): number => markElements(svg, name).length;

/** The text content of an element (tspans joined). */
export const textOf = (element: string): string => element.replace(/<[^>]*>/g, '');

/** An attribute's value on an element's opening tag, or undefined. */
export const attributeOf = (element: string, attribute: string): string | undefined => element.match(new RegExp(`\\s${attribute}="([^"]*)"`))?.[1];

/** The texts of every axis label in an SVG, in drawing order. */
export function axisLabels(svg: string): string[] {
  return [...svg.matchAll(/<g class="mark-text role-axis-label"[^>]*>([\s\S]*?)<\/g>/g)].flatMap((g) =>
    [...g[1]!.matchAll(/<text[^>]*>(.*?)<\/text>/g)].map((t) => textOf(t[1]!)),
  );
}

/** The cells of a figure's data table, row by row. */
export function tableRows(html: string): string[][] {
  const body = html.slice(html.indexOf('<tbody>'), html.indexOf('</tbody>'));
  return [...body.matchAll(/<tr>([\s\S]*?)<\/tr>/g)].map((r) => [...r[1]!.matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((c) => c[1]!));
}
