import { describe, expect, it } from 'vitest';
import express, { type ErrorRequestHandler, type RequestHandler } from 'express';
import helmet from 'helmet';
import request from 'supertest';
import { fixedHeaders, inTurn } from '../../server/lib/middleware-chain';
import { SECURITY_HEADERS } from '../../server/app';

const answer: RequestHandler = (_req, res) => void res.json({ ok: true });
const errors: ErrorRequestHandler = (err: Error, _req, res, _next) => void res.status(418).json({ error: err.message });

describe('helmet worked out once', () => {
  it('sets exactly the headers helmet sets itself, with the same values', async () => {
    const live = express().use(helmet(SECURITY_HEADERS)).get('/', answer);
    const once = express().use(fixedHeaders(helmet(SECURITY_HEADERS))).get('/', answer);
    const { date: _a, ...expected } = (await request(live).get('/')).headers;
    const { date: _b, ...got } = (await request(once).get('/')).headers;
    expect(got).toEqual(expected);
    expect(got['content-security-policy']).toContain("img-src 'self' data: blob:");
    expect(got['x-powered-by']).toBeUndefined();
  });

  it('refuses, at start, a middleware that reads the request or never passes it on', () => {
    expect(() => fixedHeaders((req, _res, next) => (req.headers.host ? next() : next()))).toThrow(/more than set headers/);
    expect(() => fixedHeaders(() => undefined)).toThrow(/did not pass/);
  });
});

describe('middlewares run in turn as one', () => {
  const app = (handlers: RequestHandler[]) => express().use('/api', inTurn(handlers)).get('/api/x', answer).use(errors);
  const mark = (name: string): RequestHandler => (_req, res, next) => {
    res.append('X-Ran', name);
    next();
  };

  it('runs each in order, then the route', async () => {
    const res = await request(app([mark('a'), mark('b'), mark('c')])).get('/api/x');
    expect(res.status).toBe(200);
    expect(res.headers['x-ran']).toBe('a, b, c');
  });

  it('hands an error passed on, thrown or rejected to the error handler and runs nothing after it', async () => {
    const passed: RequestHandler = (_req, _res, next) => next(new Error('passed on'));
    const thrown: RequestHandler = () => {
      throw new Error('thrown');
    };
    const rejected: RequestHandler = async () => {
      throw new Error('rejected');
    };
    for (const [failing, message] of [[passed, 'passed on'], [thrown, 'thrown'], [rejected, 'rejected']] as const) {
      const res = await request(app([mark('a'), failing, mark('c')])).get('/api/x');
      expect(res.status).toBe(418);
      expect(res.body.error).toBe(message);
      expect(res.headers['x-ran']).toBe('a');
    }
  });

  it('sees the path below its mount point, as a layer would', async () => {
    let seen = '';
    await request(app([(req, _res, next) => ((seen = req.url), next())])).get('/api/x?y=1');
    expect(seen).toBe('/x?y=1');
  });
});
