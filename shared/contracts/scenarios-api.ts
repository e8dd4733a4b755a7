import { z } from 'zod';
import { nameSchema } from './common.ts';
import { parseScenario, ScenarioValidationError } from './scenario.ts';

/**
 * A scenario document in a request, parsed once at the edge: it reaches the service as the
 * document as written (stored as such, so the builder shows what the user wrote) with its
 * typed `Scenario` (defaults filled in). Errors name the field as `document.<path>`.
 */
export const scenarioDocumentSchema = z
  .record(z.string(), z.unknown(), { error: 'document must be a JSON object (a scenario document)' })
  .transform((written, ctx) => {
    try {
      return { written, scenario: parseScenario(written) };
    } catch (error) {
      if (!(error instanceof ScenarioValidationError)) throw error;
      for (const issue of error.issues) {
        const message = issue.field && issue.message.startsWith(issue.field) ? `document.${issue.message}` : issue.message;
        ctx.addIssue({ code: 'custom', path: issue.field ? issue.field.split('.') : [], message, input: written });
      }
      return z.NEVER;
    }
  });
export type ScenarioDocument = z.output<typeof scenarioDocumentSchema>;

export const createScenarioBodySchema = z.strictObject({
  name: nameSchema,
  document: scenarioDocumentSchema,
  note: z.string().max(2000).optional(),
});
/** The body as sent. */
export type CreateScenarioBody = z.input<typeof createScenarioBodySchema>;
/** The body as the service receives it (document parsed). */
export type CreateScenarioRequest = z.output<typeof createScenarioBodySchema>;

export const updateScenarioBodySchema = z.strictObject({
  name: nameSchema.optional(),
  /** A new document creates a new version; the old ones stay. */
  document: scenarioDocumentSchema.optional(),
  note: z.string().max(2000).optional(),
});
export type UpdateScenarioBody = z.input<typeof updateScenarioBodySchema>;
export type UpdateScenarioRequest = z.output<typeof updateScenarioBodySchema>;

export const cloneScenarioBodySchema = z.strictObject({ name: nameSchema.optional() });

export const scenarioSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  currentVersion: z.number(),
  ownerUserId: z.string(),
  ownerName: z.string(),
  documentHash: z.string(),
  title: z.string().optional(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ScenarioSummary = z.infer<typeof scenarioSummarySchema>;

export const scenarioDetailSchema = scenarioSummarySchema.extend({
  document: z.record(z.string(), z.unknown()),
  /** The document with every default filled in, as the engine will see it. */
  resolved: z.record(z.string(), z.unknown()),
  costCredits: z.number(),
});
export type ScenarioDetail = z.infer<typeof scenarioDetailSchema>;

export const scenarioVersionSchema = z.object({
  version: z.number(),
  documentHash: z.string(),
  note: z.string().nullable(),
  createdByUserId: z.string(),
  createdAt: z.string(),
  document: z.record(z.string(), z.unknown()),
});

export const scenarioListResponseSchema = z.object({ scenarios: z.array(scenarioSummarySchema) });
export const scenarioVersionsResponseSchema = z.object({ versions: z.array(scenarioVersionSchema) });
export const versionParamsSchema = z.strictObject({ id: z.string().min(1).max(32), version: z.coerce.number().int().min(1) });
export const idResponseSchema = z.object({ id: z.string() });

/** Presets: the example scenarios shipped with Tidefield. */
export const presetSchema = z.object({ key: z.string(), title: z.string(), description: z.string(), document: z.record(z.string(), z.unknown()) });
export const presetListResponseSchema = z.object({ presets: z.array(presetSchema) });
