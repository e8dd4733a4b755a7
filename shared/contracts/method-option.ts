import type { CitationKey } from './citations.ts';

/** The parsed option object; each `words` reads only the fields of its own variant. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type Options = Record<string, any>;

/** One option of a choice between published methods (see method-choices.ts). */
export interface MethodOption {
  /** The discriminator's value in the scenario document. */
  value: string;
  label: string;
  /** One line on what the option does. */
  summary: string;
  /** Published sources, cited by the builder and the methods paragraph alike. */
  cites: readonly CitationKey[];
  /** The object placed in the document when the option is chosen. */
  template: Record<string, unknown>;
  /** The methods paragraph's words for the option, from its parsed values (no citation; see `clause`). */
  words: (o: Options) => string;
}
