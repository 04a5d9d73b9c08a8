/** OpenAPI paths for the set-up library, attachments, inventories and batch runs. */
const error = { $ref: '#/components/schemas/Error' };
const json = (schema: object) => ({ content: { 'application/json': { schema } } });
const err = (description: string) => ({ description, ...json(error) });
const csrf = [{ in: 'header', name: 'X-CSRF-Token', required: true, schema: { type: 'string' } }];
const id = [{ in: 'path', name: 'id', required: true, schema: { type: 'integer' } }];
const q = (name: string, schema: object, description: string) => ({ in: 'query', name, required: false, schema, description });
const decimal = { type: 'string', pattern: '^-?\\d{1,6}(\\.\\d{1,6})?$' };

const check = {
  type: 'object', required: ['key', 'label', 'unit', 'nominal', 'plus', 'minus'],
  properties: { key: { type: 'string' }, label: { type: 'string' }, unit: { enum: ['in', 'mm', 'deg'] }, nominal: { ...decimal, description: '0 or more (a size or angle measured on the part; 0 for flatness, runout…); an angle under 360' }, plus: { ...decimal, description: 'How far over nominal a part may be, 0 or more. Sent as ".002" or "+0.002" too; kept as "0.002"' }, minus: { ...decimal, description: 'How far under nominal a part may be, 0 or more, without a minus sign; ".002" is kept as "0.002"' } },
};
const setup = {
  type: 'object',
  properties: {
    id: { type: 'integer' }, name: { type: 'string' }, kind: { type: 'string' }, inputs: { type: 'object' }, notes: { type: 'string' }, job: { type: ['string', 'null'] },
    status: { enum: ['draft', 'released', 'archived'] }, version: { type: 'integer' }, checks: { type: 'array', items: check },
    ownerId: { type: 'integer' }, ownerName: { type: ['string', 'null'] }, releasedAt: { type: ['string', 'null'], format: 'date-time' }, releasedByName: { type: ['string', 'null'] },
    createdAt: { type: 'string', format: 'date-time' }, updatedAt: { type: 'string', format: 'date-time' },
  },
};
const attachment = {
  type: 'object',
  properties: {
    id: { type: 'integer' }, setupId: { type: 'integer' }, fileName: { type: 'string' }, contentType: { enum: ['application/pdf', 'image/png', 'image/jpeg'] },
    size: { type: 'integer' }, sha256: { type: 'string' }, hasThumbnail: { type: 'boolean' }, width: { type: ['integer', 'null'] }, height: { type: ['integer', 'null'] },
    uploadedById: { type: ['integer', 'null'] }, uploadedByName: { type: ['string', 'null'] }, createdAt: { type: 'string', format: 'date-time' },
  },
};
const inventorySet = { type: 'object', description: 'InventorySetDto: id, type, name, unit (in | mm | arcsec), standardSet, grade, wearBlockSize, wearBlockCount, notes, version, totals, blocks[] (id, size, label, count, missing, damaged, available, note).' };
const run = { type: 'object', description: 'BatchRunDto: id, setupId, setupName, setupVersion, label, partCount, status (open | closed), checks, startedByName, closedAt, closedByName, version, summary {entered, passed, failed}; on GET /:id also parts[] and stats[] (per check: n, mean, min, max, range, spreadFromFirst, stdDev, passCount, failCount, low, high, deviations[]). Numbers are decimal text.' };
const part = {
  type: 'object', required: ['values'],
  properties: {
    partNo: { type: 'integer', description: 'The part meant (409 if it was recorded meanwhile); default the lowest part not yet entered.' },
    touchOff: { ...decimal, type: ['string', 'null'] }, droAtStop: { ...decimal, type: ['string', 'null'] },
    values: { type: 'object', additionalProperties: decimal, description: 'One reading per check key of the run (all required); ".585" and "+0.5854" are read as 0.585 and 0.5854.' },
    note: { type: 'string' },
    confirm: { type: 'boolean', description: 'Record readings far from the nominal (more than half the nominal or ten tolerance bands away), refused otherwise.' },
  },
};
const correction = { ...part, required: ['values', 'revision'], properties: { ...part.properties, revision: { type: 'string', description: "The part's revision the correction is based on (from the part as loaded)." } } };
const setupPage = { type: 'object', properties: { setups: { type: 'array', items: setup }, total: { type: 'integer' }, page: { type: 'integer' }, pageSize: { type: 'integer' } } };
const setupBody = { type: 'object', required: ['name', 'kind', 'inputs', 'version'], properties: { name: { type: 'string' }, kind: { type: 'string' }, inputs: { type: 'object' }, notes: { type: 'string' }, job: { type: ['string', 'null'] }, checks: { type: 'array', items: check }, version: { type: 'integer', description: 'Required: the version the edit is based on.' } } };
const conflict = { description: 'Stale version: {error, version, setup}', ...json({ type: 'object', properties: { error: { type: 'string' }, version: { type: 'integer' }, setup } }) };
const inventoryPaths = (path: string, what: string) => ({
  [`/api/inventories/${path}`]: {
    post: { summary: `Add a ${what} set from a standard composition or a list of blocks (admin or lead)`, parameters: csrf, requestBody: json({ type: 'object', required: ['name'], properties: { name: { type: 'string' }, standardSet: { type: 'string' }, blocks: { type: 'array', items: { type: 'object', properties: { size: decimal, count: { type: 'integer' } } } }, unit: { enum: ['in', 'mm'] }, grade: { type: ['string', 'null'] }, wearBlockSize: decimal, wearBlockCount: { enum: [0, 2], description: 'Wear blocks come as a pair (one for each end of a stack) with a thickness, or none; a thickness alone means the pair' }, notes: { type: 'string' } } }), responses: { 201: { description: 'Created', ...json(inventorySet) }, 400: err('Invalid fields (unknown standard set, …)'), 403: err('Not an admin or lead'), 409: err('Name taken') } },
  },
  [`/api/inventories/${path}/{id}`]: {
    get: { summary: `One ${what} set with its blocks`, parameters: id, responses: { 200: { description: 'Set', ...json(inventorySet) }, 404: err('Unknown or another team\'s') } },
    put: { summary: 'Change name, grade, wear blocks, notes (admin or lead); wear blocks are a pair with a thickness or none', parameters: [...id, ...csrf], requestBody: json({ type: 'object', required: ['name', 'version'] }), responses: { 200: { description: 'Updated', ...json(inventorySet) }, 400: err('Invalid fields (a wear-block count other than 0 or 2, a count without a thickness, …)'), 403: err('Not an admin or lead'), 409: err('Stale version') } },
    delete: { summary: 'Delete the set (admin); refused while any saved set-up of the team, of any status, names it ("box:<id>")', parameters: [...id, ...csrf], responses: { 204: { description: 'Deleted' }, 403: err('Not an admin'), 409: err('Saved set-ups use the set: how many, and the first names') } },
  },
  [`/api/inventories/${path}/{id}/blocks/{blockId}`]: {
    patch: { summary: 'Mark blocks missing or damaged, change the count or note (admin or lead)', parameters: [...id, { in: 'path', name: 'blockId', required: true, schema: { type: 'integer' } }, ...csrf], requestBody: json({ type: 'object', properties: { count: { type: 'integer' }, missing: { type: 'integer' }, damaged: { type: 'integer' }, note: { type: 'string', maxLength: 200, description: 'Why blocks are missing or damaged; trimmed' } } }), responses: { 200: { description: 'The set after the change', ...json(inventorySet) }, 400: err('Missing + damaged exceed the count, or a note over 200 characters') } },
  },
});

export const libraryPaths = {
  '/api/setups': {
    get: {
      summary: 'The team\'s set-ups you may see, with search, filters, sort and paging (all query parameters optional; visibility applies before counting)',
      parameters: [
        q('q', { type: 'string' }, 'Words searched in name, job and notes (all must match)'), q('kind', { type: 'string' }, 'Area'), q('status', { enum: ['draft', 'released', 'archived'] }, 'Status'),
        q('ownerId', { type: 'integer' }, 'Owner'), q('job', { type: 'string' }, 'Exact job'), q('sort', { enum: ['name', 'kind', 'status', 'job', 'owner', 'updatedAt', 'createdAt'] }, 'Sort column (default updatedAt)'),
        q('dir', { enum: ['asc', 'desc'] }, 'Sort direction'), q('page', { type: 'integer', minimum: 1 }, '1-based page'), q('pageSize', { type: 'integer', minimum: 1, maximum: 100 }, 'Default 50'),
      ],
      responses: { 200: { description: '{setups, total, page, pageSize}', ...json(setupPage) }, 400: err('A bad query parameter, named in fields'), 401: err('Not signed in') },
    },
    post: { summary: 'Save a set-up (a draft)', parameters: csrf, requestBody: json({ ...setupBody, required: ['name', 'kind', 'inputs'] }), responses: { 201: { description: 'Created', ...json(setup) }, 400: err('Invalid fields'), 401: err('Not signed in'), 403: err('Missing CSRF token') } },
  },
  '/api/setups/owners': {
    get: {
      summary: 'Everyone who owns set-ups you may see, with how many (sorted by name): the choices of the list\'s ownerId filter',
      responses: { 200: { description: '{owners: [{id, name, count}]}', ...json({ type: 'object', properties: { owners: { type: 'array', items: { type: 'object', properties: { id: { type: 'integer' }, name: { type: 'string' }, count: { type: 'integer' } } } } } }) }, 401: err('Not signed in') },
    },
  },
  '/api/setups/{id}': {
    get: { summary: 'One set-up', parameters: id, responses: { 200: { description: 'Set-up', ...json(setup) }, 404: err('Unknown, another team\'s, or a draft you may not see') } },
    put: { summary: 'Change a set-up: version is required; editing released content makes a new draft for a lead to release; archived set-ups are read-only', parameters: [...id, ...csrf], requestBody: json(setupBody), responses: { 200: { description: 'Updated', ...json(setup) }, 400: err('Invalid fields (version missing, …)'), 403: err('Not yours to change'), 404: err('Unknown'), 409: conflict } },
    delete: { summary: 'Delete a draft that was never released, and its files (owner, lead or admin); a released or archived set-up, one released once (releasedVersion), or one with batch runs is refused with 409: a lead archives it instead', parameters: [...id, ...csrf], responses: { 204: { description: 'Deleted' }, 403: err('Not yours to delete'), 404: err('Unknown'), 409: err('Released, archived, released once or with batch runs: archive instead') } },
  },
  '/api/setups/{id}/release': { post: { summary: 'Release (lead or admin); body {version?}', parameters: [...id, ...csrf], responses: { 200: { description: 'Released', ...json(setup) }, 403: err('Not a lead or admin'), 404: err('Unknown'), 409: conflict, 422: err('Does not compute (with the reason: the team box it names is gone, …) or a check value has a negative nominal') } } },
  '/api/setups/{id}/archive': { post: { summary: 'Archive (lead or admin); body {version?}', parameters: [...id, ...csrf], responses: { 200: { description: 'Archived', ...json(setup) }, 403: err('Not a lead or admin'), 409: conflict } } },
  '/api/setups/{id}/revisions': { get: { summary: 'History: who, when, what changed (newest first)', parameters: id, responses: { 200: { description: '{revisions: [{id, version, action, status, userId, userName, createdAt, changes: [{field, from, to}]}]}' } } } },
  '/api/setups/{id}/export': { get: { summary: 'The set-up as a JSON file {format: "slantwise.setup/1", exportedAt, source, setup}', parameters: id, responses: { 200: { description: 'Download (Content-Disposition: attachment)' } } } },
  '/api/setups/import': { post: { summary: 'Import an exported set-up into your team as a draft', parameters: csrf, requestBody: json({ type: 'object', required: ['format', 'setup'] }), responses: { 201: { description: 'Created', ...json(setup) }, 400: err('Wrong format or invalid set-up fields') } } },
  '/api/setups/{id}/sheet.pdf': { get: { summary: 'Set-up sheet PDF: sketch, inputs, results, gauge stack, checks, derivation, notes, attachments, cautions, link back', parameters: id, responses: { 200: { description: 'application/pdf', content: { 'application/pdf': {} } }, 404: err('Unknown or not visible') } } },
  '/api/setups/{id}/attachments': {
    get: { summary: 'Drawings and photos of a set-up', parameters: id, responses: { 200: { description: '{attachments: [...]}', ...json({ type: 'object', properties: { attachments: { type: 'array', items: attachment } } }) } } },
    post: {
      summary: 'Upload one file (multipart field "file"): PDF, PNG or JPEG by content; owner, lead or admin',
      parameters: [...id, ...csrf],
      requestBody: { content: { 'multipart/form-data': { schema: { type: 'object', required: ['file'], properties: { file: { type: 'string', format: 'binary' } } } } } },
      responses: { 201: { description: 'Stored (sha256, thumbnail for images)', ...json(attachment) }, 400: err('No file / wrong field'), 403: err('May not change this set-up'), 413: err('Larger than UPLOAD_MAX_MB'), 415: err('Not a PDF, PNG or JPEG by content') },
    },
  },
  '/api/setups/{id}/attachments/{attachmentId}': {
    get: { summary: 'Download the file (?inline=1 to view); same access as the set-up', parameters: [...id, { in: 'path', name: 'attachmentId', required: true, schema: { type: 'integer' } }, q('inline', { enum: ['1'] }, 'Content-Disposition inline')], responses: { 200: { description: 'The file with its content type' }, 404: err('Unknown or not visible') } },
    delete: { summary: 'Remove the file (owner, lead or admin)', parameters: [...id, { in: 'path', name: 'attachmentId', required: true, schema: { type: 'integer' } }, ...csrf], responses: { 204: { description: 'Removed' }, 403: err('May not change this set-up') } },
  },
  '/api/setups/{id}/attachments/{attachmentId}/thumbnail': { get: { summary: 'JPEG thumbnail of an image (320 px)', parameters: [...id, { in: 'path', name: 'attachmentId', required: true, schema: { type: 'integer' } }], responses: { 200: { description: 'image/jpeg' }, 404: err('No thumbnail') } } },
  '/api/inventories': { get: { summary: 'The team\'s gauge-block and angle-block sets (totals, no blocks)', responses: { 200: { description: '{gaugeSets, angleSets}' } } } },
  '/api/inventories/standard-sets': { get: { summary: 'Standard compositions a set can start from', responses: { 200: { description: '{sets: [{id, name, type, unit, blocks, total, source, status}]}' } } } },
  ...inventoryPaths('gauge-sets', 'gauge-block'),
  ...inventoryPaths('angle-sets', 'angle-block'),
  '/api/inventories/gauge-sets/{id}/stack': {
    get: { summary: 'Fewest-block stack from the blocks in the box (missing and damaged left out; wear blocks unless wear=no)', parameters: [...id, { in: 'query', name: 'target', required: true, schema: decimal }, q('grade', { enum: ['K', '0', '1', '2'] }, 'Grade for the tolerance'), q('wear', { enum: ['yes', 'no'] }, 'Use the set\'s wear blocks')], responses: { 200: { description: 'The gauge-stack answer of /api/calc/gauge-stack plus inventory and excluded' }, 400: err('Bad target: each field\'s message leaves out its name ("must be at most 100000"); the error is the sentence'), 422: err('The box cannot make it') } },
  },
  '/api/inventories/angle-sets/{id}/combination': {
    get: { summary: 'Fewest angle blocks (added or reversed) from the blocks in the box', parameters: [...id, { in: 'query', name: 'angle', required: true, schema: { type: 'string' } }], responses: { 200: { description: 'The angle-blocks answer plus inventory and excluded' }, 400: err('Bad angle') } },
  },
  '/api/batches': {
    get: { summary: 'The team\'s batch runs', parameters: [q('setupId', { type: 'integer' }, 'Runs of one set-up'), q('status', { enum: ['open', 'closed'] }, 'Status')], responses: { 200: { description: '{batches: [...]}', ...json({ type: 'object', properties: { batches: { type: 'array', items: run } } }) } } },
    post: { summary: 'Start a run from a released set-up with check values (not apprentices)', parameters: csrf, requestBody: json({ type: 'object', required: ['setupId', 'partCount'], properties: { setupId: { type: 'integer' }, partCount: { type: 'integer', minimum: 1, maximum: 500 }, label: { type: 'string' } } }), responses: { 201: { description: 'Started', ...json(run) }, 400: err('Invalid fields'), 403: err('Apprentice'), 409: err('Set-up not released or without checks') } },
  },
  '/api/batches/{id}': { get: { summary: 'A run with its parts and statistics', parameters: id, responses: { 200: { description: 'Run', ...json(run) }, 404: err('Unknown') } } },
  '/api/batches/{id}/parts': { post: { summary: 'Record the next part (one transaction; numbers never repeat)', parameters: [...id, ...csrf], requestBody: json(part), responses: { 201: { description: '{part, run}' }, 400: err('Bad readings, named per field (values.<key>)'), 409: err('Run closed, part beyond the run or already entered; {error, run} as it is now') } } },
  '/api/batches/{id}/parts/{partNo}': { put: { summary: 'Correct an entered part while the run is open', parameters: [...id, { in: 'path', name: 'partNo', required: true, schema: { type: 'integer' } }, ...csrf], requestBody: json(correction), responses: { 200: { description: '{part, run}' }, 400: err('Bad readings, or no revision'), 404: err('Part not entered'), 409: err('Run closed, or the part changed since it was loaded; {error, run, part} as they are now') } } },
  '/api/batches/{id}/close': { post: { summary: 'Close the run (the machinist who started it, a lead or an admin); read-only afterwards', parameters: [...id, ...csrf], responses: { 200: { description: 'Closed', ...json(run) }, 403: err('Not allowed'), 409: err('Already closed') } } },
  '/api/batches/{id}/export.csv': { get: { summary: 'The run as CSV: one row per part, a column per check (band in the header)', parameters: id, responses: { 200: { description: 'text/csv', content: { 'text/csv': {} } } } } },
};
