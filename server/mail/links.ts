/**
 * Every link a message carries into the app, built in one place. Each must land on a page of the
 * client: tests/api/mail-links.test.ts matches them against the routes in src/app/router.tsx.
 */
export const appLinks = {
  /** The front page; signed-in people go on from there. */
  home: (appUrl: string) => `${appUrl}/`,
  resetPassword: (appUrl: string, token: string) => `${appUrl}/reset-password?token=${encodeURIComponent(token)}`,
  /** A blanket's own page: its maker sees there what to fix, and can print its tag. */
  blanket: (appUrl: string, blanketId: number) => `${appUrl}/blankets/${blanketId}`,
  myBlankets: (appUrl: string) => `${appUrl}/blankets`,
  /** The maker's drop-off page: their bookings, and booking another time. */
  dropOff: (appUrl: string) => `${appUrl}/drop-off`,
};
