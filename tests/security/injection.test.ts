/**
 * Hostile input in every stored text field: SQL-injection and script strings are stored and given
 * back verbatim as JSON, searched literally, printed as text on the set-up sheet and neutralised in
 * the CSV export. Path tricks in upload names, oversized and mistyped bodies, cookie flags and the
 * security headers of the app's HTML page complete the picture (sign-in basics: tests/api/auth.test.ts).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import { Attachment, User } from '../../server/models';
import { client, makeTeam, openApp, type Client, type Members, type TestApp } from '../support/api';
import { pdfText } from '../support/pdf-text';

const SQL = ["Robert'); DROP TABLE setups;--", '" OR ""="', "1' OR '1'='1", '50%_off \\ back\\slash', 'x\'; SELECT SLEEP(5); --'];
const XSS = ['<img src=x onerror="window.__xss=1">', '<script>window.__xss=1</script>', '"><svg/onload=alert(1)>', 'javascript:alert(1)', '{{constructor.constructor(\'alert(1)\')()}}'];
const FORMULA = ['=HYPERLINK("http://evil.test","click")', '+1+2', '-2+3', '@SUM(A1:A2)'];
const HOSTILE = [...SQL, ...XSS, ...FORMULA];

let t: TestApp;
let m: Members;
const c = {} as Record<'admin' | 'lead' | 'machinist', Client>;

beforeAll(async () => {
  t = openApp();
  m = await makeTeam('hostile');
  c.admin = await client(t.app, m.admin);
  c.lead = await client(t.app, m.lead);
  c.machinist = await client(t.app, m.machinist);
}, 60_000);
afterAll(() => t.close());

const send = (who: Client, method: 'post' | 'put' | 'patch', p: string, body: object) => who.agent[method](p).set('X-CSRF-Token', who.token).send(body);

function binary(res: request.Response, done: (err: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

/** Parses RFC 4180 CSV (quoted cells, doubled quotes, CRLF rows). */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') {
      row.push(cell);
      cell = '';
    } else if (ch === '\r' && text[i + 1] === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
      i++;
    } else cell += ch;
  }
  return rows;
}

describe('hostile text in stored fields', () => {
  it.each(HOSTILE)('stores set-up name, notes and job %j verbatim and gives them back as JSON', async (text) => {
    const created = await send(c.lead, 'post', '/api/setups', { name: text, notes: `${text}\n${text}`, job: text.slice(0, 80), kind: 'taper', inputs: { unit: 'in', note: text } }).expect(201);
    expect(created.headers['content-type']).toMatch(/^application\/json/);
    const got = await c.lead.agent.get(`/api/setups/${created.body.id}`).expect(200);
    expect(got.body).toMatchObject({ name: text, notes: `${text}\n${text}`, job: text.slice(0, 80), inputs: { unit: 'in', note: text } });
    // Searching for the text finds it literally (wildcards and quotes are not SQL).
    const found = await c.lead.agent.get('/api/setups').query({ q: text.slice(0, 100) }).expect(200);
    expect(found.body.setups.map((s: { id: number }) => s.id)).toContain(created.body.id);
  });

  it('keeps the tables intact after every hostile string (nothing was executed)', async () => {
    const list = await c.lead.agent.get('/api/setups').query({ pageSize: 100 }).expect(200);
    expect(list.body.total).toBe(HOSTILE.length);
    expect(new Set(list.body.setups.map((s: { name: string }) => s.name))).toEqual(new Set(HOSTILE));
  });

  it('stores inventory names and notes, batch labels and part notes, assignment titles and instructions verbatim', async () => {
    for (const [i, text] of HOSTILE.entries()) {
      const set = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: `${text} ${i}`, standardSet: 'inch-81', notes: text }).expect(201);
      const back = await c.admin.agent.get(`/api/inventories/gauge-sets/${set.body.id}`).expect(200);
      expect(back.body).toMatchObject({ name: `${text} ${i}`, notes: text });
      await send(c.admin, 'patch', `/api/inventories/gauge-sets/${set.body.id}/blocks/${back.body.blocks[0].id}`, { note: text.slice(0, 200) }).expect(200);
      const block = (await c.admin.agent.get(`/api/inventories/gauge-sets/${set.body.id}`).expect(200)).body.blocks[0];
      expect(block.note).toBe(text.slice(0, 200));

      const assignment = await send(c.lead, 'post', '/api/training/assignments', { title: text, instructions: text, items: [{ type: 'sine-stack', count: 1 }], dueAt: '2030-01-01T12:00:00Z', assigneeIds: [m.apprentice.id] }).expect(201);
      const a = await c.lead.agent.get(`/api/training/assignments/${assignment.body.id}`).expect(200);
      expect(a.body).toMatchObject({ title: text, instructions: text });
    }
    const sets = await c.admin.agent.get('/api/inventories').expect(200);
    expect(JSON.stringify(sets.body)).toContain(JSON.stringify(XSS[0]).slice(1, -1));
  });

  it('stores an invitation address with quote characters verbatim and refuses markup in one, naming the field', async () => {
    const email = `o'hara-${m.team.id}@example.test`;
    const ok = await send(c.admin, 'post', '/api/team/invitations', { email, role: 'apprentice' }).expect(201);
    expect(ok.body.invitation.email).toBe(email);
    const list = await c.admin.agent.get('/api/team/invitations').expect(200);
    expect(list.body.invitations.map((i: { email: string }) => i.email)).toContain(email);
    for (const bad of ['<script>@example.test', "x' OR 1=1 --@example.test", '"><svg/onload=alert(1)>@x.test']) {
      const res = await send(c.admin, 'post', '/api/team/invitations', { email: bad, role: 'apprentice' }).expect(400);
      expect(res.body.fields.email).toBeDefined();
    }
  });

  it('prints hostile names as plain text on the set-up sheet PDF, with no script or launch actions', async () => {
    const name = XSS[0]!;
    const s = await send(c.lead, 'post', '/api/setups', { name, notes: XSS[1], job: SQL[0]!.slice(0, 80), kind: 'taper', inputs: { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' } }).expect(201);
    const res = await c.lead.agent.get(`/api/setups/${s.body.id}/sheet.pdf`).buffer(true).parse(binary).expect(200);
    const pdf = res.body as Buffer;
    const text = pdfText(pdf);
    expect(text).toContain(name);
    expect(text).toContain(SQL[0]!.slice(0, 40));
    expect(pdf.toString('latin1')).not.toMatch(/\/(JavaScript|JS|Launch|SubmitForm|ImportData)\b/);
  });

  it('neutralises formula cells in the batch CSV (labels, operator names, notes) and keeps negative numbers as numbers', async () => {
    // An operator whose name starts like a formula (names come from accepted invitations).
    await User.update({ name: '=cmd|\' /C calc\'!A0' }, { where: { id: m.machinist.id } });
    const checks = [{ key: 'face', label: '=1+1 face', unit: 'in', nominal: '0', plus: '0.0010', minus: '0.0010' }];
    const s = await send(c.lead, 'post', '/api/setups', { name: 'CSV check', kind: 'taper', inputs: { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' }, checks }).expect(201);
    await send(c.lead, 'post', `/api/setups/${s.body.id}/release`, {}).expect(200);
    const run = await send(c.machinist, 'post', '/api/batches', { setupId: s.body.id, partCount: FORMULA.length }).expect(201);
    for (const note of FORMULA) await send(c.machinist, 'post', `/api/batches/${run.body.id}/parts`, { values: { face: '-0.0021' }, touchOff: '-0.5000', note }).expect(201);
    const res = await c.machinist.agent.get(`/api/batches/${run.body.id}/export.csv`).expect(200);
    const rows = parseCsv(res.text);
    expect(rows).toHaveLength(FORMULA.length + 1);
    const bad = rows.flat().filter((cell) => /^[=+@\t\r]/.test(cell) || (cell.startsWith('-') && !/^-\d+(\.\d+)?$/.test(cell)));
    expect(bad).toEqual([]);
    // The text is kept, after the neutralising apostrophe.
    const noteAt = rows[0]!.indexOf('note');
    expect(rows.slice(1).map((r) => r[noteAt])).toEqual(FORMULA.map((f) => `'${f}`));
    expect(rows[1]).toContain(`'${'=cmd|\' /C calc\'!A0'}`);
    expect(rows[0]!.find((h) => h.includes('face'))).toMatch(/^'=1\+1 face/);
    expect(rows[1]).toContain('-0.0021');
    expect(rows[1]).toContain('-0.5000');
  });
});

describe('path tricks in upload names', () => {
  let setupId: number;
  let png: Buffer;
  const pdf = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n', 'latin1');

  beforeAll(async () => {
    setupId = (await send(c.lead, 'post', '/api/setups', { name: 'Upload names', kind: 'taper', inputs: {} }).expect(201)).body.id;
    png = await sharp({ create: { width: 4, height: 4, channels: 3, background: { r: 9, g: 9, b: 9 } } }).png().toBuffer();
  });

  /**
   * A multipart body written by hand: client libraries strip folders from file names, and the
   * point here is what the server does with the name exactly as an attacker sends it.
   */
  function rawUpload(dispositionParams: string, bytes: Buffer) {
    const boundary = '----slantwise-test-boundary';
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; ${dispositionParams}\r\nContent-Type: application/octet-stream\r\n\r\n`, 'latin1'),
      bytes,
      Buffer.from(`\r\n--${boundary}--\r\n`, 'latin1'),
    ]);
    return c.lead.agent.post(`/api/setups/${setupId}/attachments`).set('X-CSRF-Token', c.lead.token).set('Content-Type', `multipart/form-data; boundary=${boundary}`).send(body);
  }

  it.each([
    ['filename="../../etc/passwd.png"', 'passwd.png'],
    ['filename="..\\..\\x.pdf"', 'x.pdf'],
    ['filename="/absolute/root.png"', 'root.png'],
    [`filename="${'n'.repeat(1_000)}.png"`, `${'n'.repeat(196)}.png`],
    ["filename*=UTF-8''..%2F..%2F..%2Fetc%2Fshadow.pdf", 'shadow.pdf'],
    ["filename*=UTF-8''evil%0D%0ASet-Cookie%3A%20x%3D1.png", 'evilSet-Cookie: x=1.png'],
  ])('stores %s under a server-made key, shows %j and serves a safe Content-Disposition', async (params, shown) => {
    const bytes = shown.endsWith('.pdf') ? pdf : png;
    const up = await rawUpload(params, bytes).expect(201);
    expect(up.body.fileName).toBe(shown);
    const row = await Attachment.findByPk(up.body.id);
    expect(row!.storageKey).toMatch(new RegExp(`^teams/${m.team.id}/setups/${setupId}/[0-9a-f-]{36}$`));
    expect(row!.storageKey).not.toContain(shown.slice(0, 5));
    const dl = await c.lead.agent.get(`/api/setups/${setupId}/attachments/${up.body.id}`).buffer(true).parse(binary).expect(200);
    const disposition = String(dl.headers['content-disposition']);
    expect(disposition).toMatch(/^attachment; filename=("[^"\\/\r\n\u0000]*"|[^";\\/\s]+)(; filename\*=UTF-8''[\w%.!~*'()-]+)?$/);
    expect((dl.body as Buffer).equals(bytes)).toBe(true);
  });

  it('answers 400 naming the file, never 5xx, when the name is only dots or the part header is malformed', async () => {
    const dots = await rawUpload('filename=".."', png).expect(400);
    expect(dots.body.fields.file).toBeDefined();
    // NUL and control bytes in a part header make the form unreadable: a clear 400, not a server error.
    const nul = await rawUpload('filename="a\u0000b\u0001c.png"', png).expect(400);
    expect(nul.body.fields.file).toMatch(/multipart/);
    const broken = await rawUpload('filename="a\r\nb.png"\r\nContent-Disposition: form-data; name="other"', png);
    expect(broken.status).toBeGreaterThanOrEqual(400);
    expect(broken.status).toBeLessThan(500);
    expect(broken.headers['content-type']).toMatch(/json/);
  });

  it('writes nothing outside the upload folder and only server-made names inside it', () => {
    const root = path.resolve(t.config.uploads.dir);
    const all = (fs.readdirSync(root, { recursive: true }) as string[]).filter((f) => fs.statSync(path.join(root, f)).isFile());
    const odd = all.filter((f) => !/^teams\/\d+\/setups\/\d+\/[0-9a-f-]{36}(-thumb)?(\.[0-9a-f]{12}\.part)?$/.test(f.split(path.sep).join('/')));
    expect(odd).toEqual([]);
    expect(fs.existsSync(path.resolve(root, '../../etc/passwd.png'))).toBe(false);
    expect(fs.existsSync(path.resolve(root, '..', 'x.pdf'))).toBe(false);
  });
});

describe('request bodies', () => {
  it('refuses an oversized JSON body on a signed-in route with a JSON 413, storing nothing', async () => {
    const before = (await c.machinist.agent.get('/api/setups').expect(200)).body.total;
    const res = await send(c.machinist, 'post', '/api/setups', { name: 'Big', kind: 'taper', inputs: {}, notes: 'x'.repeat(150_000) }).expect(413);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body.error).toMatch(/too large/);
    expect((await c.machinist.agent.get('/api/setups').expect(200)).body.total).toBe(before);
  });

  it('answers a body under the size limit but over a field limit with 400 naming the field', async () => {
    const res = await send(c.machinist, 'post', '/api/setups', { name: 'Long notes', kind: 'taper', inputs: {}, notes: 'x'.repeat(20_000) }).expect(400);
    expect(res.body.fields.notes).toMatch(/10,000/);
  });

  it('answers bodies of the wrong content type with a JSON 4xx', async () => {
    const text = await c.machinist.agent.post('/api/setups').set('X-CSRF-Token', c.machinist.token).set('Content-Type', 'text/plain').send('name=x').expect(400);
    expect(text.body.error).toMatch(/JSON object/);
    const form = await c.machinist.agent.post('/api/setups').set('X-CSRF-Token', c.machinist.token).type('form').send({ name: 'x', kind: 'taper' }).expect(400);
    expect(form.body.error).toMatch(/JSON object/);
    const charset = await c.machinist.agent.post('/api/setups').set('X-CSRF-Token', c.machinist.token).set('Content-Type', 'application/json; charset=iso-8859-1').send('{}');
    expect(charset.status).toBe(415);
    expect(charset.body.error).toMatch(/charset/i);
    const list = await c.machinist.agent.post('/api/setups').set('X-CSRF-Token', c.machinist.token).send([{ name: 'x' }]).expect(400);
    expect(list.body.error).toMatch(/JSON object/);
  });
});

// Keep this block last: openApp() here rebinds the models to a short-lived connection.
describe('cookies and headers', () => {
  it('gives the signed-in session cookie the same flags as the first one', async () => {
    const agent = request.agent(t.app).set('X-Forwarded-For', '10.99.0.1');
    const csrf = await agent.get('/api/auth/csrf').expect(200);
    const login = await agent.post('/api/auth/login').set('X-CSRF-Token', csrf.body.token).send({ email: m.apprentice.email, password: 'correct-horse-battery' }).expect(200);
    const cookie = String(login.headers['set-cookie']);
    expect(cookie).toMatch(/^slantwise\.sid=/);
    expect(cookie).toMatch(/; HttpOnly/);
    expect(cookie).toMatch(/; SameSite=Lax/);
    expect(cookie).toMatch(/; Path=\//);
    expect(cookie).not.toMatch(/Domain=/);
  });

  it('with SECURE_COOKIES=true never sends the cookie over plain HTTP, and marks it Secure over TLS', async () => {
    const secure = openApp({ secureCookies: true });
    try {
      const plain = await request(secure.app).get('/api/auth/csrf').expect(200);
      expect(plain.headers['set-cookie']).toBeUndefined();
      const tls = await request(secure.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https').expect(200);
      expect(String(tls.headers['set-cookie'])).toMatch(/^slantwise\.sid=.*; Secure/);
    } finally {
      await secure.close();
    }
  });

  it('sends the security headers on the HTML app page and its client-side routes too', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'slantwise-static-'));
    fs.writeFileSync(path.join(dir, 'index.html'), '<!doctype html><html><head><title>Slantwise</title></head><body><sw-root></sw-root></body></html>');
    const site = openApp({ staticDir: dir });
    try {
      for (const page of ['/', '/library/12', '/team']) {
        const res = await request(site.app).get(page).expect(200);
        expect(res.headers['content-type']).toMatch(/text\/html/);
        const csp = String(res.headers['content-security-policy']);
        expect(csp).toMatch(/default-src 'self'/);
        expect(csp).toMatch(/script-src 'self'(;|$)/);
        expect(csp).toMatch(/object-src 'none'/);
        expect(csp).toMatch(/frame-ancestors 'none'/);
        expect(csp).toMatch(/base-uri 'self'/);
        expect(csp).not.toMatch(/unsafe-eval|script-src[^;]*unsafe-inline/);
        expect(res.headers['x-content-type-options']).toBe('nosniff');
        expect(res.headers['referrer-policy']).toBe('no-referrer');
        expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
        expect(res.headers['cross-origin-opener-policy']).toBe('same-origin');
        expect(res.headers['x-powered-by']).toBeUndefined();
      }
    } finally {
      await site.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
