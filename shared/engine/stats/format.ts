/**
 * Number formatting for the plain-language summaries: significant figures without exponent
 * notation for ordinary magnitudes, "× 10ⁿ" for very small ones, and the Particle Data Group
 * rounding rule for a value with its error.
 */

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};

function timesTenTo(mantissa: string, exponent: number): string {
  const power = String(exponent).split('').map((c) => SUPERSCRIPT[c]).join('');
  return `${mantissa} × 10${power}`;
}

/** x rounded at the decimal place 10^lastDigitPower, without exponent notation. */
function toFixedAtPlace(x: number, lastDigitPower: number): string {
  if (lastDigitPower >= 0) return String(Math.round(x / 10 ** lastDigitPower) * 10 ** lastDigitPower);
  return x.toFixed(-lastDigitPower);
}

/**
 * x with `digits` significant figures: plain decimals for 1e-4 ≤ |x| < 1e6, otherwise
 * "m × 10ⁿ". Example: formatSignificant(0.0948, 2) = "0.095"; formatSignificant(5.7e-10, 2) = "5.7 × 10⁻¹⁰".
 */
export function formatSignificant(x: number, digits = 2): string {
  if (x === 0) return '0';
  const [mantissa, exponentText] = x.toExponential(digits - 1).split('e');
  const exponent = Number(exponentText);
  if (exponent < -4 || exponent >= 6) return timesTenTo(mantissa, exponent);
  return toFixedAtPlace(Number(x.toPrecision(digits)), exponent - (digits - 1));
}

/** A fraction as a percentage with two significant figures. Example: 0.09489 → "9.5%". */
export function formatPercent(fraction: number): string {
  return `${formatSignificant(100 * fraction, 2)}%`;
}

/**
 * x rounded at the decimal place that gives `resolution` (an interval's width, say) two
 * significant figures, but never coarser than x's own second significant figure; so that the
 * ends of a narrow interval stay distinct. Example: formatAtResolution(2.4137, 0.0213) = "2.414".
 */
export function formatAtResolution(x: number, resolution: number): string {
  if (x === 0) return '0';
  if (!(resolution > 0)) return formatSignificant(x, 2);
  const fromResolution = Math.floor(Math.log10(resolution)) - 1;
  const fromValue = Math.floor(Math.log10(Math.abs(x))) - 1;
  // toFixed stops at 100 decimals; such widths only occur for absurd inputs.
  return toFixedAtPlace(x, Math.max(-15, Math.min(fromResolution, fromValue)));
}

/**
 * An observed fraction and its interval as percentages at the resolution of the interval's
 * width (formatAtResolution). Example: formatPercentRange(0.15, 0.0321, 0.3789) = ["15", "3.2", "38"]
 * (to be read as 15%, 3.2–38%).
 */
export function formatPercentRange(fraction: number, lower: number, upper: number): [string, string, string] {
  const width = 100 * (upper - lower);
  const text = (x: number) => formatAtResolution(100 * x, width);
  return [text(fraction), text(lower), text(upper)];
}

/**
 * A fraction and its standard error as percentages, rounded by the Particle Data Group rule
 * (Review of Particle Physics, Introduction, "Rounding"; from memory): take the error's three
 * leading digits; 100–354 → two significant figures, 355–949 → one, 950–999 → round up to
 * 1000 and keep two; the value is rounded to the same decimal place.
 * Example: formatPercentWithError(0.021, 0.0014) = "2.10% ± 0.14%".
 */
export function formatPercentWithError(fraction: number, se: number): string {
  const value = 100 * fraction;
  const error = 100 * se;
  if (!(error > 0)) return `${formatSignificant(value, 2)}%`;
  const [mantissa, exponentText] = error.toExponential(2).split('e');
  let exponent = Number(exponentText);
  const leading = Math.round(Number(mantissa) * 100);
  let digits = leading <= 354 ? 2 : 1;
  if (leading >= 950) {
    exponent += 1;
    digits = 2;
  }
  const place = exponent - (digits - 1);
  // toFixed stops at 100 decimals; errors that small are shown in exponent form instead.
  if (place < -15) return `${formatSignificant(value, 3)}% ± ${formatSignificant(error, digits)}%`;
  const roundedError = leading >= 950 ? 10 ** exponent : Math.round(error / 10 ** place) * 10 ** place;
  return `${toFixedAtPlace(value, place)}% ± ${toFixedAtPlace(roundedError, place)}%`;
}

/**
 * A p-value given by its natural log, with two significant figures; values below 1e-4 as
 * "m × 10ⁿ", also when p itself underflows a double. Example: formatPValue(Math.log(0.4567)) = "0.46".
 */
export function formatPValue(logP: number): string {
  if (logP === -Infinity) return '0';
  if (logP === 0) return '1';
  const log10 = logP / Math.LN10;
  if (log10 >= -4) {
    const text = formatSignificant(Math.exp(logP), 2);
    return text === '1.0' ? '1' : text;
  }
  let exponent = Math.floor(log10);
  let mantissa = Number((10 ** (log10 - exponent)).toFixed(1));
  if (mantissa >= 10) {
    mantissa = 1;
    exponent += 1;
  }
  return timesTenTo(mantissa.toFixed(1), exponent);
}

/** A significance in σ with one decimal (whole σ above 100). Example: 6.1985 → "6.2σ". */
export function formatSigma(sigma: number): string {
  if (sigma === Infinity) return '∞σ';
  return `${sigma >= 100 ? Math.round(sigma) : sigma.toFixed(1)}σ`;
}
