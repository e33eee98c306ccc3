import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Recipient } from '../../server/db/models/recipient';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import { BlanketEvent } from '../../server/db/models/blanket-event';
import { Drive } from '../../server/db/models/drive';
import { MANIFEST_COLUMNS } from '../../server/modules/runs/manifest-format';
import type { ExportView, RunView } from '@shared/schemas/run';
import type { Page } from '@shared/schemas/page';
import { assignedBlanket } from '../fixtures/runs';

let t: TestApp;
let coordinator: Client;
let organiser: Client;
let volunteer: Client;
let run: RunView;
let shelter: Recipient;
let latestChecker: string;

/** supertest buffers text/csv as a string; keep the raw bytes to see the BOM and CRLFs. */
const raw = (c: Client, url: string) =>
  c.agent.get(url).buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (d: Buffer) => chunks.push(d));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });

beforeAll(async () => {
  t = await makeTestApp();
  coordinator = await signedIn(t.app, 'coordinator');
  organiser = await signedIn(t.app, 'organiser');
  volunteer = await signedIn(t.app, 'volunteer');
  const maker = (await User.findOne({ where: { email: 'maren@example.org' } }))!;
  const anonymousMaker = (await User.findOne({ where: { email: 'tobias@example.org' } }))!;
  shelter = (await Recipient.findOne({ where: { kind: 'family-shelter' } }))!;
  const site = (await Site.findOne())!;
  // Names, colours and a recipient that a spreadsheet would take for formulas (OWASP CSV Injection).
  await maker.update({ name: '@Mallory Formula' });
  // An address on two lines: quoted in the file, and still one row for one blanket.
  await shelter.update({ name: '+Harbour Lantern, "east" door', address: '4 Quay Row\nThimbleford' });
  const checkedOne = await assignedBlanket(maker.id, shelter.id, { colours: '=HYPERLINK("http://bad.example.org","x")', measuredWidthCm: 78.5, measuredLengthCm: 101 });
  const checkers = await User.findAll({ where: { role: 'organiser' }, order: [['id', 'ASC']], limit: 2 });
  // Checked twice (sent back, checked again): the latest check names who and when.
  await BlanketEvent.create({ blanketId: checkedOne.id, actorId: checkers[0]!.id, kind: 'inspection', fromStatus: 'received', toStatus: 'checked', createdAt: new Date('2026-11-28T23:30:00Z') });
  await BlanketEvent.create({ blanketId: checkedOne.id, actorId: checkers[0]!.id, kind: 'inspection', fromStatus: 'checked', toStatus: 'received', createdAt: new Date('2026-11-29T09:00:00Z') });
  await BlanketEvent.create({ blanketId: checkedOne.id, actorId: checkers[checkers.length - 1]!.id, kind: 'inspection', fromStatus: 'received', toStatus: 'checked', createdAt: new Date('2026-11-30T10:15:00Z') });
  latestChecker = checkers[checkers.length - 1]!.name;
  await assignedBlanket(anonymousMaker.id, shelter.id, { colours: '-2+3 stripes', labelName: 'anonymous' });
  await assignedBlanket(maker.id, shelter.id, { colours: 'cream and moss' });
  // Measured at intake on one side only, and not for a smoke-free or a pet-free home.
  await assignedBlanket(maker.id, shelter.id, { colours: 'one side measured', measuredWidthCm: 70, smokeFree: false, petFree: false, dryerSafe: false });
  const res = await coordinator.post('/api/runs', { runDate: '2026-12-20', driverId: maker.id, startSiteId: site.id, recipientIds: [shelter.id] });
  run = res.body.run;
});
afterAll(async () => t.close());

describe('GET /api/runs/:id/manifest.csv', () => {
  it('is RFC 4180 CSV with our columns, one row per blanket, parsed back by csv-parse', async () => {
    const res = await raw(coordinator, `/api/runs/${run.id}/manifest.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="kindloop-run-\d+-2026-12-20-made-\d{4}-\d\d-\d\d-[0-9a-f]{6}\.csv"/);
    expect(run.blanketCount).toBeGreaterThanOrEqual(3);
    expect(res.headers['x-manifest-rows']).toBe(String(run.blanketCount));
    const text = (res.body as Buffer).toString('utf8');
    expect(text.charCodeAt(0)).not.toBe(0xfeff);
    expect(text.endsWith('\r\n')).toBe(true);
    const rows = parse(text, { record_delimiter: ['\r\n', '\n', '\r'] }) as string[][];
    expect(rows[0]).toEqual([...MANIFEST_COLUMNS]);
    expect(rows).toHaveLength(run.blanketCount + 1);
    const col = (name: (typeof MANIFEST_COLUMNS)[number]) => MANIFEST_COLUMNS.indexOf(name);
    for (const r of rows.slice(1)) {
      expect(r[col('Run date')]).toBe('2026-12-20');
      expect(r[col('Stop')]).toBe('1');
      expect(r[col('Box')]).toBe('1');
      expect(r[col('Blanket code')]).toMatch(/^KL-/);
      expect(r[col('Address')]).toBe('4 Quay Row\nThimbleford');
    }
    // The blanket re-measured at intake and checked twice: its size on record, the latest check.
    const checked = rows.find((r) => r[col('Colours')]!.includes('HYPERLINK'))!;
    expect([checked[col('Width (cm)')], checked[col('Length (cm)')], checked[col('Width (in)')], checked[col('Length (in)')]]).toEqual(['78.5', '101', '30.9', '39.8']);
    expect([checked[col('Checked by')], checked[col('Checked on')]]).toEqual([latestChecker, '2026-11-30']);
    const unchecked = rows.find((r) => r[col('Colours')] === 'cream and moss')!;
    expect([unchecked[col('Checked by')], unchecked[col('Checked on')]]).toEqual(['', '']);
    // One side measured is no size on record: the logged 80 × 100 cm stands (sizeOnRecord).
    const half = rows.find((r) => r[col('Colours')] === 'one side measured')!;
    expect([half[col('Width (cm)')], half[col('Length (cm)')], half[col('Width (in)')], half[col('Length (in)')]]).toEqual(['80', '100', '31.5', '39.4']);
    const care = ['Machine washable', 'Dryer safe', 'Smoke-free home', 'Pet-free home'] as const;
    expect(care.map((c) => half[col(c)])).toEqual(['yes', 'no', 'no', 'no']);
    expect(care.map((c) => unchecked[col(c)])).toEqual(['yes', 'yes', 'yes', 'yes']);
  });

  it("gives the check's day in the drive's zone, not in UTC (decision 0015)", async () => {
    const drive = (await Drive.findOne({ order: [['id', 'ASC']] }))!;
    const zone = drive.timeZone;
    // 10:15 UTC on 30 November is a quarter past midnight on 1 December fourteen hours east of UTC.
    await drive.update({ timeZone: 'Etc/GMT-14' });
    try {
      const text = ((await raw(coordinator, `/api/runs/${run.id}/manifest.csv`)).body as Buffer).toString('utf8');
      const rows = parse(text) as string[][];
      const checked = rows.find((r) => r[MANIFEST_COLUMNS.indexOf('Colours')]!.includes('HYPERLINK'))!;
      expect(checked[MANIFEST_COLUMNS.indexOf('Checked on')]).toBe('2026-12-01');
    } finally {
      await drive.update({ timeZone: zone });
    }
  });

  it('makes formula cells inert (OWASP CSV Injection) and keeps plain text as it is', async () => {
    const text = ((await raw(coordinator, `/api/runs/${run.id}/manifest.csv`)).body as Buffer).toString('utf8');
    const rows = parse(text) as string[][];
    const col = (name: (typeof MANIFEST_COLUMNS)[number]) => MANIFEST_COLUMNS.indexOf(name);
    const colours = rows.slice(1).map((r) => r[col('Colours')]);
    expect(colours).toContain(`'=HYPERLINK("http://bad.example.org","x")`);
    expect(colours).toContain(`'-2+3 stripes`);
    expect(colours).toContain('cream and moss');
    expect(rows[1]![col('Recipient')]).toBe(`'+Harbour Lantern, "east" door`);
    const makers = rows.slice(1).map((r) => r[col('Made by (as on the label)')]);
    expect(makers).toContain("'@Mallory");
    expect(makers).toContain('Anonymous');
    // Nowhere does a cell begin with a formula character once parsed.
    for (const r of rows.slice(1)) for (const v of r) expect(v).not.toMatch(/^[=+@\t\r\n\0]|^-(?!\d+(?:\.\d+)?$)/);
  });

  it('adds a UTF-8 BOM when asked, for spreadsheet programs', async () => {
    const res = await raw(organiser, `/api/runs/${run.id}/manifest.csv?bom=true`);
    expect(res.status).toBe(200);
    const bytes = res.body as Buffer;
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
  });

  it('keeps each manifest in the export folder, lists it with size, rows and who made it, and sends it again byte for byte', async () => {
    const first = await raw(coordinator, `/api/runs/${run.id}/manifest.csv?bom=1`);
    const page = (await organiser.get('/api/exports?pageSize=100')).body as Page<ExportView>;
    const name = /filename="([^"]+)"/.exec(first.headers['content-disposition'])![1]!;
    const e = page.items.find((x) => x.fileName === name)!;
    expect(e).toMatchObject({ kind: 'run', runId: run.id, rows: run.blanketCount, bom: true, bytes: (first.body as Buffer).length });
    expect(e.createdBy?.name).toBe('Cass Merriweather');
    expect(fs.readFileSync(path.join(t.config.exportDir, name))).toEqual(first.body);
    const again = await raw(organiser, `/api/exports/${e.id}`);
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    fs.rmSync(path.join(t.config.exportDir, name));
    const gone = await organiser.get(`/api/exports/${e.id}`);
    expect(gone.status).toBe(410);
    expect(gone.body.error.message).toMatch(/make the manifest again/);
  });

  it('is for staff only: a volunteer gets 403, and a run that does not exist is 404', async () => {
    expect((await volunteer.get(`/api/runs/${run.id}/manifest.csv`)).status).toBe(403);
    expect((await volunteer.get('/api/exports')).status).toBe(403);
    expect((await coordinator.get('/api/runs/999999/manifest.csv')).status).toBe(404);
    expect((await coordinator.get(`/api/runs/${run.id}/manifest.csv?bom=perhaps`)).status).toBe(400);
  });
});

describe('GET /api/recipients/:id/manifest.csv', () => {
  it('lists everything given to the recipient, with its run where it has one', async () => {
    const res = await raw(organiser, `/api/recipients/${shelter.id}/manifest.csv`);
    expect(res.status).toBe(200);
    const rows = parse((res.body as Buffer).toString('utf8')) as string[][];
    expect(rows.length - 1).toBe(Number(res.headers['x-manifest-rows']));
    expect(rows.length - 1).toBeGreaterThanOrEqual(3);
    expect(rows.slice(1).filter((r) => r[0] === '2026-12-20')).toHaveLength(run.blanketCount);
  });
});
