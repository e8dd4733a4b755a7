import { Card } from '../../../components/ui/card.tsx';
import { CopyButton } from '../../../components/ui/copy-button.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { ReferenceLinks } from '../../../components/ui/citation-links.tsx';
import { useRunMethods } from '../api/get-run-methods.ts';

/**
 * The methods export has three sections (shared/engine/result/methods-paragraph.ts): the paragraph,
 * "Assumptions" and "References". This card shows the paragraph and its references; the
 * assumptions have their own card on the run page.
 */
function sectionsOf(text: string): { paragraph: string; references: string[] } {
  const [paragraph, ...rest] = text.split('\n\nAssumptions\n');
  const tail = rest.join('');
  const start = tail.indexOf('\nReferences\n');
  const references = start < 0 ? [] : tail.slice(start + '\nReferences\n'.length).split('\n').filter((l) => l.startsWith('- ')).map((l) => l.slice(2).replace(/, https:\/\/doi\.org\/\S+$/, ''));
  return { paragraph: paragraph.trim(), references };
}

/** The methods paragraph for a paper (every published method, engine version, scenario hash, seed), with a copy button. */
export function MethodsParagraph({ departmentId, runId }: { departmentId: string; runId: string }) {
  const methods = useRunMethods(departmentId, runId, true);

  return (
    <Card
      title="Methods paragraph"
      description="Ready for a paper’s methods section: every choice with its citation, the Monte Carlo size and error, and the engine version, seed and scenario hash that reproduce the run. The assumptions are listed in their own section."
      actions={
        methods.data !== undefined && (
          <CopyButton text={sectionsOf(methods.data).paragraph} label="Copy the methods paragraph" size="md" />
        )
      }
    >
      <QueryState query={methods} loadingLabel="Loading the methods paragraph…" errorTitle="The methods paragraph could not be loaded">
        {(text) => {
          const { paragraph, references } = sectionsOf(text);
          return (
            <>
              <div tabIndex={0} role="region" aria-label="Methods paragraph text" className="max-h-96 overflow-y-auto rounded-md border border-ink-700 bg-ink-900 p-4 text-foam-300 whitespace-pre-wrap select-all">
                {paragraph}
              </div>
              {references.length > 0 && (
                <section aria-label="References" className="mt-4">
                  <h3 className="font-bold text-foam-50">References</h3>
                  <ul className="mt-2 flex flex-col gap-1 text-sm text-foam-300">
                    {references.map((r) => (
                      <li key={r}>
                        <ReferenceLinks text={r} />
                      </li>
                    ))}
                  </ul>
                </section>
              )}
            </>
          );
        }}
      </QueryState>
    </Card>
  );
}
