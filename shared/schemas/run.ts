import { z } from 'zod';
import type { Population, SizeCategory, BlanketStatus } from './blanket';
import { IsoDaySchema } from './recipient';
import { PageQuerySchema } from './page-query';
import type { Caution } from '../guidelines/cautions';

/**
 * Delivery runs: one car, one day, a driver, a start site and an ordered list of stops (recipients),
 * each stop with the blankets going to it, packed in numbered boxes.
 */

/** More boxes than one car carries would be a typing slip. */
export const MAX_BOX = 99;
/** A run is a day's driving; past this many stops it should be split. */
export const MAX_STOPS = 30;

const id = (label: string) =>
  z.number({ error: `${label} must be a number` }).int(`${label} must be a whole number`).positive(`${label} must be more than 0`);

const box = z
  .number({ error: 'Box must be a number' })
  .int('Box must be a whole number')
  .min(1, 'Boxes are numbered from 1')
  .max(MAX_BOX, `Box: at most ${MAX_BOX}`);

const notes = z
  .string({ error: 'Notes must be text' })
  .trim()
  .max(2000, 'Notes: at most 2000 characters');

const reason = z
  .string({ error: 'Reason must be text' })
  .trim()
  .min(1, 'Reason: say why, so the history explains it')
  .max(500, 'Reason: at most 500 characters');

/** POST /api/runs. Stops may be given now (each recipient's waiting blankets come with it) or added later. */
export const RunCreateSchema = z
  .object({
    runDate: IsoDaySchema,
    driverId: id('Driver'),
    startSiteId: id('Start site'),
    recipientIds: z.array(id('Recipient')).max(MAX_STOPS, `At most ${MAX_STOPS} stops on one run`).default([]),
    notes: notes.default(''),
  })
  .strict()
  .refine((v) => new Set(v.recipientIds).size === v.recipientIds.length, { path: ['recipientIds'], message: 'A recipient is listed twice' });
export type RunCreate = z.infer<typeof RunCreateSchema>;

/** PATCH /api/runs/:id. `stopOrder` is every stop id of the run in the new order. */
export const RunUpdateSchema = z
  .object({
    runDate: IsoDaySchema.optional(),
    driverId: id('Driver').optional(),
    startSiteId: id('Start site').optional(),
    notes: notes.optional(),
    stopOrder: z.array(id('Stop')).max(MAX_STOPS).optional(),
    version: z.number().int().min(0).optional(),
  })
  .strict()
  .refine((v) => Object.entries(v).some(([k, x]) => k !== 'version' && x !== undefined), 'Send at least one field to change');
export type RunUpdate = z.infer<typeof RunUpdateSchema>;

export const RUN_SORTS = ['runDate', 'createdAt'] as const;
export const RunListQuerySchema = PageQuerySchema.extend({
  when: z.enum(['upcoming', 'past', 'all'], { error: "when is 'upcoming', 'past' or 'all'" }).default('all'),
});
export type RunListQuery = z.infer<typeof RunListQuerySchema>;

export const RunStopParamsSchema = z.object({
  id: z.coerce.number().int().positive('Not a valid run id'),
  stopId: z.coerce.number().int().positive('Not a valid stop id'),
});
export const RunBlanketParamsSchema = z.object({
  id: z.coerce.number().int().positive('Not a valid run id'),
  blanketId: z.coerce.number().int().positive('Not a valid blanket id'),
});

/** POST /api/runs/:id/stops */
export const StopAddSchema = z.object({ recipientId: id('Recipient') }).strict();

/** POST /api/runs/:id/blankets: put one assigned blanket on the run (its recipient becomes a stop if it is not one). */
export const RunBlanketAddSchema = z.object({ blanketId: id('Blanket'), box: box.default(1) }).strict();

/** POST /api/runs/:id/stops/:stopId/packed: optional box numbers per blanket; the rest keep theirs. */
export const PackSchema = z
  .object({ boxes: z.array(z.object({ blanketId: id('Blanket'), box }).strict()).max(500).default([]) })
  .strict();
export type PackBody = z.infer<typeof PackSchema>;

/** POST /api/runs/:id/stops/:stopId/delivered */
export const DeliverSchema = z
  .object({
    receivedCount: z.number({ error: 'Count must be a number' }).int('Count must be a whole number').min(0, 'Count cannot be negative').max(10_000),
    signedBy: z
      .string({ error: 'Signed by must be text' })
      .trim()
      .min(1, 'Signed by: who took the blankets in?')
      .max(120, 'Signed by: at most 120 characters'),
  })
  .strict();
export type DeliverBody = z.infer<typeof DeliverSchema>;

/** DELETE …/packed and DELETE …/delivered: a step back needs its reason. */
export const UndoSchema = z.object({ reason }).strict();

const flag = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');
/** GET …/manifest.csv: `bom` adds a UTF-8 byte order mark so spreadsheet programs read accents right. */
export const ManifestQuerySchema = z.object({ bom: flag.default(false) });

export const ExportListQuerySchema = PageQuerySchema;

// ---- views -------------------------------------------------------------------------------------

export type StopState = 'planned' | 'packed' | 'delivered';
export type RunState = 'planned' | 'packed' | 'partly-delivered' | 'delivered' | 'empty';

export { RUN_STATE_LABELS } from './run-values';

export interface RunBlanketView {
  id: number;
  code: string;
  status: BlanketStatus;
  box: number;
  sizeCategory: SizeCategory | null;
  colours: string;
  makerLabel: string;
}

export interface RunStopView {
  id: number;
  position: number;
  state: StopState;
  recipient: { id: number; name: string; address: string; lat: number | null; lng: number | null; population: Population; deliveryNotes: string | null };
  blankets: RunBlanketView[];
  boxes: number[];
  /** Distance of the leg that arrives at this stop, in km; null when a pin is missing. */
  legKm: number | null;
  packedAt: string | null;
  deliveredAt: string | null;
  receivedCount: number | null;
  signedBy: string | null;
  /** Wherever blankets go to infants or frail people: the cautions, and the facility's policy first. */
  cautions: Caution[];
}

export interface RunSummary {
  id: number;
  runDate: string;
  state: RunState;
  driver: { id: number; name: string };
  startSite: { id: number; name: string };
  stopCount: number;
  blanketCount: number;
  deliveredCount: number;
}

export interface RunView extends RunSummary {
  version: number;
  notes: string;
  startSite: { id: number; name: string; address: string; lat: number | null; lng: number | null };
  stops: RunStopView[];
  /** The leg from the last stop back to the start; null when a pin is missing or there are no stops. */
  returnKm: number | null;
  /** Total round trip; null when any stop has no pin. */
  totalKm: number | null;
  /** Stops that cannot be placed on the map or in the route. */
  unpinned: string[];
}

/** A recipient with assigned blankets that no run carries yet: what a coordinator plans from. */
export interface WaitingRecipient {
  id: number;
  name: string;
  address: string;
  population: Population;
  lat: number | null;
  lng: number | null;
  waiting: number;
}

export interface ExportView {
  id: number;
  kind: 'run' | 'recipient';
  runId: number | null;
  recipientId: number | null;
  title: string;
  fileName: string;
  bytes: number;
  rows: number;
  bom: boolean;
  createdBy: { id: number; name: string } | null;
  createdAt: string;
}
