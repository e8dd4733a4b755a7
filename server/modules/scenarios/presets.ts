import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const SCENARIO_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../shared/scenarios');

export interface Preset {
  key: string;
  title: string;
  description: string;
  document: Record<string, unknown>;
}

let cache: Preset[] | undefined;

/** The example scenarios in shared/scenarios (every JSON file there with a `seed`). */
export function loadPresets(): Preset[] {
  cache ??= readdirSync(SCENARIO_DIR)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((file) => ({ file, doc: JSON.parse(readFileSync(path.join(SCENARIO_DIR, file), 'utf8')) as Record<string, unknown> }))
    .filter(({ doc }) => typeof doc.seed === 'string')
    .map(({ file, doc }) => ({
      key: file.replace(/\.json$/, ''),
      title: typeof doc.title === 'string' ? doc.title : file.replace(/\.json$/, ''),
      description: typeof doc.description === 'string' ? doc.description : '',
      document: doc,
    }));
  return cache;
}
