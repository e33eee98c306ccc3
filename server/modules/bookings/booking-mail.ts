import { DateTime } from 'luxon';

export interface BookingMailFacts {
  name: string;
  siteName: string;
  siteAddress: string;
  siteNotes: string | null;
  startsAt: Date;
  endsAt: Date;
  timeZone: string;
  blanketCodes: string[];
  appUrl: string;
}

/** "Saturday 12 June 2027, 10:30–11:00 (Europe/London)" in the drive's zone. */
export function whenText(startsAt: Date, endsAt: Date, zone: string): string {
  const s = DateTime.fromJSDate(startsAt, { zone }).setLocale('en-GB');
  const e = DateTime.fromJSDate(endsAt, { zone }).setLocale('en-GB');
  return `${s.toFormat('cccc d LLLL yyyy, HH:mm')}–${e.toFormat('HH:mm')} (${zone})`;
}

const bringing = (codes: string[]) => `You are bringing ${codes.length === 1 ? 'blanket' : 'blankets'} ${codes.join(', ')}.`;

function body(f: BookingMailFacts, opening: string[], closing: string[]) {
  return [
    `Hello ${f.name},`,
    '',
    ...opening,
    '',
    `  ${whenText(f.startsAt, f.endsAt, f.timeZone)}`,
    `  ${f.siteName}, ${f.siteAddress}`,
    ...(f.siteNotes ? [`  ${f.siteNotes}`] : []),
    '',
    ...closing,
    '',
    'Kindloop',
  ].join('\n');
}

export function bookingConfirmedMail(f: BookingMailFacts) {
  return {
    subject: `Drop-off booked: ${f.siteName}, ${whenText(f.startsAt, f.endsAt, f.timeZone).split(',')[0]}`,
    text: body(f, ['Thank you! Your drop-off is booked:'], [
      bringing(f.blanketCodes),
      'The calendar invitation is attached. To change the time or cancel, open your drop-offs:',
      f.appUrl,
    ]),
  };
}

export function bookingMovedMail(f: BookingMailFacts) {
  return {
    subject: `Drop-off changed: ${f.siteName}, ${whenText(f.startsAt, f.endsAt, f.timeZone).split(',')[0]}`,
    text: body(f, ['Your drop-off has changed. The new time and place:'], [
      bringing(f.blanketCodes),
      'The attached invitation updates the entry already in your calendar.',
      f.appUrl,
    ]),
  };
}

export function bookingCancelledMail(f: BookingMailFacts) {
  return {
    subject: `Drop-off cancelled: ${f.siteName}`,
    text: body(f, ['Your drop-off is cancelled:'], [
      'Your blankets are marked finished again; book another time whenever it suits you:',
      f.appUrl,
    ]),
  };
}

export function bookingReminderMail(f: BookingMailFacts) {
  return {
    subject: `Tomorrow: blanket drop-off at ${f.siteName}`,
    text: body(f, ['A reminder of your drop-off tomorrow:'], [
      bringing(f.blanketCodes),
      'Each blanket should carry its tag. Plans changed? Move or cancel it here:',
      f.appUrl,
      '',
      'You can turn these reminders off on the same page.',
    ]),
  };
}

/** After an organiser marks the visit "did not come": no blame, the blankets are free to book again. */
export function bookingMissedMail(f: BookingMailFacts) {
  return {
    subject: `We missed you at ${f.siteName}`,
    text: body(f, ['We did not see you at your drop-off:'], [
      `Your ${f.blanketCodes.length === 1 ? 'blanket is' : 'blankets are'} marked finished again (${f.blanketCodes.join(', ')}), so you can book another time whenever it suits you:`,
      f.appUrl,
      '',
      'If you did come and we missed you, reply to this message and an organiser will put it right.',
    ]),
  };
}
