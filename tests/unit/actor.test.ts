import { describe, expect, it } from 'vitest';
import { maySee, readsAll } from '../../server/auth/actor';
import { REFUSAL_STATUS } from '../../server/modules/blankets/move-blanket';

describe('who may see whose data', () => {
  it('lets a volunteer see only their own records, and staff everyone’s', () => {
    expect(maySee({ id: 7, role: 'volunteer' }, 7)).toBe(true);
    expect(maySee({ id: 7, role: 'volunteer' }, 8)).toBe(false);
    expect(maySee({ id: 1, role: 'organiser' }, 8)).toBe(true);
    expect(maySee({ id: 2, role: 'coordinator' }, 8)).toBe(true);
    expect(readsAll({ id: 7, role: 'volunteer' })).toBe(false);
  });
});

describe('refused moves', () => {
  it('answer a missing reason as a request to fix (400), and a move from the wrong place or step as a conflict', () => {
    expect(REFUSAL_STATUS).toEqual({ same: 409, skip: 409, role: 403, reason: 400, channel: 409 });
  });
});
