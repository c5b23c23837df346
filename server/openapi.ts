/**
 * The OpenAPI registry every router registers into; `GET /api/v1/openapi.json`
 * serves the document generated from it.
 *
 * Routes declared with `defineRoute()` (server/http/route.ts) register
 * themselves: their params, query, body and response schemas are the same zod
 * schemas that validate requests, so the document cannot drift from the code.
 * To describe a reusable component, call `registry.register('Name', schema)`.
 */
import {
  extendZodWithOpenApi,
  OpenAPIRegistry,
  OpenApiGeneratorV3,
} from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';

extendZodWithOpenApi(z);

export const API_PREFIX = '/api/v1';

export const registry = new OpenAPIRegistry();

registry.registerComponent('securitySchemes', 'session', {
  type: 'apiKey',
  in: 'cookie',
  name: 'phasewright.sid',
  description:
    'Session cookie from POST /api/v1/session. State-changing requests also send X-CSRF-Token.',
});
registry.registerComponent('securitySchemes', 'bearer', {
  type: 'http',
  scheme: 'bearer',
  description: 'A personal API token from POST /api/v1/tokens. No CSRF token needed.',
});

export function buildOpenApiDocument() {
  return new OpenApiGeneratorV3(registry.definitions).generateDocument({
    openapi: '3.0.3',
    info: {
      title: 'Phasewright API',
      version: '1',
      description:
        'Design, review and hand over work-up and isolation routes. Errors are always ' +
        '{"error":{"code","message","details"}}.',
    },
    servers: [{ url: '/' }],
  });
}
