/**
 * Log-normal field prescription: log10 B = log10 B_median + widthDex · z with z a standard
 * normal deviate (the usual description of the spread of white-dwarf fields, e.g. the
 * log-normal fits of Ferrario, de Martino & Gänsicke 2015, SSRv 191, 111). Units: MG.
 * Example: median 50 MG, width 0.5 dex, z = −1 gives 50 · 10^-0.5 ≈ 15.8 MG.
 */
export function lognormalFieldMG(medianMG: number, widthDex: number, z: number): number {
  return medianMG * Math.exp(widthDex * z * Math.LN10); // = median · 10^(width z), without Math.pow's cost
}

/** The same prescription in the kernel's form: log10 B (MG) from log10 of the median. Example: log10 50, 0.5 dex, z = −1 → 1.199 (15.8 MG). */
export function lognormalLog10FieldMG(log10MedianMG: number, widthDex: number, z: number): number {
  return log10MedianMG + widthDex * z;
}
