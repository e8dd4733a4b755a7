import { describe, expect, it } from 'vitest';
import { ChunkStream, chunkUniform } from './random.ts';

describe('ChunkStream', () => {
  it('draws exactly the uniforms of seedrandom’s xor4096 for the same seed and chunk', () => {
    const stream = new ChunkStream();
    for (const [seed, chunk] of [
      ['baseline-fixed-reach', 0],
      ['baseline-fixed-reach', 1],
      ['', 7],
      ['ünïcode seed ✓', 123456],
      ['x'.repeat(300), 2],
    ] as const) {
      const reference = chunkUniform(seed, chunk);
      stream.reset(seed, chunk);
      for (let k = 0; k < 100_000; k++) {
        const expected = reference();
        const got = stream.uniform();
        if (got !== expected) expect({ seed, chunk, k, got }).toEqual({ seed, chunk, k, got: expected });
      }
    }
  });

  it('starts afresh on reset: a chunk drawn after another equals the chunk drawn alone', () => {
    const stream = new ChunkStream().reset('a', 1);
    for (let k = 0; k < 1000; k++) stream.uniform();
    stream.reset('a', 2);
    const reference = chunkUniform('a', 2);
    for (let k = 0; k < 1000; k++) expect(stream.uniform()).toBe(reference());
  });
});
