import type { ConstraintEvaluation, Evaluation } from '../../../../shared/contracts/constraints.ts';
import { Badge } from '../../../components/ui/badge.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { pCell, shortVerdict, sigmaCell, toneOf } from './scorecard-text.ts';

/** One line per constraint (observed, predicted ± MC error, σ, verdict in words) and the joint score. */
export function ScorecardTable({ evaluation }: { evaluation: Evaluation }) {
  const columns: TableColumn<ConstraintEvaluation>[] = [
    {
      id: 'label',
      header: 'Constraint',
      rowHeader: true,
      cell: (c) => (
        <span className="flex flex-col gap-0.5">
          <span className="font-bold">{c.label}</span>
          {c.citation && <span className="text-sm text-foam-300">{c.citation}</span>}
        </span>
      ),
    },
    { id: 'observed', header: 'Observed', cell: (c) => <span className="tabular-nums">{c.observed}</span> },
    { id: 'predicted', header: 'Predicted ± MC error', cell: (c) => <span className="tabular-nums">{c.predicted}</span> },
    {
      id: 'sigma',
      header: 'Significance',
      align: 'end',
      cell: (c) => (
        <span className="flex flex-col items-end whitespace-nowrap tabular-nums">
          <span>{sigmaCell(c)}</span>
          <span className="text-sm text-foam-300">{pCell(c.p)}</span>
        </span>
      ),
    },
    {
      id: 'verdict',
      header: 'Verdict',
      cell: (c) => (
        <span className="flex flex-col gap-1">
          <span className="flex flex-wrap gap-1">
            <Badge tone={toneOf(c)}>{shortVerdict(c)}</Badge>
            {c.mcLimited && <Badge tone="info">MC-limited</Badge>}
          </span>
          <span className="text-sm text-foam-300">{c.verdict}</span>
          {c.caveats.map((text) => (
            <span key={text} className="text-sm text-foam-300">
              {text}
            </span>
          ))}
        </span>
      ),
    },
  ];
  return (
    <div className="flex flex-col gap-3">
      <p data-testid="scorecard-combined" className="font-bold text-foam-50">
        {evaluation.combined.verdict}
      </p>
      <Table caption={`Scorecard against ${evaluation.constraintSet.name}`} hideCaption columns={columns} rows={evaluation.constraints} rowKey={(c) => c.id} stackOnNarrow />
      <p className="text-sm text-foam-300">{evaluation.combined.method}</p>
    </div>
  );
}
