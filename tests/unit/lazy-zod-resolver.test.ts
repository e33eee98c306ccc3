import { describe, expect, it } from 'vitest';
import { zodResolver } from '@hookform/resolvers/zod';
import { lazyZodResolver, preload } from '@/lib/lazy-zod-resolver';
import { RegisterSchema } from '@shared/schemas/user';
import { PledgeCreateSchema } from '@shared/schemas/pledge';
import { MAX_PLEDGE_QUANTITY as fromValues } from '@shared/schemas/pledge-values';
import { MAX_PLEDGE_QUANTITY as fromSchema } from '@shared/schemas/pledge';

const options = { fields: {}, shouldUseNativeValidation: false } as const;

describe('lazyZodResolver', () => {
  it('reports the same errors and values as zodResolver with the schema in hand', async () => {
    const lazy = lazyZodResolver<{ name: string; email: string; password: string }>(() => import('@shared/schemas/user').then((m) => m.RegisterSchema));
    const eager = zodResolver(RegisterSchema);
    for (const [values, errorCount] of [
      [{ name: '', email: 'not-an-address', password: 'short' }, 3],
      [{ name: 'Wren Maker', email: 'wren@example.org', password: 'three long words in a row' }, 0],
    ] as const) {
      const a = await lazy({ ...values }, undefined, options);
      const b = await eager({ ...values }, undefined, options);
      expect(Object.keys(a.errors)).toHaveLength(errorCount);
      expect(Object.keys(a.errors).sort()).toEqual(Object.keys(b.errors).sort());
      for (const key of Object.keys(b.errors)) expect((a.errors as Record<string, { message?: string }>)[key]?.message).toBe((b.errors as Record<string, { message?: string }>)[key]?.message);
      expect(a.values).toEqual(b.values);
    }
  });

  it('catches a quantity above the pledge limit', async () => {
    const lazy = lazyZodResolver(() => import('@shared/schemas/pledge').then((m) => m.PledgeCreateSchema.pick({ quantity: true, dueDate: true })));
    const r = await lazy({ quantity: fromValues + 1, dueDate: '2026-12-20' }, undefined, options);
    expect(r.errors.quantity?.message).toBe(PledgeCreateSchema.shape.quantity.safeParse(fromValues + 1).error?.issues[0]?.message);
  });
});

describe('preload', () => {
  it('starts at once, loads once, and tries a failed load again on the next call', async () => {
    let calls = 0;
    const get = preload(async () => {
      calls += 1;
      if (calls === 1) throw new Error('connection dropped');
      return 'schema';
    });
    expect(calls).toBe(1);
    await expect(get()).rejects.toThrow('connection dropped');
    await expect(get()).resolves.toBe('schema');
    await expect(get()).resolves.toBe('schema');
    expect(calls).toBe(2);
  });

  it('holds the module once it has arrived, for checks that run while a person types', async () => {
    let release: (v: string) => void = () => {};
    const get = preload(() => new Promise<string>((resolve) => (release = resolve)));
    expect(get.loaded).toBeUndefined();
    release('schema');
    await get();
    expect(get.loaded).toEqual({ value: 'schema' });
  });
});

it('the zod-free pledge limit is the one the schema enforces', () => {
  expect(fromValues).toBe(fromSchema);
});
