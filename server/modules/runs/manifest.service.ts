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
import { manifestRecord, manifestStringifier, type ManifestRecord, type ManifestSourceRow } from './manifest-format';
import { driveToday } from '../bookings/drive-clock';

export type ManifestTarget = { kind: 'run'; id: number } | { kind: 'recipient'; id: number };

/** Rows read from the database per query: enough to keep SQLite busy, few enough to keep memory flat. */
export const MANIFEST_PAGE = 1000;

const COLUMNS = `
  b.id AS blanketId, b.code, b.widthCm, b.lengthCm, b.measuredWidthCm, b.measuredLengthCm, b.yarnWeight,
  b.fibres, b.colours, b.features, b.machineWashable, b.dryerSafe, b.smokeFree, b.petFree, b.labelName,
  maker.name AS makerName, checker.name AS checkedBy, checkedEvent.createdAt AS checkedAt`;

/** The latest "checked" step of the blanket's history: who passed it and when. */
const CHECKED_JOIN = `
  JOIN users maker ON maker.id = b.userId
  LEFT JOIN blanket_events checkedEvent ON checkedEvent.id =
    (SELECT MAX(e.id) FROM blanket_events e WHERE e.blanketId = b.id AND e.toStatus = 'checked')
  LEFT JOIN users checker ON checker.id = checkedEvent.actorId`;

type Row = ManifestSourceRow & { blanketId: number };

/**
 * A run's manifest, stop by stop in driving order, box by box, read a page at a time by keyset
 * (box, blanket) on the index that orders them, so memory stays flat however many rows there are.
 * The stop's own columns are read once per stop: joined into the page query, SQLite's planner put the
 * one-row tables in the outer loop and sorted every remaining row for each page.
 */
async function* runRows(sequelize: Sequelize, runId: number, pageSize: number): AsyncGenerator<ManifestRecord> {
  const stops = await sequelize.query<{ id: number; position: number; runDate: string; recipient: string; address: string }>(
    `SELECT s.id, s.position, run.runDate, rc.name AS recipient, rc.address
       FROM run_stops s JOIN runs run ON run.id = s.runId JOIN recipients rc ON rc.id = s.recipientId
      WHERE s.runId = ? ORDER BY s.position ASC`,
    { replacements: [runId], type: QueryTypes.SELECT },
  );
  for (const stop of stops) {
    let after = { box: 0, blanketId: 0 };
    for (;;) {
      const rows = await sequelize.query<Row>(
        `SELECT rb.box, ${COLUMNS}
           FROM run_blankets rb
           JOIN blankets b ON b.id = rb.blanketId
           ${CHECKED_JOIN}
          WHERE rb.stopId = :stopId AND (rb.box, rb.blanketId) > (:box, :blanketId)
          ORDER BY rb.box ASC, rb.blanketId ASC
          LIMIT :limit`,
        { replacements: { stopId: stop.id, ...after, limit: pageSize }, type: QueryTypes.SELECT },
      );
      for (const r of rows) yield manifestRecord({ ...r, runDate: stop.runDate, position: stop.position, recipient: stop.recipient, address: stop.address });
      if (rows.length < pageSize) break;
      const last = rows[rows.length - 1]!;
      after = { box: last.box ?? 0, blanketId: last.blanketId };
    }
  }
}

/** Everything given to one recipient (assigned, packed or delivered), with its run and box where it has one. */
async function* recipientRows(sequelize: Sequelize, recipientId: number, pageSize: number): AsyncGenerator<ManifestRecord> {
  const [rc] = await sequelize.query<{ name: string; address: string }>('SELECT name, address FROM recipients WHERE id = ?', {
    replacements: [recipientId],
    type: QueryTypes.SELECT,
  });
  if (!rc) return;
  let after = 0;
  for (;;) {
    const rows = await sequelize.query<Row>(
      `SELECT run.runDate, s.position, rb.box, ${COLUMNS}
         FROM blankets b
         LEFT JOIN run_blankets rb ON rb.blanketId = b.id
         LEFT JOIN run_stops s ON s.id = rb.stopId
         LEFT JOIN runs run ON run.id = rb.runId
         ${CHECKED_JOIN}
        WHERE b.recipientId = :recipientId AND b.status IN (:statuses) AND b.id > :after
        ORDER BY b.id ASC
        LIMIT :limit`,
      { replacements: { recipientId, statuses: [...ASSIGNED_STATUSES], after, limit: pageSize }, type: QueryTypes.SELECT },
    );
    for (const r of rows) yield manifestRecord({ ...r, recipient: rc.name, address: rc.address });
    if (rows.length < pageSize) break;
    after = rows[rows.length - 1]!.blanketId;
  }
}

export function manifestRows(sequelize: Sequelize, target: ManifestTarget, pageSize = MANIFEST_PAGE): AsyncGenerator<ManifestRecord> {
  return target.kind === 'run' ? runRows(sequelize, target.id, pageSize) : recipientRows(sequelize, target.id, pageSize);
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
  let records = -1; // the header row is not a blanket
  const tee = new Transform({
    transform(chunk: Buffer, _enc, cb) {
      bytes += chunk.length;
      for (const byte of chunk) if (byte === 0x0a) records += 1;
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
                rows: Math.max(0, records),
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
    await pipeline(Readable.from(manifestRows(sequelize, target)), manifestStringifier(opts), tee, res);
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
