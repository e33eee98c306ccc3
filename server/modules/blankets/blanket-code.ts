import { randomBytes } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { Blanket } from '../../db/models/blanket';
import { CODE_LENGTH, codeFromBytes } from '@shared/blankets/code';

/** With about a million codes, a few hundred blankets collide rarely; ten tries failing means something is wrong. */
export const MAX_CODE_TRIES = 10;

/**
 * A tag code no other blanket has. The unique index on `code` still guards a race between two
 * requests; this loop just keeps the common collision from reaching the user.
 */
export async function uniqueBlanketCode(
  transaction?: Transaction,
  random: (n: number) => Uint8Array = randomBytes,
): Promise<string> {
  for (let i = 0; i < MAX_CODE_TRIES; i++) {
    const code = codeFromBytes(random(CODE_LENGTH));
    if ((await Blanket.count({ where: { code }, transaction })) === 0) return code;
  }
  throw new Error(`No free blanket code after ${MAX_CODE_TRIES} tries`);
}
