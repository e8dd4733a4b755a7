import { z } from 'zod';
import { OBSERVER_MAX_SYSTEMS } from '../../../../shared/contracts/pricing.ts';
import { roleAtLeast, type Role } from '../../../../shared/contracts/roles.ts';
import { formatCount } from './run-text.ts';

/** The largest run the role may start (observers: OBSERVER_MAX_SYSTEMS; others: no cap below the contract's 10^10). */
export function systemsCapFor(role: Role): number | null {
  return roleAtLeast(role, 'modeller') ? null : OBSERVER_MAX_SYSTEMS;
}

/** The server's own words for a run above the observer's cap (runs.service checkSize), shown at the field before submitting. */
export function observerCapMessage(systems: number): string {
  return `Observers may start runs of at most ${formatCount(OBSERVER_MAX_SYSTEMS)} systems (this one has ${formatCount(systems)}); ask a modeller for a larger run.`;
}

/** The size to pre-fill: the scenario's own, brought within the caller's cap. */
export function prefilledSystems(scenarioSystems: number | undefined, cap: number | null): string {
  if (scenarioSystems === undefined) return cap === null ? '' : String(cap);
  return String(cap === null ? scenarioSystems : Math.min(scenarioSystems, cap));
}

/** Adds the caller's cap to a form schema whose `systems` output is a number (or undefined). */
export function withSystemsCap<S extends z.ZodType<{ systems?: number }>>(schema: S, cap: number | null) {
  if (cap === null) return schema;
  return schema.superRefine((values, ctx) => {
    if (values.systems !== undefined && values.systems > cap) ctx.addIssue({ code: 'custom', path: ['systems'], message: observerCapMessage(values.systems) });
  });
}
