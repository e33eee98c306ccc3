import { z } from 'zod';
import { LatSchema, LngSchema } from './recipient';
import { ClosureSchema, OpeningHoursSchema, SlotCapacitySchema, SlotMinutesSchema, type Closure, type OpeningHours } from './schedule';

/** The schedule a coordinator sets per site; every field optional in a PATCH. */
const scheduleFields = {
  openingHours: OpeningHoursSchema.optional(),
  slotMinutes: SlotMinutesSchema.optional(),
  slotCapacity: SlotCapacitySchema.optional(),
  closures: z.array(ClosureSchema).max(100, 'At most 100 closures').optional(),
};

const text = (label: string, max: number) =>
  z.string({ error: `${label} must be text` }).trim().max(max, `${label}: at most ${max} characters`);

const siteFields = {
  name: text('Name', 200).min(1, 'Name: give the drop-off site a name'),
  address: text('Address', 400).min(1, 'Address: where do people bring blankets?'),
  lat: LatSchema.nullable(),
  lng: LngSchema.nullable(),
  notes: text('Notes', 2000)
    .nullable()
    .optional()
    .transform((v) => (v === '' ? null : v)),
  active: z.boolean({ error: 'Active must be true or false' }),
};

function pinTogether(v: { lat?: number | null; lng?: number | null }, ctx: z.RefinementCtx) {
  if (v.lat === undefined || v.lng === undefined) return;
  if ((v.lat === null) !== (v.lng === null)) {
    ctx.addIssue({
      code: 'custom',
      path: [v.lat === null ? 'lat' : 'lng'],
      message: 'A map pin needs both latitude and longitude, or neither',
    });
  }
}

/** POST /api/sites. Opening hours and slots will extend this, not replace it. */
export const SiteCreateSchema = z
  .object({
    ...siteFields,
    lat: siteFields.lat.default(null),
    lng: siteFields.lng.default(null),
    active: siteFields.active.default(true),
    ...scheduleFields,
  })
  .superRefine(pinTogether);
export type SiteCreate = z.infer<typeof SiteCreateSchema>;

/** PATCH /api/sites/:id */
export const SiteUpdateSchema = z
  .object({
    name: siteFields.name.optional(),
    address: siteFields.address.optional(),
    lat: siteFields.lat.optional(),
    lng: siteFields.lng.optional(),
    notes: siteFields.notes,
    active: siteFields.active.optional(),
    ...scheduleFields,
  })
  .superRefine(pinTogether)
  .refine((v) => Object.values(v).some((x) => x !== undefined), 'Send at least one field to change');
export type SiteUpdate = z.infer<typeof SiteUpdateSchema>;

export const SiteListQuerySchema = z.object({
  active: z.enum(['true', 'false', 'all'], { error: "active must be 'true', 'false' or 'all'" }).default('true'),
});

export interface SiteView {
  id: number;
  name: string;
  address: string;
  lat: number | null;
  lng: number | null;
  notes: string | null;
  active: boolean;
  openingHours: OpeningHours | null;
  slotMinutes: number;
  slotCapacity: number;
  closures: Closure[];
}
