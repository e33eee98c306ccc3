import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';

/**
 * Who may pass each route's gate. 'ok' means the role gets past the gate (the answer may still be
 * 400 or 404 for the dummy input sent here); a number is the exact refusal expected.
 * Every route the app mounts must appear here: a route missing from this table fails the test.
 */
type Expect = 'ok' | 401 | 403;
type Row = [anonymous: Expect, volunteer: Expect, organiser: Expect, coordinator: Expect];
const PUBLIC: Row = ['ok', 'ok', 'ok', 'ok'];
const SIGNED_IN: Row = [401, 'ok', 'ok', 'ok'];
const STAFF: Row = [401, 403, 'ok', 'ok'];
const COORDINATOR: Row = [401, 403, 403, 'ok'];

const matrix: Record<string, Row> = {
  'GET /api/drive': PUBLIC,
  'GET /api/drive/progress': STAFF,
  'GET /api/drive/glance': STAFF,
  'GET /api/drive/glance/weeks': STAFF,
  'GET /api/health': PUBLIC,
  'GET /api/map': PUBLIC,
  'GET /api/auth/csrf': PUBLIC,
  'POST /api/auth/register': PUBLIC,
  'POST /api/auth/login': PUBLIC,
  'POST /api/auth/logout': PUBLIC,
  'GET /api/auth/me': SIGNED_IN,
  'POST /api/auth/password-reset': PUBLIC,
  'POST /api/auth/password-reset/confirm': PUBLIC,
  'GET /api/users': COORDINATOR,
  'PATCH /api/users/:id': COORDINATOR,
  'GET /api/users/me/thank-you-mail': SIGNED_IN,
  'PUT /api/users/me/thank-you-mail': SIGNED_IN,
  'GET /api/mail/caught': COORDINATOR,
  'GET /api/mail/caught/:id': COORDINATOR,
  'GET /api/mail/outbox': COORDINATOR,
  'POST /api/mail/outbox/:id/send-again': COORDINATOR,
  'POST /api/mail/outbox/:id/give-up': COORDINATOR,
  'POST /api/tools/border-fit': PUBLIC,
  'POST /api/tools/size-from-gauge': PUBLIC,
  'POST /api/tools/yarn-estimate': PUBLIC,
  'GET /api/plans': SIGNED_IN,
  'POST /api/plans': SIGNED_IN,
  'GET /api/plans/:id': SIGNED_IN,
  'DELETE /api/plans/:id': SIGNED_IN,
  'GET /api/needs': SIGNED_IN,
  'GET /api/pledges': SIGNED_IN,
  'POST /api/pledges': SIGNED_IN,
  'GET /api/pledges/:id': SIGNED_IN,
  'PATCH /api/pledges/:id': SIGNED_IN,
  'DELETE /api/pledges/:id': SIGNED_IN,
  'GET /api/blankets': SIGNED_IN,
  'POST /api/blankets': SIGNED_IN,
  'GET /api/blankets/:id': SIGNED_IN,
  'PATCH /api/blankets/:id': SIGNED_IN,
  'POST /api/blankets/:id/photos': SIGNED_IN,
  'GET /api/blankets/:id/photos/:photoId': SIGNED_IN,
  'DELETE /api/blankets/:id/photos/:photoId': SIGNED_IN,
  'GET /api/recipients': SIGNED_IN,
  'POST /api/recipients': STAFF,
  'GET /api/recipients/:id': SIGNED_IN,
  'PATCH /api/recipients/:id': STAFF,
  'PUT /api/recipients/:id/guidelines': STAFF,
  'POST /api/recipients/:id/needs': STAFF,
  'PATCH /api/recipients/:id/needs/:needId': STAFF,
  'DELETE /api/recipients/:id/needs/:needId': STAFF,
  'GET /api/sites': SIGNED_IN,
  'POST /api/sites': COORDINATOR,
  'GET /api/sites/:id': SIGNED_IN,
  'PATCH /api/sites/:id': COORDINATOR,
  'POST /api/guidelines/check': SIGNED_IN,
  'GET /api/blankets/tags': SIGNED_IN,
  'GET /api/blankets/by-code/:code': STAFF,
  'POST /api/blankets/:id/intake': STAFF,
  'POST /api/blankets/:id/inspection': STAFF,
  'GET /api/intake/queue': STAFF,
  'GET /api/drive/clock': PUBLIC,
  'PUT /api/drive/clock': COORDINATOR,
  'PUT /api/drive/clock/now': COORDINATOR,
  'POST /api/bookings/:id/missed': STAFF,
  'GET /api/sites/:id/slots': SIGNED_IN,
  'GET /api/slots/soonest': SIGNED_IN,
  'GET /api/bookings': SIGNED_IN,
  'POST /api/bookings': SIGNED_IN,
  'GET /api/bookings/reminders': SIGNED_IN,
  'PUT /api/bookings/reminders': SIGNED_IN,
  'GET /api/bookings/:id': SIGNED_IN,
  'PATCH /api/bookings/:id': SIGNED_IN,
  'DELETE /api/bookings/:id': SIGNED_IN,
  'GET /api/assignments': STAFF,
  'POST /api/assignments': STAFF,
  'POST /api/assignments/batch': STAFF,
  'PATCH /api/assignments/:id': STAFF,
  'DELETE /api/assignments/:id': STAFF,
  'GET /api/assignments/board/needs': STAFF,
  'GET /api/assignments/board/waiting': STAFF,
  'POST /api/matching/suggest': STAFF,
  'GET /api/runs': STAFF,
  'GET /api/runs/waiting': STAFF,
  'POST /api/runs': COORDINATOR,
  'GET /api/runs/:id': STAFF,
  'PATCH /api/runs/:id': COORDINATOR,
  'POST /api/runs/:id/route': COORDINATOR,
  'POST /api/runs/:id/stops': COORDINATOR,
  'DELETE /api/runs/:id/stops/:stopId': COORDINATOR,
  'POST /api/runs/:id/blankets': COORDINATOR,
  'DELETE /api/runs/:id/blankets/:blanketId': COORDINATOR,
  'POST /api/runs/:id/stops/:stopId/packed': STAFF,
  'DELETE /api/runs/:id/stops/:stopId/packed': STAFF,
  'POST /api/runs/:id/stops/:stopId/delivered': STAFF,
  'DELETE /api/runs/:id/stops/:stopId/delivered': STAFF,
  'GET /api/runs/:id/manifest.csv': STAFF,
  'GET /api/recipients/:id/manifest.csv': STAFF,
  'GET /api/exports': STAFF,
  'GET /api/exports/:id': STAFF,
};

const ROLES = ['anonymous', 'volunteer', 'organiser', 'coordinator'] as const;
// Routes that end a session or burn a rate limit are probed with a fresh client each time.
const fill = (path: string) => path.replace(/:[A-Za-z]+/g, '999999');

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t.close());

describe('role matrix', () => {
  it('lists every mounted route', () => {
    const mounted = t.app.locals.routes.map((r) => `${r.method.toUpperCase()} ${r.path}`);
    const missing = mounted.filter((k) => !(k in matrix));
    const stale = Object.keys(matrix).filter((k) => !mounted.includes(k));
    expect(missing, 'routes without a row in the role matrix').toEqual([]);
    expect(stale, 'rows for routes that no longer exist').toEqual([]);
  });

  for (const [key, row] of Object.entries(matrix)) {
    it(`${key}: ${row.join(' / ')}`, async () => {
      const [method, path] = key.split(' ');
      for (let i = 0; i < ROLES.length; i++) {
        const role = ROLES[i];
        let res;
        if (role === 'anonymous') {
          const agent = request.agent(t.app);
          const token = (await agent.get('/api/auth/csrf')).body.csrfToken;
          res = await agent[method.toLowerCase() as 'get'](fill(path)).set('X-CSRF-Token', token).send({});
        } else {
          const c: Client = await signedIn(t.app, role);
          const m = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
          res = m === 'get' ? await c.get(fill(path)) : m === 'delete' ? await c.delete(fill(path)) : await c[m](fill(path), {});
        }
        const expected = row[i];
        if (expected === 'ok') expect([401, 403], `${role} should pass the gate of ${key}, got ${res.status}`).not.toContain(res.status);
        else expect(res.status, `${role} on ${key}`).toBe(expected);
        expect(res.status, `${role} on ${key} must never be a server error`).toBeLessThan(500);
      }
    });
  }
});
