import { useEffect, useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { useRunMethods } from '../api/get-run-methods.ts';

type CopyState = 'idle' | 'copied' | 'failed';

/** The methods paragraph for a paper (every published method, engine version, scenario hash, seed), with a copy button. */
export function MethodsParagraph({ departmentId, runId }: { departmentId: string; runId: string }) {
  const methods = useRunMethods(departmentId, runId, true);
  const [copy, setCopy] = useState<CopyState>('idle');

  useEffect(() => {
    if (copy !== 'copied') return;
    const timer = setTimeout(() => setCopy('idle'), 4000);
    return () => clearTimeout(timer);
  }, [copy]);

  const copyText = async (text: string) => {
    try {
      await navigator.clipboard.writeText(text);
      setCopy('copied');
    } catch {
      // No clipboard access (an insecure origin, a refused permission): the text can still be selected by hand.
      setCopy('failed');
    }
  };

  return (
    <Card
      title="Methods paragraph"
      description="Ready for a paper’s methods section: it cites every published method the run used and names the engine version, scenario hash and seed that reproduce it."
      actions={
        methods.data !== undefined && (
          <Button variant="secondary" onClick={() => void copyText(methods.data!)}>
            Copy the methods paragraph
          </Button>
        )
      }
    >
      <p aria-live="polite" className={copy === 'idle' ? 'sr-only' : 'mb-3 font-bold text-kelp-300'}>
        {copy === 'copied' ? 'Copied to the clipboard.' : copy === 'failed' ? 'The browser refused the clipboard: select the text below and copy it by hand.' : ''}
      </p>
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
