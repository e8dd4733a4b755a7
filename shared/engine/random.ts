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

/** 2^-32: (int32 >>> 0) · UNIFORM_SCALE is the uniform in [0, 1) of chunkUniform. */
export const UNIFORM_SCALE = 2 ** -32;

/**
 * The kernel's generator: draw for draw the stream of chunkUniform(seed, chunkIndex), stepped by
 * one method that every chunk shares. seedrandom makes new closures for each generator, so a call
 * site that serves many chunks sees a new function each chunk and V8 does not inline it: about
 * 8 ns per draw in the kernel against 2.5 ns in one long-lived generator (measured 2026-12-05).
 * seedrandom still seeds the stream (its exported xor4096 state) and is the reference: random.test.ts
 * checks every draw equal to chunkUniform's. The step is xorgens (Brent, R. P. 2006, "Some
 * long-period random number generators using shifts and xors", ANZIAM J. 48, C188; from memory) with a Weyl
 * sequence, as seedrandom's xor4096.js writes it.
 */
export class ChunkStream {
  private readonly x = new Int32Array(128);
  private w = 0;
  private i = 0;

  /** Starts chunk `chunkIndex` of `seed`: the state seedrandom.xor4096(`${seed}#${chunkIndex}`) starts from. */
  reset(seed: string, chunkIndex: number): this {
    const state = seedrandom.xor4096(`${seed}#${chunkIndex}`, { state: true }).state();
    this.x.set(state.X);
    this.w = state.w;
    this.i = state.i;
    return this;
  }

  /** The next uniform in [0, 1). */
  uniform(): number {
    const x = this.x;
    const w = (this.w = (this.w + 0x61c88647) | 0);
    let v = x[(this.i + 34) & 127];
    const i = (this.i = (this.i + 1) & 127);
    let t = x[i];
    v ^= v << 13;
    t ^= t << 17;
    v ^= v >>> 15;
    t ^= t >>> 12;
    v = x[i] = v ^ t;
    return (((v + (w ^ (w >>> 16))) | 0) >>> 0) * UNIFORM_SCALE;
  }
}
