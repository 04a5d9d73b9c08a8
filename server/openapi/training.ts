/** OpenAPI paths for training: exercise types, assignments, an apprentice's own work and the score table. */
const error = { $ref: '#/components/schemas/Error' };
const json = (schema: object) => ({ content: { 'application/json': { schema } } });
const errorResponse = (description: string) => ({ description, ...json(error) });
const csrf = [{ in: 'header', name: 'X-CSRF-Token', required: true, schema: { type: 'string' } }];
const id = [{ in: 'path', name: 'id', required: true, schema: { type: 'integer' } }];
const position = [{ in: 'path', name: 'position', required: true, schema: { type: 'integer', minimum: 1 } }];
const types = ['taper-depth', 'taper-end-thickness', 'taper-angle', 'sine-stack', 'sine-angle', 'gauge-fewest', 'lathe-half-angle', 'lathe-offset', 'dovetail-pins'];
const step = { type: 'object', properties: { label: { type: 'string' }, formula: { type: 'string' }, substituted: { type: 'string' }, value: { type: 'string' }, unit: { type: 'string' } } };
const summary = {
  type: 'object',
  properties: {
    userId: { type: 'integer' }, name: { type: 'string' }, status: { enum: ['not-started', 'in-progress', 'done', 'late', 'missing'] },
    correct: { type: 'integer' }, closed: { type: 'integer' }, total: { type: 'integer' }, score: { type: 'integer', description: 'Percent correct' },
    completedAt: { type: ['string', 'null'], format: 'date-time' },
  },
};
const assignment = {
  type: 'object',
  properties: {
    id: { type: 'integer' }, title: { type: 'string' }, instructions: { type: 'string' },
    items: { type: 'array', items: { type: 'object', properties: { type: { enum: types }, count: { type: 'integer' } } } },
    dueAt: { type: 'string', format: 'date-time' }, createdAt: { type: 'string', format: 'date-time' }, createdBy: { type: ['string', 'null'] },
    work: { type: 'array', items: summary, description: 'Leads and admins: every assignee. Anyone else: only their own work.' },
  },
};
const problem = {
  type: 'object',
  description: 'Regenerated from the stored seed; no seed or answer is sent until the problem is closed.',
  properties: {
    position: { type: 'integer' }, type: { enum: types }, title: { type: 'string' }, prompt: { type: 'string' },
    givens: { type: 'array', items: { type: 'object', properties: { label: { type: 'string' }, value: { type: 'string' }, unit: { type: 'string' } } } },
    answerLabel: { type: 'string' }, unit: { type: 'string' }, tolerance: { type: 'string' },
    attempts: { type: 'array', items: { type: 'object', properties: { answer: { type: 'string' }, correct: { type: 'boolean' }, at: { type: 'string' } } } },
    attemptsLeft: { type: 'integer' }, hintsAvailable: { type: 'integer' }, hints: { type: 'array', items: step },
    closed: { type: 'boolean' }, correct: { type: 'boolean' },
    solution: { type: ['object', 'null'], properties: { answer: { type: 'string' }, steps: { type: 'array', items: step } } },
  },
};

export const trainingPaths = {
  '/api/training/exercise-types': {
    get: { summary: 'Every exercise type with its title and calculation area', responses: { 200: { description: 'Types' }, 401: errorResponse('Not signed in') } },
  },
  '/api/training/assignments': {
    get: { summary: 'Leads and admins: the team\'s assignments with everyone\'s work. Others: only assignments given to them, with only their own work.', responses: { 200: { description: 'List', ...json({ type: 'object', properties: { assignments: { type: 'array', items: assignment } } }) }, 401: errorResponse('Not signed in') } },
    post: {
      summary: 'Create an assignment for chosen apprentices (leads and admins); each gets their own generated problems and an e-mail',
      parameters: csrf,
      requestBody: json({
        type: 'object', required: ['title', 'items', 'dueAt', 'assigneeIds'],
        properties: {
          title: { type: 'string', maxLength: 160 }, instructions: { type: 'string' },
          items: { type: 'array', items: { type: 'object', properties: { type: { enum: types }, count: { type: 'integer', minimum: 1, maximum: 10 } } }, description: 'Each type once; 30 problems at most' },
          dueAt: { type: 'string', format: 'date-time', description: 'From now to five years ahead' },
          timeZone: { type: 'string', maxLength: 64, description: "The lead's IANA time zone (e.g. America/Chicago), checked against Intl; the e-mail gives the due time on that clock. Default UTC." },
          assigneeIds: { type: 'array', items: { type: 'integer' }, description: 'Active apprentices of the team' },
        },
      }),
      responses: { 201: { description: 'Created; mailSent counts the notices the SMTP server accepted', ...json(assignment) }, 400: errorResponse('Invalid fields'), 403: errorResponse('Not a lead or admin') },
    },
  },
  '/api/training/assignments/{id}': {
    get: { summary: 'One assignment (apprentices: only if assigned, with only their own work)', parameters: id, responses: { 200: { description: 'Assignment', ...json(assignment) }, 404: errorResponse('Unknown, another team\'s, or not assigned to you') } },
    patch: {
      summary: 'Move the due date (leads and admins of the team); apprentices who have not finished get an e-mail with the new due time',
      parameters: [...id, ...csrf],
      requestBody: json({
        type: 'object', required: ['dueAt'],
        properties: {
          dueAt: { type: 'string', format: 'date-time', description: 'From now to five years ahead' },
          timeZone: { type: 'string', maxLength: 64, description: "The lead's IANA time zone for the e-mail; default UTC" },
        },
      }),
      responses: {
        200: { description: 'The assignment; mailSent counts the notices the SMTP server accepted', ...json(assignment) },
        400: errorResponse('Invalid due date or time zone'), 403: errorResponse('Not a lead or admin'), 404: errorResponse('Unknown or another team\'s'),
      },
    },
    delete: { summary: 'Delete an assignment and its work (leads and admins)', parameters: [...id, ...csrf], responses: { 204: { description: 'Deleted' }, 403: errorResponse('Not a lead or admin'), 404: errorResponse('Unknown') } },
  },
  '/api/training/assignments/{id}/work/{userId}/problems/{position}/grade': {
    post: {
      summary: "Grade a closed problem of an apprentice's work by hand, over the checker (leads and admins of the team): the score follows, and the apprentice reads who graded it and why",
      parameters: [...id, { name: 'userId', in: 'path', required: true, schema: { type: 'integer', minimum: 1 } }, { name: 'position', in: 'path', required: true, schema: { type: 'integer', minimum: 1 } }, ...csrf],
      requestBody: json({
        type: 'object', required: ['correct', 'note'],
        properties: { correct: { type: 'boolean' }, note: { type: 'string', minLength: 3, maxLength: 500, description: 'Why, for the apprentice to read; trimmed' } },
      }),
      responses: {
        200: { description: 'The problem as the lead reads it, with grade {correct, note, by, at}' },
        400: errorResponse('No grade, or no reason'), 403: errorResponse('Not a lead or admin'), 404: errorResponse('Unknown assignment, apprentice or problem'),
        409: errorResponse('The problem is still open'),
      },
    },
  },
  '/api/training/assignments/{id}/assignees': {
    post: {
      summary: 'Give a sent assignment to more apprentices (leads and admins of the team): each gets problems of their own, the same due date and the new-assignment e-mail',
      parameters: [...id, ...csrf],
      requestBody: json({
        type: 'object', required: ['assigneeIds'],
        properties: {
          assigneeIds: { type: 'array', minItems: 1, maxItems: 200, items: { type: 'integer', minimum: 1 }, description: 'Active apprentices of the team who do not have the assignment yet' },
          timeZone: { type: 'string', maxLength: 64, description: "The lead's IANA time zone for the e-mail; default UTC" },
        },
      }),
      responses: {
        201: { description: 'The assignment with everyone\'s work; mailSent counts the notices the SMTP server accepted', ...json(assignment) },
        400: errorResponse('Not active apprentices of the team, an empty list or an unknown time zone'), 403: errorResponse('Not a lead or admin'), 404: errorResponse('Unknown or another team\'s'),
        409: errorResponse('Some of them already have it (named); nobody is added'),
      },
    },
  },
  '/api/training/assignments/{id}/work': {
    get: { summary: 'Your own problems of an assignment', parameters: id, responses: { 200: { description: 'Assignment and problems', ...json({ type: 'object', properties: { assignment, problems: { type: 'array', items: problem } } }) }, 404: errorResponse('Not assigned to you') } },
  },
  '/api/training/assignments/{id}/work/{userId}': {
    get: {
      summary: "One apprentice's work on an assignment, problem by problem, with hints used and the worked solution even while open (leads and admins; read only)",
      parameters: [...id, { name: 'userId', in: 'path', required: true, schema: { type: 'integer', minimum: 1 } }],
      responses: {
        200: { description: 'Assignment, apprentice and problems', ...json({ type: 'object', properties: { assignment, apprentice: { type: 'object', properties: { id: { type: 'integer' }, name: { type: 'string' } } }, problems: { type: 'array', items: { type: 'object', description: 'A problem as in /work, plus hintsUsed and solution {answer, exact, steps}' } } } }) },
        403: errorResponse('Not a lead or admin'),
        404: errorResponse('Not in your team, or not assigned to that apprentice'),
      },
    },
  },
  '/api/training/assignments/{id}/problems/{position}/hints': {
    post: { summary: 'Reveal the next derivation step of one of your problems (the answer step shows "?")', parameters: [...id, ...position, ...csrf], responses: { 200: { description: 'The problem with one more hint', ...json(problem) }, 404: errorResponse('Not yours'), 409: errorResponse('Closed, or every hint shown') } },
  },
  '/api/training/assignments/{id}/problems/{position}/attempts': {
    post: {
      summary: 'Answer one of your problems; graded on the server from the stored seed to the stated tolerance. Three answers at most; a correct one closes the problem and shows the worked solution.',
      parameters: [...id, ...position, ...csrf],
      requestBody: json({ type: 'object', required: ['answer'], properties: { answer: { type: 'string', description: 'A number; angles also as DMS, e.g. 7°30\'' } } }),
      responses: { 201: { description: 'Graded', ...json({ type: 'object', properties: { correct: { type: 'boolean' }, problem } }) }, 400: errorResponse('Not a readable number (no attempt used)'), 404: errorResponse('Not yours'), 409: errorResponse('The problem is closed') },
    },
  },
  '/api/training/scores': {
    get: {
      summary: 'Score table: every apprentice × every assignment, with late and missing work (leads and admins)',
      responses: { 200: { description: 'Table', ...json({ type: 'object', properties: { assignments: { type: 'array' }, rows: { type: 'array', items: { type: 'object', properties: { userId: { type: 'integer' }, name: { type: 'string' }, cells: { type: 'array', items: { type: 'object', properties: { assignmentId: { type: 'integer' }, assigned: { type: 'boolean' }, summary: { oneOf: [summary, { type: 'null' }] } } } } } } } } }) }, 403: errorResponse('Not a lead or admin') },
    },
  },
};
