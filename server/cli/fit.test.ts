import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { fitDetailSchema } from '../../shared/contracts/fits.ts';
import { jStat } from '../../shared/engine/stats/testing/jstat-reference.ts';
import { main as synth } from './synth.ts';
import { main } from './fit.ts';

const dir = mkdtempSync(join(tmpdir(), 'tidefield-fit-'));
const checkOne = JSON.parse(readFileSync(new URL('../../tests/fixtures/check-1.json', import.meta.url), 'utf8'));

async function run(cli: typeof main, args: string[]) {
  let stdout = '';
  let stderr = '';
  const code = await cli(args, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t) });
  return { code, stdout, stderr };
}

describe('fit CLI', () => {
  it('prints the fit as GET /api/fits/:id does, with the binomial likelihood of separate runs at each node', async () => {
    const scenario = { ...checkOne, systems: 20_000 };
    const constraint = { kind: 'fraction', magnetic: 5, total: 200 };
    const path = join(dir, 'fit.json');
    writeFileSync(path, JSON.stringify({ scenario, constraints: [constraint], parameters: [{ path: 'companions.multiplier', min: 1, max: 3, points: 2 }], workers: 1 }));
    const out = await run(main, [path]);
    expect(out.code).toBe(0);
    expect(out.stderr).toMatch(/2 grid points × 20000 systems/);
    const fit = fitDetailSchema.parse(JSON.parse(out.stdout));
    // Each node's ln L is ln Binomial(5 | 200, f) at the fraction of a separate synth run with that multiplier (jStat's pmf; 1e-9 for log-gamma rounding).
    for (const [i, m] of [1, 3].entries()) {
      const own = join(dir, `m${m}.json`);
      writeFileSync(own, JSON.stringify({ ...scenario, companions: { ...scenario.companions, multiplier: m } }));
      const result = JSON.parse((await run(synth, [own, '--workers', '1'])).stdout);
      const f = result.counts.magnetic / result.counts.whiteDwarfs;
      expect(fit.posterior!.logLikelihood[i]).toBeCloseTo(Math.log(jStat.binomial.pdf(5, 200, f)), 9);
    }
  }, 120_000);

  it('names the field of a bad grid', async () => {
    const path = join(dir, 'bad.json');
    writeFileSync(path, JSON.stringify({ scenario: checkOne, constraints: [{ kind: 'fraction', magnetic: 1, total: 10 }], parameters: [{ path: 'envelope.alpha', min: 0, max: 1, points: 3, scale: 'log' }] }));
    const out = await run(main, [path]);
    expect(out.code).toBe(2);
    expect(out.stderr).toMatch(/parameters\.0\.min: parameters\[0\]\.min must be above 0 for a log grid/);
  });
});
