import type { Application as Express } from 'express';
import { statusOfKind } from '../errors';
import type { EndpointSpec } from '../http/endpoint';
import { apiRoutes, type MountedRoute } from '../http/route-registry';
import { reachableSchemas, requestSchemas, schemaRef } from './request-schemas';

type Schema = Record<string, unknown>;

/** Express's `/:id` as OpenAPI's `/{id}`. */
export const openApiPath = (path: string): string => path.replace(/:(\w+)/g, '{$1}');
const paramNames = (path: string): string[] => [...path.matchAll(/:(\w+)/g)].map((m) => m[1]!);

const errorSchema: Schema = {
  type: 'object',
  required: ['code', 'message'],
  additionalProperties: false,
  properties: {
    code: { type: 'string', enum: [...Object.keys(statusOfKind), 'internal'] },
    message: { type: 'string' },
    fields: { type: 'object', description: 'One message per field, by dotted path (e.g. springs.0.rateNPerMm).', additionalProperties: { type: 'string' } },
    details: {},
  },
};

const errorReply = (description: string) => ({ description, content: { 'application/json': { schema: { $ref: schemaRef('Error') } } } });
const errorResponses = {
  ValidationFailed: errorReply('The request does not fit: `fields` names each problem.'),
  Unauthorised: errorReply('Not signed in, or the sign-in has ended.'),
  Forbidden: errorReply('This account’s role may not do this (or a cross-site request).'),
  NotFound: errorReply('No such record (a malformed id is one too).'),
  TooLarge: errorReply('The body is larger than the server accepts.'),
  RateLimited: errorReply('Too many requests from this address or for this account; try again later.'),
  Internal: errorReply('Something went wrong on the server; no internals are given.'),
};
const responseRef = (name: keyof typeof errorResponses) => ({ $ref: `#/components/responses/${name}` });

function operation(route: MountedRoute, spec: EndpointSpec | undefined, schemas: Record<string, Schema>): Schema {
  const s: EndpointSpec = spec ?? { summary: 'Not described yet' };
  const signedIn = route.roles !== undefined || s.signedIn === true;
  const parameters: Schema[] = paramNames(route.path).map((name) => ({
    name,
    in: 'path',
    required: true,
    description: s.ids?.[name],
    schema: s.ids?.[name] ? { type: 'string', format: 'uuid' } : { type: 'string' },
  }));
  if (s.query) {
    const q = schemas[s.query.name];
    const required = new Set((q?.required as string[] | undefined) ?? []);
    for (const [name, schema] of Object.entries((q?.properties ?? {}) as Record<string, Schema>)) {
      parameters.push({ name, in: 'query', required: required.has(name), schema });
    }
  }
  const responses: Record<string, unknown> = {};
  const status = String(s.status ?? (s.reply === 'none' ? 204 : 200));
  responses[status] =
    s.reply === 'none'
      ? { description: 'Done; no content.' }
      : s.reply
        ? { description: s.reply.description, content: { [s.reply.type]: { schema: { type: 'string' } } } }
        : { description: 'The answer, as JSON.', content: { 'application/json': { schema: { type: ['object', 'array'] } } } };
  if (s.body || s.query || s.content) responses['400'] = responseRef('ValidationFailed');
  if (signedIn) responses['401'] = responseRef('Unauthorised');
  if (route.roles || (route.crossSiteChecked && route.method !== 'GET')) responses['403'] = responseRef('Forbidden');
  if (s.ids || paramNames(route.path).length) responses['404'] = responseRef('NotFound');
  if (s.body || s.content) responses['413'] = responseRef('TooLarge');
  if (route.rateLimited) responses['429'] = responseRef('RateLimited');
  responses['500'] = responseRef('Internal');
  return {
    operationId: `${route.method.toLowerCase()}${route.path.replace(/[:{}*]/g, '').split(/[/.-]/).map((w) => (w ? w[0]!.toUpperCase() + w.slice(1) : '')).join('')}`,
    summary: s.summary,
    ...(s.description ? { description: s.description } : {}),
    tags: [route.path.split('/')[2] ?? 'files'],
    ...(route.roles ? { 'x-roles': [...route.roles] } : {}),
    ...(signedIn ? { security: [{ bearer: [] }, { session: [] }] } : {}),
    ...(parameters.length ? { parameters } : {}),
    ...(s.body
      ? { requestBody: { required: true, content: { 'application/json': { schema: { $ref: schemaRef(s.body.name) } } } } }
      : s.content
        ? { requestBody: { required: true, description: s.content.description, content: { [s.content.type]: { schema: s.content.schema ?? { type: 'string' } } } } }
        : {}),
    responses,
  };
}

const documents = new WeakMap<Express, Schema>();

/**
 * The OpenAPI 3.1 description of this app: every mounted API route (from the router stack) with the request schemas
 * of its DTO classes, its roles, path and query parameters and error replies. Built once per app.
 */
export function openApiDocument(app: Express): Schema {
  const found = documents.get(app);
  if (found) return found;
  const all = requestSchemas();
  const routes = apiRoutes(app);
  const paths: Record<string, Record<string, unknown>> = {};
  for (const route of routes) {
    const path = openApiPath(route.path);
    (paths[path] ??= {})[route.method.toLowerCase()] = operation(route, route.spec, all);
  }
  const used = reachableSchemas(routes.flatMap((r) => [r.spec?.body?.name, r.spec?.query?.name].filter((n): n is string => !!n)), all);
  const schemas: Record<string, Schema> = { Error: errorSchema };
  for (const name of [...used].sort()) schemas[name] = all[name]!;
  const doc: Schema = {
    openapi: '3.1.0',
    info: {
      title: 'Loadline API',
      version: '0.1.0',
      description:
        'Spring calculations, recommendations, the catalogue and the fitment table. Request bodies are described by the same ' +
        'class-validator rules the server checks them with; a refused request is a 400 whose `fields` gives one message per field.',
    },
    jsonSchemaDialect: 'https://spec.openapis.org/oas/3.1/dialect/base',
    servers: [{ url: '/' }],
    paths,
    components: {
      schemas,
      responses: errorResponses,
      securitySchemes: {
        bearer: { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' },
        session: { type: 'apiKey', in: 'cookie', name: 'loadline_session' },
      },
    },
  };
  documents.set(app, doc);
  return doc;
}
