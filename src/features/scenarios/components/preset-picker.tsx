import { Link } from 'react-router-dom';
import type { z } from 'zod';
import type { presetSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { cx } from '../../../lib/class-names.ts';
import { paths } from '../../../config/paths.ts';

export type Preset = z.infer<typeof presetSchema>;

/**
 * The example scenarios shipped with Tidefield, and a blank one: each a link that opens the
 * builder on it (the choice lives in the address, so it can be shared and reloaded).
 */
export function PresetPicker({ presets, chosen }: { presets: readonly Preset[]; chosen: string | null }) {
  const items = [{ key: null, title: 'Blank', description: 'Every default of the schema and no companions: build from scratch.' }, ...presets];
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
                className={cx(
                  'flex h-full flex-col gap-1 rounded-lg border p-4 no-underline',
                  current ? 'border-lantern-300 bg-lantern-400/10' : 'border-ink-600 bg-ink-900 hover:border-foam-400',
                )}
              >
                <span className="font-bold text-foam-50">
                  {preset.title}
                  {current && <span className="ml-2 text-sm text-lantern-300">(open below)</span>}
                </span>
                <span className="line-clamp-3 text-sm text-foam-300">{preset.description || 'An example scenario.'}</span>
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
