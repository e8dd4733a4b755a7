// Piscina worker entry for runs from TypeScript source. On Node 20, worker threads pick up
// tsx neither from the parent nor from `--import tsx` in their execArgv, so the task module is
// loaded through tsx's own module API instead (a compiled build uses chunk-task.js directly).
import { tsImport } from 'tsx/esm/api';

const loaded = await tsImport('./chunk-task.ts', import.meta.url);
const task = typeof loaded.default === 'function' ? loaded.default : loaded.default?.default;
if (typeof task !== 'function') throw new Error('chunk-task.ts has no default export function');

export default task;

/** The named task for building the track giant's engulfment grid on a worker. */
export const buildEngulfmentGrid = loaded.buildEngulfmentGrid ?? loaded.default?.buildEngulfmentGrid;
