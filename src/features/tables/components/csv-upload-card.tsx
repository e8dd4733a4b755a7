import { useId, useRef, useState } from 'react';
import { nameSchema } from '../../../../shared/contracts/common.ts';
import { CSV_MAX_BYTES, OCCURRENCE_CSV_COLUMNS, OCCURRENCE_CSV_REQUIRED, type CsvProblem } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { Field, controlClasses } from '../../../components/ui/field.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { cx } from '../../../lib/class-names.ts';
import { usePreviewTableCsv } from '../api/preview-table-csv.ts';
import { useUploadTableCsv } from '../api/upload-table-csv.ts';
import { csvTemplate, linesToShow, previewLines, type CsvPreview } from './csv-preview.ts';

/** Lines drawn in the preview (every line with a problem is always among them). */
const PREVIEW_LINES = 60;
/** Problems listed in the report before "and N more". */
const REPORT_LENGTH = 40;

const COLUMN_HELP: Record<(typeof OCCURRENCE_CSV_COLUMNS)[number], string> = {
  class: 'planet, brownDwarf or star',
  massUnit: 'MJup, Msun, or q (mass ratio M2/M1)',
  massMin: 'lower end of the mass range, in massUnit',
  massMax: 'upper end of the mass range, in massUnit',
  periodMinDays: 'shortest initial period, days',
  periodMaxDays: 'longest initial period, days',
  occurrence: 'probability (0–1) that a star hosts one companion of the row',
  shape: 'powerlaw (default) or lognormalPeriod',
  massSlope: 'powerlaw: a in dN ∝ M^a dlnM',
  periodSlope: 'powerlaw: b in dN ∝ P^b dlnP',
  meanLog10PeriodDays: 'lognormalPeriod: mean of log10 P (days)',
  sigmaLog10Period: 'lognormalPeriod: spread of log10 P, dex',
  label: 'a short name for the row',
  source: 'where the numbers come from (paper, table)',
  assumed: 'what was assumed where the source is silent',
};

function downloadTemplate() {
  const url = URL.createObjectURL(new Blob([csvTemplate()], { type: 'text/csv' }));
  const link = document.createElement('a');
  link.href = url;
  link.download = 'occurrence-table-template.csv';
  link.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

const where = (p: CsvProblem) => `Line ${p.line}${p.column ? `, column ${p.column}` : ''}`;

/**
 * Upload a CSV as a new occurrence table in two steps: the server checks the file and the page
 * shows its lines with every problem at its line and column; only a file without problems can
 * be stored, under a name.
 */
export function CsvUploadCard({ departmentId, onStored }: { departmentId: string; onStored: (id: string) => void }) {
  const fileId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const preview = usePreviewTableCsv();
  const upload = useUploadTableCsv(departmentId);
  const [file, setFile] = useState<File | null>(null);
  const [lines, setLines] = useState<CsvPreview | null>(null);
  const [name, setName] = useState('');
  const [nameTouched, setNameTouched] = useState(false);
  const [description, setDescription] = useState('');

  async function choose(next: File | null) {
    setFile(next);
    setLines(null);
    upload.reset();
    preview.reset();
    if (!next) return;
    if (!nameTouched) setName(next.name.replace(/\.csv$/i, '').slice(0, 160));
    if (next.size > CSV_MAX_BYTES) return; // the server answers 413; say so before sending
    const text = await next.text();
    preview.mutate(next, { onSuccess: (result) => setLines(previewLines(text, result.problems)) });
  }

  // The upload's own report wins over the preview's (the file may have changed on disk).
  const uploadProblems = isApiError(upload.error) && upload.error.details ? upload.error.details : null;
  const problems: readonly CsvProblem[] = uploadProblems ?? preview.data?.problems ?? [];
  const nameCheck = nameSchema.safeParse(name);
  const nameError =
    isApiError(upload.error) && upload.error.field === 'name'
      ? upload.error.message
      : nameTouched && !nameCheck.success
        ? nameCheck.error.issues[0]?.message
        : undefined;
  const fileError =
    file && file.size > CSV_MAX_BYTES
      ? `The file is ${Math.round(file.size / 1024)} kB; an upload may be at most ${Math.round(CSV_MAX_BYTES / 1024)} kB.`
      : preview.isError
        ? errorMessage(preview.error)
        : isApiError(upload.error) && upload.error.field === 'file' && !uploadProblems
          ? upload.error.message
          : undefined;
  const ready = Boolean(file && preview.data && problems.length === 0 && preview.data.rowCount > 0 && nameCheck.success);
  const otherUploadError = upload.isError && !(isApiError(upload.error) && (upload.error.field === 'name' || upload.error.field === 'file')) ? errorMessage(upload.error) : undefined;

  return (
    <Card
      title="Upload a CSV"
      description="The file is checked first and nothing is stored until every line is right. One row per line, with a header row naming the columns."
    >
      <div className="flex flex-col gap-6">
        <details className="rounded-md border border-ink-700 bg-ink-900 p-4">
          <summary className="cursor-pointer font-bold text-lantern-300">The columns a file may have</summary>
          <p className="mt-3 text-sm text-foam-300">
            Required: {OCCURRENCE_CSV_REQUIRED.join(', ')}. Columns may come in any order; empty shape parameters take their defaults. Up to 10,000 rows and{' '}
            {Math.round(CSV_MAX_BYTES / 1024)} kB.
          </p>
          <dl className="mt-3 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
            {OCCURRENCE_CSV_COLUMNS.map((c) => (
              <div key={c} className="contents">
                <dt>
                  <code className="font-mono text-foam-50">{c}</code>
                </dt>
                <dd className="text-foam-300">{COLUMN_HELP[c]}</dd>
              </div>
            ))}
          </dl>
          <Button variant="secondary" size="sm" className="mt-4" onClick={downloadTemplate}>
            Download a template CSV
          </Button>
        </details>

        <Field id={fileId} label="CSV file" hint="Choosing a file checks it at once; nothing is stored yet." error={fileError}>
          {(control) => (
            <input
              {...control}
              ref={inputRef}
              type="file"
              accept=".csv,text/csv"
              onChange={(event) => void choose(event.target.files?.[0] ?? null)}
              className={cx(controlClasses, 'cursor-pointer file:mr-4 file:rounded file:border-0 file:bg-ink-700 file:px-3 file:py-1 file:font-bold file:text-foam-50')}
            />
          )}
        </Field>

        {preview.isPending && <LoadingState label="Checking the file…" />}
        {preview.data && (
          <PreviewReport rowCount={preview.data.rowCount} readyCount={uploadProblems ? null : preview.data.rows.length} problems={problems} lines={lines} />
        )}

        {preview.data && (
          <div className="grid gap-5 md:grid-cols-2">
            <TextField
              label="Name of the new table"
              value={name}
              maxLength={160}
              autoComplete="off"
              error={nameError}
              onChange={(event) => {
                setName(event.target.value);
                setNameTouched(true);
              }}
            />
            <Field label="Description" hint="Optional: what the table is and where it comes from.">
              {(control) => (
                <textarea {...control} rows={2} maxLength={4000} value={description} onChange={(event) => setDescription(event.target.value)} className={cx(controlClasses, 'resize-y')} />
              )}
            </Field>
          </div>
        )}
        <Alert message={otherUploadError} />
        {preview.data && (
          <div className="flex flex-wrap items-center gap-3">
            <Button
              pending={upload.isPending}
              disabled={!ready}
              onClick={() =>
                file &&
                upload.mutate({ file, name: name.trim(), ...(description.trim() ? { description: description.trim() } : {}) }, { onSuccess: ({ id }) => onStored(id) })
              }
            >
              Store as a new table
            </Button>
            <Button
              variant="ghost"
              onClick={() => {
                if (inputRef.current) inputRef.current.value = '';
                void choose(null);
              }}
            >
              Choose another file
            </Button>
            {!ready && problems.length > 0 && <span className="text-sm text-foam-300">Fix the file and choose it again.</span>}
          </div>
        )}
      </div>
    </Card>
  );
}

interface PreviewReportProps {
  rowCount: number;
  /** Rows the server understood; null when the upload's report replaced the preview's. */
  readyCount: number | null;
  problems: readonly CsvProblem[];
  lines: CsvPreview | null;
}

function PreviewReport({ rowCount, readyCount, problems, lines }: PreviewReportProps) {
  const badLines = new Set(problems.map((p) => p.line)).size;
  // With a wrong header no row can be read, so none is "fine" or "ready" yet.
  const headerBroken = problems.some((p) => p.line === 1);
  return (
    <section aria-labelledby="csv-report-title" className="flex flex-col gap-4">
      <h3 id="csv-report-title" className="text-lg font-bold text-foam-50">
        {problems.length === 0 ? `All ${rowCount} row${rowCount === 1 ? '' : 's'} are ready to store` : `${problems.length} problem${problems.length === 1 ? '' : 's'} on ${badLines} line${badLines === 1 ? '' : 's'}`}
      </h3>
      {rowCount === 0 && <Alert message="The file has a header but no rows." />}
      {problems.length > 0 && (
        <>
          <p className="text-foam-300">
            {headerBroken
              ? 'The header (line 1) is wrong, so the rows cannot be read until it is fixed. '
              : readyCount !== null && `${readyCount} of ${rowCount} rows are fine. `}
            Line 1 is the header; nothing is stored while any problem remains.
          </p>
          <ul aria-label="Problems in the file" className="flex flex-col gap-1.5 rounded-md border border-coral-300/50 bg-coral-300/8 p-4">
            {problems.slice(0, REPORT_LENGTH).map((p, i) => (
              <li key={i} className="text-foam-50 [overflow-wrap:anywhere]">
                <span className="font-bold text-coral-300">{where(p)}:</span> {p.message}
              </li>
            ))}
            {problems.length > REPORT_LENGTH && <li className="text-foam-300">and {problems.length - REPORT_LENGTH} more.</li>}
          </ul>
        </>
      )}
      {lines && lines.lines.length > 0 && <PreviewTable preview={lines} headerBroken={headerBroken} />}
    </section>
  );
}

function PreviewTable({ preview, headerBroken }: { preview: CsvPreview; headerBroken: boolean }) {
  const shown = linesToShow(preview.lines, PREVIEW_LINES);
  return (
    <div role="region" aria-labelledby="csv-preview-caption" tabIndex={0} className="relative overflow-x-auto rounded-md border border-ink-700">
      <table className="w-full border-collapse text-left text-sm">
        <caption id="csv-preview-caption" className="px-4 py-3 text-left font-bold text-foam-50">
          The file as read{shown.length < preview.lines.length ? ` (${shown.length} of ${preview.lines.length} lines: every line with a problem, then the first)` : ''}
        </caption>
        <thead className="bg-ink-800 text-foam-300">
          <tr>
            <th scope="col" className="px-3 py-2">
              Line
            </th>
            <th scope="col" className="px-3 py-2">
              Status
            </th>
            {preview.header.map((h) => (
              <th key={h} scope="col" className="px-3 py-2 font-mono font-normal whitespace-nowrap">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {shown.map((line) => {
            const bad = new Set(line.problems.map((p) => p.column));
            return (
              <tr key={line.line} className={cx('border-t border-ink-700 align-top', line.problems.length > 0 && 'bg-coral-300/5')}>
                <th scope="row" className="px-3 py-2 tabular-nums">
                  {line.line}
                </th>
                <td className="min-w-48 px-3 py-2">
                  {line.problems.length === 0 && headerBroken && line.line > 1 ? (
                    <Badge>waits for the header</Badge>
                  ) : line.problems.length === 0 ? (
                    <Badge tone="success">ready</Badge>
                  ) : (
                    <ul className="flex flex-col gap-1 text-coral-300">
                      {line.problems.map((p, i) => (
                        <li key={i}>{p.message}</li>
                      ))}
                    </ul>
                  )}
                </td>
                {preview.header.map((h) => (
                  <td key={h} className="px-3 py-2">
                    <span
                      className={cx(
                        'block max-w-64 truncate rounded px-1 tabular-nums',
                        bad.has(h) && 'font-bold text-coral-300 outline-2 outline-coral-300',
                      )}
                      title={line.cells[h]}
                    >
                      {line.cells[h] || '—'}
                      {bad.has(h) && <span className="sr-only"> (problem)</span>}
                    </span>
                  </td>
                ))}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
