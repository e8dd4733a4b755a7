import { z } from 'zod';
import { apiErrorBodySchema } from '../../../shared/contracts/api-error.ts';
import type { RegisteredRoute } from '../../lib/http.ts';

type JsonSchema = Record<string, unknown>;

const toSchema = (schema: z.ZodType, io: 'input' | 'output'): JsonSchema => {
  const { $schema: _ignored, ...rest } = z.toJSONSchema(schema, { io, unrepresentable: 'any', target: 'draft-2020-12' }) as JsonSchema;
  return rest;
};

const ACCESS_TEXT: Record<RegisteredRoute['access'], string> = {
  public: 'No sign-in needed.',
  signedIn: 'Any signed-in user.',
  observer: 'Members of the active department with the observer role or higher.',
  modeller: 'Members with the modeller role or higher.',
  admin: 'Department admins only.',
};

function parametersOf(schema: z.ZodType | undefined, location: 'path' | 'query') {
  if (!schema) return [];
  const json = toSchema(schema, 'input') as { properties?: Record<string, JsonSchema>; required?: string[] };
  return Object.entries(json.properties ?? {}).map(([name, property]) => ({
    name,
    in: location,
    required: location === 'path' || (json.required ?? []).includes(name),
    schema: property,
  }));
}

/**
 * The OpenAPI 3.1 description of every route defined through defineRoute, generated from the
 * same zod schemas that validate requests (JSON Schema 2020-12, as OpenAPI 3.1 uses).
 */
export function buildOpenApi(routes: readonly RegisteredRoute[], version: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  const errorSchema = toSchema(apiErrorBodySchema, 'output');
  for (const route of routes) {
    const path = route.fullPath.replace(/\/$/, '').replace(/:(\w+)/g, '{$1}') || '/';
    const okContent = route.produces && route.produces !== 'multipart/form-data'
      ? { [route.produces]: { schema: { type: 'string' } } }
      : route.response
        ? { 'application/json': { schema: toSchema(route.response, 'output') } }
        : undefined;
    const responses: Record<string, unknown> = {
      [String(route.status)]: { description: route.status === 204 ? 'Done; no content.' : 'Success.', ...(okContent && route.status !== 204 ? { content: okContent } : {}) },
      default: { description: 'An error: { error: { code, message, field? } }.', content: { 'application/json': { schema: errorSchema } } },
    };
    const requestBody = route.body
      ? {
          required: true,
          content:
            route.produces === 'multipart/form-data'
              ? { 'multipart/form-data': { schema: { allOf: [toSchema(route.body, 'input'), { type: 'object', properties: { file: { type: 'string', format: 'binary' } } }] } } }
              : { 'application/json': { schema: toSchema(route.body, 'input') } },
        }
      : route.produces === 'multipart/form-data'
        ? { required: true, content: { 'multipart/form-data': { schema: { type: 'object', properties: { file: { type: 'string', format: 'binary' } }, required: ['file'] } } } }
        : undefined;
    paths[path] ??= {};
    paths[path][route.method] = {
      summary: route.summary,
      description: ACCESS_TEXT[route.access],
      tags: [route.tag],
      security: route.access === 'public' ? [] : [{ sessionCookie: [] }, { bearerToken: [] }],
      parameters: [...parametersOf(route.params, 'path'), ...parametersOf(route.query, 'query')],
      ...(requestBody ? { requestBody } : {}),
      responses,
    };
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Tidefield API',
      version,
      description: 'Population synthesis of magnetic white dwarfs: scenarios, occurrence tables, observed samples, seeded Monte Carlo runs, sweeps and comparisons. Every error answers { "error": { "code", "message", "field"? } }.',
    },
    servers: [{ url: '/' }],
    components: {
      securitySchemes: {
        sessionCookie: { type: 'apiKey', in: 'cookie', name: 'tidefield_session' },
        bearerToken: { type: 'http', scheme: 'bearer', description: 'A personal API token (POST /api/tokens).' },
      },
    },
    paths,
  };
}
