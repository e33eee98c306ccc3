import { createEvent } from 'ics';
import type { MailAttachment } from '../../mail/attachment';

export interface InvitationInput {
  bookingId: number;
  /** RFC 5545 SEQUENCE: 0 when booked, raised by every move and by the cancellation. */
  sequence: number;
  method: 'REQUEST' | 'CANCEL';
  startsAt: Date;
  endsAt: Date;
  siteName: string;
  siteAddress: string;
  siteNotes: string | null;
  lat: number | null;
  lng: number | null;
  blanketCodes: string[];
  maker: { name: string; email: string };
  organiser: { name: string; email: string };
  /** The host part of the UID; the product's public address, so UIDs are unique to this installation. */
  host: string;
  appUrl: string;
}

/**
 * One UID per booking for its whole life (RFC 5545 §3.8.4.7), so a calendar that holds the entry
 * replaces it when a move or a cancellation arrives with a higher SEQUENCE (RFC 5546 §2.1.4, §3.2.5).
 */
export const bookingUid = (bookingId: number, host: string) => `drop-off-${bookingId}@${host}`;

const utcArray = (d: Date): [number, number, number, number, number] => [
  d.getUTCFullYear(),
  d.getUTCMonth() + 1,
  d.getUTCDate(),
  d.getUTCHours(),
  d.getUTCMinutes(),
];

/** The calendar file for a booking, times in UTC (RFC 5545 §3.3.5 form 2), written by the `ics` package. */
export function bookingCalendar(i: InvitationInput): string {
  const cancelled = i.method === 'CANCEL';
  const { error, value } = createEvent({
    productId: '-//Kindloop//Drop-off booking//EN',
    method: i.method,
    uid: bookingUid(i.bookingId, i.host),
    sequence: i.sequence,
    start: utcArray(i.startsAt),
    startInputType: 'utc',
    startOutputType: 'utc',
    end: utcArray(i.endsAt),
    endInputType: 'utc',
    endOutputType: 'utc',
    title: `${cancelled ? 'Cancelled: ' : ''}Blanket drop-off at ${i.siteName}`,
    location: `${i.siteName}, ${i.siteAddress}`,
    ...(i.lat !== null && i.lng !== null ? { geo: { lat: i.lat, lon: i.lng } } : {}),
    description: [
      `Bringing ${i.blanketCodes.length === 1 ? 'blanket' : 'blankets'} ${i.blanketCodes.join(', ')}.`,
      i.siteNotes ? `At the site: ${i.siteNotes}` : '',
      `Change or cancel: ${i.appUrl}`,
    ]
      .filter(Boolean)
      .join('\n'),
    url: i.appUrl,
    status: cancelled ? 'CANCELLED' : 'CONFIRMED',
    busyStatus: 'BUSY',
    organizer: { name: i.organiser.name, email: i.organiser.email },
    attendees: [{ name: i.maker.name, email: i.maker.email, rsvp: false, partstat: 'ACCEPTED', role: 'REQ-PARTICIPANT' }],
  });
  if (error || !value) throw error ?? new Error('The calendar file could not be written');
  return value;
}

export function calendarAttachment(i: InvitationInput): MailAttachment {
  return {
    filename: i.method === 'CANCEL' ? 'drop-off-cancelled.ics' : 'drop-off.ics',
    contentType: `text/calendar; charset=utf-8; method=${i.method}`,
    content: bookingCalendar(i),
  };
}

/** "Kindloop <no-reply@x>" → { name, email }; a bare address keeps the product's name. */
export function parseMailbox(from: string): { name: string; email: string } {
  const m = /^\s*"?([^"<]*?)"?\s*<([^>]+)>\s*$/.exec(from);
  return m ? { name: m[1] || 'Kindloop', email: m[2] } : { name: 'Kindloop', email: from.trim() };
}
