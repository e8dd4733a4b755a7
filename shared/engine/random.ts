import seedrandom from 'seedrandom';

/**
 * A source of uniform doubles in [0, 1). Every random draw in the engine goes through one
 * of these so that runs are reproducible; nothing in the engine calls Math.random.
 */
export type Uniform = () => number;

/**
 * The generator for chunk `chunkIndex` of a run seeded with `seed`.
 * seedrandom's xor4096 (Brent 2006 xorgens, 4096-bit state) is used because its per-draw
 * cost is about a tenth of seedrandom's default ARC4 generator; seeding it costs a few
 * microseconds, which is negligible once per chunk.
 */
export function chunkUniform(seed: string, chunkIndex: number): Uniform {
  const gen = seedrandom.xor4096(`${seed}#${chunkIndex}`);
  return () => gen();
}

/**
 * The same generator as chunkUniform, as its raw 32-bit integers: u = (i >>> 0) · 2^-32 is exactly
 * chunkUniform's uniform. The kernel converts inline, so a draw's double never leaves registers.
 */
export function chunkInt32(seed: string, chunkIndex: number): () => number {
  return seedrandom.xor4096(`${seed}#${chunkIndex}`).int32;
}

/** 2^-32: (int32 >>> 0) · UNIFORM_SCALE is the uniform in [0, 1) of chunkUniform. */
export const UNIFORM_SCALE = 2 ** -32;
