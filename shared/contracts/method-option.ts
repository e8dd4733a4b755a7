import { z } from 'zod';
import { citationOf, shortCitations, type Cite } from './citations.ts';

/**
 * The pieces every choice between published methods is declared with (method-choices.ts,
 * ifmr-relations.ts): an option carries its own schema variant, and the choice's discriminated
 * union in the scenario contract is built from its options (`unionOf`), so a variant exists in
 * exactly one place.
 */

/** A variant of a choice: an object schema whose discriminator is a literal. */
export type VariantSchema = z.ZodObject;

/** What a declaration writes for one option. */
export interface OptionDeclaration<S extends VariantSchema = VariantSchema> {
  /** The variant: discriminator literal, fields with their bounds (`number(lo, hi)`), doc comments and defaults. */
  schema: S;
  label: string;
  /** One line on what the option does. */
  summary: string;
  /**
   * Published sources, cited by the builder and the methods paragraph alike: keys into
   * citations.ts, or a citation written inline (short form, full reference, DOI when certain).
   */
  cites: readonly Cite[];
  /** Values the builder starts with beyond the schema's own defaults (fields that have none). */
  start?: Record<string, unknown>;
  /** The methods paragraph's words for the option, from its parsed values (no citation; see `clause`). */
  words(o: z.output<S>): string;
}

/** One option of a choice, as the builder and the methods paragraph read it. */
export interface MethodOption<S extends VariantSchema = VariantSchema> extends OptionDeclaration<S> {
  /** The discriminator's value in the scenario document (the schema's literal). */
  value: string;
  /** The object placed in the document when the option is chosen: the discriminator, `start`, and the schema's defaults. */
  template: Record<string, unknown>;
}

/** A choice between options: where its union sits in the document, its discriminator and its options in the builder's order. */
export interface MethodChoice<D extends string = string, O extends readonly MethodOption[] = readonly MethodOption[]> {
  path: readonly (string | number)[];
  /** Its discriminator key ("law", "kind", "relation"). */
  discriminator: D;
  options: O;
}

/** Declares an option; the schema comes first so that `words` reads its parsed fields with their types. */
export const option = <S extends VariantSchema>(declaration: OptionDeclaration<S>): OptionDeclaration<S> => declaration;

/** Each declared option completed, its value typed as its schema's literal. */
type Completed<D extends string, O extends readonly OptionDeclaration[]> = {
  readonly [K in keyof O]: O[K] extends OptionDeclaration<infer S> ? MethodOption<S> & { readonly value: z.output<S>[D] & string } : never;
};

/** The discriminator values of a choice ("kroupa2001" | "salpeter1955" | …). */
export type ValueOf<C extends MethodChoice> = C['options'][number]['value'];

/**
 * A choice from its options: each option's value is read from its schema's discriminator literal
 * and its template is its schema's parse of the value and `start` (so defaults are written once,
 * on the field).
 */
export function defineChoice<const D extends string, const O extends readonly [OptionDeclaration, ...OptionDeclaration[]]>(
  path: readonly (string | number)[],
  discriminator: D,
  options: O,
): MethodChoice<D, Completed<D, O>> {
  const completed = options.map((declared) => {
    const literal = declared.schema.shape[discriminator];
    if (!(literal instanceof z.ZodLiteral)) throw new Error(`${path.join('.')}: every option needs a literal ${discriminator}`);
    const value = String(literal.value);
    const template = declared.schema.parse({ [discriminator]: value, ...declared.start }) as Record<string, unknown>;
    return { ...declared, value, template };
  });
  return { path, discriminator, options: completed as unknown as Completed<D, O> };
}

type SchemasOf<O extends readonly MethodOption[]> = { -readonly [K in keyof O]: O[K]['schema'] };

/** The choice's discriminated union, its members in the options' order. */
export function unionOf<D extends string, O extends readonly [MethodOption, ...MethodOption[]]>(choice: MethodChoice<D, O>) {
  return z.discriminatedUnion(choice.discriminator, choice.options.map((o) => o.schema) as unknown as SchemasOf<O>);
}

/** The option of a choice with this discriminator value (read through the choice's common type: its words take any parsed variant). */
export function optionOf(choice: MethodChoice, value: unknown): MethodOption | undefined {
  return choice.options.find((o) => o.value === value);
}

/** The paragraph's clause for the option the document chose: its words and, when it has any, its citations ("… (Kroupa 2001)"). */
export function clause(choice: MethodChoice, chosen: Record<string, unknown>): string {
  const chosenOption = optionOf(choice, chosen[choice.discriminator]);
  if (!chosenOption) return '';
  const words = chosenOption.words(chosen);
  return chosenOption.cites.length > 0 ? `${words} (${shortCitations(chosenOption.cites)})` : words;
}

/** Every citation the options of these choices carry, each once. */
export const citationsOfChoices = (choices: readonly MethodChoice[]) => [...new Set(choices.flatMap((c) => c.options.flatMap((o) => o.cites.map(citationOf))))];

/**
 * A dispatch table on a parsed union `U`: one entry per discriminator value, each reading its own
 * variant (and any further arguments `A`). A variant added to a choice without its entry is a type error.
 */
export type ByOption<U extends Record<D, string>, D extends keyof U, R, A extends unknown[] = []> = { [K in U[D]]: (o: Extract<U, Record<D, K>>, ...rest: A) => R };

/** A function of the union that calls the table's entry for the variant it is given (see ByOption). */
export function byOption<U extends Record<D, string>, D extends keyof U, R, A extends unknown[] = []>(discriminator: D, table: ByOption<U, D, R, A>): (o: U, ...rest: A) => R {
  return (o, ...rest) => (table[o[discriminator]] as (o: U, ...rest: A) => R)(o, ...rest);
}
