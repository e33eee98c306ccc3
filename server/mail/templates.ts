import { appLinks } from './links';

/** Plain-text mail, written to be read on a phone by someone who isn't expecting us. */
export function passwordResetMail(name: string, link: string, minutes: number) {
  return {
    subject: 'Reset your Kindloop password',
    text: [
      `Hello ${name},`,
      '',
      'Someone (hopefully you) asked to reset the password for this Kindloop account.',
      `Open this link within ${minutes} minutes to choose a new one. It works once:`,
      '',
      link,
      '',
      'If you did not ask for this, you can ignore this message; your password stays as it is.',
      '',
      'Kindloop',
    ].join('\n'),
  };
}

export function welcomeMail(name: string, appUrl: string) {
  return {
    subject: 'Welcome to Kindloop',
    text: [
      `Hello ${name},`,
      '',
      'Thank you for joining the drive. You can see what the recipients need, pledge blankets,',
      'plan your border and log what you finish here:',
      '',
      appLinks.home(appUrl),
      '',
      'Kindloop',
    ].join('\n'),
  };
}

/** To a maker whose blanket came back from the intake table with something to put right. */
export function blanketNeedsFixMail(opts: {
  name: string;
  code: string;
  blanketId: number;
  recipientName: string | null;
  fixes: string[];
  note?: string;
  /** The size as logged and as measured on the table, so the maker sees which one the check used. */
  logged?: { widthCm: number; lengthCm: number };
  measured?: { widthCm: number; lengthCm: number } | null;
  appUrl: string;
}) {
  const lines = [
    `Hello ${opts.name},`,
    '',
    `Thank you for blanket ${opts.code}. We checked it at the drop-off table and it needs a small fix`,
    opts.recipientName ? `before it can go to ${opts.recipientName}:` : 'before it can go out:',
    '',
    ...opts.fixes.map((f) => `- ${f}`),
  ];
  if (opts.note) lines.push('', `A note from the organiser: ${opts.note}`);
  const m = opts.measured;
  const l = opts.logged;
  if (m && l && (m.widthCm !== l.widthCm || m.lengthCm !== l.lengthCm)) {
    lines.push('', `We measured it at ${m.widthCm} × ${m.lengthCm} cm (you logged ${l.widthCm} × ${l.lengthCm} cm); the check used our measurement.`);
  }
  lines.push(
    '',
    'Once it is done, bring it back to any drop-off point. Its page says the same and keeps it all in one place:',
    '',
    appLinks.blanket(opts.appUrl, opts.blanketId),
    '',
    'Kindloop',
  );
  return { subject: `Blanket ${opts.code}: a small fix, please`, text: lines.join('\n') };
}

/**
 * To a maker who asked to hear where their blankets went, once a stop is delivered. It names the
 * recipient by its public name only: never who signed for the blankets or anyone else at the place.
 */
export function deliveryThankYouMail(opts: { name: string; recipientName: string; codes: string[]; appUrl: string }) {
  const one = opts.codes.length === 1;
  return {
    subject: one ? `Your blanket ${opts.codes[0]} has been delivered` : `Your ${opts.codes.length} blankets have been delivered`,
    text: [
      `Hello ${opts.name},`,
      '',
      `Thank you. ${one ? 'Your blanket has' : 'Your blankets have'} reached ${opts.recipientName}:`,
      '',
      ...opts.codes.map((c) => `- ${c}`),
      '',
      'Every one was made by hand and checked at the drop-off table before it went. Your blankets and where',
      'each one went are kept here:',
      '',
      appLinks.myBlankets(opts.appUrl),
      '',
      'You asked for this message when your blankets are delivered; you can turn it off on the drop-off page.',
      '',
      'Kindloop',
    ].join('\n'),
  };
}
