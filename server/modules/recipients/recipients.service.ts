import type { Sequelize, Transaction } from 'sequelize';
import { Recipient } from '../../db/models/recipient';
import { Need } from '../../db/models/need';
import { needCounts, noCounts } from '../pledges/need-counts';
import type { NeedCounts } from '@shared/schemas/pledge';
import { HttpError, notFound } from '../../lib/http-error';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import { describeGuidelines } from '@shared/guidelines/describe';
import { GuidelineSetSchema, type GuidelineSet } from '@shared/schemas/guidelines';
import type {
  NeedCreate,
  NeedUpdate,
  NeedView,
  RecipientCreate,
  RecipientUpdate,
  RecipientView,
} from '@shared/schemas/recipient';
import type { Role } from '@shared/schemas/user';

/** Contact details and delivery notes are for the people who plan deliveries. */
const seesContacts = (role: Role) => role === 'organiser' || role === 'coordinator';

/**
 * A stored guideline set, read back through the schema. A row written by an older version that no
 * longer parses falls back to the population's defaults rather than breaking every check.
 */
export function storedGuidelines(r: Pick<Recipient, 'guidelines' | 'population'>): GuidelineSet {
  const parsed = GuidelineSetSchema.safeParse(r.guidelines);
  return parsed.success ? parsed.data : defaultGuidelines(r.population);
}

type CountsByNeed = Map<number, NeedCounts>;

/** Volunteers see what is pledged; where the blankets stand is for the people who handle them. */
function needView(n: Need, counts: CountsByNeed, withBlankets: boolean): NeedView {
  const c = counts.get(n.id) ?? noCounts(n.id, n.recipientId, n.quantity);
  const view: NeedView = {
    id: n.id,
    recipientId: n.recipientId,
    sizeCategory: n.sizeCategory,
    quantity: n.quantity,
    deadline: n.deadline,
    preferences: n.preferences ?? null,
    pledged: c.pledged,
    version: n.version,
  };
  if (withBlankets) Object.assign(view, { finished: c.finished, inHand: c.inHand, assigned: c.assigned });
  return view;
}

/**
 * A recipient's guidelines read back and described, kept per id, version and last change: reading
 * them through the schema on every list was most of what a list of recipients cost.
 */
const readGuidelines = new Map<string, { guidelines: GuidelineSet; summary: string[] }>();
function guidelinesAndSummary(r: Recipient) {
  const key = `${r.id}:${r.version}:${new Date(r.updatedAt).getTime()}`;
  let known = readGuidelines.get(key);
  if (!known) {
    const guidelines = storedGuidelines(r);
    known = { guidelines, summary: describeGuidelines(guidelines) };
    if (readGuidelines.size >= 500) readGuidelines.clear();
    readGuidelines.set(key, known);
  }
  return known;
}

function recipientView(r: Recipient, role: Role, counts: CountsByNeed): RecipientView {
  const { guidelines, summary } = guidelinesAndSummary(r);
  const needs = [...(r.needs ?? [])].sort((a, b) => a.deadline.localeCompare(b.deadline) || a.id - b.id);
  const view: RecipientView = {
    id: r.id,
    name: r.name,
    kind: r.kind,
    population: r.population,
    address: r.address,
    lat: r.lat,
    lng: r.lng,
    active: r.active,
    version: r.version,
    guidelines,
    guidelineSummary: summary,
    needs: needs.map((n) => needView(n, counts, seesContacts(role))),
  };
  if (seesContacts(role)) {
    view.contactName = r.contactName ?? null;
    view.contactEmail = r.contactEmail ?? null;
    view.contactPhone = r.contactPhone ?? null;
    view.deliveryNotes = r.deliveryNotes ?? null;
  }
  return view;
}

export async function listRecipients(role: Role, active: 'true' | 'false' | 'all'): Promise<RecipientView[]> {
  // Volunteers only ever see the recipients the drive is collecting for.
  const filter = role === 'volunteer' ? 'true' : active;
  const where = filter === 'all' ? {} : { active: filter === 'true' };
  const rows = await Recipient.findAll({ where, include: [{ model: Need, as: 'needs' }], order: [['name', 'ASC']] });
  const counts = await needCounts(rows.flatMap((r) => (r.needs ?? []).map((n) => n.id)), { blankets: seesContacts(role) });
  return rows.map((r) => recipientView(r, role, counts));
}

async function loadRecipient(id: number, transaction?: Transaction): Promise<Recipient> {
  const r = await Recipient.findByPk(id, { include: [{ model: Need, as: 'needs' }], transaction });
  if (!r) throw notFound('That recipient');
  return r;
}

export async function getRecipient(id: number, role: Role): Promise<RecipientView> {
  const r = await loadRecipient(id);
  if (role === 'volunteer' && !r.active) throw notFound('That recipient');
  const counts = await needCounts((r.needs ?? []).map((n) => n.id), { blankets: seesContacts(role) });
  return recipientView(r, role, counts);
}

function checkVersion(current: number, sent: number | undefined, what: string) {
  if (sent !== undefined && sent !== current) {
    throw new HttpError(409, `Someone else changed this ${what} since you opened it; reload and try again`, [
      { path: 'version', message: `You had version ${sent}; it is now ${current}` },
    ]);
  }
}

export async function createRecipient(sequelize: Sequelize, input: RecipientCreate, role: Role): Promise<RecipientView> {
  const id = await sequelize.transaction(async (transaction) => {
    const r = await Recipient.create(
      {
        name: input.name,
        kind: input.kind,
        population: input.population,
        address: input.address,
        lat: input.lat,
        lng: input.lng,
        contactName: input.contactName ?? null,
        contactEmail: input.contactEmail ?? null,
        contactPhone: input.contactPhone ?? null,
        deliveryNotes: input.deliveryNotes ?? null,
        guidelines: input.guidelines ?? defaultGuidelines(input.population),
        active: input.active,
      },
      { transaction },
    );
    return r.id;
  });
  return getRecipient(id, role);
}

export async function updateRecipient(id: number, input: RecipientUpdate, role: Role): Promise<RecipientView> {
  const r = await loadRecipient(id);
  checkVersion(r.version, input.version, 'recipient');
  const lat = input.lat !== undefined ? input.lat : r.lat;
  const lng = input.lng !== undefined ? input.lng : r.lng;
  if ((lat === null) !== (lng === null)) {
    throw new HttpError(400, 'A map pin needs both latitude and longitude, or neither', [
      { path: lat === null ? 'lat' : 'lng', message: 'Give both coordinates or clear both' },
    ]);
  }
  const { version: _version, ...fields } = input;
  for (const [key, value] of Object.entries(fields)) {
    if (value !== undefined) r.set(key as keyof RecipientUpdate & keyof Recipient, value as never);
  }
  // The rules an organiser edited stay; only who they speak about follows the recipient.
  if (input.population !== undefined && input.population !== storedGuidelines(r).population) {
    r.guidelines = { ...storedGuidelines(r), population: input.population };
  }
  await r.save();
  return getRecipient(id, role);
}

export async function putGuidelines(id: number, g: GuidelineSet, role: Role, version?: number): Promise<RecipientView> {
  const r = await loadRecipient(id);
  checkVersion(r.version, version, 'recipient');
  if (g.population !== r.population) {
    throw new HttpError(400, `population: these guidelines are for ${g.population}, but ${r.name} serves ${r.population}`, [
      { path: 'population', message: `Must be ${r.population}, the population ${r.name} serves` },
    ]);
  }
  r.guidelines = g;
  r.changed('guidelines', true);
  await r.save();
  return getRecipient(id, role);
}

async function loadNeed(recipientId: number, needId: number): Promise<Need> {
  const need = await Need.findOne({ where: { id: needId, recipientId } });
  if (!need) throw notFound('That need');
  return need;
}

export async function createNeed(recipientId: number, input: NeedCreate): Promise<NeedView> {
  await loadRecipient(recipientId);
  const need = await Need.create({
    recipientId,
    sizeCategory: input.sizeCategory,
    quantity: input.quantity,
    deadline: input.deadline,
    preferences: input.preferences ?? null,
  });
  return needView(need, new Map(), true);
}

export async function updateNeed(recipientId: number, needId: number, input: NeedUpdate): Promise<NeedView> {
  const need = await loadNeed(recipientId, needId);
  checkVersion(need.version, input.version, 'need');
  if (input.sizeCategory !== undefined) need.sizeCategory = input.sizeCategory;
  if (input.quantity !== undefined) need.quantity = input.quantity;
  if (input.deadline !== undefined) need.deadline = input.deadline;
  if (input.preferences !== undefined) need.preferences = input.preferences;
  await need.save();
  return needView(need, await needCounts([need.id]), true);
}

export async function deleteNeed(recipientId: number, needId: number): Promise<void> {
  const need = await loadNeed(recipientId, needId);
  const pledged = (await needCounts([need.id], { blankets: false })).get(need.id)?.pledged ?? 0;
  if (pledged > 0) {
    // Deleting would quietly turn volunteers' pledges into "wherever it's needed most".
    throw new HttpError(
      409,
      `Makers have pledged ${pledged} blanket${pledged === 1 ? '' : 's'} against this need; lower its quantity or move the pledges first`,
    );
  }
  await need.destroy();
}

/** Every active recipient's guidelines, for `alsoFits`. */
export async function activeRecipientGuidelines(transaction?: Transaction) {
  const rows = await Recipient.findAll({ where: { active: true }, order: [['id', 'ASC']], transaction });
  return rows.map((r) => ({ recipientId: r.id, name: r.name, guidelines: storedGuidelines(r) }));
}
