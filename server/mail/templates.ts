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
