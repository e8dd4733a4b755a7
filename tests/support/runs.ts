import { readFileSync } from 'node:fs';
import type request from 'supertest';

/** The example scenario of the engine's contract (tests/fixtures/check-1.json, a test fixture, not a preset). */
export function checkScenario(overrides: Record<string, unknown> = {}): Record<string, unknown> {
  const doc = JSON.parse(readFileSync(new URL('../../tests/fixtures/check-1.json', import.meta.url), 'utf8')) as Record<string, unknown>;
  return { ...doc, ...overrides };
}

/** Polls a run until it reaches a final state (or the timeout passes) and returns its summary. */
export async function waitForRun(agent: request.Agent, runId: string, timeoutMs = 60_000): Promise<Record<string, unknown>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/runs/${runId}`);
    if (res.status !== 200) throw new Error(`GET run ${runId}: ${res.status} ${JSON.stringify(res.body)}`);
    if (['succeeded', 'failed', 'cancelled'].includes(res.body.status)) return res.body;
    if (Date.now() > deadline) throw new Error(`run ${runId} still ${res.body.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

let scenariosMade = 0;

/** Creates a scenario; without a name each gets its own ("Check scenario 1", "Check scenario 2", …), as names are unique per department. */
export async function createScenario(agent: request.Agent, document: Record<string, unknown>, name = `Check scenario ${++scenariosMade}`): Promise<string> {
  const res = await agent.post('/api/scenarios').send({ name, document });
  if (res.status !== 201) throw new Error(`create scenario: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.id as string;
}

/** Polls a fit until it reaches a final state (or the timeout passes) and returns its detail. */
export async function waitForFit(agent: request.Agent, id: string, timeoutMs = 90_000): Promise<Record<string, any>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/fits/${id}`);
    if (res.status !== 200) throw new Error(`GET fit ${id}: ${res.status} ${JSON.stringify(res.body)}`);
    if (['succeeded', 'failed', 'cancelled'].includes(res.body.status)) return res.body;
    if (Date.now() > deadline) throw new Error(`fit ${id} still ${res.body.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 150));
  }
}
