import { z } from 'zod';

/** The bounds a schema puts on one number (null where it sets none). */
export interface NumberBounds {
  min: number | null;
  max: number | null;
  integer: boolean;
}

/** Strips the wrappers that do not change what a value must look like (zod's public accessors only). */
function unwrap(node: z.ZodType): z.ZodType {
  let current: z.ZodType = node;
  for (let i = 0; i < 16; i++) {
    if (current instanceof z.ZodDefault || current instanceof z.ZodPrefault || current instanceof z.ZodOptional || current instanceof z.ZodNullable || current instanceof z.ZodReadonly || current instanceof z.ZodCatch) {
      current = current.unwrap() as z.ZodType;
    } else if (current instanceof z.ZodPipe) {
      current = current.in as z.ZodType;
    } else {
      return current;
    }
  }
  return current;
}

/** The member of a union that `value` chose (by the discriminator, else the first that accepts it). */
function member(node: z.ZodType, value: unknown): z.ZodType {
  if (!(node instanceof z.ZodUnion)) return node;
  const options = node.options as readonly z.ZodType[];
  const discriminator = node instanceof z.ZodDiscriminatedUnion ? node.def.discriminator : undefined;
  if (discriminator && value !== null && typeof value === 'object') {
    const wanted = (value as Record<string, unknown>)[discriminator];
    const chosen = options.find((o) => {
      const inner = unwrap(o);
      const literal = inner instanceof z.ZodObject ? inner.shape[discriminator] : undefined;
      return literal instanceof z.ZodLiteral && literal.values.has(wanted as never);
    });
    if (chosen) return unwrap(chosen);
  }
  return unwrap(options.find((o) => o.safeParse(value).success) ?? options[0]);
}

/** The schema node that validates `path` of `input`, choosing union members by the input's shape. */
export function schemaAt(schema: z.ZodType, path: readonly (string | number)[], input: unknown): z.ZodType | null {
  let node: z.ZodType | undefined = schema;
  let value: unknown = input;
  for (const key of path) {
    if (!node) return null;
    const here = member(unwrap(node), value);
    if (here instanceof z.ZodObject) node = here.shape[String(key)] as z.ZodType | undefined;
    else if (here instanceof z.ZodArray) node = here.element as z.ZodType;
    else if (here instanceof z.ZodTuple) node = (here.def.items[Number(key)] ?? here.def.rest ?? undefined) as z.ZodType | undefined;
    else if (here instanceof z.ZodRecord) node = here.valueType as z.ZodType;
    else return null;
    value = value !== null && typeof value === 'object' ? (value as Record<string | number, unknown>)[key] : undefined;
  }
  return node ? member(unwrap(node), value) : null;
}

/** Bounds of a number schema, read from zod's public `minValue` / `maxValue` / `isInt`. */
export function numberBounds(node: z.ZodType): NumberBounds | null {
  const inner = unwrap(node);
  if (!(inner instanceof z.ZodNumber)) return null;
  const finite = (v: number | null) => (v === null || !Number.isFinite(v) || Math.abs(v) >= Number.MAX_SAFE_INTEGER ? null : v);
  return { min: finite(inner.minValue), max: finite(inner.maxValue), integer: inner.isInt };
}

/** The bounds of the number at `path` of `input` (null when the path holds no number). */
export function boundsAt(schema: z.ZodType, path: readonly (string | number)[], input: unknown): NumberBounds | null {
  const node = schemaAt(schema, path, input);
  return node ? numberBounds(node) : null;
}
