import { useId } from 'react';

export interface ShareToggleProps {
  checked: boolean;
  onChange: (checked: boolean) => void;
  /** "Show each group as a share of its own total". */
  label?: string;
}

/** The switch between counts and shares (each series normalised to its own total) above a histogram. */
export function ShareToggle({ checked, onChange, label = 'Show each series as a share of its own total' }: ShareToggleProps) {
  const id = useId();
  return (
    <div className="flex items-center gap-2">
      <input id={id} type="checkbox" className="size-5 cursor-pointer accent-lantern-400" checked={checked} onChange={(event) => onChange(event.target.checked)} />
      <label htmlFor={id} className="cursor-pointer text-foam-300">
        {label}
      </label>
    </div>
  );
}
