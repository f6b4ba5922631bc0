// The ceilings of this machine for `npm run bench`, each in a process of its own like the app:
//   `baseline-http`: a bare Node `http` handler returning a fixed JSON body;
//   `baseline-express-pg`: a bare Express 5 handler running one trivial query through a `pg` pool
//   (the same pool size as the app's default).
// Usage: node --import tsx tests/bench/baseline-server.ts <http|express-pg> <port> [DATABASE_URL]
import http from 'node:http';
import express from 'express';
import pg from 'pg';

const [mode, portArg, databaseUrl] = process.argv.slice(2);
const port = Number(portArg);
const body = JSON.stringify({ ok: true, name: 'baseline', items: [1, 2, 3] });

if (mode === 'http') {
  http
    .createServer((_req, res) => {
      res.writeHead(200, { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) });
      res.end(body);
    })
    .listen(port, '127.0.0.1', () => console.log('ready'));
} else if (mode === 'express-pg') {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 10 });
  const app = express();
  app.get('/', async (_req, res) => {
    const { rows } = await pool.query<{ one: number }>('select 1 as one');
    res.json({ ok: rows[0]?.one === 1 });
  });
  app.listen(port, '127.0.0.1', () => console.log('ready'));
} else {
  console.error('mode must be http or express-pg');
  process.exit(2);
}
