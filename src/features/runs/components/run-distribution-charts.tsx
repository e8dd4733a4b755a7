import { useState } from 'react';
import type { ScenarioResult } from '../../../../shared/contracts/result.ts';
import { binnedChartSpec } from '../../../components/charts/binned-chart-spec.ts';
import { binWidthText } from '../../../components/charts/bin-width.ts';
import { CHANNEL_SERIES, MAGNETIC_SERIES, presentSeries, SETTING_SERIES } from '../../../components/charts/result-series.ts';
import { ShareToggle } from '../../../components/charts/share-toggle.tsx';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { formatCount } from './run-text.ts';

/** A histogram's magnetic and non-magnetic counts on one set of bins. */
interface MagneticSplit {
  magnetic: number[];
  nonMagnetic: number[];
}

/** The two series every magnetic-vs-rest histogram draws, in the shared colours. */
function magneticSeries(bins: MagneticSplit) {
  return [
    { name: MAGNETIC_SERIES.magnetic.label, colour: MAGNETIC_SERIES.magnetic.colour, counts: bins.magnetic },
    { name: MAGNETIC_SERIES.nonMagnetic.label, colour: MAGNETIC_SERIES.nonMagnetic.colour, counts: bins.nonMagnetic },
  ];
}

const sum = (counts: readonly number[]) => counts.reduce((a, b) => a + b, 0);

/** Totals of the two series, for the chart's text description. */
function magneticTotals(bins: MagneticSplit): { magnetic: number; other: number } {
  return { magnetic: sum(bins.magnetic), other: sum(bins.nonMagnetic) };
}

type Bins = ScenarioResult['bins'];

/** White-dwarf masses, magnetic against not magnetic, as counts or as shapes (shares). */
export function WdMassChart({ bins }: { bins: Bins['wdMass'] }) {
  const [share, setShare] = useState(true);
  const width = binWidthText(bins.edgesMsun);
  const { magnetic, other } = magneticTotals(bins);
  return (
    <Card title="White-dwarf mass" description="Are magnetic white dwarfs heavier? As shares, the two shapes compare directly.">
      <div className="flex flex-col gap-3">
        <ShareToggle checked={share} onChange={setShare} />
        <VegaChart
          description={`Histogram of white-dwarf mass in ${width} Msun bins: ${formatCount(magnetic)} magnetic and ${formatCount(other)} non-magnetic white dwarfs${share ? ', each as a share of its own total' : ''}.`}
          spec={binnedChartSpec({
            edges: bins.edgesMsun,
            series: magneticSeries(bins),
            xTitle: 'White-dwarf mass (Msun)',
            xUnit: 'Msun',
            binLabel: `${width} Msun bin`,
            countNoun: 'White dwarfs',
            normalise: share,
            fill: true,
          })}
        />
      </div>
    </Card>
  );
}

/** Field strengths of white dwarfs with any field, with the detection threshold that makes one count as magnetic. */
export function LogFieldChart({ bins }: { bins: Bins['logField'] }) {
  const width = binWidthText(bins.edgesLog10MG);
  const total = bins.counts.reduce((a, b) => a + b, 0);
  return (
    <Card title="Field strength" description={`Every white dwarf with a field, including those below the ${bins.thresholdMG} MG detection threshold (dashed line).`}>
      <VegaChart
        description={`Histogram of the magnetic field of ${formatCount(total)} white dwarfs in ${width} dex bins of log B, with the detection threshold at ${bins.thresholdMG} MG.`}
        spec={binnedChartSpec({
          edges: bins.edgesLog10MG,
          series: [{ name: 'White dwarfs with a field', colour: MAGNETIC_SERIES.magnetic.colour, counts: bins.counts }],
          xTitle: 'Magnetic field B (MG, log scale)',
          xUnit: 'MG',
          logX: true,
          binLabel: `${width} dex bin`,
          countNoun: 'White dwarfs',
          markers: [{ at: Math.log10(bins.thresholdMG), label: `threshold ${bins.thresholdMG} MG` }],
          fill: true,
        })}
      />
    </Card>
  );
}

/** Field strengths split by the channel that made them (engine 2; engine-1 results have only the total). */
export function LogFieldByChannelChart({ bins }: { bins: Bins['logField'] }) {
  const byChannel = bins.byChannel;
  if (!byChannel) return null;
  const width = binWidthText(bins.edgesLog10MG);
  const series = presentSeries(CHANNEL_SERIES, byChannel).filter((c) => (byChannel as Record<string, number[]>)[c.key].some((n) => n > 0));
  if (series.length === 0) return null;
  return (
    <Card title="Field strength by channel" description={`The same white dwarfs by the channel that gave them their strongest field; dashed line: the ${bins.thresholdMG} MG threshold.`}>
      <VegaChart
        description={`Histogram of the magnetic field in ${width} dex bins of log B by channel: ${series.map((c) => `${c.label} ${formatCount((byChannel as Record<string, number[]>)[c.key].reduce((a, b) => a + b, 0))}`).join(', ')}.`}
        spec={binnedChartSpec({
          edges: bins.edgesLog10MG,
          series: series.map((c) => ({ name: c.short, colour: c.colour, counts: (byChannel as Record<string, number[]>)[c.key] })),
          xTitle: 'Magnetic field B (MG, log scale)',
          xUnit: 'MG',
          logX: true,
          binLabel: `${width} dex bin`,
          countNoun: 'White dwarfs',
          markers: [{ at: Math.log10(bins.thresholdMG), label: `threshold ${bins.thresholdMG} MG` }],
          trim: true,
        })}
      />
    </Card>
  );
}

/** Magnetic and non-magnetic white dwarfs against log cooling age (1 Myr to 14 Gyr): does the incidence grow with age? */
export function CoolingAgeChart({ bins }: { bins: NonNullable<Bins['coolingAge']> }) {
  const [share, setShare] = useState(true);
  const width = binWidthText(bins.edgesLog10Gyr);
  const { magnetic, other } = magneticTotals(bins);
  return (
    <Card title="Cooling age" description="Cooling age of the white dwarfs (age since the end of the main sequence, the giant phases neglected). As shares, a field that appears late shows as a magnetic shape shifted to old ages.">
      <div className="flex flex-col gap-3">
        <ShareToggle checked={share} onChange={setShare} />
        <VegaChart
          description={`Histogram of cooling age in ${width} dex bins of log t (Gyr): ${formatCount(magnetic)} magnetic and ${formatCount(other)} non-magnetic white dwarfs${share ? ', each as a share of its own total' : ''}.`}
          spec={binnedChartSpec({
            edges: bins.edgesLog10Gyr,
            series: magneticSeries(bins),
            xTitle: 'Cooling age (Gyr, log scale)',
            xUnit: 'Gyr',
            logX: true,
            binLabel: `${width} dex bin`,
            countNoun: 'White dwarfs',
            normalise: share,
            fill: true,
            trim: true,
          })}
        />
      </div>
    </Card>
  );
}

/** Final orbital periods of post-common-envelope companions, magnetic white dwarfs against the others. */
export function PostCommonEnvelopePeriodChart({ bins }: { bins: NonNullable<Bins['postCommonEnvelopePeriod']> }) {
  const width = binWidthText(bins.edgesLog10Days);
  const { magnetic, other } = magneticTotals(bins);
  return (
    <Card
      title="Post-common-envelope periods"
      description="Final orbital period of the closest post-common-envelope companion of each white dwarf that has one. Observed white dwarf + M dwarf post-common-envelope binaries mostly lie below a day to a few days."
    >
      {magnetic + other === 0 ? (
        <p className="text-foam-300">No white dwarf has a post-common-envelope companion in this run.</p>
      ) : (
        <VegaChart
          description={`Histogram of the final orbital period in ${width} dex bins of log P (days): ${formatCount(magnetic)} magnetic and ${formatCount(other)} non-magnetic white dwarfs with a post-common-envelope companion.`}
          spec={binnedChartSpec({
            edges: bins.edgesLog10Days,
            series: magneticSeries(bins),
            xTitle: 'Final orbital period (days, log scale)',
            xUnit: 'd',
            logX: true,
            binLabel: `${width} dex bin`,
            countNoun: 'White dwarfs',
            fill: true,
            trim: true,
          })}
        />
      )}
    </Card>
  );
}

/** White-dwarf mass in each setting (single, wide companion, post-CE companion), all white dwarfs of the setting. */
export function WdMassBySettingChart({ bins, heliumWhiteDwarfs }: { bins: NonNullable<Bins['wdMassBySetting']>; heliumWhiteDwarfs?: number }) {
  const [share, setShare] = useState(true);
  const width = binWidthText(bins.edgesMsun);
  const all = (split: { magnetic: number[]; nonMagnetic: number[] }) => split.magnetic.map((m, i) => m + split.nonMagnetic[i]);
  const series = SETTING_SERIES.map((s) => ({ name: s.short, colour: s.colour, counts: all(bins[s.key]) }));
  const totals = series.map((s) => `${s.name} ${formatCount(s.counts.reduce((a, b) => a + b, 0))}`).join(', ');
  return (
    <Card
      title="White-dwarf mass by setting"
      description={`Post-common-envelope white dwarfs keep the core mass at the onset of the common envelope, so helium white dwarfs (below about 0.47 Msun) appear among them${heliumWhiteDwarfs !== undefined ? `: ${formatCount(heliumWhiteDwarfs)} in this run` : ''}.`}
    >
      <div className="flex flex-col gap-3">
        <ShareToggle checked={share} onChange={setShare} />
        <VegaChart
          description={`Histogram of white-dwarf mass in ${width} Msun bins by setting: ${totals}${share ? ', each as a share of its own total' : ''}.`}
          spec={binnedChartSpec({
            edges: bins.edgesMsun,
            series,
            xTitle: 'White-dwarf mass (Msun)',
            xUnit: 'Msun',
            binLabel: `${width} Msun bin`,
            countNoun: 'White dwarfs',
            normalise: share,
            trim: true,
          })}
        />
      </div>
    </Card>
  );
}
