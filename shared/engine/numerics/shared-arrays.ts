/**
 * Typed arrays on shared memory where the platform has it (Node's threads; a browser page only
 * when cross-origin isolated), else on an ordinary buffer. A prepared scenario's tables travel to a
 * worker thread with every batch of chunks, and structured cloning shares a SharedArrayBuffer
 * instead of copying it: the fixed-reach baseline's tables are ≈ 0.6 MB, and copying them into
 * ≈ 100 batches grew the resident memory by ≈ 55 MB over 10^8 systems (`npm run bench`). The
 * tables are written once, while the scenario is prepared, and only read afterwards.
 */
function sharedBuffer(bytes: number): ArrayBufferLike {
  return typeof SharedArrayBuffer === 'function' ? new SharedArrayBuffer(bytes) : new ArrayBuffer(bytes);
}

/** A zero-filled Float64Array of `length` on shared memory (see above). */
export function sharedFloat64Array(length: number): Float64Array {
  return new Float64Array(sharedBuffer(length * Float64Array.BYTES_PER_ELEMENT));
}

/** A zero-filled Int32Array of `length` on shared memory (see above). */
export function sharedInt32Array(length: number): Int32Array {
  return new Int32Array(sharedBuffer(length * Int32Array.BYTES_PER_ELEMENT));
}
