import { useState, type ReactNode } from 'react';
import { Link, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import type { Sample } from '../../../shared/contracts/samples.ts';
import { Alert } from '../../components/ui/alert.tsx';
import { Button } from '../../components/ui/button.tsx';
import { Card } from '../../components/ui/card.tsx';
import { ConfirmDialog } from '../../components/ui/confirm-dialog.tsx';
import { errorMessage } from '../../components/ui/error-state.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { QueryState } from '../../components/ui/query-state.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { useDeleteSample } from '../../features/samples/api/delete-sample.ts';
import { useSample } from '../../features/samples/api/get-sample.ts';
import { SampleForm } from '../../features/samples/components/sample-form.tsx';
import { IllustrativeBadge, LibraryEntry } from '../../features/samples/components/samples-panels.tsx';
import { SampleSplitsTable } from '../../features/samples/components/sample-splits-table.tsx';
import { formatDateTimeUtc } from '../../lib/format.ts';
import { SampleTestCard } from '../../features/runs/components/sample-test-card.tsx';

export function Component() {
  const me = useSignedInMe();
  const { id = '' } = useParams();
  const sample = useSample(me.department.id, id);
  const back = <Link to={paths.samples.getHref()}>Samples</Link>;
  return (
    <QueryState query={sample} loadingLabel="Loading the sample…" errorTitle="The sample could not be loaded">
      {(s) => (
        <>
          {s.library ? <LibraryPage sample={s} eyebrow={back} /> : <EditPage sample={s} eyebrow={back} departmentId={me.department.id} />}
          <TestAgainstRun departmentId={me.department.id} sampleId={s.id} />
        </>
      )}
    </QueryState>
  );
}

/** The chosen run lives in the address bar, so that a link shows the same test. */
function TestAgainstRun({ departmentId, sampleId }: { departmentId: string; sampleId: string }) {
  const [search, setSearch] = useSearchParams();
  return (
    <div id="test" className="mt-6 scroll-mt-6">
      <SampleTestCard
        departmentId={departmentId}
        sampleId={sampleId}
        runId={search.get('run')}
        onRunChange={(run) => setSearch({ run }, { replace: true, preventScrollReset: true })}
      />
    </div>
  );
}

function LibraryPage({ sample, eyebrow }: { sample: Sample; eyebrow: ReactNode }) {
  return (
    <>
      <PageHeader eyebrow={eyebrow} title={sample.name} description="A published constraint from the library: read-only, the same for every department." />
      <div className="flex flex-col gap-6">
        <LibraryEntry entry={sample} standalone />
        {sample.bins.length > 0 && <SampleSplitsTable bins={sample.bins} caption="Splits as published" />}
        <Alert tone="info" message={<>Library entries cannot be changed. To use other numbers, <Link to={paths.samples.new.getHref()}>record your own sample</Link>.</>} />
      </div>
    </>
  );
}

function EditPage({ sample, eyebrow, departmentId }: { sample: Sample; eyebrow: ReactNode; departmentId: string }) {
  const navigate = useNavigate();
  const remove = useDeleteSample(departmentId);
  const [confirming, setConfirming] = useState(false);
  return (
    <>
      <PageHeader
        eyebrow={eyebrow}
        title={sample.name}
        description={
          <span className="flex flex-wrap items-center gap-2">
            Last changed {formatDateTimeUtc(sample.updatedAt)}. <IllustrativeBadge sample={sample} />
          </span>
        }
        actions={
          <Button
            variant="danger"
            onClick={() => {
              remove.reset();
              setConfirming(true);
            }}
          >
            Delete sample
          </Button>
        }
      />
      <Card title="Edit the sample">
        <SampleForm departmentId={departmentId} sample={sample} cancelHref={paths.samples.getHref()} onSaved={() => undefined} />
      </Card>
      <ConfirmDialog
        open={confirming}
        title={`Delete ${sample.name}?`}
        confirmLabel="Delete"
        tone="danger"
        pending={remove.isPending}
        error={remove.isError ? errorMessage(remove.error) : undefined}
        onConfirm={() => remove.mutate(sample.id, { onSuccess: () => navigate(paths.samples.getHref()) })}
        onCancel={() => setConfirming(false)}
      >
        The counts and their splits are removed for everyone in the department. Runs and sweeps keep their own results; comparisons against this sample can no longer be opened.
      </ConfirmDialog>
    </>
  );
}
