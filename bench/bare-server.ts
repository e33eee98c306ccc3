/**
 * The baseline of the API benchmark: bare Express answering each route with the very bytes Kindloop
 * answered it with, no session, no database. Started by bench/api.ts as a process of its own.
 *   BARE_PORT=3413 BARE_BODIES=/tmp/bodies.json tsx bench/bare-server.ts
 */
import fs from 'node:fs';
import express from 'express';

/** Route i of the benchmark is served at /r/i. */
const bodies = (JSON.parse(fs.readFileSync(process.env.BARE_BODIES!, 'utf8')) as string[]).map((b) => Buffer.from(b, 'base64'));
const app = express();
app.disable('x-powered-by');
bodies.forEach((body, i) => {
  app.get(`/r/${i}`, (_req, res) => {
    res.type('application/json').send(body);
  });
});
app.listen(Number(process.env.BARE_PORT), '127.0.0.1', () => console.log('bare server ready'));
