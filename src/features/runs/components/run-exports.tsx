import { buttonClasses } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';

/** Download links for the result; the server sends them as attachments with the session cookie. */
export function RunExports({ runId }: { runId: string }) {
  const base = `/api/runs/${encodeURIComponent(runId)}`;
  return (
    <Card title="Exports" description="The result as a table (CSV: counts, fractions with errors, every histogram bin) or as the full result document (JSON).">
      <div className="flex flex-wrap gap-3">
        <a href={`${base}/export.csv`} download className={buttonClasses({ variant: 'secondary' })}>
          Download CSV
        </a>
        <a href={`${base}/export.json`} download className={buttonClasses({ variant: 'secondary' })}>
          Download JSON
        </a>
      </div>
    </Card>
  );
}
