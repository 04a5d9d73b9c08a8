/** OpenAPI paths for the admin's export of all team data. */
export const teamExportPaths = {
  '/api/team/export': {
    get: {
      summary: 'Download all team data (admins): a .tar.gz holding team.json (every team table, members with their bcrypt hashes; no sessions, tokens or captured mails) and every attachment file and thumbnail under files/. Restore it into an empty instance with scripts/import-team.ts.',
      responses: {
        200: { description: 'The archive', content: { 'application/gzip': { schema: { type: 'string', format: 'binary' } } } },
        401: { description: 'Not signed in', content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } },
        403: { description: 'Not an admin', content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } },
      },
    },
  },
};
