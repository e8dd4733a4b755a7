import { z } from 'zod';

/**
 * The client's build-time settings, checked once. Vite exposes only `VITE_`-prefixed
 * variables (plus MODE, DEV, PROD, BASE_URL); Tidefield needs none yet because the API is
 * served from the same origin. Add new `VITE_` variables to this schema, never read
 * `import.meta.env` elsewhere.
 */
const envSchema = z.object({
  MODE: z.string(),
  DEV: z.boolean(),
  BASE_URL: z.string().startsWith('/'),
});

export function parseEnv(source: Record<string, unknown>) {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `${issue.path.join('.') || '(root)'}: ${issue.message}`);
    throw new Error(`Invalid client environment:\n- ${problems.join('\n- ')}`);
  }
  return { mode: parsed.data.MODE, isDev: parsed.data.DEV, baseUrl: parsed.data.BASE_URL };
}

export const env = parseEnv(import.meta.env);
