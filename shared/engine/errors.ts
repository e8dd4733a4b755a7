/**
 * The engine's single policy for invalid input: throw an EngineError whose message always
 * reads "<parameter> = <value> is outside the allowed range <allowed>". Callers (CLI, API)
 * can show the message as is and use `parameter` to point at the offending field.
 */
export class EngineError extends Error {
  override readonly name = 'EngineError';
  constructor(
    readonly parameter: string,
    readonly value: unknown,
    readonly allowed: string,
  ) {
    super(`${parameter} = ${formatValue(value)} is outside the allowed range ${allowed}`);
  }
}

function formatValue(value: unknown): string {
  if (typeof value === 'number') return Number.isNaN(value) ? 'NaN' : String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  try {
    return JSON.stringify(value) ?? String(value);
  } catch {
    return String(value);
  }
}

/** Throws an EngineError unless lo <= value <= hi (and value is a finite number). */
export function requireInRange(parameter: string, value: number, lo: number, hi: number, unit = ''): number {
  if (!Number.isFinite(value) || value < lo || value > hi) {
    throw new EngineError(parameter, value, `[${lo}, ${hi}]${unit ? ' ' + unit : ''}`);
  }
  return value;
}
