import { z, type ZodType } from 'zod';
import { rolesWith } from '../../shared/permissions';
import type { RouteDef } from './route';

/**
 * The OpenAPI 3.1 document of the API, built from the route table (method, path, access, params, query,
 * body, response). zod 4's own `z.toJSONSchema` rather than @asteasolutions/zod-to-openapi: the route table
 * already holds every schema, JSON Schema draft 2020-12 is what OpenAPI 3.1 uses, and it adds no dependency
 * and no registry of `.openapi()` annotations to keep in step with the schemas.
 */
export const openApiResponse = z.looseObject({
  openapi: z.literal('3.1.0'),
  info: z.looseObject({ title: z.string(), version: z.string() }),
  paths: z.record(z.string(), z.record(z.string(), z.unknown())),
});

const jsonSchema = (schema: ZodType, io: 'input' | 'output') => {
  try {
    return z.toJSONSchema(schema, { io, unrepresentable: 'any', target: 'draft-2020-12' });
  } catch {
    return {};
  }
};

const toOpenApiPath = (path: string) => path.replace(/:([A-Za-z_]+)/g, '{$1}');

function parametersOf(route: RouteDef): unknown[] {
  const out: unknown[] = [];
  for (const [where, schema] of [['path', route.params], ['query', route.query]] as const) {
    const names = new Set<string>(where === 'path' ? [...route.path.matchAll(/:([A-Za-z_]+)/g)].map((m) => m[1]!) : []);
    const shape = schema ? (jsonSchema(schema, 'input') as { properties?: Record<string, unknown>; required?: string[] }) : {};
    for (const name of Object.keys(shape.properties ?? {})) names.add(name);
    for (const name of names) {
      out.push({
        name,
        in: where,
        required: where === 'path' || (shape.required ?? []).includes(name),
        schema: shape.properties?.[name] ?? { type: 'string' },
      });
    }
  }
  return out;
}

export function buildOpenApi(routes: RouteDef[]) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const route of routes) {
    const status = String(route.status ?? 200);
    const contract = route.response;
    const responses =
      contract === 'empty'
        ? { '204': { description: 'No content' } }
        : contract === 'stream' || contract === undefined
          ? { [status]: { description: contract === 'stream' ? 'A file or page (not JSON)' : 'Answer not described yet' } }
          : { [status]: { description: 'OK', content: { 'application/json': { schema: jsonSchema(contract, 'output') } } } };
    const access = route.access;
    const who = access === 'public' || access === 'signed-in' ? access : typeof access === 'string' ? `${access}: ${rolesWith(access).join(', ')}` : access.join(', ');
    (paths[toOpenApiPath('/api' + route.path)] ??= {})[route.method] = {
      operationId: `${route.method} ${route.path}`,
      description: `Who may call it: ${who}.`,
      parameters: parametersOf(route),
      ...(route.body ? { requestBody: { required: true, content: { 'application/json': { schema: jsonSchema(route.body, 'input') } } } } : {}),
      responses: { ...responses, default: { description: 'An error: {error:{code,message,params?,fields?}}' } },
    };
  }
  return { openapi: '3.1.0' as const, info: { title: 'Broodcast API', version: '1' }, paths };
}
