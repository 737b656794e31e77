// One typography for the report's symbols. Text is written with σ and an underscore before the
// subscript (K/σ_K, σ_RV); the SVG charts and the HTML page draw the subscript as a subscript, so
// no underscore ever shows. Masses are in M⊕ and the minimum mass is "m sin i" everywhere.

export const MSINI_EARTH = 'm sin i (M⊕)';

/** σ followed by `_` and a subscript of letters; the plain-text spelling sigma_X is read as σ_X. */
const SUBSCRIPTED = /(?:σ|\bsigma)_([A-Za-z]+)/g;

/** HTML (already escaped) with every σ_X as σ<sub>X</sub>. */
export function htmlSymbols(escapedHtml: string): string {
  return escapedHtml.replace(SUBSCRIPTED, 'σ<sub>$1</sub>');
}

/**
 * An SVG with every σ_X in its text content drawn as σ and a lowered, smaller X; the text after the
 * subscript is raised back (a tspan's dy moves every glyph after it). In aria-label attributes,
 * read by screen readers, σ_X becomes "sigma X"; other attributes are untouched.
 */
export function svgSymbols(svg: string): string {
  const spoken = svg.replace(/aria-label="([^"]*)"/g, (_, label: string) => `aria-label="${label.replace(SUBSCRIPTED, 'sigma $1')}"`);
  return spoken.replace(/>([^<]*)</g, (whole, text: string) => {
    if (!SUBSCRIPTED.test(text)) return whole;
    SUBSCRIPTED.lastIndex = 0;
    const parts = text.split(SUBSCRIPTED);
    let out = parts[0]!;
    for (let i = 1; i < parts.length; i += 2) {
      out += `σ<tspan dy="0.3em" font-size="75%">${parts[i]}</tspan><tspan dy="-0.3em">${parts[i + 1]}</tspan>`;
    }
    return `>${out}<`;
  });
}
