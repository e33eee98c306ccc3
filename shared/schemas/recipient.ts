import { z } from 'zod';
import { RECIPIENT_KINDS, RECIPIENT_KIND_LABELS } from './recipient-values';
import { PopulationSchema, SizeCategorySchema } from './blanket';
import { GuidelineSetSchema } from './guidelines';

export { RECIPIENT_KINDS, RECIPIENT_KIND_LABELS };

export const RecipientKindSchema = z.enum(RECIPIENT_KINDS, {
  error: `Kind must be one of ${RECIPIENT_KINDS.join(', ')}`,
});
export type RecipientKind = z.infer<typeof RecipientKindSchema>;

const text = (label: string, max: number) =>
  z.string({ error: `${label} must be text` }).trim().max(max, `${label}: at most ${max} characters`);

const optionalText = (label: string, max: number) =>
  text(label, max)
    .nullable()
    .optional()
    .transform((v) => (v === '' ? null : v));

/** Latitude and longitude in decimal degrees (WGS 84, as every web map uses). */
export const LatSchema = z
  .number({ error: 'Latitude must be a number of degrees' })
  .min(-90, 'Latitude must be between -90 and 90')
  .max(90, 'Latitude must be between -90 and 90');
export const LngSchema = z
  .number({ error: 'Longitude must be a number of degrees' })
  .min(-180, 'Longitude must be between -180 and 180')
  .max(180, 'Longitude must be between -180 and 180');

const email = z
  .string({ error: 'Contact e-mail must be text' })
  .trim()
  .toLowerCase()
  .max(254)
  .refine((v) => v === '' || z.email().safeParse(v).success, 'Contact e-mail: enter a valid e-mail address')
  .transform((v) => (v === '' ? null : v))
  .nullable()
  .optional();

/** A map pin: both coordinates or neither. */
function pinTogether(v: { lat?: number | null; lng?: number | null }, ctx: z.RefinementCtx) {
  const hasLat = v.lat !== undefined && v.lat !== null;
  const hasLng = v.lng !== undefined && v.lng !== null;
  if (v.lat !== undefined && v.lng !== undefined && hasLat !== hasLng) {
    ctx.addIssue({
      code: 'custom',
      path: [hasLat ? 'lng' : 'lat'],
      message: 'A map pin needs both latitude and longitude, or neither',
    });
  }
}

const recipientFields = {
  name: text('Name', 200).min(1, 'Name: give the recipient a name'),
  kind: RecipientKindSchema,
  population: PopulationSchema,
  address: text('Address', 400).min(1, 'Address: where do deliveries go?'),
  lat: LatSchema.nullable(),
  lng: LngSchema.nullable(),
  contactName: optionalText('Contact name', 200),
  contactEmail: email,
  contactPhone: optionalText('Contact phone', 60),
  deliveryNotes: optionalText('Delivery notes', 2000),
  active: z.boolean({ error: 'Active must be true or false' }),
};

/** POST /api/recipients. Guidelines start from the population's defaults unless given. */
export const RecipientCreateSchema = z
  .object({
    ...recipientFields,
    lat: recipientFields.lat.default(null),
    lng: recipientFields.lng.default(null),
    active: recipientFields.active.default(true),
    guidelines: GuidelineSetSchema.optional(),
  })
  .superRefine(pinTogether)
  .superRefine((v, ctx) => {
    if (v.guidelines && v.guidelines.population !== v.population) {
      ctx.addIssue({
        code: 'custom',
        path: ['guidelines', 'population'],
        message: `Guidelines are for ${v.guidelines.population} but the recipient serves ${v.population}`,
      });
    }
  });
export type RecipientCreate = z.infer<typeof RecipientCreateSchema>;

/** PATCH /api/recipients/:id: any subset of the fields, with the version last read. */
export const RecipientUpdateSchema = z
  .object({
    name: recipientFields.name.optional(),
    kind: recipientFields.kind.optional(),
    population: recipientFields.population.optional(),
    address: recipientFields.address.optional(),
    lat: recipientFields.lat.optional(),
    lng: recipientFields.lng.optional(),
    contactName: recipientFields.contactName,
    contactEmail: recipientFields.contactEmail,
    contactPhone: recipientFields.contactPhone,
    deliveryNotes: recipientFields.deliveryNotes,
    active: recipientFields.active.optional(),
    version: z.number({ error: 'version must be a number' }).int().min(0).optional(),
  })
  .superRefine(pinTogether)
  .refine((v) => Object.entries(v).some(([k, x]) => k !== 'version' && x !== undefined), 'Send at least one field to change');
export type RecipientUpdate = z.infer<typeof RecipientUpdateSchema>;

export const RecipientListQuerySchema = z.object({
  active: z.enum(['true', 'false', 'all'], { error: "active must be 'true', 'false' or 'all'" }).default('true'),
});

/** An ISO calendar day, e.g. 2027-02-01, that is a real date. */
export const IsoDaySchema = z
  .string({ error: 'Use a date like 2027-02-01' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2027-02-01')
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, 'That date does not exist');

/** Largest quantity one need may ask for: beyond this it is a typing mistake. */
export const MAX_NEED_QUANTITY = 5000;

const needFields = {
  sizeCategory: SizeCategorySchema,
  quantity: z
    .number({ error: 'Quantity must be a number' })
    .int('Quantity must be a whole number')
    .min(1, 'Quantity must be at least 1')
    .max(MAX_NEED_QUANTITY, `Quantity must be at most ${MAX_NEED_QUANTITY}`),
  deadline: IsoDaySchema,
  preferences: optionalText('Preferences', 1000),
};

export const NeedCreateSchema = z.object(needFields);
export type NeedCreate = z.infer<typeof NeedCreateSchema>;

export const NeedUpdateSchema = z
  .object({
    sizeCategory: needFields.sizeCategory.optional(),
    quantity: needFields.quantity.optional(),
    deadline: needFields.deadline.optional(),
    preferences: needFields.preferences,
    version: z.number({ error: 'version must be a number' }).int().min(0).optional(),
  })
  .refine((v) => Object.entries(v).some(([k, x]) => k !== 'version' && x !== undefined), 'Send at least one field to change');
export type NeedUpdate = z.infer<typeof NeedUpdateSchema>;

export const NeedParamsSchema = z.object({
  id: z.coerce.number().int().positive('Not a valid id'),
  needId: z.coerce.number().int().positive('Not a valid need id'),
});

export interface NeedView {
  id: number;
  recipientId: number;
  sizeCategory: z.infer<typeof SizeCategorySchema>;
  quantity: number;
  deadline: string;
  preferences: string | null;
  /** Blankets promised against this need by active or fulfilled pledges (see NeedCounts). */
  pledged: number;
  /** Made and not declined, under pledges for this need (for organisers and coordinators). */
  finished?: number;
  /** With the organisers: received, checked or held for a fix (for organisers and coordinators). */
  inHand?: number;
  /** Assigned, packed or delivered (for organisers and coordinators). */
  assigned?: number;
  version: number;
}

export interface RecipientView {
  id: number;
  name: string;
  kind: RecipientKind;
  population: z.infer<typeof PopulationSchema>;
  address: string;
  lat: number | null;
  lng: number | null;
  /** Contact details and delivery notes are for organisers and coordinators only. */
  contactName?: string | null;
  contactEmail?: string | null;
  contactPhone?: string | null;
  deliveryNotes?: string | null;
  active: boolean;
  version: number;
  guidelines: z.infer<typeof GuidelineSetSchema>;
  guidelineSummary: string[];
  needs: NeedView[];
}
