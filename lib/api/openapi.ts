// The OpenAPI 3.1 document, generated from the route list and its zod schemas (zod's own JSON Schema export).
import { z } from 'zod';
import { ROUTES } from './routes';
import type { RouteSpec } from './spec';

const errorSchema = {
  type: 'object',
  properties: {
    error: {
      type: 'object',
      properties: { code: { type: 'string' }, message: { type: 'string' }, details: {} },
      required: ['code', 'message'],
    },
  },
  required: ['error'],
};

const jsonSchema = (schema: z.ZodType, io: 'input' | 'output') =>
  z.toJSONSchema(schema, { target: 'draft-2020-12', io, unrepresentable: 'any' });

function parameters(spec: RouteSpec) {
  const out: object[] = [];
  for (const [where, schema] of [['path', spec.params], ['query', spec.query]] as const) {
    if (!schema) continue;
    const js = jsonSchema(schema, 'input') as { properties?: Record<string, object>; required?: string[] };
    for (const [name, prop] of Object.entries(js.properties ?? {})) {
      out.push({ name, in: where, required: where === 'path' || (js.required ?? []).includes(name), schema: prop });
    }
  }
  return out;
}

export function openApiDocument() {
  const paths: Record<string, Record<string, object>> = {};
  for (const [name, spec] of Object.entries(ROUTES) as [string, RouteSpec][]) {
    const status = String(spec.status ?? 200);
    paths[spec.path] ??= {};
    paths[spec.path][spec.method.toLowerCase()] = {
      operationId: name,
      summary: spec.summary,
      tags: [spec.tag],
      description: `Needs permission \`${spec.permission}\`.`,
      parameters: parameters(spec),
      ...(spec.body ? { requestBody: { required: true, content: { 'application/json': { schema: jsonSchema(spec.body, 'input') } } } } : {}),
      responses: {
        [status]: { description: 'OK', content: { 'application/json': { schema: spec.response ? jsonSchema(spec.response, 'output') : {} } } },
        401: { description: 'No session and no valid API token', content: { 'application/json': { schema: errorSchema } } },
        403: { description: 'The role or the token may not do this', content: { 'application/json': { schema: errorSchema } } },
        404: { description: 'No such record, or it belongs to a site the caller does not', content: { 'application/json': { schema: errorSchema } } },
        422: { description: 'Invalid input; details lists { path, message }', content: { 'application/json': { schema: errorSchema } } },
      },
      security: [{ session: [] }, { bearer: [] }],
    };
  }
  return {
    openapi: '3.1.0',
    info: { title: 'Plumeward API', version: '1', description: 'Steam-trap survey workbench. Errors are { "error": { "code", "message", "details" } }.' },
    components: {
      securitySchemes: {
        session: { type: 'apiKey', in: 'cookie', name: 'next-auth.session-token' },
        bearer: { type: 'http', scheme: 'bearer', description: 'A personal API token (pwt_…), created by an admin under Settings → API tokens.' },
      },
    },
    paths,
  };
}
