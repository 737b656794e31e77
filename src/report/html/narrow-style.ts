import { MUTED } from './palette.js';

/** Screens up to this width get the phone layout (our own choice: phones and small tablets). */
export const NARROW_MAX_PX = 600;
/** Side padding of the page on a phone. */
const NARROW_PADDING_PX = 12;
/** The width left for content on a 390 px wide phone (a common phone width), after the padding. */
export const PHONE_CONTENT_PX = 390 - 2 * NARROW_PADDING_PX;
/** Chart text never shrinks below this on a phone (common practice for legible text on screens). */
export const MIN_CHART_TEXT_PX = 8;

/**
 * Phone widths: narrower padding and headings; a chart shrinks with the page (max-width 100%,
 * height auto) down to the width at which its smallest text is MIN_CHART_TEXT_PX (its
 * `--legible-width`, set per chart in figure.ts), then scrolls sideways in its box, as wide tables
 * do. Boxes marked `side-scroll` (too wide for PHONE_CONTENT_PX) say so above their content.
 */
export const NARROW_CSS = `
@media screen and (max-width: ${NARROW_MAX_PX}px) {
  body { font-size: 14px; }
  main { padding: 14px ${NARROW_PADDING_PX}px 32px; }
  h1 { font-size: 21px; }
  h2 { font-size: 17px; margin-top: 22px; }
  .facts { grid-template-columns: 1fr; }
  .facts dd { margin-bottom: 4px; }
  .svg-box { overflow-x: auto; }
  .svg-box svg { min-width: var(--legible-width, 0); }
  .side-scroll::before {
    content: "scroll sideways \\2192";
    display: block;
    position: sticky;
    left: 0;
    width: max-content;
    font-size: 12px;
    color: ${MUTED};
  }
}
`;
