import type { Sequelize, Transaction } from 'sequelize';
import type { User } from '../models/user';

export interface SeedContext {
  sequelize: Sequelize;
  transaction: Transaction;
  /** The day the database is seeded: every demo date is relative to it, so the demo always looks mid-drive. */
  today: Date;
  passwordHash: string;
  users: { volunteer: User; organiser: User; coordinator: User; volunteers: User[] };
  /** Where demo photos go; unset (as in most tests) means the demo has no photos. */
  uploadDir?: string;
  /** Ids created by earlier steps, for later steps to refer to. */
  ids: Record<string, number[]>;
}

export function daysFrom(today: Date, days: number): Date {
  return new Date(today.getTime() + days * 86_400_000);
}

export function isoDay(d: Date): string {
  return d.toISOString().slice(0, 10);
}
