import { calcPaths } from './calc';
import { libraryPaths } from './library';
import { teamPaths, teamSchemas } from './team';
import { teamAdminPaths } from './team-admin';
import { teamExportPaths } from './team-export';
import { trainingPaths } from './training';

/** The OpenAPI 3.1 description of the API, served at GET /api/openapi.json. */
export const openApiDocument = {
  openapi: '3.1.0',
  info: {
    title: 'Slantwise API',
    version: '0.1.0',
    description:
      'Calculation routes under /api/calc are public and stateless (no sign-in, no CSRF token, rate-limited). ' +
      'Every other unsafe request needs a session cookie and the X-CSRF-Token header from GET /api/auth/csrf. ' +
      'Errors are always JSON: {"error": "message", "fields"?: {"field": "message"}}.',
  },
  servers: [{ url: '/' }],
  paths: { ...teamPaths, ...calcPaths, ...teamAdminPaths, ...trainingPaths, ...libraryPaths, ...teamExportPaths },
  components: { schemas: { ...teamSchemas } },
} as const;
