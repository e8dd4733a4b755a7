import { useState } from 'react';
import type { ScenarioResult } from '../../../../shared/contracts/result.ts';
import { binnedChartSpec } from '../../../components/charts/binned-chart-spec.ts';
import { binWidthText } from '../../../components/charts/bin-width.ts';
import { MAGNETIC_SERIES } from '../../../components/charts/result-series.ts';
import { ShareToggle } from '../../../components/charts/share-toggle.tsx';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { formatCount } from './run-text.ts';

type Bins = ScenarioResult['bins'];

/** White-dwarf masses, magnetic against not magnetic, as counts or as shapes (shares). */
export function WdMassChart({ bins }: { bins: Bins['wdMass'] }) {
  const [share, setShare] = useState(true);
  const width = binWidthText(bins.edgesMsun);
  const magnetic = bins.magnetic.reduce((a, b) => a + b, 0);
  const other = bins.nonMagnetic.reduce((a, b) => a + b, 0);
  return (
    <Card title="White-dwarf mass" description="Are magnetic white dwarfs heavier? As shares, the two shapes compare directly.">
      <div className="flex flex-col gap-3">
        <ShareToggle checked={share} onChange={setShare} />
        <VegaChart
          description={`Histogram of white-dwarf mass in ${width} Msun bins: ${formatCount(magnetic)} magnetic and ${formatCount(other)} non-magnetic white dwarfs${share ? ', each as a share of its own total' : ''}.`}
          spec={binnedChartSpec({
            edges: bins.edgesMsun,
            series: [
              { name: MAGNETIC_SERIES.magnetic.label, colour: MAGNETIC_SERIES.magnetic.colour, counts: bins.magnetic },
              { name: MAGNETIC_SERIES.nonMagnetic.label, colour: MAGNETIC_SERIES.nonMagnetic.colour, counts: bins.nonMagnetic },
            ],
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
