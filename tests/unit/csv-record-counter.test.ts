import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { stringify } from 'csv-stringify/sync';
import { CsvRecordCounter } from '@/features/runs/lib/csv-record-counter';

const bytes = (s: string) => new TextEncoder().encode(s);

describe('counting CSV records as the bytes arrive (RFC 4180, section 2)', () => {
  it('does not count a line break inside a quoted field', () => {
    const csv = 'box,address\r\n1,"4 Larkspur Road\r\nThimbleford"\r\n2,"say ""hi"", then\nleave"\r\n';
    expect(new CsvRecordCounter().push(bytes(csv))).toBe(3);
  });

  it('counts the records csv-stringify wrote, however the bytes are split into chunks', () => {
    const cell = fc.string({ unit: fc.constantFrom('a', 'é', '"', ',', '\n', '\r', ' ', '=', '🧶'), maxLength: 12 });
    fc.assert(
      fc.property(fc.array(fc.array(cell, { minLength: 1, maxLength: 4 }), { minLength: 1, maxLength: 20 }), fc.array(fc.nat(), { maxLength: 6 }), (rows, cuts) => {
        const data = bytes(stringify(rows, { record_delimiter: 'windows', quote_record_delimiter: true }));
        const at = [...new Set(cuts.map((c) => c % (data.length + 1)))].sort((a, b) => a - b);
        const counter = new CsvRecordCounter();
        let from = 0;
        for (const cut of [...at, data.length]) {
          counter.push(data.subarray(from, cut));
          from = cut;
        }
        expect(counter.records).toBe(rows.length);
      }),
    );
  });
});
