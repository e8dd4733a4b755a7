import { memo, useMemo, useState, useTransition } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { Alert } from '../../components/ui/alert.tsx';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { QueryState } from '../../components/ui/query-state.tsx';
import { Spinner } from '../../components/ui/spinner.tsx';
import { paths } from '../../config/paths.ts';
import { cx } from '../../lib/class-names.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { RunCostNotice } from '../../features/billing/components/run-cost-notice.tsx';
import { useCreateScenario } from '../../features/scenarios/api/create-scenario.ts';
import { useScenarioPresets } from '../../features/scenarios/api/get-scenario-presets.ts';
import { PresetPicker, type Preset, type PresetChoice } from '../../features/scenarios/components/preset-picker.tsx';
import { ScenarioBuilder, type ScenarioSaveInput } from '../../features/scenarios/components/scenario-builder.tsx';
import { defaultDraft, resolvedDraft } from '../../features/scenarios/components/scenario-draft.ts';

export function Component() {
  const presets = useScenarioPresets();
  const [search] = useSearchParams();
  const presetKey = search.get('preset');
  const navigate = useNavigate();
  // React Router renders the next builder in a transition. Until it is shown, the current builder
  // stays on screen and would take input that the new one then drops (each key also restarts the
  // render, putting the switch off while the user types). So while the switch is pending the
  // builder takes no input and the page says what is opening. The pending state is this page's own
  // transition around the navigation, which lasts until the router's update is shown; a switch that
  // the unsaved-changes question holds back ends it at once, leaving the builder as it was.
  const [opening, startOpening] = useTransition();
  const [openingChoice, setOpeningChoice] = useState<PresetChoice | null>(null);

  function open(choice: PresetChoice) {
    setOpeningChoice(choice);
    startOpening(async () => {
      await navigate(paths.scenarios.new.getHref(choice.key ?? undefined), { replace: true });
    });
  }

  return (
    <>
      <PageHeader
        eyebrow={<Link to={paths.scenarios.getHref()}>Scenarios</Link>}
        title="New scenario"
        description="Start from an example or from the defaults, change what your study needs, and save it as version 1."
      />
      <div className="flex flex-col gap-6">
        <Card
          title="Start from"
          description="The examples shipped with Tidefield, each with the published sources of its numbers."
        >
          <QueryState
            query={presets}
            loadingLabel="Loading the examples…"
            errorTitle="The examples could not be loaded"
          >
            {(data) => <PresetPicker presets={data.presets} chosen={presetKey} onOpen={open} />}
          </QueryState>
        </Card>
        <div className="relative">
          {opening && openingChoice && (
            <p
              role="status"
              className="absolute inset-x-0 top-0 z-10 mx-auto flex w-fit items-center gap-2 rounded-lg border border-ink-600 bg-ink-900 px-4 py-3 text-foam-300 shadow-lg"
            >
              <Spinner className="size-4 text-lantern-300" />
              {openingChoice.key === null
                ? 'Opening a blank scenario…'
                : `Opening the example “${openingChoice.title}”…`}
            </p>
          )}
          <div inert={opening || undefined} aria-busy={opening || undefined} className={cx(opening && 'opacity-50')}>
            {presetKey === null ? (
              <NewScenarioBuilder key="blank" preset={null} />
            ) : (
              <QueryState
                query={presets}
                loadingLabel="Opening the example…"
                errorTitle="The example could not be opened"
              >
                {(data) => {
                  const preset = data.presets.find((p) => p.key === presetKey);
                  return preset ? (
                    <NewScenarioBuilder key={preset.key} preset={preset} />
                  ) : (
                    <>
                      <Alert
                        message={`There is no example called “${presetKey}”; the builder starts from the defaults.`}
                      />
                      <NewScenarioBuilder key="blank" preset={null} />
                    </>
                  );
                }}
              </QueryState>
            )}
          </div>
        </div>
      </div>
    </>
  );
}

// Memoised so that marking the builder busy, in the click's own render, does not render it again (that made the click take 50–140 ms).
const NewScenarioBuilder = memo(function NewScenarioBuilder({ preset }: { preset: Preset | null }) {
  const me = useSignedInMe();
  const navigate = useNavigate();
  const create = useCreateScenario(me.department.id);
  const baseline = useMemo(
    // The example's name is not kept: the new scenario gets a name of its own (the field says where it started).
    () => ({ name: '', doc: preset ? resolvedDraft(preset.document) : defaultDraft() }),
    [preset],
  );

  async function save({ name, note, document }: ScenarioSaveInput) {
    const { id } = await create.mutateAsync({ name, document, ...(note ? { note } : {}) });
    return { message: 'Saved as version 1.', next: () => navigate(paths.scenarios.detail.getHref(id)) };
  }

  return (
    <ScenarioBuilder
      departmentId={me.department.id}
      readOnly={!roleAtLeast(me.role, 'modeller')}
      baseline={baseline}
      isNew
      nameNote={preset ? `Started from the example “${preset.title}”: name your own scenario.` : undefined}
      saveLabel="Save scenario"
      onSave={save}
      renderCost={(systems) => <RunCostNotice departmentId={me.department.id} systems={systems} />}
    />
  );
});
