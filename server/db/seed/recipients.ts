import { Recipient } from '../models/recipient';
import { Need } from '../models/need';
import { Site } from '../models/site';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import type { GuidelineSet } from '@shared/schemas/guidelines';
import type { Population, SizeCategory } from '@shared/schemas/blanket';
import type { RecipientKind } from '@shared/schemas/recipient';
import { addSeedStep } from './demo';
import { daysFrom, isoDay } from './seed-context';

/**
 * Thimbleford is invented, and so is its place on the map: an arbitrary point out at sea, so no
 * real town, street or building is ever pinned. Pins are offsets from it, about a town's width.
 */
export const THIMBLEFORD_CENTRE = { lat: 46.2, lng: -27.4 } as const;
const pin = (north: number, east: number) => ({
  lat: Math.round((THIMBLEFORD_CENTRE.lat + north) * 1e5) / 1e5,
  lng: Math.round((THIMBLEFORD_CENTRE.lng + east) * 1e5) / 1e5,
});

/** Phone numbers come from 01632 960xxx, a range the UK regulator keeps for fiction, so none rings anyone. */
interface DemoRecipient {
  name: string;
  kind: RecipientKind;
  population: Population;
  address: string;
  at: { lat: number; lng: number };
  contactName: string;
  contactEmail: string;
  contactPhone: string;
  deliveryNotes: string;
  /** The unit's own edits to the population's defaults. */
  edit: (g: GuidelineSet) => GuidelineSet;
  needs: Array<{ sizeCategory: SizeCategory; quantity: number; inDays: number; preferences: string | null }>;
}

export const RECIPIENTS: DemoRecipient[] = [
  {
    name: 'Willow Newborn Unit, Thimbleford General',
    kind: 'neonatal-unit',
    population: 'preemie',
    address: 'Willow Wing, Thimbleford General Hospital, 4 Larkspur Road, Thimbleford',
    at: pin(0.012, -0.018),
    contactName: 'Marigold Ashby (ward sister)',
    contactEmail: 'willow.unit@example.org',
    contactPhone: '01632 960 112',
    deliveryNotes: 'Deliver to the Willow Wing reception on weekdays, 10:00–15:00. Blankets go to the unit laundry before use.',
    // Light yarn only: the unit asked for nothing heavier than DK on its small cots.
    edit: (g) => ({ ...g, yarnWeights: [1, 2, 3] }),
    needs: [
      { sizeCategory: 'preemie', quantity: 40, inDays: 35, preferences: 'Soft pale colours; plain stitches with small holes.' },
    ],
  },
  {
    name: "Bramblewick Children's Ward, Thimbleford General",
    kind: 'childrens-ward',
    population: 'child',
    address: 'Bramblewick Ward, Thimbleford General Hospital, 4 Larkspur Road, Thimbleford',
    at: pin(0.0125, -0.0172),
    contactName: 'Idris Pellow (play specialist)',
    contactEmail: 'bramblewick.ward@example.org',
    contactPhone: '01632 960 230',
    deliveryNotes: 'Children choose a blanket and take it home, so bright colours are very welcome.',
    // The ward takes no pompoms: they work loose in the wash.
    edit: (g) => ({ ...g, refusedFeatures: [...g.refusedFeatures, 'pompoms'] }),
    needs: [
      { sizeCategory: 'child', quantity: 25, inDays: 60, preferences: 'Bright colours, stripes and squares.' },
      { sizeCategory: 'lap', quantity: 15, inDays: 28, preferences: null },
    ],
  },
  {
    name: 'Harbour Lantern Family Shelter',
    kind: 'family-shelter',
    population: 'infant',
    address: '17 Millrace Street, Thimbleford',
    at: pin(-0.006, 0.011),
    contactName: 'Noor Quenby',
    contactEmail: 'harbour.lantern@example.org',
    contactPhone: '01632 960 318',
    deliveryNotes: 'Ring the side bell and ask for the family room. Please do not share the address on social media.',
    // Parents wash by hand as often as by machine, so dryer safety is not asked for.
    edit: (g) => ({ ...g, requireDryerSafe: false }),
    needs: [
      { sizeCategory: 'baby', quantity: 20, inDays: 21, preferences: 'Any colours; washable is what matters.' },
      { sizeCategory: 'crib', quantity: 10, inDays: 50, preferences: null },
    ],
  },
  {
    name: 'Tansy Court Care Home',
    kind: 'care-home',
    population: 'elder',
    address: '2 Tansy Court, Orchard Rise, Thimbleford',
    at: pin(0.019, 0.024),
    contactName: 'Bethan Rook (activities lead)',
    contactEmail: 'tansy.court@example.org',
    contactPhone: '01632 960 455',
    deliveryNotes: 'Visiting hours are best; residents like to meet the makers.',
    // A little more room on the length: several residents are tall and like their feet covered.
    edit: (g) => ({ ...g, maxLengthCm: g.maxLengthCm + 8 }),
    needs: [{ sizeCategory: 'lap', quantity: 30, inDays: 42, preferences: 'Warm, calm colours; no very dark shades.' }],
  },
  {
    name: 'Fernhollow House',
    kind: 'care-home',
    population: 'elder',
    address: 'Fernhollow Lane, Thimbleford',
    at: pin(-0.021, -0.027),
    contactName: 'Gideon Marsh (manager)',
    contactEmail: 'fernhollow.house@example.org',
    contactPhone: '01632 960 507',
    deliveryNotes: 'Deliveries to the office by the car park, not the front door.',
    edit: (g) => ({ ...g, toleranceValue: 8 }),
    needs: [{ sizeCategory: 'lap', quantity: 12, inDays: 70, preferences: null }],
  },
  {
    name: 'Kestrel Rise Hospice',
    kind: 'hospice',
    population: 'adult',
    address: '1 Kestrel Rise, Thimbleford',
    at: pin(0.028, 0.006),
    contactName: 'Olwen Tarrant (volunteer coordinator)',
    contactEmail: 'kestrel.rise@example.org',
    contactPhone: '01632 960 661',
    deliveryNotes: 'Each blanket goes home with the family afterwards, so a small card with the maker\'s first name is welcome.',
    // Guests lie still for long hours: heavy jumbo yarn is too much weight.
    edit: (g) => ({ ...g, yarnWeights: g.yarnWeights.filter((w) => w <= 6) }),
    needs: [
      { sizeCategory: 'lap', quantity: 10, inDays: 30, preferences: null },
      { sizeCategory: 'throw', quantity: 8, inDays: 80, preferences: 'Soft fibres; gentle colours.' },
    ],
  },
];

export const SITES = [
  {
    name: 'Thimbleford Library',
    address: '9 Quill Lane, Thimbleford',
    at: pin(0.002, -0.004),
    notes: 'Hand blankets to the front desk in a named bag; staff keep them in the back office.',
  },
  {
    name: 'Millrace Community Hall',
    address: '40 Millrace Street, Thimbleford',
    at: pin(-0.004, 0.008),
    notes: 'Organisers sort and check blankets here on Saturday mornings.',
  },
  {
    name: 'Hollyhock Yarn Parlour',
    address: '3 Weaver\'s Yard, Thimbleford',
    at: pin(0.006, 0.003),
    notes: 'Open Tuesday to Saturday; the counter takes blankets during shop hours.',
  },
];

addSeedStep(async (ctx) => {
  const { transaction, today } = ctx;
  const recipients: number[] = [];
  const needs: number[] = [];
  for (const r of RECIPIENTS) {
    const row = await Recipient.create(
      {
        name: r.name,
        kind: r.kind,
        population: r.population,
        address: r.address,
        lat: r.at.lat,
        lng: r.at.lng,
        contactName: r.contactName,
        contactEmail: r.contactEmail,
        contactPhone: r.contactPhone,
        deliveryNotes: r.deliveryNotes,
        guidelines: r.edit(defaultGuidelines(r.population)),
      },
      { transaction },
    );
    recipients.push(row.id);
    for (const n of r.needs) {
      const need = await Need.create(
        {
          recipientId: row.id,
          sizeCategory: n.sizeCategory,
          quantity: n.quantity,
          deadline: isoDay(daysFrom(today, n.inDays)),
          preferences: n.preferences,
        },
        { transaction },
      );
      needs.push(need.id);
    }
  }
  const sites: number[] = [];
  for (const s of SITES) {
    const row = await Site.create({ name: s.name, address: s.address, lat: s.at.lat, lng: s.at.lng, notes: s.notes }, { transaction });
    sites.push(row.id);
  }
  ctx.ids.recipients = recipients;
  ctx.ids.needs = needs;
  ctx.ids.sites = sites;
});
