// Test fixture: the real chunk task, except that any batch holding chunk 3 throws.
import { tsImport } from 'tsx/esm/api';

const loaded = await tsImport('./chunk-task.ts', import.meta.url);
const realTask = typeof loaded.default === 'function' ? loaded.default : loaded.default.default;

export default function failingChunkTask(task) {
  if (task.chunks.includes(3)) throw new Error('deliberate failure in chunk 3');
  return realTask(task);
}
