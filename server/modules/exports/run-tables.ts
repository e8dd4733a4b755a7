import { fromLog10, type Cell, type ExportColumn, type ExportTable } from './export-table.ts';
import { TableRegistry } from './table-registry.ts';

/**
 * The run tables, derived from whatever bins a result document holds. The result is read
 * through the narrow shapes below (not the full result contract), and every bin family that
 * not every engine writes is optional: engine-1 and engine-2 results both export, each with
 * the tables it has.
 */

type Counts = number[];
interface MagneticSplit { magnetic: Counts; nonMagnetic: Counts }
interface Fraction { value: number | null; se: number | null; k: number; n: number }

export interface RunTableResult {
  counts: {
    whiteDwarfs: number;
    magnetic: number;
    byChannel: Record<string, number>;
    bySetting: Record<string, { whiteDwarfs: number; magnetic: number }>;
    companionFates?: Record<string, number>;
    heliumWhiteDwarfs?: number;
  };
  fraction: Fraction;
  fractionBySetting: Record<string, Fraction>;
  fractionByChannel: Record<string, Fraction>;
  bins: {
    wdMass?: { edgesMsun: number[] } & MagneticSplit;
    wdMassBySetting?: { edgesMsun: number[] } & Record<string, MagneticSplit | number[]>;
    logField?: { edgesLog10MG: number[]; counts: Counts; thresholdMG: number; byChannel?: Record<string, Counts> };
    coolingAge?: { edgesLog10Gyr: number[] } & MagneticSplit;
    postCommonEnvelopePeriod?: { edgesLog10Days: number[] } & MagneticSplit;
    fateMap?: { log10MassEdgesMsun: number[]; log10PeriodEdgesDays: number[]; fates: string[]; counts: number[][][] };
    survivorSeparation?: { edgesLog10AU: number[]; wide: Counts; postCE: Counts };
  };
}

const SETTINGS = ['single', 'wide', 'postCE'] as const;
const SETTING_LABEL: Record<string, string> = { single: 'single', wide: 'wide companion', postCE: 'post-common-envelope companion', all: 'all white dwarfs' };

const count = (name: string, description: string): ExportColumn => ({ name, datatype: 'int64', description });
const bound = (name: string, unit: string, description: string): ExportColumn => ({ name, datatype: 'float64', unit, description });
/** snake_case column names (astronomers' tables and astropy attribute access). */
const snake = (key: string) => key.replace(/CE$/, '_ce').replace(/([a-z])([A-Z])/g, '$1_$2').toLowerCase();

/** A histogram table: lower and upper bin bound columns, then one count column per series. */
function histogram(
  table: Pick<ExportTable, 'name' | 'title' | 'description' | 'params'>,
  edges: { lo: string; hi: string; unit: string; quantity: string; values: number[] },
  series: { column: string; description: string; counts: Counts }[],
): ExportTable {
  const rows: Cell[][] = [];
  const bins = edges.values.length - 1;
  for (let i = 0; i < bins; i++) rows.push([edges.values[i], edges.values[i + 1], ...series.map((s) => s.counts[i] ?? 0)]);
  return {
    ...table,
    columns: [
      bound(edges.lo, edges.unit, `lower bound of the ${edges.quantity} bin (inclusive)`),
      bound(edges.hi, edges.unit, `upper bound of the ${edges.quantity} bin (exclusive)`),
      ...series.map((s) => count(s.column, s.description)),
    ],
    rows,
  };
}

export const runTables = new TableRegistry<RunTableResult>()
  .register({
    name: 'wd-mass',
    title: 'White-dwarf masses',
    description: 'White dwarfs in the sample per mass bin, magnetic and not (solMass).',
    build: ({ bins }) =>
      bins.wdMass
        ? histogram(
            { name: 'wd-mass', title: 'White-dwarf masses', description: 'Number of model white dwarfs in the sample per white-dwarf mass bin, magnetic (B at or above the threshold) and not.' },
            { lo: 'mass_lo', hi: 'mass_hi', unit: 'solMass', quantity: 'white-dwarf mass', values: bins.wdMass.edgesMsun },
            [
              { column: 'magnetic', description: 'magnetic white dwarfs in the bin', counts: bins.wdMass.magnetic },
              { column: 'non_magnetic', description: 'non-magnetic white dwarfs in the bin', counts: bins.wdMass.nonMagnetic },
            ],
          )
        : null,
  })
  .register({
    name: 'wd-mass-by-setting',
    title: 'White-dwarf masses by setting',
    description: 'Mass histogram split into single, wide-companion and post-CE white dwarfs (solMass).',
    build: ({ bins }) => {
      const b = bins.wdMassBySetting;
      if (!b) return null;
      const series = SETTINGS.flatMap((s) => {
        const split = b[s] as MagneticSplit | undefined;
        if (!split) return [];
        return [
          { column: `${snake(s)}_magnetic`, description: `magnetic white dwarfs with setting "${SETTING_LABEL[s]}"`, counts: split.magnetic },
          { column: `${snake(s)}_non_magnetic`, description: `non-magnetic white dwarfs with setting "${SETTING_LABEL[s]}"`, counts: split.nonMagnetic },
        ];
      });
      return histogram(
        { name: 'wd-mass-by-setting', title: 'White-dwarf masses by setting', description: 'Number of model white dwarfs per mass bin, split by setting (single, wide companion, post-common-envelope companion) and by magnetism.' },
        { lo: 'mass_lo', hi: 'mass_hi', unit: 'solMass', quantity: 'white-dwarf mass', values: b.edgesMsun },
        series,
      );
    },
  })
  .register({
    name: 'field',
    title: 'Magnetic field strengths',
    description: 'Magnetic white dwarfs per field-strength bin, in total and per channel where recorded (MG).',
    build: ({ bins }) => {
      const f = bins.logField;
      if (!f) return null;
      const channels = Object.entries(f.byChannel ?? {});
      return histogram(
        {
          name: 'field',
          title: 'Magnetic field strengths',
          description: 'Number of model white dwarfs with a field per field-strength bin (logarithmic bins, bounds given in MG), in total and per channel when the result records them.',
          params: [{ name: 'threshold', value: f.thresholdMG, unit: 'MG', description: 'detection threshold: a white dwarf counts as magnetic at or above it' }],
        },
        { lo: 'field_lo', hi: 'field_hi', unit: 'MG', quantity: 'field strength', values: f.edgesLog10MG.map(fromLog10) },
        [
          { column: 'count', description: 'white dwarfs with a field in the bin (all channels)', counts: f.counts },
          ...channels.map(([channel, counts]) => ({ column: snake(channel), description: `white dwarfs whose field comes from channel "${channel}"`, counts })),
        ],
      );
    },
  })
  .register({
    name: 'cooling-age',
    title: 'Cooling ages',
    description: 'White dwarfs per cooling-age bin, magnetic and not (Gyr).',
    build: ({ bins }) =>
      bins.coolingAge
        ? histogram(
            { name: 'cooling-age', title: 'Cooling ages', description: 'Number of model white dwarfs per cooling-age bin (logarithmic bins, bounds in Gyr), magnetic and not.' },
            { lo: 'age_lo', hi: 'age_hi', unit: 'Gyr', quantity: 'cooling age', values: bins.coolingAge.edgesLog10Gyr.map(fromLog10) },
            [
              { column: 'magnetic', description: 'magnetic white dwarfs in the bin', counts: bins.coolingAge.magnetic },
              { column: 'non_magnetic', description: 'non-magnetic white dwarfs in the bin', counts: bins.coolingAge.nonMagnetic },
            ],
          )
        : null,
  })
  .register({
    name: 'post-ce-period',
    title: 'Post-common-envelope periods',
    description: 'Final orbital periods of post-CE survivors, magnetic white dwarf or not (d).',
    build: ({ bins }) =>
      bins.postCommonEnvelopePeriod
        ? histogram(
            { name: 'post-ce-period', title: 'Post-common-envelope periods', description: 'Number of post-common-envelope binaries per final orbital-period bin (logarithmic bins, bounds in days), by whether the white dwarf is magnetic.' },
            { lo: 'period_lo', hi: 'period_hi', unit: 'd', quantity: 'orbital period', values: bins.postCommonEnvelopePeriod.edgesLog10Days.map(fromLog10) },
            [
              { column: 'magnetic', description: 'binaries with a magnetic white dwarf', counts: bins.postCommonEnvelopePeriod.magnetic },
              { column: 'non_magnetic', description: 'binaries with a non-magnetic white dwarf', counts: bins.postCommonEnvelopePeriod.nonMagnetic },
            ],
          )
        : null,
  })
  .register({
    name: 'survivor-separation',
    title: 'Survivor separations',
    description: 'Final separations of surviving companions, wide and post-CE (AU).',
    build: ({ bins }) =>
      bins.survivorSeparation
        ? histogram(
            { name: 'survivor-separation', title: 'Survivor separations', description: 'Number of surviving companions per final semi-major-axis bin (logarithmic bins, bounds in AU): wide survivors and post-common-envelope survivors.' },
            { lo: 'separation_lo', hi: 'separation_hi', unit: 'AU', quantity: 'separation', values: bins.survivorSeparation.edgesLog10AU.map(fromLog10) },
            [
              { column: 'wide', description: 'wide survivors (no common envelope)', counts: bins.survivorSeparation.wide },
              { column: 'post_ce', description: 'post-common-envelope survivors', counts: bins.survivorSeparation.postCE },
            ],
          )
        : null,
  })
  .register({
    name: 'fate-map',
    title: 'Companion fates',
    description: 'Companions per fate on the (companion mass, initial period) plane (solMass, d).',
    build: ({ bins }) => {
      const m = bins.fateMap;
      if (!m) return null;
      const rows: Cell[][] = [];
      m.fates.forEach((fate, f) =>
        m.counts[f].forEach((periods, i) =>
          periods.forEach((n, j) => {
            rows.push([fate, fromLog10(m.log10MassEdgesMsun[i]), fromLog10(m.log10MassEdgesMsun[i + 1]), fromLog10(m.log10PeriodEdgesDays[j]), fromLog10(m.log10PeriodEdgesDays[j + 1]), n]);
          }),
        ),
      );
      return {
        name: 'fate-map',
        title: 'Companion fates',
        description: 'Number of companions of sampled white dwarfs per fate, companion-mass bin and initial-period bin (logarithmic bins, bounds in solMass and days); one row per cell, zeros included.',
        columns: [
          { name: 'fate', datatype: 'string', description: `the companion's fate (${m.fates.join(', ')})` },
          bound('companion_mass_lo', 'solMass', 'lower bound of the companion-mass bin (inclusive)'),
          bound('companion_mass_hi', 'solMass', 'upper bound of the companion-mass bin (exclusive)'),
          bound('period_lo', 'd', 'lower bound of the initial-period bin (inclusive)'),
          bound('period_hi', 'd', 'upper bound of the initial-period bin (exclusive)'),
          count('count', 'companions in the cell'),
        ],
        rows,
      };
    },
  })
  .register({
    name: 'fractions-by-setting',
    title: 'Magnetic fraction by setting',
    description: 'Magnetic fraction with its Monte Carlo standard error: all white dwarfs and per setting.',
    build: (r) => ({
      name: 'fractions-by-setting',
      title: 'Magnetic fraction by setting',
      description: 'Magnetic white dwarfs over white dwarfs in the sample, overall and per setting, with the binomial Monte Carlo standard error sqrt(f(1-f)/N); fraction and error are empty where a setting has no white dwarfs.',
      columns: [
        { name: 'setting', datatype: 'string', description: 'all, single, wide (wide companion) or postCE (post-common-envelope companion)' },
        count('white_dwarfs', 'white dwarfs in the setting'),
        count('magnetic', 'magnetic white dwarfs in the setting'),
        { name: 'fraction', datatype: 'float64', description: 'magnetic / white_dwarfs' },
        { name: 'fraction_se', datatype: 'float64', description: 'Monte Carlo standard error of the fraction' },
      ],
      rows: [
        ['all', r.fraction.n, r.fraction.k, r.fraction.value, r.fraction.se],
        ...Object.entries(r.fractionBySetting).map(([setting, f]): Cell[] => [setting, f.n, f.k, f.value, f.se]),
      ],
    }),
  })
  .register({
    name: 'fractions-by-channel',
    title: 'Magnetic fraction by channel',
    description: 'Share of all white dwarfs made magnetic by each channel, with its Monte Carlo standard error.',
    build: (r) => ({
      name: 'fractions-by-channel',
      title: 'Magnetic fraction by channel',
      description: 'Magnetic white dwarfs of each formation channel over all white dwarfs in the sample, with the binomial Monte Carlo standard error.',
      columns: [
        { name: 'channel', datatype: 'string', description: 'the channel that made the field' },
        count('magnetic', 'magnetic white dwarfs of the channel'),
        count('white_dwarfs', 'all white dwarfs in the sample'),
        { name: 'fraction', datatype: 'float64', description: 'magnetic / white_dwarfs' },
        { name: 'fraction_se', datatype: 'float64', description: 'Monte Carlo standard error of the fraction' },
      ],
      rows: Object.entries(r.fractionByChannel).map(([channel, f]): Cell[] => [channel, f.k, f.n, f.value, f.se]),
    }),
  })
  .register({
    name: 'companion-fates',
    title: 'Companion fate counts',
    description: 'Companions of sampled white dwarfs by fate, and helium white dwarfs where recorded.',
    build: ({ counts }) => {
      if (!counts.companionFates) return null;
      const rows: Cell[][] = Object.entries(counts.companionFates).map(([fate, n]) => [fate, n]);
      return {
        name: 'companion-fates',
        title: 'Companion fate counts',
        description: 'Number of companions of sampled white dwarfs per fate.',
        columns: [{ name: 'fate', datatype: 'string', description: "the companion's fate" }, count('count', 'companions with that fate')],
        rows,
        params:
          counts.heliumWhiteDwarfs === undefined
            ? undefined
            : [{ name: 'helium_white_dwarfs', value: counts.heliumWhiteDwarfs, datatype: 'int64', description: 'helium white dwarfs (envelope ejected on the red-giant branch) in the sample' }],
      };
    },
  });
