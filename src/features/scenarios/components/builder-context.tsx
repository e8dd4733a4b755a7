import { createContext, useContext } from 'react';
import type { Draft, DraftPath } from './scenario-draft.ts';

/** What every input of the scenario builder reads and writes. */
export interface BuilderContextValue {
  doc: Draft;
  /** Sets the value at `path` (undefined removes it, so the schema's default applies). */
  update: (path: DraftPath, value: unknown) => void;
  /** The message to show beside the input at `path`: the server's answer to a save, else the live check. */
  messageAt: (path: DraftPath) => string | undefined;
  /** Observers see every value but change none. */
  readOnly: boolean;
  departmentId: string;
}

export const BuilderContext = createContext<BuilderContextValue | null>(null);

export function useBuilder(): BuilderContextValue {
  const value = useContext(BuilderContext);
  if (!value) throw new Error('useBuilder is for inputs inside <ScenarioBuilder>');
  return value;
}
