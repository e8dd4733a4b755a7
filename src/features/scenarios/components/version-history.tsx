import { Button } from '../../../components/ui/button.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useScenarioVersions } from '../api/get-scenario-versions.ts';
import type { Draft } from './scenario-draft.ts';
import { documentChanges } from './version-changes.ts';

export interface VersionHistoryProps {
  departmentId: string;
  scenarioId: string;
  currentVersion: number;
  /** The version open in the builder (null: the current one). */
  openVersion: number | null;
  /** Names for the people who saved versions (user id → name), where the page knows them. */
  names: Record<string, string>;
  readOnly: boolean;
  onOpen: (version: number, document: Draft) => void;
}

/**
 * Every saved version, newest first, each with what changed from the one before it, field by
 * field. Any version can be opened in the builder; saving it makes it the newest version
 * (the older ones stay, and runs keep the version they ran).
 */
export function VersionHistory({ departmentId, scenarioId, currentVersion, openVersion, names, readOnly, onOpen }: VersionHistoryProps) {
  const versions = useScenarioVersions(departmentId, scenarioId);
  return (
    <Card title="Version history" description="Saving a changed document adds a version; older versions stay, and each run records the version it drew.">
      <QueryState query={versions} loadingLabel="Loading the versions…" errorTitle="The version history could not be loaded">
        {({ versions: list }) => (
          <ol className="flex flex-col gap-3">
            {list.map((v, index) => {
              const previous = list[index + 1];
              const changes = previous ? documentChanges(previous.document, v.document) : [];
              const isOpen = (openVersion ?? currentVersion) === v.version;
              return (
                <li key={v.version} className="rounded-md border border-ink-700 bg-ink-900/60 p-4">
                  <div className="flex flex-wrap items-start justify-between gap-3">
                    <div className="min-w-0">
                      <h3 className="flex flex-wrap items-center gap-2 font-bold text-foam-50">
                        Version {v.version}
                        {v.version === currentVersion && <Badge tone="success">current</Badge>}
                        {isOpen && <Badge tone="info">open in the builder</Badge>}
                      </h3>
                      <p className="text-sm text-foam-300">
                        {formatDateTimeUtc(v.createdAt)} · {names[v.createdByUserId] ?? 'a member of the department'} ·{' '}
                        <code className="font-mono" title={`Scenario hash ${v.documentHash}`}>
                          {v.documentHash.slice(0, 10)}
                        </code>
                      </p>
                      {v.note && <p className="mt-1 text-foam-50">“{v.note}”</p>}
                    </div>
                    {!isOpen && (
                      <Button variant="secondary" size="sm" onClick={() => onOpen(v.version, v.document as Draft)}>
                        {readOnly ? 'Show' : 'Open'} version {v.version}
                        <span className="sr-only"> in the builder</span>
                      </Button>
                    )}
                  </div>
                  {previous &&
                    (changes.length === 0 ? (
                      <p className="mt-2 text-sm text-foam-400">Same values as version {previous.version} (written differently).</p>
                    ) : (
                      <details className="mt-2">
                        <summary className="cursor-pointer text-sm font-bold text-lantern-300">
                          {changes.length} change{changes.length === 1 ? '' : 's'} from version {previous.version}
                        </summary>
                        <ul className="mt-2 flex flex-col gap-1 text-sm">
                          {changes.map((c) => (
                            <li key={c.field} className="[overflow-wrap:anywhere]">
                              <code className="font-mono text-foam-50">{c.field}</code>: <span className="text-foam-400">{c.before}</span> → <span className="text-foam-50">{c.after}</span>
                            </li>
                          ))}
                        </ul>
                      </details>
                    ))}
                  {!previous && <p className="mt-2 text-sm text-foam-400">The first version.</p>}
                </li>
              );
            })}
          </ol>
        )}
      </QueryState>
    </Card>
  );
}
