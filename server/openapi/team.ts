/** OpenAPI paths for health, sign-in and set-ups. */
const error = { $ref: '#/components/schemas/Error' };
const json = (schema: object) => ({ content: { 'application/json': { schema } } });
const errorResponse = (description: string) => ({ description, ...json(error) });
const user = {
  type: 'object',
  required: ['id', 'email', 'name', 'role'],
  properties: { id: { type: 'integer' }, email: { type: 'string' }, name: { type: 'string' }, role: { enum: ['admin', 'lead', 'machinist', 'apprentice'] } },
};
const setup = {
  type: 'object',
  properties: {
    id: { type: 'integer' }, name: { type: 'string' }, kind: { type: 'string' }, inputs: { type: 'object' }, notes: { type: 'string' },
    job: { type: ['string', 'null'] }, status: { enum: ['draft', 'released', 'archived'] }, version: { type: 'integer' },
    ownerId: { type: 'integer' }, ownerName: { type: ['string', 'null'] }, createdAt: { type: 'string', format: 'date-time' }, updatedAt: { type: 'string', format: 'date-time' },
  },
};
const setupBody = {
  type: 'object',
  required: ['name', 'kind', 'inputs'],
  properties: {
    name: { type: 'string', maxLength: 160 }, kind: { enum: ['taper', 'sine-bar', 'gauge-blocks', 'angle-blocks', 'lathe-taper', 'pins-rolls'] },
    inputs: { type: 'object', description: 'The calculation area\'s input object, as sent to /api/calc/<area>.' },
    notes: { type: 'string' }, job: { type: ['string', 'null'] }, version: { type: 'integer', description: 'PUT only: the version the edit was based on; a stale one gets 409.' },
  },
};
const csrf = [{ in: 'header', name: 'X-CSRF-Token', required: true, schema: { type: 'string' } }];
const id = [{ in: 'path', name: 'id', required: true, schema: { type: 'integer' } }];

export const teamSchemas = {
  Error: { type: 'object', required: ['error'], properties: { error: { type: 'string' }, fields: { type: 'object', additionalProperties: { type: 'string' } } } },
};

export const teamPaths = {
  '/api/health': {
    get: { summary: 'Health of the app and its database', responses: { 200: { description: '{"status":"ok","db":"up"}' }, 503: { description: 'The database does not answer' } } },
  },
  '/api/auth/csrf': { get: { summary: 'The session\'s CSRF token', responses: { 200: { description: 'Token', ...json({ type: 'object', properties: { token: { type: 'string' } } }) } } } },
  '/api/auth/login': {
    post: {
      summary: 'Sign in (the session id is regenerated)', parameters: csrf,
      requestBody: json({ type: 'object', required: ['email', 'password'], properties: { email: { type: 'string' }, password: { type: 'string' } } }),
      responses: { 200: { description: 'Signed in', ...json({ type: 'object', properties: { user } }) }, 400: errorResponse('Missing fields'), 401: errorResponse('Wrong e-mail or password (one message for both)'), 403: errorResponse('Missing CSRF token'), 429: errorResponse('Too many failures for this account or address') },
    },
  },
  '/api/auth/logout': { post: { summary: 'Sign out', parameters: csrf, responses: { 204: { description: 'Session destroyed' }, 403: errorResponse('Missing CSRF token') } } },
  '/api/auth/session': { get: { summary: 'Who is signed in, for the app\'s start-up (never 401)', responses: { 200: { description: '{"user": User | null}', ...json({ type: 'object', properties: { user: { oneOf: [user, { type: 'null' }] } } }) } } } },
  '/api/auth/me': { get: { summary: 'The signed-in user', responses: { 200: { description: 'User', ...json(user) }, 401: errorResponse('Not signed in') } } },
  '/api/setups': {
    get: { summary: 'The team\'s set-ups visible to you', responses: { 200: { description: 'List', ...json({ type: 'object', properties: { setups: { type: 'array', items: setup } } }) }, 401: errorResponse('Not signed in') } },
    post: { summary: 'Save a set-up', parameters: csrf, requestBody: json(setupBody), responses: { 201: { description: 'Created', ...json(setup) }, 400: errorResponse('Invalid fields'), 401: errorResponse('Not signed in'), 403: errorResponse('Missing CSRF token') } },
  },
  '/api/setups/{id}': {
    get: { summary: 'One set-up', parameters: id, responses: { 200: { description: 'Set-up', ...json(setup) }, 404: errorResponse('Unknown or another team\'s set-up') } },
    put: { summary: 'Change a set-up', parameters: [...id, ...csrf], requestBody: json(setupBody), responses: { 200: { description: 'Updated', ...json(setup) }, 400: errorResponse('Invalid fields'), 403: errorResponse('Not yours to change'), 404: errorResponse('Unknown'), 409: errorResponse('Stale version') } },
    delete: { summary: 'Delete a set-up', parameters: [...id, ...csrf], responses: { 204: { description: 'Deleted' }, 403: errorResponse('Not yours to delete'), 404: errorResponse('Unknown') } },
  },
};
