/**
 * Links that carry a token (a password reset today; any later sign-in or confirmation link the same
 * way) work once and act for the person they were sent to. Whoever holds one can take over that
 * account, so the Mail page shows them only to their addressee. A template that sends such a link
 * must put its secret in a `token` parameter for this to find it.
 */
const SINGLE_USE_LINK = /\bhttps?:\/\/[^\s<>"]*[?&#]token=[^\s<>"]*/gi;

export const HIDDEN_LINK = '[single-use link hidden: only the person it was sent to can see it]';

export function redactSingleUseLinks(text: string): { text: string; hidden: number } {
  let hidden = 0;
  const out = text.replace(SINGLE_USE_LINK, () => {
    hidden++;
    return HIDDEN_LINK;
  });
  return { text: out, hidden };
}

/** The bare addresses in a To header as the catcher stored it ("a@x.org, Name <b@x.org>"). */
export function addressesIn(to: string): string[] {
  return to
    .split(',')
    .map((part) => (part.match(/<([^>]+)>/)?.[1] ?? part).trim().toLowerCase())
    .filter(Boolean);
}

/** Only when the reader is the one addressee does a single-use link stay in the text. */
export function isSoleAddressee(to: string, readerEmail: string): boolean {
  const list = addressesIn(to);
  return list.length === 1 && list[0] === readerEmail.trim().toLowerCase();
}
