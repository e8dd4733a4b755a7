import { z } from 'zod';
import { nameSchema } from './common.ts';

/** The document is validated by parseScenario (shared/contracts/scenario.ts) in the service, which names the failing field as `document.<path>`. */
export const createScenarioBodySchema = z.strictObject({
  name: nameSchema,
  document: z.record(z.string(), z.unknown(), { error: 'document must be a JSON object (a scenario document)' }),
  note: z.string().max(2000).optional(),
});
export type CreateScenarioBody = z.infer<typeof createScenarioBodySchema>;

export const updateScenarioBodySchema = z.strictObject({
  name: nameSchema.optional(),
  /** A new document creates a new version; the old ones stay. */
  document: z.record(z.string(), z.unknown()).optional(),
  note: z.string().max(2000).optional(),
});
export type UpdateScenarioBody = z.infer<typeof updateScenarioBodySchema>;

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
