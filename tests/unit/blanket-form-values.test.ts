import { describe, expect, it } from 'vitest';
import { BlanketFormSchema } from '../../src/features/blankets/components/blanket-form-schema';
import { FORM_FIELDS, cmFrom, guidelineFields, inUnit } from '../../src/features/blankets/components/blanket-form-values';
import { BORDER_CHOICES } from '@shared/border/library-names';
import { BORDER_LIBRARY } from '@shared/border/library';

describe('what the blanket form knows before its schema has loaded', () => {
  it('names the same fields as the schema, in its order', () => {
    expect(FORM_FIELDS).toEqual(Object.keys(BlanketFormSchema.shape));
  });

  it('offers every border of the library by its own name, in the library order', () => {
    expect(BORDER_CHOICES).toEqual(BORDER_LIBRARY.map((b) => ({ id: b.id, name: b.name })));
  });

  it('converts inches for the check the same way the schema reads them', () => {
    expect(cmFrom(30, 'in')).toBe(76.2);
    expect(inUnit(76.2, 'in')).toBe(30);
    const fields = guidelineFields({ unit: 'in', width: 30, length: Number.NaN, yarnWeight: 4 });
    expect(fields.widthCm).toBe(76.2);
    expect(fields.lengthCm).toBeUndefined();
  });
});
