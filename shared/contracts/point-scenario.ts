import { withParameter, type Scenario } from './scenario.ts';

/**
 * The scenario at one point of a sweep or fit grid: every path of `values` set, validated again
 * (a value outside the schema's range throws ScenarioValidationError naming the field).
 */
export function scenarioAtPoint(scenario: Scenario, values: Readonly<Record<string, number>>): Scenario {
  return Object.entries(values).reduce((s, [path, value]) => withParameter(s, path, value), scenario);
}
