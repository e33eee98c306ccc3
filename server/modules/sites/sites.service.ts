import { Site } from '../../db/models/site';
import { HttpError, notFound } from '../../lib/http-error';
import type { SiteCreate, SiteUpdate, SiteView } from '@shared/schemas/site';

export function siteView(s: Site): SiteView {
  return {
    id: s.id,
    name: s.name,
    address: s.address,
    lat: s.lat,
    lng: s.lng,
    notes: s.notes ?? null,
    active: s.active,
    openingHours: s.openingHours ?? null,
    slotMinutes: s.slotMinutes,
    slotCapacity: s.slotCapacity,
    closures: [...(s.closures ?? [])].sort((a, b) => a.from.localeCompare(b.from)),
  };
}

export async function listSites(active: 'true' | 'false' | 'all'): Promise<SiteView[]> {
  const where = active === 'all' ? {} : { active: active === 'true' };
  return (await Site.findAll({ where, order: [['name', 'ASC']] })).map(siteView);
}

/** With activeOnly (makers), a closed site is "not found": its notes may say where a key is kept. */
export async function getSite(id: number, opts: { activeOnly?: boolean } = {}): Promise<SiteView> {
  const s = await Site.findByPk(id);
  if (!s || (opts.activeOnly && !s.active)) throw notFound('That drop-off site');
  return siteView(s);
}

export async function createSite(input: SiteCreate): Promise<SiteView> {
  const s = await Site.create({
    name: input.name,
    address: input.address,
    lat: input.lat,
    lng: input.lng,
    notes: input.notes ?? null,
    active: input.active,
    openingHours: input.openingHours ?? null,
    slotMinutes: input.slotMinutes,
    slotCapacity: input.slotCapacity,
    closures: input.closures ?? null,
  });
  return siteView(s);
}

export async function updateSite(id: number, input: SiteUpdate): Promise<SiteView> {
  const s = await Site.findByPk(id);
  if (!s) throw notFound('That drop-off site');
  const lat = input.lat !== undefined ? input.lat : s.lat;
  const lng = input.lng !== undefined ? input.lng : s.lng;
  if ((lat === null) !== (lng === null)) {
    throw new HttpError(400, 'A map pin needs both latitude and longitude, or neither', [
      { path: lat === null ? 'lat' : 'lng', message: 'Give both coordinates or clear both' },
    ]);
  }
  if (input.name !== undefined) s.name = input.name;
  if (input.address !== undefined) s.address = input.address;
  s.lat = lat;
  s.lng = lng;
  if (input.notes !== undefined) s.notes = input.notes;
  if (input.active !== undefined) s.active = input.active;
  // Existing bookings keep their times when hours change; the organisers see them in the site's day.
  if (input.openingHours !== undefined) s.openingHours = input.openingHours;
  if (input.slotMinutes !== undefined) s.slotMinutes = input.slotMinutes;
  if (input.slotCapacity !== undefined) s.slotCapacity = input.slotCapacity;
  if (input.closures !== undefined) s.closures = input.closures;
  await s.save();
  return siteView(s);
}
