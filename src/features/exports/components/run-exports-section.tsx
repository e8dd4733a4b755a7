import type { ReactNode } from 'react';
import type { Role } from '../../../../shared/contracts/roles.ts';
import { Link } from 'react-router-dom';
import { Card } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { useRunExports } from '../api/get-run-exports.ts';
import { ShareLinkPanel } from './share-link-panel.tsx';

const linkClass = 'font-bold';

function ExportItem({ title, description, children }: { title: string; description: string; children: ReactNode }) {
  return (
    <li className="flex flex-col gap-1 border-l-2 border-ink-600 pl-4">
      <span className="font-bold text-foam-50">{title}</span>
      <span className="text-sm text-foam-400">{description}</span>
      <div className="flex flex-wrap gap-x-4 gap-y-1">{children}</div>
    </li>
  );
}

/** Everything a run can be taken out as: standard tables with units, the documents, references, notebook access and a read-only link. */
export function RunExportsSection({ departmentId, role, runId }: { departmentId: string; role: Role; runId: string }) {
  const exports = useRunExports(departmentId, runId);
  const base = `/api/runs/${encodeURIComponent(runId)}`;
  const file = (query: string) => `${base}/export?${query}`;

  return (
    <Card title="Exports" description="Take the run into a notebook or a paper. Every file names the engine version, scenario hash and seed that reproduce it.">
      <ul className="flex flex-col gap-4">
        <ExportItem title="Tables in astronomers' formats" description="Each binned table as ECSV (YAML header, read by astropy.table) or VOTable 1.4 (IVOA), with units and the scenario.">
          {exports.isPending && <span className="text-sm text-foam-400">Loading the table list…</span>}
          {exports.isError && <span className="text-sm text-coral-300">{exports.error.message}</span>}
        </ExportItem>
        {exports.data?.tables.map((t) => (
          <li key={t.name} className="ml-4 flex flex-col gap-1 pl-4">
            <span className="text-foam-50">{t.title}</span>
            <span className="text-sm text-foam-400">{t.description}</span>
            <span className="flex gap-4">
              <a className={linkClass} href={file(`format=ecsv&table=${t.name}`)} download aria-label={`${t.title} as ECSV`}>ECSV</a>
              <a className={linkClass} href={file(`format=votable&table=${t.name}`)} download aria-label={`${t.title} as VOTable`}>VOTable</a>
            </span>
          </li>
        ))}
        <ExportItem title="Result document (JSON)" description="Every count, fraction with its Monte Carlo error, histogram, assumption and method, as the API returns it.">
          <a className={linkClass} href={`${base}/export.json`} download>Download JSON</a>
        </ExportItem>
        <ExportItem title="Summary table (CSV)" description="Headline counts, fractions with errors and every histogram bin in one plain CSV file.">
          <a className={linkClass} href={`${base}/export.csv`} download>Download CSV</a>
        </ExportItem>
        <ExportItem title="Methods paragraph (text)" description="A paragraph for a paper's methods section citing every published method used.">
          <a className={linkClass} href={`${base}/methods.txt`} download>Download text</a>
        </ExportItem>
        <ExportItem title="References (BibTeX)" description="One BibTeX entry per published method the run used, with DOIs where known.">
          <a className={linkClass} href={`${base}/references.bib`} download>Download BibTeX</a>
        </ExportItem>
        <ExportItem title="Notebook access" description="Python's standard library and an API token: start runs, wait, read results and tables (examples/notebook/tidefield_example.py).">
          <Link className={linkClass} to={paths.apiTokens.getHref()}>Create an API token</Link>
          <code className="text-sm text-foam-300">tf.table("{runId}", "wd-mass")</code>
        </ExportItem>
        <ExportItem title="Read-only link" description="A link that shows this run's result page to anyone who has it, without signing in; revoke it at any time.">
          <ShareLinkPanel departmentId={departmentId} role={role} kind="run" objectId={runId} />
        </ExportItem>
      </ul>
    </Card>
  );
}
