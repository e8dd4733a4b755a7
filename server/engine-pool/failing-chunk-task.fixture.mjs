// Test fixture: the real chunk task, except that any batch holding chunk 3 fails.
// By default it throws every time. With TIDEFIELD_FIXTURE_CRASH_ONCE=<path to a file that does
// not exist yet>, the first batch holding chunk 3 kills its worker thread instead (as a crash
// would) and leaves that file behind; every later attempt computes normally.
import { existsSync, writeFileSync } from 'node:fs';
import { tsImport } from 'tsx/esm/api';

const loaded = await tsImport('./chunk-task.ts', import.meta.url);
const realTask = typeof loaded.default === 'function' ? loaded.default : loaded.default.default;

export default function failingChunkTask(task) {
  if (task.chunks.includes(3)) {
    const marker = process.env.TIDEFIELD_FIXTURE_CRASH_ONCE;
    if (!marker) throw new Error('deliberate failure in chunk 3');
    if (!existsSync(marker)) {
      writeFileSync(marker, 'crashed\n');
      process.exit(1);
    }
  }
  return realTask(task);
}
