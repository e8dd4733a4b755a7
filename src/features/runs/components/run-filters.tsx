import { useEffect, useState } from 'react';
import { RUN_STATUSES } from '../../../../shared/contracts/runs.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { hasFilters, type RunListState } from './run-list-params.ts';
import { RUN_STATUS_TEXT } from './run-text.ts';

const statusOptions = [{ value: '', label: 'Any status' }, ...RUN_STATUSES.map((s) => ({ value: s, label: RUN_STATUS_TEXT[s].label }))];
const ownerOptions = [
  { value: 'any', label: 'Everyone in the department' },
  { value: 'me', label: 'Only mine' },
];

// Typing pauses this long before the list is asked again.
const TYPING_PAUSE_MS = 300;

export interface RunFiltersProps {
  state: RunListState;
  onChange: (next: RunListState) => void;
}

/** Status, scenario name and owner filters; each change starts again at page 1. */
export function RunFilters({ state, onChange }: RunFiltersProps) {
  const [text, setText] = useState(state.q);

  // The address bar may change the filter too (back button, "Clear filters").
  useEffect(() => setText(state.q), [state.q]);

  useEffect(() => {
    if (text === state.q) return;
    const timer = setTimeout(() => onChange({ ...state, q: text, page: 1 }), TYPING_PAUSE_MS);
    return () => clearTimeout(timer);
  }, [text, state, onChange]);

  return (
    <form
      role="search"
      aria-label="Filter runs"
      className="grid items-end gap-4 sm:grid-cols-2 lg:grid-cols-[12rem_minmax(12rem,1fr)_16rem_auto]"
      onSubmit={(event) => {
        event.preventDefault();
        onChange({ ...state, q: text, page: 1 });
      }}
    >
      <Select
        label="Status"
        value={state.status ?? ''}
        options={statusOptions}
        onChange={(event) => onChange({ ...state, status: (event.target.value || null) as RunListState['status'], page: 1 })}
      />
      <TextField
        label="Scenario name contains"
        type="search"
        value={text}
        maxLength={100}
        autoComplete="off"
        onChange={(event) => setText(event.target.value)}
      />
      <Select
        label="Whose runs"
        value={state.mine ? 'me' : 'any'}
        options={ownerOptions}
        onChange={(event) => onChange({ ...state, mine: event.target.value === 'me', page: 1 })}
      />
      <Button
        variant="ghost"
        disabled={!hasFilters(state)}
        onClick={() => onChange({ ...state, status: null, q: '', mine: false, page: 1 })}
      >
        Clear filters
      </Button>
    </form>
  );
}
