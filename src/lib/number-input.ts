/**
 * Numbers as people type them into a text box: "0.47", "-2", "1e6", "2.5e7", "10^8", "3 × 10^6",
 * and, with `grouping`, "1,000,000", "1 000 000" or "1_000_000". Returns null when nothing is
 * typed and NaN when the text is not a number, so that a schema can say what is allowed.
 * Without `grouping` a comma is not part of a number (lists of values are split on commas).
 */
export function parseNumberText(text: string, { grouping = false }: { grouping?: boolean } = {}): number | null {
  const compact = text.trim().replace(grouping ? /[\s,_\u2009\u202f]/g : /[\s_\u2009\u202f]/g, '');
  if (compact === '') return null;
  const power = /^(-)?(?:(\d+(?:\.\d+)?)[x×*])?10\^(-?\d{1,3})$/i.exec(compact);
  if (power) {
    const value = (power[2] === undefined ? 1 : Number(power[2])) * 10 ** Number(power[3]);
    return power[1] ? -value : value;
  }
  if (!/^[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[-+]?\d{1,3})?$/i.test(compact)) return Number.NaN;
  return Number(compact);
}

/** Values separated by commas, semicolons or spaces: "0.5, 1, 2" → [0.5, 1, 2]; NaN for a word that is not a number. */
export function parseNumberList(text: string): number[] {
  return text
    .split(/[,;\s]+/)
    .filter((part) => part !== '')
    .map((part) => parseNumberText(part) ?? Number.NaN);
}
