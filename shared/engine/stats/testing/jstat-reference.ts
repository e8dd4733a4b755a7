// jstat (a dev dependency) is the reference library the statistics tests compare against.
// It ships no type declarations, so this one file imports it untyped and gives the few functions
// used a signature. Test code only: nothing in the engine imports this file.
// @ts-ignore -- no declaration file for 'jstat'; the interface below types what is used
import jstatModule from 'jstat';

interface JStat {
  beta: { inv(p: number, a: number, b: number): number; cdf(x: number, a: number, b: number): number };
  binomial: { pdf(k: number, n: number, p: number): number; cdf(k: number, n: number, p: number): number };
  hypgeom: { pdf(k: number, population: number, marked: number, drawn: number): number };
  normal: { inv(p: number, mean: number, sd: number): number; cdf(x: number, mean: number, sd: number): number };
}

export const jStat = jstatModule as unknown as JStat;
