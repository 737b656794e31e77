// Colours beyond a fixed palette: hues spread by the golden angle in OKLCH, three lightness
// levels in turn, each brought into the sRGB gamut by lowering its chroma.

/** The golden angle (deg): successive hues never fall on each other and stay well spread. */
const GOLDEN_ANGLE_DEG = 137.50776;
const LIGHTNESS = [0.55, 0.7, 0.42];
const CHROMA = 0.15;

/**
 * OKLab to linear sRGB, Ottosson 2020 ("A perceptual color space for image processing",
 * bottosson.github.io/posts/oklab): the cone responses are cubed, then mixed to R, G, B.
 */
export function oklabToLinearSrgb(l: number, a: number, b: number): [number, number, number] {
  const lc = (l + 0.3963377774 * a + 0.2158037573 * b) ** 3;
  const mc = (l - 0.1055613458 * a - 0.0638541728 * b) ** 3;
  const sc = (l - 0.0894841775 * a - 1.291485548 * b) ** 3;
  return [
    4.0767416621 * lc - 3.3077115913 * mc + 0.2309699292 * sc,
    -1.2684380046 * lc + 2.6097574011 * mc - 0.3413193965 * sc,
    -0.0041960863 * lc - 0.7034186147 * mc + 1.707614701 * sc,
  ];
}

/** The sRGB transfer function (IEC 61966-2-1): linear light to an 8-bit channel. */
function channelByte(linear: number): number {
  const v = linear <= 0.0031308 ? 12.92 * linear : 1.055 * linear ** (1 / 2.4) - 0.055;
  return Math.round(Math.min(1, Math.max(0, v)) * 255);
}

const inGamut = (rgb: number[]) => rgb.every((c) => c >= -1e-9 && c <= 1 + 1e-9);

/** An OKLCH colour (hue in deg) as #rrggbb, its chroma lowered in steps until it fits sRGB. */
export function oklchHex(lightness: number, chroma: number, hueDeg: number): string {
  const h = (hueDeg * Math.PI) / 180;
  let c = chroma;
  let rgb = oklabToLinearSrgb(lightness, c * Math.cos(h), c * Math.sin(h));
  while (!inGamut(rgb) && c > 0) {
    c = Math.max(0, c - 0.005);
    rgb = oklabToLinearSrgb(lightness, c * Math.cos(h), c * Math.sin(h));
  }
  return `#${rgb.map((x) => channelByte(x).toString(16).padStart(2, '0')).join('')}`;
}

/** `count` colours, none equal to another or to one in `taken` (lower-case #rrggbb). */
export function generatedColours(count: number, taken: ReadonlySet<string>): string[] {
  const seen = new Set(taken);
  const out: string[] = [];
  for (let k = 0; out.length < count; k++) {
    const hex = oklchHex(LIGHTNESS[k % LIGHTNESS.length]!, CHROMA, 25 + k * GOLDEN_ANGLE_DEG);
    if (seen.has(hex)) continue;
    seen.add(hex);
    out.push(hex);
  }
  return out;
}
