import { EventEmitter } from 'node:events';
import type { RunProgressEvent } from '../../../shared/contracts/runs.ts';

/**
 * In-process fan-out of run progress to the server-sent-event streams. The database stays the
 * source of truth (a stream starts from the stored state); this only makes updates immediate.
 */
export class RunEvents {
  private readonly emitter = new EventEmitter();

  constructor() {
    this.emitter.setMaxListeners(0);
  }

  publish(event: RunProgressEvent): void {
    this.emitter.emit(event.id, event);
  }

  subscribe(runId: string, listener: (event: RunProgressEvent) => void): () => void {
    this.emitter.on(runId, listener);
    return () => this.emitter.off(runId, listener);
  }
}
