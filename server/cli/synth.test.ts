import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from './synth.ts';

const dir = mkdtempSync(join(tmpdir(), 'tidefield-synth-'));
const checkOne = JSON.parse(readFileSync(new URL('../../tests/fixtures/check-1.json', import.meta.url), 'utf8'));

function file(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}

async function run(args: string[]) {
  let stdout = '';
  let stderr = '';
  const code = await main(args, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t) });
  return { code, stdout, stderr };
}

describe('synth CLI', () => {
  it('prints only the result JSON on stdout and progress on stderr; 1 and 2 workers agree', async () => {
    const path = file('small.json', { ...checkOne, systems: 200_000, observed: { magnetic: 30, total: 200 } });
    const one = await run([path, '--workers', '1']);
    expect(one.code).toBe(0);
    const result = JSON.parse(one.stdout);
    expect(result.counts.primaries).toBe(200_000);
    expect(Number.isInteger(result.counts.magnetic)).toBe(true);
    expect(result.comparison.pValue).toBeGreaterThan(0);
    expect(result.impliedOccurrence.interval95).not.toBeNull();
    expect(one.stderr).toMatch(/chunk 4\/4/);
    const two = await run([path, '--workers', '2']);
    expect(JSON.parse(two.stdout).counts).toEqual(result.counts);
  }, 60_000);

  it('writes to --out and resolves a stored occurrence table', async () => {
    const path = file('table.json', { seed: 't', systems: 70_000, companions: { multiplier: 1, tableId: 'baseline-occurrence' } });
    const out = join(dir, 'out.json');
    const r = await run([path, '--workers', '1', '--out', out]);
    expect(r.code).toBe(0);
    expect(r.stdout).toBe('');
    expect(JSON.parse(readFileSync(out, 'utf8')).methods.some((m: { reference: string }) => m.reference.includes('Cumming'))).toBe(true);
    const missing = await run([file('missing-table.json', { seed: 't', companions: { tableId: 'no-such-table' } })]);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/companions.tableId "no-such-table" is not a stored table/);
  }, 60_000);

  it('exits non-zero naming every bad field', async () => {
    const r = await run([file('bad.json', { ...checkOne, systems: 1e12, envelope: { alpha: 20, lambda: 0.5 } })]);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/systems must be between 1000 and 1e10 \(got 1e12\)/);
    expect(r.stderr).toMatch(/envelope.alpha must be between 0.01 and 10 \(got 20\)/);
  });

  it('explains a missing file, bad JSON and bad options', async () => {
    expect((await run([join(dir, 'nope.json')])).stderr).toMatch(/cannot read scenario file .*nope.json: ENOENT/);
    expect((await run([file('broken.json', '{"seed": ')])).stderr).toMatch(/is not valid JSON/);
    expect((await run([file('ok.json', checkOne), '--workers', '0'])).stderr).toMatch(/--workers must be an integer/);
    expect((await run([])).code).toBe(2);
    // Option errors come from node:util parseArgs and name the option.
    const ok = file('ok.json', checkOne);
    expect((await run([ok, '--speed', '3'])).stderr).toMatch(/Unknown option '--speed'/);
    expect((await run([ok, '--out'])).stderr).toMatch(/--out <value>' argument missing/);
    expect((await run([ok, ok])).stderr).toMatch(/only one scenario file may be given/);
    expect((await run(['--help'])).code).toBe(0);
  });
});

describe('synth CLI --constraints', () => {
  it('adds the evaluation against a constraint set (library references and CSV lists) to the output', async () => {
    const scenario = file('eval.json', { ...checkOne, systems: 50_000 });
    const set = file('set.json', {
      name: 'CLI set (illustrative)',
      constraints: [{ libraryId: 'tout2008-wd-dm-zero' }, { kind: 'meanMass', population: 'magnetic', csv: 'massMsun\n0.8\n0.9\n1.0\n' }],
    });
    const r = await run([scenario, '--workers', '1', '--constraints', set]);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.evaluation.constraintSet.name).toBe('CLI set (illustrative)');
    expect(out.evaluation.constraints.map((c: { id: string }) => c.id)).toEqual(['tout2008-wd-dm-zero', 'c2']);
    expect(out.evaluation.combined.method).toMatch(/independent/);
    expect(r.stderr).toMatch(/evaluation: /);
  }, 60_000);

  it('names the line and column of a bad CSV row in a constraint-set file', async () => {
    const set = file('bad-set.json', { constraints: [{ kind: 'fieldDistribution', csv: 'fieldMG\n12\nstrong\n' }] });
    const r = await run([file('eval2.json', { ...checkOne, systems: 2000 }), '--constraints', set]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/line 3, column fieldMG: fieldMG must be a number \(got "strong"\)/);
  });
});
