// A piscina task file for tests: the real chunk task, except that any batch holding chunk 2 of a
// scenario whose seed starts with "explode" throws, as a crashing worker would.
import { tsImport } from 'tsx/esm/api';

const loaded = await tsImport('../../server/engine-pool/chunk-task.ts', import.meta.url);
const real = typeof loaded.default === 'function' ? loaded.default : loaded.default.default;

export default async function task(input) {
  if (String(input?.prepared?.seed ?? '').startsWith('explode') && input.chunks?.includes(2)) {
    throw new Error('worker exploded on chunk 2 (test fault)');
  }
  return real(input);
}
