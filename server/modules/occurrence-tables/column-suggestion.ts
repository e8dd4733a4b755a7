/** Words people use for a column under another name (common practice in survey tables; our choice of list). */
const SYNONYMS: Record<string, string> = {
  kind: 'class',
  type: 'class',
  category: 'class',
  companion: 'class',
  unit: 'massUnit',
  units: 'massUnit',
  massunits: 'massUnit',
  rate: 'occurrence',
  frequency: 'occurrence',
  fraction: 'occurrence',
  eta: 'occurrence',
  reference: 'source',
  citation: 'source',
  ref: 'source',
  name: 'label',
  note: 'assumed',
  notes: 'assumed',
  pmin: 'periodMinDays',
  pmax: 'periodMaxDays',
  periodmin: 'periodMinDays',
  periodmax: 'periodMaxDays',
  mmin: 'massMin',
  mmax: 'massMax',
};

/** Levenshtein distance (insertions, deletions, substitutions each cost 1). */
function editDistance(a: string, b: string): number {
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    for (let j = 1; j <= b.length; j++) current[j] = Math.min(previous[j] + 1, current[j - 1] + 1, previous[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    previous = current;
  }
  return previous[b.length];
}

/**
 * The allowed column an unknown header most likely meant: a known synonym ("kind" → "class"),
 * the same name in other case or with spaces/underscores, or the nearest name at most a third
 * of its length away by edit distance. Null when nothing is close.
 */
export function nearestColumn(header: string, allowed: readonly string[]): string | null {
  const simple = header.toLowerCase().replace(/[\s_-]/g, '');
  const synonym = SYNONYMS[simple];
  if (synonym && allowed.includes(synonym)) return synonym;
  const sameLetters = allowed.find((c) => c.toLowerCase() === simple);
  if (sameLetters) return sameLetters;
  let best: { column: string; distance: number } | null = null;
  for (const column of allowed) {
    const distance = editDistance(simple, column.toLowerCase());
    if (!best || distance < best.distance) best = { column, distance };
  }
  return best && best.distance <= Math.max(1, Math.floor(best.column.length / 3)) ? best.column : null;
}
