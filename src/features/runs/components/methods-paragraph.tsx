import { Card } from '../../../components/ui/card.tsx';
import { CopyButton } from '../../../components/ui/copy-button.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { useRunMethods } from '../api/get-run-methods.ts';

/** The methods paragraph for a paper (every published method, engine version, scenario hash, seed), with a copy button. */
export function MethodsParagraph({ departmentId, runId }: { departmentId: string; runId: string }) {
  const methods = useRunMethods(departmentId, runId, true);

  return (
    <Card
      title="Methods paragraph"
      description="Ready for a paper’s methods section: it cites every published method the run used and names the engine version, scenario hash and seed that reproduce it."
      actions={
        methods.data !== undefined && (
          <CopyButton text={methods.data} label="Copy the methods paragraph" size="md" />
        )
      }
    >
      <QueryState query={methods} loadingLabel="Loading the methods paragraph…" errorTitle="The methods paragraph could not be loaded">
        {(text) => (
          <div tabIndex={0} role="region" aria-label="Methods paragraph text" className="max-h-96 overflow-y-auto rounded-md border border-ink-700 bg-ink-900 p-4 text-foam-300 whitespace-pre-wrap select-all">
            {text}
          </div>
        )}
      </QueryState>
    </Card>
  );
}
