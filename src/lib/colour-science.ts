/**
 * Small colour-science helpers for checking the theme and the chart palette: WCAG contrast,
 * CIELAB, the CIEDE2000 colour difference and a simulation of colour-vision deficiency.
 * Colours are sRGB hex strings ("#rrggbb").
 */

export type Rgb = readonly [number, number, number];
export type Lab = readonly [number, number, number];
export type Deficiency = 'protan' | 'deutan' | 'tritan';

export function hexToRgb(hex: string): Rgb {
  const match = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!match) throw new Error(`colour = ${JSON.stringify(hex)} is not a #rrggbb hex colour`);
  return [parseInt(match[1], 16) / 255, parseInt(match[2], 16) / 255, parseInt(match[3], 16) / 255];
}

/** IEC 61966-2-1 (sRGB) transfer function, encoded → linear light. */
function toLinear(channel: number): number {
  return channel <= 0.04045 ? channel / 12.92 : ((channel + 0.055) / 1.055) ** 2.4;
}

export function hexToLinearRgb(hex: string): Rgb {
  const [r, g, b] = hexToRgb(hex);
  return [toLinear(r), toLinear(g), toLinear(b)];
}

/** WCAG 2.2 relative luminance (the sRGB Y with Rec. 709 weights). */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = hexToLinearRgb(hex);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2.2 contrast ratio, from 1 (none) to 21 (black on white). */
export function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

/** Linear sRGB → CIELAB under D65 (sRGB matrix of IEC 61966-2-1; CIE 15:2004 Lab). */
export function linearRgbToLab([r, g, b]: Rgb): Lab {
  const x = (0.4124564 * r + 0.3575761 * g + 0.1804375 * b) / 0.95047;
  const y = 0.2126729 * r + 0.7151522 * g + 0.072175 * b;
  const z = (0.0193339 * r + 0.119192 * g + 0.9503041 * b) / 1.08883;
  // CIE's linear segment near black avoids the cube root's infinite slope at zero.
  const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : (24389 / 27 * t + 16) / 116);
  const [fx, fy, fz] = [f(x), f(y), f(z)];
  return [116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)];
}

export function hexToLab(hex: string): Lab {
  return linearRgbToLab(hexToLinearRgb(hex));
}

/**
 * CIEDE2000 colour difference ΔE00 (CIE 142-2001), written after the implementation notes
 * of Sharma, Wu & Dalal 2005 (Color Res. Appl. 30, 21), whose test pairs the unit test uses.
 * kL = kC = kH = 1. About 1 is a just-noticeable difference; above 10 reads as another colour.
 */
export function deltaE2000([l1, a1, b1]: Lab, [l2, a2, b2]: Lab): number {
  const rad = Math.PI / 180;
  const meanC = (Math.hypot(a1, b1) + Math.hypot(a2, b2)) / 2;
  const g = 0.5 * (1 - Math.sqrt(meanC ** 7 / (meanC ** 7 + 25 ** 7)));
  const a1p = (1 + g) * a1;
  const a2p = (1 + g) * a2;
  const c1p = Math.hypot(a1p, b1);
  const c2p = Math.hypot(a2p, b2);
  const hue = (b: number, a: number) => (b === 0 && a === 0 ? 0 : (Math.atan2(b, a) / rad + 360) % 360);
  const h1p = hue(b1, a1p);
  const h2p = hue(b2, a2p);

  const dLp = l2 - l1;
  const dCp = c2p - c1p;
  let dhp = 0;
  if (c1p * c2p !== 0) {
    dhp = h2p - h1p;
    if (dhp > 180) dhp -= 360;
    else if (dhp < -180) dhp += 360;
  }
  const dHp = 2 * Math.sqrt(c1p * c2p) * Math.sin((dhp / 2) * rad);

  const meanLp = (l1 + l2) / 2;
  const meanCp = (c1p + c2p) / 2;
  let meanHp = h1p + h2p;
  if (c1p * c2p !== 0) {
    if (Math.abs(h1p - h2p) <= 180) meanHp /= 2;
    else meanHp = h1p + h2p < 360 ? (meanHp + 360) / 2 : (meanHp - 360) / 2;
  }
  const t =
    1 -
    0.17 * Math.cos((meanHp - 30) * rad) +
    0.24 * Math.cos(2 * meanHp * rad) +
    0.32 * Math.cos((3 * meanHp + 6) * rad) -
    0.2 * Math.cos((4 * meanHp - 63) * rad);
  const dTheta = 30 * Math.exp(-(((meanHp - 275) / 25) ** 2));
  const rc = 2 * Math.sqrt(meanCp ** 7 / (meanCp ** 7 + 25 ** 7));
  const sl = 1 + (0.015 * (meanLp - 50) ** 2) / Math.sqrt(20 + (meanLp - 50) ** 2);
  const sc = 1 + 0.045 * meanCp;
  const sh = 1 + 0.015 * meanCp * t;
  const rt = -Math.sin(2 * dTheta * rad) * rc;
  return Math.sqrt(
    (dLp / sl) ** 2 + (dCp / sc) ** 2 + (dHp / sh) ** 2 + rt * (dCp / sc) * (dHp / sh),
  );
}

/**
 * Machado, Oliveira & Fernandes 2009 (IEEE TVCG 15, 1291), Table 1 at severity 1.0
 * (protanopia, deuteranopia, tritanopia). The matrices act on linear RGB.
 */
export const MACHADO_2009: Record<Deficiency, readonly Rgb[]> = {
  protan: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
  deutan: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.01182, 0.04294, 0.968881],
  ],
  tritan: [
    [1.255528, -0.076749, -0.178779],
    [-0.078411, 0.930809, 0.147602],
    [0.004733, 0.691367, 0.3039],
  ],
};

/** The linear RGB a dichromat of the given kind sees (Machado et al. 2009), clipped to the gamut. */
export function simulateDeficiency(rgb: Rgb, deficiency: Deficiency): Rgb {
  const clamp = (v: number) => Math.min(1, Math.max(0, v));
  const [r, g, b] = MACHADO_2009[deficiency].map((row) => clamp(row[0] * rgb[0] + row[1] * rgb[1] + row[2] * rgb[2]));
  return [r, g, b];
}

/** The CIELAB colour that a dichromat of the given kind sees for `hex`. */
export function simulateDeficiencyLab(hex: string, deficiency: Deficiency): Lab {
  return linearRgbToLab(simulateDeficiency(hexToLinearRgb(hex), deficiency));
}
