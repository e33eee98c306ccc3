import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import fc from 'fast-check';
import { MANIFEST_COLUMNS, manifestStringifier, type ManifestRecord } from '../../server/modules/runs/manifest-format';

/**
 * RFC 4180 (Common Format and MIME Type for CSV Files): records end in CRLF, a field holding a comma,
 * a double quote or a line break is enclosed in double quotes, and a double quote inside is doubled;
 * one optional header line. The manifests are parsed back with csv-parse, a registry CSV parser.
 */
async function write(records: ManifestRecord[], bom = false): Promise<string> {
  const s = manifestStringifier({ bom });
  const chunks: Buffer[] = [];
  s.on('data', (c: Buffer | string) => chunks.push(Buffer.from(c)));
  const done = new Promise<void>((resolve, reject) => {
    s.on('end', resolve);
    s.on('error', reject);
  });
  for (const r of records) s.write(r);
  s.end();
  await done;
  return Buffer.concat(chunks).toString('utf8');
}

/** The text with every quoted field taken out: what is left may hold CR and LF only as CRLF record ends. */
const outsideQuotes = (text: string) => text.replace(/"(?:[^"]|"")*"/g, '');

const record = (over: Partial<Record<number, string | number>> = {}): ManifestRecord =>
  MANIFEST_COLUMNS.map((_, i) => over[i] ?? `v${i}`);

describe('RFC 4180', () => {
  it('ends every record, the header included, with CRLF and never a bare LF', async () => {
    const text = await write([record(), record()]);
    expect(text.split('\r\n')).toHaveLength(4); // header, two records, and the empty tail after the last CRLF
    expect(text.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
    expect(text.startsWith(MANIFEST_COLUMNS.join(','))).toBe(true);
  });

  it('quotes fields with a comma, a quote or a line break, and doubles the quote (RFC 4180 §2.6, §2.7)', async () => {
    const text = await write([record({ 2: 'Fernhollow House, east wing', 13: 'cream "vintage" wool', 3: 'Line one\r\nLine two' })]);
    expect(text).toContain('"Fernhollow House, east wing"');
    expect(text).toContain('"cream ""vintage"" wool"');
    expect(text).toContain('"Line one\r\nLine two"');
  });

  it('quotes a lone LF or CR too: unquoted text holds neither (RFC 4180 §2, TEXTDATA)', async () => {
    const text = await write([record({ 3: '4 Quay Row\nThimbleford', 16: 'soft\rwarm' })]);
    expect(text).toContain('"4 Quay Row\nThimbleford"');
    expect(text).toContain('"soft\rwarm"');
    expect(outsideQuotes(text).replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
    // A reader that ends a row at any line break, as spreadsheet programs do, still finds one record.
    const back = parse(text, { record_delimiter: ['\r\n', '\n', '\r'] }) as string[][];
    expect(back).toHaveLength(2);
    expect(back[1]![3]).toBe('4 Quay Row\nThimbleford');
  });

  it('round-trips any text through csv-parse unchanged, except neutralised formula cells', async () => {
    const cell = fc.string({ unit: 'binary', maxLength: 30 });
    await fc.assert(
      fc.asyncProperty(fc.array(fc.array(cell, { minLength: MANIFEST_COLUMNS.length, maxLength: MANIFEST_COLUMNS.length }), { maxLength: 5 }), async (rows) => {
        const text = await write(rows);
        expect(outsideQuotes(text).replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
        const back = parse(text, { columns: false, relax_column_count: false, record_delimiter: '\r\n' }) as string[][];
        expect(back[0]).toEqual([...MANIFEST_COLUMNS]);
        expect(back).toHaveLength(rows.length + 1);
        back.slice(1).forEach((r, i) =>
          r.forEach((v, j) => {
            const sent = rows[i]![j]!;
            const dangerous = /^[=+\-@\t\r\n\0]/.test(sent) && !/^[+-]?\d+(?:[.,]\d+)?$/.test(sent);
            expect(v).toBe(dangerous ? `'${sent}` : sent);
          }),
        );
      }),
      { numRuns: 200 },
    );
  });

  it('puts a UTF-8 byte order mark in front only when asked, for spreadsheet programs', async () => {
    const withBom = await write([record({ 2: 'Crèche Ñandú' })], true);
    const without = await write([record({ 2: 'Crèche Ñandú' })], false);
    expect(withBom.charCodeAt(0)).toBe(0xfeff);
    expect(without.charCodeAt(0)).not.toBe(0xfeff);
    const back = parse(withBom, { bom: true }) as string[][];
    expect(back[0]![0]).toBe('Run date');
    expect(back[1]![2]).toBe('Crèche Ñandú');
  });
});
