/** The ceiling for the load benchmark: a bare Express route that does nothing but answer JSON. */
import express from 'express';

const app = express();
app.disable('x-powered-by');
app.get('/bare', (_req, res) => {
  res.json({ ok: true });
});
const server = app.listen(Number(process.env['PORT'] ?? 0), '127.0.0.1', () => {
  const addr = server.address();
  console.log(`LISTENING ${typeof addr === 'object' && addr ? addr.port : ''}`);
});
process.once('SIGTERM', () => server.close(() => process.exit(0)));
