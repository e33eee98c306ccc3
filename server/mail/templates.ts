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
      appUrl,
      '',
      'Kindloop',
    ].join('\n'),
  };
}

/** To a maker whose blanket came back from the intake table with something to put right. */
export function blanketNeedsFixMail(opts: {
  name: string;
  code: string;
  recipientName: string | null;
  fixes: string[];
  note?: string;
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
  lines.push(
    '',
    'Once it is done, bring it back to any drop-off point. You can see it under My blankets:',
    '',
    opts.appUrl,
    '',
    'Kindloop',
  );
  return { subject: `Blanket ${opts.code}: a small fix, please`, text: lines.join('\n') };
}
