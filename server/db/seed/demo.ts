import type { Sequelize } from 'sequelize';
import { User } from '../models/user';
import { Drive } from '../models/drive';
import { hashPassword } from '../../auth/password';
import { daysFrom, isoDay, type SeedContext } from './seed-context';

/** A fictional drive in a fictional town; every name here is invented. */
export const DEMO_TOWN = 'Thimbleford';

const MORE_VOLUNTEERS: Array<[string, string]> = [
  ['Maren Oakley', 'maren'],
  ['Tobias Wren', 'tobias'],
  ['Ines Marlow', 'ines'],
  ['Priya Hollis', 'priya'],
  ['Agnes Fairweather', 'agnes'],
  ['Dev Kettering', 'dev'],
  ['Rosalind Quill', 'rosalind'],
  ['Samir Ashdown', 'samir'],
  ['Hattie Brambleby', 'hattie'],
  ['Oona Castell', 'oona'],
  ['Felix Pennyworth', 'felix'],
  ['Lucia Thornbury', 'lucia'],
];

type Step = (ctx: SeedContext) => Promise<void>;

/** Later areas append their part of the scenario here, in order. */
const steps: Step[] = [];
export function addSeedStep(step: Step) {
  steps.push(step);
}

export async function seedDemo(sequelize: Sequelize, password: string, logN: number, today = new Date(), opts: { uploadDir?: string } = {}) {
  // One hash for every demo account: the password is the same and hashing 15 times at N=2^17 is slow.
  const passwordHash = await hashPassword(password, logN);
  await sequelize.transaction(async (transaction) => {
    await Drive.create(
      {
        name: 'Thimbleford Winter Warmth Drive',
        town: DEMO_TOWN,
        summary:
          'Neighbours in Thimbleford crochet and knit blankets at home for the newborn unit, the children\'s ward, ' +
          'the family shelter and the care homes of the valley. Pledge what you can make, plan your border, ' +
          'log each finished blanket and bring it to a drop-off point before the deadline.',
        startsOn: isoDay(daysFrom(today, -42)),
        endsOn: isoDay(daysFrom(today, 90)),
      },
      { transaction },
    );
    const mk = (name: string, email: string, role: 'volunteer' | 'organiser' | 'coordinator') =>
      User.create({ name, email, role, passwordHash, town: DEMO_TOWN }, { transaction });
    const volunteer = await mk('Wren Calloway', 'volunteer@example.org', 'volunteer');
    const organiser = await mk('Odile Farrant', 'organiser@example.org', 'organiser');
    const coordinator = await mk('Cass Merriweather', 'coordinator@example.org', 'coordinator');
    const volunteers = [volunteer];
    for (const [name, local] of MORE_VOLUNTEERS) volunteers.push(await mk(name, `${local}@example.org`, 'volunteer'));

    const ctx: SeedContext = {
      sequelize,
      transaction,
      today,
      passwordHash,
      uploadDir: opts.uploadDir,
      users: { volunteer, organiser, coordinator, volunteers },
      ids: {},
    };
    for (const step of steps) await step(ctx);
  });
}

export async function isEmpty(): Promise<boolean> {
  return (await User.count()) === 0;
}
