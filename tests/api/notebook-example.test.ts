/**
 * The notebook example (examples/notebook/tidefield_example.py), run with the machine's
 * /usr/bin/python3 against a real test server with an API token: it starts a run, waits,
 * reads the result and the ECSV white-dwarf mass table; its numbers must be the API's.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { SYSTEM_PYTHON } from '../../scripts/astropy.ts';
import { checkScenario, createScenario } from '../support/runs.ts';
import { createTestApp, signUp, type TestContext } from '../support/test-app.ts';

const EXAMPLE = path.resolve(import.meta.dirname, '../../examples/notebook/tidefield_example.py');

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestApp();
});
afterAll(() => ctx?.close());

function runPython(env: Record<string, string>): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    // Only the variables the example reads, plus PATH: nothing of the test process leaks in.
    const child = spawn(SYSTEM_PYTHON, [EXAMPLE], { env: { PATH: process.env.PATH ?? '/usr/bin', ...env } });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (c: Buffer) => (stdout += c.toString()));
    child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
  });
}

it('starts a run, waits, and reads the result and its ECSV table with urllib, json and an API token', async () => {
  const { agent } = await signUp(ctx.app);
  const scenarioId = await createScenario(agent, checkScenario({ systems: 10_000, seed: 'notebook' }));
  const token = (await agent.post('/api/tokens').send({ name: 'Notebook', scope: 'run' }).expect(201)).body.token as string;

  const out = await runPython({ TIDEFIELD_URL: ctx.url, TIDEFIELD_TOKEN: token, TIDEFIELD_SCENARIO: scenarioId, TIDEFIELD_SYSTEMS: '10000' });
  expect(out.stderr).toContain('queued run');
  expect(out.code).toBe(0);
  const summary = JSON.parse(out.stdout);
  const result = (await agent.get(`/api/runs/${summary.runId}/result`).expect(200)).body;
  expect(result.systems).toBe(10_000);
  expect(summary.fraction).toEqual(result.fraction);
  expect(summary.tables).toContain('wd-mass');
  expect(summary.wdMass.units).toEqual({ mass_lo: 'solMass', mass_hi: 'solMass', magnetic: null, non_magnetic: null });
  expect(summary.wdMass.massLo).toEqual(result.bins.wdMass.edgesMsun.slice(0, -1));
  expect(summary.wdMass.magnetic).toEqual(result.bins.wdMass.magnetic);
  expect(summary.wdMass.nonMagnetic).toEqual(result.bins.wdMass.nonMagnetic);
}, 120_000);

it('reports the API error (status and message) when the token is wrong', async () => {
  const out = await runPython({ TIDEFIELD_URL: ctx.url, TIDEFIELD_TOKEN: 'tfk_not-a-token', TIDEFIELD_SCENARIO: 'x' });
  expect(out.code).not.toBe(0);
  expect(out.stderr).toMatch(/HTTP 401: .*unknown, expired or revoked/);
});
