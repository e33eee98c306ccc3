import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Response } from 'express';
import { QueryTypes, type Sequelize } from 'sequelize';
import { Export, Run } from '../../db/models/run';
import { Recipient } from '../../db/models/recipient';
import { User } from '../../db/models/user';
import { HttpError, notFound } from '../../lib/http-error';
import type { Actor } from '../pledges/pledges.service';
import { ASSIGNED_STATUSES } from '@shared/blankets/status';
import type { Page } from '@shared/schemas/page';
import type { ExportView } from '@shared/schemas/run';
import { MANIFEST_CARE, MANIFEST_SOURCE_FIELDS, manifestShaper, manifestStringifier, type ManifestRecord, type ManifestSourceRow } from './manifest-format';
import { preparedRead, preparedReader } from '../../db/prepared-read';
import { driveToday, driveZone } from '../bookings/drive-clock';
import { DAY_MS, localDayOf, zoneSpans } from '../drive/glance-sql';
import { nowMs } from '../../lib/clock';

export type ManifestTarget = { kind: 'run'; id: number } | { kind: 'recipient'; id: number };

type SourceField = (typeof MANIFEST_SOURCE_FIELDS)[number];

/** Rows read from the database per query: enough to keep SQLite busy, few enough to keep memory flat. */
export const MANIFEST_PAGE = 1000;

/**
 * A REAL column that holds a whole number is handed over as an INTEGER: the same value once parsed,
 * and SQLite writes an integer into JSON several times faster than a floating-point number.
 */
const exactNumber = (column: string) => `CASE WHEN ${column} = CAST(${column} AS INTEGER) THEN CAST(${column} AS INTEGER) ELSE ${column} END`;

/**
 * The size on record as SQL, one side at a time: the measured size where both sides were measured,
 * else the logged one (shared/schemas/blanket.ts, sizeOnRecord, the same rule).
 */
const sizeOnRecord = (side: 'Width' | 'Length') =>
  `CASE WHEN b.measuredWidthCm IS NOT NULL AND b.measuredLengthCm IS NOT NULL THEN ${exactNumber(`b.measured${side}Cm`)} ELSE ${exactNumber(`b.${side.toLowerCase()}Cm`)} END`;

/** The four care answers as one number, a bit each where the answer is yes (SQLite's truth, as JavaScript's for 0/1). */
const CARE_SQL = MANIFEST_CARE.map((c) => `CASE WHEN b.${c.field} THEN ${c.bit} ELSE 0 END`).join(' + ');

/**
 * The latest "checked" step of the blanket's history: when, and who passed it. Ordered by time on the
 * (blanketId, toStatus, createdAt, id, actorId) index, both lookups are answered by the index alone
 * (migration 0130); joining the history entry itself made SQLite fetch each entry's large record of
 * the check from the table. Asked as MAX(id), SQLite took the blanketId index and read every history
 * entry of the blanket to test its status.
 */
const latestCheck = (column: 'createdAt' | 'actorId') =>
  `(SELECT e.${column} FROM blanket_events e WHERE e.blanketId = b.id AND e.toStatus = 'checked' ORDER BY e.createdAt DESC, e.id DESC LIMIT 1)`;
/**
 * Each field of a page row (manifest-format's MANIFEST_SOURCE_FIELDS) as SQL over the page query's
 * tables. A run's rows leave out the last two, the run's date and the stop's position (read once
 * per stop and given to the shaper); a recipient's rows take them from each blanket's own run.
 */
const FIELD_SQL: Record<SourceField, string> = {
  box: 'rb.box',
  blanketId: 'b.id',
  code: 'b.code',
  widthCm: sizeOnRecord('Width'),
  lengthCm: sizeOnRecord('Length'),
  yarnWeight: 'b.yarnWeight',
  fibres: 'b.fibres',
  colours: 'b.colours',
  features: 'b.features',
  care: CARE_SQL,
  // The maker's and the checker's ids here; named in the service (peopleNames). Every blanket has a
  // maker (blankets.userId is required and its user cannot be deleted).
  labelName: "CASE WHEN b.labelName = 'anonymous' THEN NULL ELSE b.userId END",
  checkedBy: latestCheck('actorId'),
  // The check's stored time; the page's outer query makes it the drive's local day (pageQuery's `outer`).
  checkedOn: latestCheck('createdAt'),
  runDate: 'run.runDate',
  position: 's.position',
};

interface PageQuery {
  sql: string;
  /** The keyset columns, as positions in a page row. */
  key: number[];
}

/**
 * One page as one JSON text: the page's rows selected in keyset order, then folded by SQLite into a
 * JSON array of arrays. The driver then hands over one string per page instead of an object per row,
 * and JSON.parse makes the rows far faster than the driver's per-column conversion did.
 */
function pageQuery(inner: {
  fields: Record<SourceField, string>;
  /** Fields finished over the page's own columns (once per row, after the inner query's LIMIT). */
  outer: Partial<Record<SourceField, (column: string) => string>>;
  only: readonly SourceField[];
  from: string;
  where: string;
  orderBy: SourceField[];
}): PageQuery {
  const select = inner.only.map((f) => `${inner.fields[f]} AS ${f}`).join(', ');
  // No ORDER BY inside the aggregate: SQLite folds the ordered subquery as it comes, and sorting each
  // page again cost a fifth of the query. pageReader checks the order and sorts only if it must.
  return {
    sql: `SELECT json_group_array(json_array(${inner.only.map((f) => inner.outer[f]?.(`p.${f}`) ?? `p.${f}`).join(', ')})) AS page
    FROM (SELECT ${select} FROM ${inner.from} WHERE ${inner.where} ORDER BY ${inner.orderBy.map((c) => `${inner.fields[c]} ASC`).join(', ')} LIMIT ?) p`,
    key: inner.orderBy.map((f) => inner.only.indexOf(f)),
  };
}

/** A run's stop, rows keyed by (box, blanket) on the index that orders them. */
const runPage = (checkedOn: (column: string) => string) =>
  pageQuery({
    // The blanket's id from run_blankets, so the ORDER BY is the index's own order: named from
    // blankets, SQLite sorted every page again in a temporary tree.
    fields: { ...FIELD_SQL, blanketId: 'rb.blanketId' },
    outer: { checkedOn },
    // The run's date and the stop's position are the same on every row: passed once, not per row.
    only: MANIFEST_SOURCE_FIELDS.filter((f) => f !== 'runDate' && f !== 'position'),
    from: 'run_blankets rb JOIN blankets b ON b.id = rb.blanketId',
    where: 'rb.stopId = ? AND (rb.box, rb.blanketId) > (?, ?)',
    orderBy: ['box', 'blanketId'],
  });

/** Everything given to one recipient (assigned, packed or delivered), with its run and box where it has one. */
const recipientPage = (checkedOn: (column: string) => string) =>
  pageQuery({
    fields: FIELD_SQL,
    outer: { checkedOn },
    only: MANIFEST_SOURCE_FIELDS,
    from: `blankets b
    LEFT JOIN run_blankets rb ON rb.blanketId = b.id
    LEFT JOIN run_stops s ON s.id = rb.stopId
    LEFT JOIN runs run ON run.id = rb.runId`,
    where: `b.recipientId = ? AND b.status IN (${ASSIGNED_STATUSES.map((x) => `'${x}'`).join(', ')}) AND b.id > ?`,
    orderBy: ['blanketId'],
  });

/** How far back the check days are read with the zone's own clock changes; older ones at its earliest offset. */
const CHECKS_LOOK_BACK_DAYS = 400;
const pageQueries = new Map<string, { run: PageQuery; recipient: PageQuery }>();

/**
 * The page queries for the drive's zone now: "Checked on" is the drive's local day of the check
 * (decision 0015, days are the drive's), not the UTC day, which in a zone far from UTC is the day
 * before or after for checks made in the local morning or evening. Built once per zone and span.
 */
async function pageQueriesNow(): Promise<{ run: PageQuery; recipient: PageQuery }> {
  const now = nowMs();
  const spans = zoneSpans(await driveZone(), now - CHECKS_LOOK_BACK_DAYS * DAY_MS, now + 2 * DAY_MS);
  const checkedOn = (column: string) => localDayOf(column, spans);
  const key = checkedOn('p.checkedOn');
  let queries = pageQueries.get(key);
  if (!queries) {
    if (pageQueries.size > 16) pageQueries.clear();
    pageQueries.set(key, (queries = { run: runPage(checkedOn), recipient: recipientPage(checkedOn) }));
  }
  return queries;
}

const BOX = MANIFEST_SOURCE_FIELDS.indexOf('box');
const LABEL_NAME = MANIFEST_SOURCE_FIELDS.indexOf('labelName');
const CHECKED_BY = MANIFEST_SOURCE_FIELDS.indexOf('checkedBy');
const BLANKET_ID = MANIFEST_SOURCE_FIELDS.indexOf('blanketId');

/** Compares two page rows by the keyset columns (numbers; a blanket on no run has no box). */
function byKey(key: number[]) {
  return (a: ManifestSourceRow, b: ManifestSourceRow): number => {
    for (const i of key) {
      const d = Number(a[i] ?? 0) - Number(b[i] ?? 0);
      if (d !== 0) return d;
    }
    return 0;
  };
}

/** @internal exported for its test: puts a page in keyset order if it came otherwise. */
export function inKeyOrder(rows: ManifestSourceRow[], key: number[]): ManifestSourceRow[] {
  const compare = byKey(key);
  for (let i = 1; i < rows.length; i++) if (compare(rows[i - 1]!, rows[i]!) > 0) return rows.sort(compare);
  return rows;
}

/** Reads pages of one page query: each call hands its read to SQLite at once (preparedReader). */
async function pageReader(sequelize: Sequelize, query: PageQuery): Promise<(params: unknown[]) => Promise<ManifestSourceRow[]>> {
  const read = await preparedReader<{ page: string | null }>(sequelize, query.sql);
  const names = await peopleNames(sequelize);
  return async (params) => {
    const [row] = await read(params);
    if (!row?.page) return [];
    const rows = JSON.parse(row.page) as ManifestSourceRow[];
    // The page names people by id (the maker where the label is theirs, the checker).
    for (const r of rows) {
      if (r[LABEL_NAME] !== null) r[LABEL_NAME] = names.get(r[LABEL_NAME] as unknown as number) ?? null;
      if (r[CHECKED_BY] !== null) r[CHECKED_BY] = names.get(r[CHECKED_BY] as unknown as number) ?? null;
    }
    return inKeyOrder(rows, query.key);
  };
}

/**
 * Everyone's name by id, read once per manifest: makers on labels and the people who checked. A
 * drive has a few thousand people against a manifest's hundred thousand rows, and looking each
 * row's two names up in SQLite was two more table searches per row.
 */
async function peopleNames(sequelize: Sequelize): Promise<Map<number, string>> {
  const rows = await preparedRead<{ id: number; name: string }>(sequelize, 'SELECT id, name FROM users', []);
  return new Map(rows.map((u) => [u.id, u.name]));
}

/**
 * Reads pages one ahead: as soon as page N is in, page N+1 is asked for, and SQLite works on it in
 * the driver's own thread while page N is shaped and written here. At most two pages are held.
 */
async function* keysetPages(read: (after: ManifestSourceRow | null) => Promise<ManifestSourceRow[]>, pageSize: number): AsyncGenerator<ManifestSourceRow[]> {
  let pending: Promise<ManifestSourceRow[]> | null = read(null);
  try {
    while (pending) {
      const rows: ManifestSourceRow[] = await pending;
      pending = rows.length === pageSize ? read(rows[rows.length - 1]!) : null;
      if (rows.length > 0) yield rows;
    }
  } finally {
    // A reader that stops early (a closed download) leaves at most one read in flight; let it end quietly.
    pending?.catch(() => undefined);
  }
}

/**
 * A run's manifest, stop by stop in driving order, box by box, a page at a time by keyset, so memory
 * stays flat however many rows there are. The stop's own columns are read once per stop: joined into
 * the page query, SQLite's planner put the one-row tables in the outer loop and sorted every
 * remaining row for each page.
 */
async function* runPages(sequelize: Sequelize, runId: number, pageSize: number): AsyncGenerator<ManifestRecord[]> {
  const stops = await sequelize.query<{ id: number; position: number; runDate: string; recipient: string; address: string }>(
    `SELECT s.id, s.position, run.runDate, rc.name AS recipient, rc.address
       FROM run_stops s JOIN runs run ON run.id = s.runId JOIN recipients rc ON rc.id = s.recipientId
      WHERE s.runId = ? ORDER BY s.position ASC`,
    { replacements: [runId], type: QueryTypes.SELECT },
  );
  const readPage = await pageReader(sequelize, (await pageQueriesNow()).run);
  const shape = manifestShaper();
  for (const stop of stops) {
    const to = { recipient: stop.recipient, address: stop.address, runDate: stop.runDate, position: stop.position };
    const read = (after: ManifestSourceRow | null) => readPage([stop.id, after?.[BOX] ?? 0, after?.[BLANKET_ID] ?? 0, pageSize]);
    for await (const rows of keysetPages(read, pageSize)) yield rows.map((r) => shape(r, to));
  }
}

async function* recipientPages(sequelize: Sequelize, recipientId: number, pageSize: number): AsyncGenerator<ManifestRecord[]> {
  const [rc] = await sequelize.query<{ name: string; address: string }>('SELECT name, address FROM recipients WHERE id = ?', {
    replacements: [recipientId],
    type: QueryTypes.SELECT,
  });
  if (!rc) return;
  const readPage = await pageReader(sequelize, (await pageQueriesNow()).recipient);
  const shape = manifestShaper();
  const to = { recipient: rc.name, address: rc.address };
  const read = (after: ManifestSourceRow | null) => readPage([recipientId, after?.[BLANKET_ID] ?? 0, pageSize]);
  for await (const rows of keysetPages(read, pageSize)) yield rows.map((r) => shape(r, to));
}

/** The manifest's records a page at a time, in file order. */
export function manifestPages(sequelize: Sequelize, target: ManifestTarget, pageSize = MANIFEST_PAGE): AsyncGenerator<ManifestRecord[]> {
  return target.kind === 'run' ? runPages(sequelize, target.id, pageSize) : recipientPages(sequelize, target.id, pageSize);
}

/** The manifest's records one by one, for a reader that wants them so. */
export async function* manifestRows(sequelize: Sequelize, target: ManifestTarget, pageSize = MANIFEST_PAGE): AsyncGenerator<ManifestRecord> {
  for await (const page of manifestPages(sequelize, target, pageSize)) yield* page;
}

/**
 * The manifest's records as an object stream for csv-stringify: a whole page is pushed at once, and
 * the next page is asked for only when the stream has room, so a slow client holds the reading back.
 * `onRecords` hears how many records each page brought.
 */
export function manifestStream(sequelize: Sequelize, target: ManifestTarget, opts: { pageSize?: number; onRecords?: (n: number) => void } = {}): Readable {
  const pageSize = opts.pageSize ?? MANIFEST_PAGE;
  const pages = manifestPages(sequelize, target, pageSize);
  let asking = false;
  return new Readable({
    objectMode: true,
    highWaterMark: pageSize,
    read() {
      if (asking) return;
      asking = true;
      pages.next().then(
        (step) => {
          asking = false;
          if (step.done) {
            this.push(null);
            return;
          }
          opts.onRecords?.(step.value.length);
          for (const record of step.value) this.push(record);
        },
        (err: Error) => this.destroy(err),
      );
    },
    destroy(err, cb) {
      pages.return(undefined).then(
        () => cb(err),
        () => cb(err),
      );
    },
  });
}

async function describeTarget(sequelize: Sequelize, target: ManifestTarget): Promise<{ title: string; slug: string; rows: number }> {
  if (target.kind === 'run') {
    const run = await Run.findByPk(target.id);
    if (!run) throw notFound('That delivery run');
    const [{ n }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM run_blankets WHERE runId = ?', {
      replacements: [run.id],
      type: QueryTypes.SELECT,
    });
    return { title: `Delivery run of ${run.runDate}`, slug: `run-${run.id}-${run.runDate}`, rows: Number(n) };
  }
  const r = await Recipient.findByPk(target.id);
  if (!r) throw notFound('That recipient');
  const [{ n }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM blankets WHERE recipientId = :id AND status IN (:statuses)', {
    replacements: { id: r.id, statuses: [...ASSIGNED_STATUSES] },
    type: QueryTypes.SELECT,
  });
  return { title: `Blankets for ${r.name}`, slug: `recipient-${r.id}`, rows: Number(n) };
}

/** The header the page reads to draw its progress bar: how many blanket rows are coming. */
export const ROWS_HEADER = 'X-Manifest-Rows';

/**
 * Streams a manifest to the client while writing the same bytes to the export folder, then records
 * the export (size, rows, who) before the response ends, so the Exports page lists it at once.
 * The database is read a page at a time and each step waits for the slower of file and network.
 */
export async function streamManifest(
  sequelize: Sequelize,
  exportDir: string,
  target: ManifestTarget,
  opts: { bom: boolean },
  actor: Actor,
  res: Response,
): Promise<void> {
  const { title, slug, rows: expected } = await describeTarget(sequelize, target);
  const stamp = await driveToday();
  const fileName = `kindloop-${slug}-made-${stamp}-${crypto.randomBytes(3).toString('hex')}.csv`;
  fs.mkdirSync(exportDir, { recursive: true });
  const filePath = path.join(exportDir, fileName);
  const file = fs.createWriteStream(filePath);
  let bytes = 0;
  // Counted at the source: a quoted address or note may hold line breaks of its own.
  let records = 0;
  const tee = new Transform({
    transform(chunk: Buffer, _enc, cb) {
      bytes += chunk.length;
      if (file.write(chunk)) cb(null, chunk);
      else file.once('drain', () => cb(null, chunk));
    },
    flush(cb) {
      file.end(() => {
        sequelize
          .transaction((transaction) =>
            Export.create(
              {
                kind: target.kind,
                runId: target.kind === 'run' ? target.id : null,
                recipientId: target.kind === 'recipient' ? target.id : null,
                title,
                fileName,
                bytes,
                rows: records,
                bom: opts.bom,
                createdById: actor.id,
              },
              { transaction },
            ),
          )
          .then(() => cb(), cb);
      });
    },
  });
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
  res.setHeader(ROWS_HEADER, String(expected));
  res.setHeader('Access-Control-Expose-Headers', ROWS_HEADER);
  try {
    const source = manifestStream(sequelize, target, {
      onRecords: (n) => {
        records += n;
      },
    });
    await pipeline(source, manifestStringifier(opts), tee, res);
  } catch (err) {
    file.destroy();
    fs.rmSync(filePath, { force: true });
    if (!res.headersSent) throw err;
    res.destroy(err as Error);
  }
}

function exportView(e: Export & { createdBy?: User | null }): ExportView {
  return {
    id: e.id,
    kind: e.kind,
    runId: e.runId ?? null,
    recipientId: e.recipientId ?? null,
    title: e.title,
    fileName: e.fileName,
    bytes: e.bytes,
    rows: e.rows,
    bom: e.bom,
    createdBy: e.createdBy ? { id: e.createdBy.id, name: e.createdBy.name } : null,
    createdAt: e.createdAt.toISOString(),
  };
}

export async function listExports(q: { page: number; pageSize: number }): Promise<Page<ExportView>> {
  const { rows, count } = await Export.findAndCountAll({
    include: [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return { items: rows.map(exportView), total: count, page: q.page, pageSize: q.pageSize };
}

/** The stored file of an earlier export, sent again as it was written. */
export async function sendExport(exportDir: string, id: number, res: Response): Promise<void> {
  const e = await Export.findByPk(id);
  if (!e) throw notFound('That export');
  // The name was generated here, but never trust a path from the database to stay inside the folder.
  const filePath = path.join(exportDir, path.basename(e.fileName));
  if (!fs.existsSync(filePath)) throw new HttpError(410, 'That file is no longer in the export folder; make the manifest again');
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${e.fileName}"`);
  res.setHeader('Content-Length', String(e.bytes));
  res.setHeader(ROWS_HEADER, String(e.rows));
  await pipeline(fs.createReadStream(filePath), res);
}
