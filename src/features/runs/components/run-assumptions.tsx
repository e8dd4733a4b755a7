import type { ScenarioResult } from '../../../../shared/contracts/result.ts';
import { Card } from '../../../components/ui/card.tsx';
import { ReferenceLinks } from '../../../components/ui/citation-links.tsx';

/** What the run took for granted: the caveats every number on the page carries. */
export function RunAssumptions({ result }: { result: ScenarioResult }) {
  return (
    <Card title="Assumptions" description="What the model takes for granted. Every number on this page depends on them.">
      <ul className="flex list-disc flex-col gap-2 pl-6 text-foam-300 marker:text-lantern-300">
        {result.assumptions.map((a) => (
          <li key={a}>{a}</li>
        ))}
      </ul>
      <details className="mt-5">
        <summary className="cursor-pointer rounded font-bold text-foam-50">Published methods used ({result.methods.length})</summary>
        <dl className="mt-3 flex flex-col gap-3">
          {result.methods.map((m, i) => (
            <div key={i} className="border-l-2 border-ink-600 pl-4">
              <dt className="font-bold text-foam-50">{m.topic}</dt>
              <dd className="text-foam-300">{m.method}</dd>
              <dd className="text-sm text-foam-400">
                <ReferenceLinks text={m.reference} />
              </dd>
            </div>
          ))}
        </dl>
      </details>
    </Card>
  );
}
