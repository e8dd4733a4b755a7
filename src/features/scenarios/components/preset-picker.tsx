import type { MouseEvent } from 'react';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import type { presetSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { cx } from '../../../lib/class-names.ts';
import { paths } from '../../../config/paths.ts';

export type Preset = z.infer<typeof presetSchema>;

/** One entry of the picker: an example, or `key: null` for the blank builder. */
export interface PresetChoice {
  key: string | null;
  title: string;
}

export interface PresetPickerProps {
  presets: readonly Preset[];
  chosen: string | null;
  /**
   * Opens the entry of a plain click instead of the link (which then does nothing), so the page
   * can show the switch as pending; a click that opens a new tab or window still follows the link.
   */
  onOpen: (choice: PresetChoice) => void;
}

/**
 * The example scenarios shipped with Tidefield, and a blank one: each a link that opens the
 * builder on it (the choice lives in the address, so it can be shared and reloaded).
 */
export function PresetPicker({ presets, chosen, onOpen }: PresetPickerProps) {
  const items = [
    { key: null, title: 'Blank', description: 'Every default of the schema and no companions: build from scratch.' },
    ...presets,
  ];
  return (
    <nav aria-label="Start from">
      <ul className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
        {items.map((preset) => {
          const current = preset.key === chosen;
          return (
            <li key={preset.key ?? 'blank'}>
              <Link
                to={paths.scenarios.new.getHref(preset.key ?? undefined)}
                aria-current={current ? 'true' : undefined}
                replace
                onClick={(event) => {
                  if (!isPlainClick(event)) return;
                  event.preventDefault();
                  onOpen({ key: preset.key, title: preset.title });
                }}
                className={cx(
                  'flex h-full flex-col gap-1 rounded-lg border p-4 no-underline',
                  current ? 'border-lantern-300 bg-lantern-400/10' : 'border-ink-600 bg-ink-900 hover:border-foam-400',
                )}
              >
                <span className="font-bold text-foam-50">
                  {preset.title}
                  {current && <span className="ml-2 text-sm text-lantern-300">(open below)</span>}
                </span>
                <span className="line-clamp-3 text-sm text-foam-300">
                  {preset.description || 'An example scenario.'}
                </span>
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}

/** A left click without a modifier key: the ones that would open the link in this tab. */
function isPlainClick(event: MouseEvent<HTMLAnchorElement>): boolean {
  return event.button === 0 && !event.metaKey && !event.altKey && !event.ctrlKey && !event.shiftKey;
}
