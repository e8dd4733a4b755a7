/**
 * Plain-word names for the fields of a scenario document, as the builder labels them, so that a
 * problem reads "Companions, row 2 — initial orbital period, upper end: is required" rather
 * than the schema path "companions.rows[1].periodDays[1] is required". A path not listed here
 * falls back to its last named key split into words ("reimersEta" → "reimers eta").
 */

/** Labels by path pattern: numbers in the path are written `#` (a row, a point, an end of a range). */
const LABELS: Record<string, string> = {
  scenario: 'The scenario document',
  name: 'Scenario name',
  note: 'Note for this version',
  title: 'Title inside the document',
  description: 'Description',
  seed: 'Seed',
  systems: 'Systems per run',
  primaries: 'Primaries',
  'primaries.imf': 'Initial mass function',
  'primaries.imf.law': 'Initial mass function',
  'primaries.imf.slope': 'IMF slope',
  'primaries.imf.breaksMsun': 'IMF break masses',
  'primaries.imf.slopes': 'IMF slopes',
  'primaries.massRangeMsun': 'Initial masses drawn',
  'primaries.history': 'Star-formation history',
  'primaries.history.kind': 'Star-formation history',
  'primaries.history.ageGyr': 'Age of the population',
  'primaries.lifetime': 'Main-sequence lifetime',
  'primaries.lifetime.kind': 'Main-sequence lifetime',
  'primaries.lifetime.t0Gyr': 'Lifetime at 1 Msun',
  'primaries.lifetime.exponent': 'Lifetime exponent',
  'primaries.lifetime.points': 'Lifetime table',
  'primaries.lifetime.points.#.massMsun': 'Lifetime table, mass',
  'primaries.lifetime.points.#.lifetimeGyr': 'Lifetime table, lifetime',
  'primaries.ifmr': 'Initial–final mass relation',
  'primaries.ifmr.relation': 'Initial–final mass relation',
  'primaries.ifmr.calibration': 'IFMR calibration',
  'primaries.ifmr.points': 'IFMR table',
  'primaries.ifmr.points.#.initialMsun': 'IFMR table, initial mass',
  'primaries.ifmr.points.#.finalMsun': 'IFMR table, final mass',
  companions: 'Companions',
  'companions.multiplier': 'Occurrence multiplier',
  'companions.rows': 'Companion rows',
  'companions.tableId': 'Stored companion table',
  'companions.rows.#': 'Companion row',
  'companions.rows.#.class': 'Companion class',
  'companions.rows.#.massMJup': 'Companion mass (Jupiter masses)',
  'companions.rows.#.massMsun': 'Companion mass (solar masses)',
  'companions.rows.#.massRatio': 'Companion mass ratio',
  'companions.rows.#.periodDays': 'Initial orbital period',
  'companions.rows.#.occurrence': 'Occurrence',
  'companions.rows.#.hostMassSlope': 'Host-mass slope',
  'companions.rows.#.shape': 'Distribution inside the row',
  'companions.rows.#.shape.kind': 'Distribution inside the row',
  'companions.rows.#.shape.massSlope': 'Mass slope',
  'companions.rows.#.shape.periodSlope': 'Period slope',
  'companions.rows.#.shape.meanLog10PeriodDays': 'Mean log10 period',
  'companions.rows.#.shape.sigmaLog10Period': 'Spread of log10 period',
  'companions.rows.#.label': 'Row label',
  'companions.rows.#.source': 'Row source',
  'companions.rows.#.assumed': 'What the row assumes',
  giant: 'Engulfment model',
  'giant.kind': 'Engulfment model',
  'giant.reachAU': 'Engulfment reach',
  'giant.reimersEta': 'Reimers mass-loss efficiency',
  'giant.agbZeroPointMsun': 'AGB zero point',
  'giant.superwind': 'Late-AGB superwind',
  'giant.superwind.kind': 'Late-AGB superwind',
  'giant.superwind.eta': 'Superwind efficiency',
  'giant.tide': 'Tide on the companion’s orbit',
  'giant.tide.kind': 'Tide on the companion’s orbit',
  envelope: 'Common envelope',
  'envelope.alpha': 'Efficiency α_CE',
  'envelope.lambda': 'Envelope structure λ',
  disruption: 'Disruption',
  'disruption.eta': 'Tidal-radius factor η',
  'disruption.dissolution': 'Dissolution in the envelope',
  'disruption.dissolution.kind': 'Dissolution in the envelope',
  'disruption.dissolution.massMJup': 'Dissolution mass',
  field: 'Field',
  'field.disruption': 'Field prescription',
  'field.disruption.kind': 'Field prescription',
  'field.disruption.referenceMG': 'Median field at the reference mass',
  'field.disruption.referenceMassMJup': 'Reference companion mass',
  'field.disruption.slope': 'Slope of log B against log M2',
  'field.disruption.widthDex': 'Field scatter',
  'field.disruption.medianMG': 'Median field',
  'field.disruption.alpha': 'Disc viscosity α',
  'field.disruption.aspectRatio': 'Disc aspect ratio H/R',
  'field.disruption.discMassFraction': 'Share of the companion in the disc',
  'field.closeSurvivor': 'Close-survivor field',
  'field.closeSurvivor.medianMG': 'Close-survivor median field',
  'field.closeSurvivor.widthDex': 'Close-survivor field width',
  'field.closeSurvivor.maxPeriodDays': 'Close-survivor period limit',
  'field.emergenceDelayGyr': 'Field emergence delay',
  'field.thresholdMG': 'Detection threshold',
  channels: 'Channels',
  'channels.disruption': 'Tidal disruption channel',
  'channels.closeSurvivor': 'Close post-common-envelope survivors',
  'channels.fossil': 'Fossil channel',
  'channels.fossil.enabled': 'Fossil fields',
  'channels.fossil.fraction': 'Share of progenitors with a field',
  'channels.fossil.massRangeMsun': 'Fossil progenitor masses',
  'channels.fossil.msField': 'Main-sequence field',
  'channels.fossil.msField.medianKG': 'Median main-sequence field',
  'channels.fossil.msField.widthDex': 'Main-sequence field width',
  selection: 'Sample',
  'selection.kind': 'Sample',
  'selection.coolingAgeFloorGyr': 'Cooling-age floor',
  'selection.wavelengthNm': 'Survey band wavelength',
  observed: 'Observed counts',
  'observed.magnetic': 'Observed magnetic count',
  'observed.total': 'Observed total count',
  'observed.label': 'Where the observed counts come from',
};

/** The keys whose values are [low, high] pairs: index 0 is the lower end, 1 the upper. */
const RANGE_KEYS = new Set(['massRangeMsun', 'massMJup', 'massMsun', 'massRatio', 'periodDays']);

/** ['companions', 'rows', 1, 'periodDays', 0] from "companions.rows[1].periodDays[0]". */
export function parseFieldPath(field: string): (string | number)[] {
  const out: (string | number)[] = [];
  for (const part of field.matchAll(/([^.[\]]+)|\[(\d+)\]/g)) out.push(part[2] !== undefined ? Number(part[2]) : part[1]);
  return out;
}

const words = (key: string) =>
  key
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase()
    .replace(/^./, (c) => c.toUpperCase());

/**
 * A field of the scenario (or of the form around it: "name", "note") in the builder's words:
 * "Companion row 2: initial orbital period, lower end", "Age of the population".
 */
export function fieldLabel(field: string): string {
  const path = parseFieldPath(field);
  if (path.length === 0) return LABELS.scenario;
  // A number right after a range key is the end of the range, not a row.
  let end: string | null = null;
  const last = path[path.length - 1];
  const beforeLast = path[path.length - 2];
  let named = path;
  if (typeof last === 'number' && typeof beforeLast === 'string' && RANGE_KEYS.has(beforeLast)) {
    end = last === 0 ? 'lower end' : 'upper end';
    named = path.slice(0, -1);
  }
  const pattern = named.map((k) => (typeof k === 'number' ? '#' : k)).join('.');
  const lastName = [...named].reverse().find((k): k is string => typeof k === 'string') ?? 'scenario';
  let label = LABELS[pattern] ?? words(lastName);
  // Rows of the companion table and points of a table are counted from 1, as the builder shows them.
  const row = named[0] === 'companions' && named[1] === 'rows' && typeof named[2] === 'number' ? named[2] + 1 : null;
  const point = named.includes('points') ? named.find((k): k is number => typeof k === 'number') : undefined;
  if (row !== null) label = named.length === 3 ? `Companion row ${row}` : `Companion row ${row}: ${label.charAt(0).toLowerCase()}${label.slice(1)}`;
  else if (point !== undefined) label = `${label}, point ${point + 1}`;
  return end ? `${label}, ${end}` : label;
}

/**
 * A problem's message in plain words, without the schema path it starts with and with the
 * schema's own key names in it replaced by their labels ("… below initialMsun = 3" → "… below
 * the initial mass = 3"). "is required" becomes "needs a value".
 */
export function plainMessage(field: string, message: string): string {
  let text = message.startsWith('document.') ? message.slice('document.'.length) : message;
  if (text.startsWith(`${field} `)) text = text.slice(field.length + 1);
  else if (text.startsWith(`${field}: `)) text = text.slice(field.length + 2);
  text = text
    .replace(/^is required$/, 'needs a value')
    .replace(/× companions\.multiplier/g, 'times the occurrence multiplier')
    .replace(/\binitialMsun\b/g, 'the initial mass')
    .replace(/\bbreaksMsun\b/g, 'the break masses')
    .replace(/observed\.total/g, 'the observed total')
    .replace(/\bmassMJup, massMsun or massRatio\b/g, 'Jupiter masses, solar masses or mass ratio')
    .replace(/\brows or tableId\b/g, 'companion rows or a stored table');
  return text;
}

/** One line of the builder's problem list: "Age of the population: must be between 0.01 and 13.8 (got 20)". */
export function problemSentence(field: string, message: string): string {
  return `${fieldLabel(field)}: ${plainMessage(field, message)}`;
}
