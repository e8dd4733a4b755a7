import type { SampleBin } from '../../../../shared/contracts/samples.ts';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { binLabel, countsInterval, countsText } from './sample-text.ts';

interface SplitRow {
  key: string;
  bin: SampleBin;
}

const columns: TableColumn<SplitRow>[] = [
  { id: 'kind', header: 'Split', cell: (r) => (r.bin.kind === 'setting' ? 'By setting' : 'Mass bin') },
  { id: 'what', header: 'White dwarfs', rowHeader: true, cell: (r) => binLabel(r.bin) },
  {
    id: 'counts',
    header: 'Magnetic of total (68% and 95% intervals)',
    stackedLabel: 'Counts',
    cell: (r) => {
      const interval = countsInterval(r.bin.magnetic, r.bin.total);
      return <span className="tabular-nums">{interval ? countsText(interval) : `${r.bin.magnetic} of ${r.bin.total}`}</span>;
    },
  },
];

/** A sample's splits by setting and by mass bin, each with its own Clopper–Pearson intervals. */
export function SampleSplitsTable({ bins, caption }: { bins: readonly SampleBin[]; caption: string }) {
  const rows = bins.map((bin, i) => ({ key: String(i), bin }));
  return (
    <section aria-label={caption} className="flex flex-col gap-3">
      <h2 className="text-xl font-bold text-foam-50">{caption}</h2>
      <Table caption={caption} hideCaption columns={columns} rows={rows} rowKey={(r) => r.key} stackOnNarrow />
    </section>
  );
}
