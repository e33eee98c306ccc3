import type { BlanketStatus, Population } from './blanket';

/** What the intake routes answer with: the blanket as the table sees it, the day's queue, the tags. */

export interface BlanketTag {
  id: number;
  code: string;
  /** The maker's first name, or "Anonymous" when they chose that for labels. */
  makerLabel: string;
  widthCm: number;
  lengthCm: number;
  sizeCategory: string | null;
  recipientName: string | null;
  /** Who it is meant for, so a tag going to babies can carry the safe-sleep reminder. */
  recipientPopulation: Population | null;
  /** What the QR code holds: a link to this blanket's intake page. */
  link: string;
  /** The QR code as an SVG document. */
  qrSvg: string;
}

export interface BlanketHistoryEntry {
  id: number;
  kind: string;
  fromStatus: string | null;
  toStatus: string | null;
  reason: string | null;
  data: unknown;
  createdAt: string;
  actor: { id: number; name: string } | null;
}

/** A blanket as the intake table sees it: the log, who made it, where it is meant to go, its history. */
export interface IntakeBlanketView {
  id: number;
  code: string;
  status: BlanketStatus;
  version: number;
  /** The size on record: measured at intake where it was, else as logged. */
  widthCm: number;
  lengthCm: number;
  /** Whether widthCm/lengthCm are the intake measurement. */
  measured: boolean;
  /** The size as its maker logged it, kept beside the measurement. */
  logged: { widthCm: number; lengthCm: number };
  yarnWeight: number;
  fibres: string[];
  features: string[];
  colours: string;
  bodyStitch: string;
  machineWashable: boolean;
  dryerSafe: boolean;
  smokeFree: boolean;
  petFree: boolean;
  newYarn: boolean;
  notes: string;
  sizeCategory: string | null;
  receivedAt: string | null;
  maker: { id: number; name: string; label: string };
  recipient: { id: number; name: string; population: string } | null;
  site: { id: number; name: string } | null;
  history: BlanketHistoryEntry[];
}

export interface IntakeQueueItem {
  id: number;
  code: string;
  status: BlanketStatus;
  makerLabel: string;
  recipientName: string | null;
  widthCm: number;
  lengthCm: number;
  sizeCategory: string | null;
  /** When it arrived, or for inspected ones when it was inspected. */
  at: string | null;
  /** For arrivals: whether it came with a drop-off booking or walked in without one. */
  arrivedAs?: 'booked' | 'walk-in';
}

/** A visit booked at the site on the queue's day: when, who, with how many blankets, and whether they came. */
export interface BookedArrival {
  bookingId: number;
  /** ISO 8601 with the drive's offset. */
  start: string;
  end: string;
  makerName: string;
  blankets: Array<{ id: number; code: string; status: BlanketStatus }>;
  arrival: 'expected' | 'arrived' | 'not_arrived' | 'missed';
}

export interface IntakeQueue {
  site: { id: number; name: string };
  date: string;
  /** The drive's zone, in which the day and every time here are read. */
  timeZone: string;
  /** Visits booked at this site on this day, in slot order (a site's day is a few dozen at most). */
  bookedArrivals: BookedArrival[];
  /** Received at this site on this day. */
  arrived: IntakeQueueItem[];
  /** At this site, received and not yet inspected (by the end of this day): one page, oldest first. */
  waiting: IntakeQueueItem[];
  waitingTotal: number;
  waitingPage: number;
  /** Inspected on this day, with the outcome as its status. */
  inspected: IntakeQueueItem[];
  /** Booked to come to this site (the day comes with drop-off scheduling). */
  expected: IntakeQueueItem[];
  expectedTotal: number;
  expectedPage: number;
  /** Rows per page of the waiting and the expected lists. */
  pageSize: number;
}
