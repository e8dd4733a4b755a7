import { Link } from 'react-router-dom';
import type { Sample } from '../../../../shared/contracts/samples.ts';
import { Badge } from '../../../components/ui/badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDate } from '../../../lib/format.ts';
import { useSamples } from '../api/get-samples.ts';
import { SAMPLE_SETTING_TEXT, isIllustrative, sampleKindText, sampleValueText } from './sample-text.ts';

/** "Illustrative" beside invented demo numbers, wherever the sample is named. */
export function IllustrativeBadge({ sample }: { sample: Pick<Sample, 'name' | 'provenance'> }) {
  return isIllustrative(sample) ? <Badge tone="warning">illustrative</Badge> : null;
}

const thresholdText = (s: Sample) => (s.fieldThresholdMG === null ? 'not stated' : `${s.fieldThresholdMG} MG`);

const columns: TableColumn<Sample>[] = [
  {
    id: 'name',
    header: 'Name',
    rowHeader: true,
    sortValue: (s) => s.name,
    cell: (s) => (
      <span className="flex flex-wrap items-center gap-2">
        <Link to={paths.samples.detail.getHref(s.id)}>{s.name}</Link>
        <IllustrativeBadge sample={s} />
      </span>
    ),
  },
  { id: 'value', header: 'Counts and intervals', sortValue: (s) => s.fraction ?? -1, cell: (s) => <span className="tabular-nums">{sampleValueText(s)}</span> },
  { id: 'setting', header: 'Setting', sortValue: (s) => s.setting, cell: (s) => SAMPLE_SETTING_TEXT[s.setting] },
  { id: 'threshold', header: 'Threshold', align: 'end', sortValue: (s) => s.fieldThresholdMG ?? -1, cell: (s) => <span className="whitespace-nowrap">{thresholdText(s)}</span> },
  { id: 'splits', header: 'Splits', align: 'end', sortValue: (s) => s.bins.length, cell: (s) => s.bins.length },
  { id: 'updated', header: 'Updated', sortValue: (s) => new Date(s.updatedAt), cell: (s) => <span className="whitespace-nowrap">{formatDate(s.updatedAt)}</span> },
  {
    id: 'test',
    header: <span className="sr-only">Test</span>,
    cell: (s) => (
      <Link to={`${paths.samples.detail.getHref(s.id)}#test`} className="whitespace-nowrap">
        Test against a run<span className="sr-only">: {s.name}</span>
      </Link>
    ),
  },
];

/** The department's own samples (editable) and the library of published constraints (read-only). */
export function SamplesPanels({ departmentId }: { departmentId: string }) {
  const samples = useSamples(departmentId);
  return (
    <QueryState query={samples} loadingLabel="Loading samples…" errorTitle="The samples could not be loaded">
      {({ samples: all }) => {
        const own = all.filter((s) => !s.library);
        const library = all.filter((s) => s.library);
        return (
          <div className="flex flex-col gap-6">
            <Card
              title="Your department’s samples"
              description="Counts you recorded. Each shows the observed fraction with its exact (Clopper–Pearson) 68% and 95% intervals."
            >
              <Table
                caption="Your department’s samples"
                hideCaption
                columns={columns}
                rows={own}
                rowKey={(s) => s.id}
                initialSort={{ columnId: 'updated', direction: 'descending' }}
                stackOnNarrow
                empty={
                  <EmptyState title="No samples yet" action={<Link to={paths.samples.new.getHref()}>Record a sample</Link>}>
                    Record how many white dwarfs of a survey are magnetic, to set runs and sweeps against it.
                  </EmptyState>
                }
              />
            </Card>
            <LibraryCard entries={library} />
          </div>
        );
      }}
    </QueryState>
  );
}

function LibraryCard({ entries }: { entries: readonly Sample[] }) {
  return (
    <Card
      title="Library of published constraints"
      description="Read-only, the same for every department. Each entry states only what its paper states: counts where the paper gives counts, otherwise the fraction as quoted."
    >
      {entries.length === 0 ? (
        <EmptyState title="The library is empty">The server has not loaded its published constraints.</EmptyState>
      ) : (
        <ul className="flex flex-col gap-4">
          {entries.map((entry) => (
            <li key={entry.id}>
              <LibraryEntry entry={entry} />
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

/** One published constraint with its full citation and provenance; `standalone` on its own page (the h1 names it). */
export function LibraryEntry({ entry, standalone = false }: { entry: Sample; standalone?: boolean }) {
  const badges = (
    <span className="flex flex-wrap gap-2">
      <Badge tone="info">library · read-only</Badge>
      <Badge>{sampleKindText(entry.kind)}</Badge>
    </span>
  );
  return (
    <article aria-label={standalone ? 'The published constraint' : undefined} className="rounded-md border border-ink-700 bg-ink-900/60 p-4">
      {standalone ? (
        badges
      ) : (
        <div className="flex flex-wrap items-start justify-between gap-2">
          <h3 className="text-lg font-bold text-foam-50">
            <Link to={paths.samples.detail.getHref(entry.id)} className="text-foam-50">
              {entry.name}
            </Link>
          </h3>
          {badges}
        </div>
      )}
      <p className="mt-2 font-bold text-foam-50 tabular-nums">{sampleValueText(entry)}</p>
      <p className="mt-1 text-sm text-foam-300">
        {SAMPLE_SETTING_TEXT[entry.setting]} · field threshold {thresholdText(entry)}
      </p>
      {entry.citation && (
        <p className="mt-3 text-foam-50">
          <span className="font-bold">Source: </span>
          <cite className="not-italic">{entry.citation}</cite>
        </p>
      )}
      {entry.provenance && <p className="mt-2 text-foam-300">{entry.provenance}</p>}
    </article>
  );
}
