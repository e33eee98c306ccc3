/**
 * A file sent with a message. Content is text (a calendar invitation, a CSV): the outbox stores it
 * in a JSON column, so binary files would need base64 and are not needed yet.
 */
export interface MailAttachment {
  filename: string;
  /** The full MIME type with parameters, e.g. `text/calendar; charset=utf-8; method=REQUEST`. */
  contentType: string;
  content: string;
}
