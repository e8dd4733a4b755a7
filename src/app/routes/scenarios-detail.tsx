import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import type { ScenarioDetail } from '../../../shared/contracts/scenarios-api.ts';
import { Alert } from '../../components/ui/alert.tsx';
import { Button, buttonClasses } from '../../components/ui/button.tsx';
import { ConfirmDialog } from '../../components/ui/confirm-dialog.tsx';
import { errorMessage } from '../../components/ui/error-state.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { QueryState } from '../../components/ui/query-state.tsx';
import { TextField } from '../../components/ui/text-field.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { RunCostNotice } from '../../features/billing/components/run-cost-notice.tsx';
import { useCloneScenario } from '../../features/scenarios/api/clone-scenario.ts';
import { useDeleteScenario } from '../../features/scenarios/api/delete-scenario.ts';
import { useScenario } from '../../features/scenarios/api/get-scenario.ts';
import { useUpdateScenario } from '../../features/scenarios/api/update-scenario.ts';
import { ScenarioBuilder, type ScenarioSaveInput } from '../../features/scenarios/components/scenario-builder.tsx';
import { resolvedDraft, type Draft } from '../../features/scenarios/components/scenario-draft.ts';
import { VersionHistory } from '../../features/scenarios/components/version-history.tsx';
import { isApiError } from '../../lib/api-client.ts';
import { formatDateTimeUtc } from '../../lib/format.ts';

export function Component() {
  const me = useSignedInMe();
  const { id = '' } = useParams();
  const scenario = useScenario(me.department.id, id);
  return (
    <QueryState query={scenario} loadingLabel="Loading the scenario…" errorTitle="The scenario could not be loaded">
      {(s) => <ScenarioPage key={s.id} scenario={s} />}
    </QueryState>
  );
}

interface OpenVersion {
  version: number;
  document: Draft;
}

function ScenarioPage({ scenario }: { scenario: ScenarioDetail }) {
  const me = useSignedInMe();
  const navigate = useNavigate();
  const departmentId = me.department.id;
  const canWrite = roleAtLeast(me.role, 'modeller');
  const update = useUpdateScenario(departmentId);
  const [open, setOpen] = useState<OpenVersion | null>(null);
  // The builder starts afresh when another version is opened.
  const [builderKey, setBuilderKey] = useState(0);

  async function save({ name, note, document, documentChanged, nameChanged }: ScenarioSaveInput) {
    const before = scenario.currentVersion;
    const saved = await update.mutateAsync({
      id: scenario.id,
      body: { ...(nameChanged ? { name } : {}), ...(documentChanged ? { document } : {}), ...(note ? { note } : {}) },
    });
    setOpen(null);
    const message = saved.currentVersion > before ? `Saved as version ${saved.currentVersion}.` : nameChanged ? 'Renamed.' : 'Nothing new to save: the document is the same as the current version.';
    return { message };
  }

  const names: Record<string, string> = { [scenario.ownerUserId]: scenario.ownerName, [me.user.id]: 'you' };

  function openVersion(version: number, document: Draft) {
    setOpen(version === scenario.currentVersion ? null : { version, document });
    setBuilderKey((k) => k + 1);
    window.scrollTo({ top: 0 });
  }

  return (
    <>
      <PageHeader
        eyebrow={<Link to={paths.scenarios.getHref()}>Scenarios</Link>}
        title={scenario.name}
        description={
          <>
            Version {scenario.currentVersion}, saved {formatDateTimeUtc(scenario.updatedAt)} · owner {scenario.ownerName} · document{' '}
            <code className="font-mono text-base" title={`Scenario hash ${scenario.documentHash}`}>
              {scenario.documentHash.slice(0, 10)}
            </code>
          </>
        }
        actions={
          <>
            <Link to={paths.runs.new.getHref(scenario.id)} className={buttonClasses()}>
              Run this scenario
            </Link>
            {canWrite && <ScenarioActions scenario={scenario} onDeleted={() => navigate(paths.scenarios.getHref())} onCloned={(id) => navigate(paths.scenarios.detail.getHref(id))} />}
          </>
        }
      />
      <div className="flex flex-col gap-8">
        <ScenarioBuilder
          key={builderKey}
          departmentId={departmentId}
          readOnly={!canWrite}
          baseline={{ name: scenario.name, doc: scenario.resolved }}
          start={open ? resolvedDraft(open.document) : undefined}
          isNew={false}
          saveLabel="Save as a new version"
          onSave={save}
          renderCost={(systems) => <RunCostNotice departmentId={departmentId} systems={systems} />}
          banner={
            open && (
              <Alert
                tone="info"
                message={
                  <div className="flex flex-wrap items-center gap-3">
                    <span>
                      Version {open.version} of {scenario.currentVersion} is open.{canWrite ? ` Saving it stores it as version ${scenario.currentVersion + 1}.` : ''}
                    </span>
                    <Button variant="secondary" size="sm" onClick={() => openVersion(scenario.currentVersion, scenario.resolved)}>
                      Back to the current version
                    </Button>
                  </div>
                }
              />
            )
          }
        />
        <VersionHistory
          departmentId={departmentId}
          scenarioId={scenario.id}
          currentVersion={scenario.currentVersion}
          openVersion={open?.version ?? null}
          names={names}
          readOnly={!canWrite}
          onOpen={openVersion}
        />
      </div>
    </>
  );
}

function ScenarioActions({ scenario, onDeleted, onCloned }: { scenario: ScenarioDetail; onDeleted: () => void; onCloned: (id: string) => void }) {
  const departmentId = useSignedInMe().department.id;
  const clone = useCloneScenario(departmentId);
  const remove = useDeleteScenario(departmentId);
  const [dialog, setDialog] = useState<'clone' | 'delete' | null>(null);
  const [cloneName, setCloneName] = useState('');
  const cloneError = clone.error ? errorMessage(clone.error) : undefined;
  const cloneNameError = isApiError(clone.error) && clone.error.field === 'name' ? cloneError : undefined;
  return (
    <>
      <Button
        variant="secondary"
        onClick={() => {
          clone.reset();
          setCloneName(`Copy of ${scenario.name}`.slice(0, 160));
          setDialog('clone');
        }}
      >
        Clone
      </Button>
      <Button
        variant="danger"
        onClick={() => {
          remove.reset();
          setDialog('delete');
        }}
      >
        Delete
      </Button>
      <ConfirmDialog
        open={dialog === 'clone'}
        title={`Clone ${scenario.name}`}
        confirmLabel="Make the copy"
        pending={clone.isPending}
        error={cloneNameError ? undefined : cloneError}
        onConfirm={() => clone.mutate({ id: scenario.id, name: cloneName.trim() }, { onSuccess: ({ id }) => onCloned(id) })}
        onCancel={() => setDialog(null)}
      >
        <p className="mb-4">The current version’s document becomes version 1 of a new scenario, owned by you. This one stays as it is.</p>
        <TextField
          label="Name of the copy"
          value={cloneName}
          maxLength={160}
          onChange={(event) => setCloneName(event.target.value)}
          error={cloneNameError}
        />
      </ConfirmDialog>
      <ConfirmDialog
        open={dialog === 'delete'}
        title={`Delete ${scenario.name}?`}
        confirmLabel="Delete the scenario"
        tone="danger"
        pending={remove.isPending}
        error={remove.isError ? errorMessage(remove.error) : undefined}
        onConfirm={() => remove.mutate(scenario.id, { onSuccess: onDeleted })}
        onCancel={() => setDialog(null)}
      >
        The scenario and its {scenario.currentVersion} version{scenario.currentVersion === 1 ? '' : 's'} are removed for everyone in the department. Runs made from it keep their own copy of the document and stay readable.
      </ConfirmDialog>
    </>
  );
}
