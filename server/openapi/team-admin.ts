/** OpenAPI paths for team administration, the dev mailbox, and the e-mailed invitation and reset links. */
const error = { $ref: '#/components/schemas/Error' };
const json = (schema: object) => ({ content: { 'application/json': { schema } } });
const errorResponse = (description: string) => ({ description, ...json(error) });
const csrf = [{ in: 'header', name: 'X-CSRF-Token', required: true, schema: { type: 'string' } }];
const id = [{ in: 'path', name: 'id', required: true, schema: { type: 'integer' } }];
const token = [{ in: 'path', name: 'token', required: true, schema: { type: 'string' }, description: 'The token of the e-mailed link (only its sha256 is stored).' }];
const role = { enum: ['admin', 'lead', 'machinist', 'apprentice'] };
const member = {
  type: 'object',
  properties: { id: { type: 'integer' }, email: { type: 'string' }, name: { type: 'string' }, role, active: { type: 'boolean' }, createdAt: { type: 'string', format: 'date-time' } },
};
const invitation = {
  type: 'object',
  properties: { id: { type: 'integer' }, email: { type: 'string' }, role, invitedBy: { type: ['string', 'null'] }, expiresAt: { type: 'string', format: 'date-time' }, createdAt: { type: 'string', format: 'date-time' } },
};
const mail = {
  type: 'object',
  properties: {
    id: { type: 'integer' }, sender: { type: 'string' }, recipients: { type: 'string' }, subject: { type: 'string' }, text: { type: 'string' },
    html: { type: ['string', 'null'] }, receivedAt: { type: 'string', format: 'date-time' }, links: { type: 'array', items: { type: 'string' } },
  },
};
const gone = errorResponse('The link expired, was already used or was replaced');
const unknown = errorResponse('No such link');

export const teamAdminPaths = {
  '/api/team/members': {
    get: { summary: 'The team\'s members (admins and leads)', responses: { 200: { description: 'Members', ...json({ type: 'object', properties: { members: { type: 'array', items: member } } }) }, 401: errorResponse('Not signed in'), 403: errorResponse('Not an admin or lead') } },
  },
  '/api/team/members/{id}': {
    patch: {
      summary: 'Change a member\'s role or deactivate / reactivate them (admins). Deactivation and role changes end the member\'s sessions at once.',
      parameters: [...id, ...csrf],
      requestBody: json({ type: 'object', properties: { role, active: { type: 'boolean' } } }),
      responses: { 200: { description: 'Updated member', ...json(member) }, 400: errorResponse('Bad role or nothing to change'), 403: errorResponse('Not an admin'), 404: errorResponse('Unknown or another team\'s member'), 409: errorResponse('Admins cannot change their own role or deactivate themselves') },
    },
  },
  '/api/team/invitations': {
    get: { summary: 'Open invitations (admins)', responses: { 200: { description: 'Invitations', ...json({ type: 'object', properties: { invitations: { type: 'array', items: invitation } } }) }, 403: errorResponse('Not an admin') } },
    post: {
      summary: 'Invite by e-mail with a role (admins); mails a single-use link valid 7 days, replacing any open invitation to the address',
      parameters: csrf,
      requestBody: json({ type: 'object', required: ['email', 'role'], properties: { email: { type: 'string' }, role } }),
      responses: { 201: { description: 'Invitation and whether the SMTP server accepted the message', ...json({ type: 'object', properties: { invitation, mailSent: { type: 'boolean' } } }) }, 400: errorResponse('Invalid fields'), 403: errorResponse('Not an admin'), 409: errorResponse('The address already has an account') },
    },
  },
  '/api/team/invitations/{id}': {
    delete: { summary: 'Revoke an open invitation (admins)', parameters: [...id, ...csrf], responses: { 204: { description: 'Revoked' }, 403: errorResponse('Not an admin'), 404: errorResponse('No open invitation with that id in the team') } },
  },
  '/api/team/mailbox': {
    get: {
      summary: 'Dev mailbox: messages caught by the local SMTP catcher (admins; only when MAIL_FAKE=true, else 404)',
      parameters: [{ in: 'query', name: 'to', required: false, schema: { type: 'string' }, description: 'Only messages to this address' }],
      responses: { 200: { description: 'Newest 100 messages', ...json({ type: 'object', properties: { messages: { type: 'array', items: mail } } }) }, 403: errorResponse('Not an admin'), 404: errorResponse('The real SMTP server is in use') },
    },
  },
  '/api/team/mailbox/{id}': {
    get: { summary: 'One captured message (admins, MAIL_FAKE=true)', parameters: id, responses: { 200: { description: 'Message', ...json(mail) }, 404: errorResponse('Unknown message, or the mailbox is off') } },
  },
  '/api/access/invitations/{token}': {
    get: { summary: 'What an invitation link offers (public)', parameters: token, responses: { 200: { description: 'Preview', ...json({ type: 'object', properties: { email: { type: 'string' }, role, teamName: { type: 'string' }, expiresAt: { type: 'string', format: 'date-time' } } }) }, 404: unknown, 410: errorResponse('Expired or used; or withdrawn by an admin or replaced by a newer invitation (the message says which)') } },
  },
  '/api/access/invitations/accept': {
    post: {
      summary: 'Accept an invitation: choose a name and password (public, single use)',
      parameters: csrf,
      requestBody: json({ type: 'object', required: ['token', 'name', 'password'], properties: { token: { type: 'string' }, name: { type: 'string' }, password: { type: 'string', minLength: 10, maxLength: 200, description: 'Not only spaces.' } } }),
      responses: { 201: { description: 'The new member', ...json({ type: 'object', properties: { user: member } }) }, 400: errorResponse('Invalid fields'), 404: unknown, 409: errorResponse('The address already has an account'), 410: gone },
    },
  },
  '/api/access/password-reset': {
    post: {
      summary: 'Ask for a reset link; only the newest link of an account works. The answer is the same whether or not the address has an account; throttled per address and per client (5 in 15 minutes).',
      parameters: csrf,
      requestBody: json({ type: 'object', required: ['email'], properties: { email: { type: 'string' } } }),
      responses: { 202: { description: 'Always the same message', ...json({ type: 'object', properties: { message: { type: 'string' } } }) }, 400: errorResponse('Not an e-mail address'), 429: errorResponse('Too many requests') },
    },
  },
  '/api/access/password-reset/{token}': {
    get: { summary: 'Whether a reset link still works', parameters: token, responses: { 200: { description: 'Valid', ...json({ type: 'object', properties: { valid: { type: 'boolean' }, expiresAt: { type: 'string', format: 'date-time' } } }) }, 404: unknown, 410: gone } },
  },
  '/api/access/password-reset/complete': {
    post: {
      summary: 'Set a new password with a reset link (single use, 1 hour); ends every session of the account',
      parameters: csrf,
      requestBody: json({ type: 'object', required: ['token', 'password'], properties: { token: { type: 'string' }, password: { type: 'string', minLength: 10, maxLength: 200, description: 'Not only spaces.' } } }),
      responses: { 204: { description: 'Password changed' }, 400: errorResponse('Invalid fields'), 404: unknown, 410: gone },
    },
  },
};
