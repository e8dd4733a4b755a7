import type { ReactNode } from 'react';
import type { FitDetail } from '../../../../shared/contracts/fits.ts';
import { intervalCaveat } from '../../../../shared/contracts/fit-interval-words.ts';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { Card } from '../../../components/ui/card.tsx';
import { ProgressBar } from '../../../components/ui/progress-bar.tsx';
import { ProgressHeadline } from '../../../components/ui/progress-headline.tsx';
import { marginalSpec } from '../../../components/charts/marginal-spec.ts';
import { pairSpec } from './fit-chart-specs.ts';
import { cancelledFitText, fitProgressText } from './fit-progress-text.ts';

const num = (x: number) => String(Number(x.toPrecision(3)));
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * Progress while the grid computes (with `progressActions`, e.g. a way to cancel), then the posterior:
 * marginals with 68/95% shaded, the corner plot, the best point, the sentence. A cancelled fit says
 * how far it got and that nothing of it was kept.
 */
export function FitResults({
  fit,
  scorecard,
  progressActions,
}: {
  fit: FitDetail;
  scorecard?: (evaluation: NonNullable<FitDetail['posterior']>['bestPoint']['evaluation']) => ReactNode;
  progressActions?: ReactNode;
}) {
  if (fit.status === 'cancelled') {
    return (
      <Card title="Cancelled" actions={<Badge tone="warning">Cancelled</Badge>}>
        <p data-testid="fit-cancelled">{cancelledFitText(fit, fit.finishedAt ? formatDateTimeUtc(fit.finishedAt) : null)}</p>
      </Card>
    );
  }
  if (fit.status === 'queued' || fit.status === 'running') {
    const percent = `${(100 * fit.progress).toFixed(1)}%`;
    return (
      <Card
        title="Progress"
        description={`${fit.pointCount.toLocaleString('en-US')} grid points × ${fit.systems.toLocaleString('en-US')} systems, one pass over the same draws.`}
        actions={progressActions}
      >
        <div className="flex flex-col gap-3">
          <ProgressHeadline percent={percent} status={fitProgressText(fit)} />
          <ProgressBar
            label="Grid computed"
            value={Math.round(fit.progress * 1000)}
            max={1000}
            valueText={`${percent}, ${fit.chunksDone} of ${fit.chunkCount} chunks`}
            minimumPercent={fit.status === 'running' ? 1 : 0}
          />
          <p className="text-sm text-foam-400">
            {fit.chunksDone.toLocaleString('en-US')} of {fit.chunkCount.toLocaleString('en-US')} chunks done; each chunk's systems are drawn once and evaluated at every grid point.
          </p>
        </div>
      </Card>
    );
  }
  if (!fit.posterior) return <Alert message={fit.error ?? 'The fit has no posterior.'} />;
  const post = fit.posterior;
  const n = post.parameters.length;
  return (
    <div className="flex flex-col gap-6">
      <Card title="Result" description="A sentence a paper could use.">
        <p data-testid="fit-sentence">{post.sentence}</p>
        {post.warnings.map((w) => (
          <Alert key={w} tone="info" message={w} className="mt-3" />
        ))}
      </Card>
      <Card title="Intervals" description="Central credible intervals of each marginal; the peak is the marginal's highest grid value. An interval cut by the grid's edge, or the prior's own where the likelihood is flat, says so.">
        <table className="w-full text-sm" data-testid="fit-intervals">
          <thead>
            <tr className="text-left text-foam-300">
              <th>Parameter</th><th>Peak</th><th>68%</th><th>95%</th><th>Note</th>
            </tr>
          </thead>
          <tbody>
            {post.intervals.map((iv, i) => (
              <tr key={iv.path}>
                <td>{post.parameters[i].label}{post.parameters[i].unit ? ` (${post.parameters[i].unit})` : ''}</td>
                <td>{num(iv.best)}</td>
                <td>{num(iv.lo68)} – {num(iv.hi68)}</td>
                <td>{num(iv.lo95)} – {num(iv.hi95)}</td>
                <td className="text-foam-300">{capital(intervalCaveat(iv, fit.grid[i], post.parameters[i].unit) ?? '—')}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Card>
      <Card title={n > 1 ? 'Corner plot' : 'Marginal posterior'} description="Marginals with the 68% (dark) and 95% (light) intervals shaded; below the diagonal, the joint posterior of each pair, with the best grid point marked by a diamond.">
        <div className="grid gap-4" style={{ gridTemplateColumns: `repeat(${n}, minmax(0, 1fr))` }} data-testid="fit-corner">
          {post.parameters.flatMap((row, i) =>
            post.parameters.map((col, j) => {
              if (j > i) return <div key={`${i}-${j}`} />;
              if (i === j) {
                return (
                  <VegaChart
                    key={`${i}-${j}`}
                    spec={marginalSpec(post.marginals[i], post.intervals[i], `${row.label}${row.unit ? ` (${row.unit})` : ''}`, row.scale === 'log')}
                    description={`Marginal posterior of ${row.label}: 68% from ${num(post.intervals[i].lo68)} to ${num(post.intervals[i].hi68)}`}
                  />
                );
              }
              return <VegaChart key={`${i}-${j}`} spec={pairSpec(post, j, i)} description={`Joint posterior of ${col.label} and ${row.label}`} />;
            }),
          )}
        </div>
      </Card>
      <Card
        title="Best point"
        description={`The grid point of highest likelihood: ${Object.entries(post.bestPoint.values).map(([path, v]) => `${post.parameters.find((p) => p.path === path)?.label ?? path} = ${num(v)}${post.intervals.find((iv) => iv.path === path)?.flat ? ' (any grid value: the likelihood is flat along it)' : ''}`).join(', ')}; ln L = ${post.bestPoint.logLikelihood === null ? '—' : post.bestPoint.logLikelihood.toFixed(2)}${post.bestPoint.goodnessOfFit.sigma !== null ? `, goodness of fit ${post.bestPoint.goodnessOfFit.sigma.toFixed(1)}σ` : ''}.`}
      >
        {scorecard ? scorecard(post.bestPoint.evaluation) : <p>{post.bestPoint.evaluation.combined.verdict}</p>}
      </Card>
      {fit.methods ? (
        <Card title="Methods" description="The grid, the priors, the constraint set with its citations, the Monte Carlo size and the engine version.">
          <pre className="whitespace-pre-wrap text-sm">{fit.methods}</pre>
        </Card>
      ) : null}
    </div>
  );
}
