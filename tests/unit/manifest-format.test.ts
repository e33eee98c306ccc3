import { describe, expect, it } from 'vitest';
import {
  MANIFEST_CARE,
  MANIFEST_COLUMNS,
  MANIFEST_SOURCE_FIELDS,
  manifestRecord,
  manifestShaper,
  neutralise,
  type ManifestDestination,
  type ManifestSourceRow,
} from '../../server/modules/runs/manifest-format';
import { inKeyOrder } from '../../server/modules/runs/manifest.service';

type Named = { [K in (typeof MANIFEST_SOURCE_FIELDS)[number]]: ManifestSourceRow[number] };
const to: ManifestDestination = { recipient: 'Harbour Lantern Family Shelter', address: '4 Quay Row, Thimbleford' };

/** The care answers as a page row carries them: one bit per yes. */
const care = (yes: Partial<Record<(typeof MANIFEST_CARE)[number]['field'], boolean>>) => MANIFEST_CARE.reduce((n, c) => n | (yes[c.field] ? c.bit : 0), 0);

/** A page row as the query returns it, written out by field name. */
const row = (over: Partial<Named> = {}): ManifestSourceRow => {
  const named: Named = {
    box: 3,
    blanketId: 41,
    code: 'KL-ABCD',
    widthCm: 78,
    lengthCm: 101,
    yarnWeight: 4,
    fibres: '["acrylic","cotton"]',
    colours: 'ocean blues',
    features: '[]',
    care: care({ machineWashable: true, smokeFree: true, petFree: true }),
    labelName: 'Maren Oakley',
    checkedBy: 'Odile Farrant',
    checkedOn: '2026-11-30',
    runDate: '2026-12-06',
    position: 2,
    ...over,
  };
  return MANIFEST_SOURCE_FIELDS.map((f) => named[f]) as ManifestSourceRow;
};

describe('manifest rows', () => {
  it('has one value per column, with the size on record in cm and inches', () => {
    const r = manifestRecord(row(), to);
    expect(r).toHaveLength(MANIFEST_COLUMNS.length);
    const at = (c: (typeof MANIFEST_COLUMNS)[number]) => r[MANIFEST_COLUMNS.indexOf(c)];
    // The size on record, as the page query gives it.
    expect(at('Width (cm)')).toBe(78);
    expect(at('Length (cm)')).toBe(101);
    // 1 in = 2.54 cm exactly (international yard and pound agreement, 1959): 78 / 2.54 = 30.7, 101 / 2.54 = 39.8.
    expect(at('Width (in)')).toBe(30.7);
    expect(at('Length (in)')).toBe(39.8);
    expect(at('Fibres')).toBe('acrylic; cotton');
    expect(at('Machine washable')).toBe('yes');
    expect(at('Dryer safe')).toBe('no');
    expect(at('Smoke-free home')).toBe('yes');
    expect(at('Pet-free home')).toBe('yes');
    expect(at('Made by (as on the label)')).toBe('Maren');
    expect(at('Checked on')).toBe('2026-11-30');
    expect(at('Yarn weight')).toBe('4 (medium)');
  });

  it('says "Anonymous" where the maker chose it, and leaves run columns empty for a blanket on no run', () => {
    const r = manifestRecord(row({ labelName: null, runDate: null, position: null, box: null, checkedBy: null, checkedOn: null }), to);
    expect(r[MANIFEST_COLUMNS.indexOf('Made by (as on the label)')]).toBe('Anonymous');
    expect(r.slice(0, 2)).toEqual(['', '']);
    expect(r[MANIFEST_COLUMNS.indexOf('Checked on')]).toBe('');
  });

  it("takes a run's date and the stop's place from the destination when the rows leave them out", () => {
    const runRow = row().slice(0, MANIFEST_SOURCE_FIELDS.indexOf('runDate')) as ManifestSourceRow;
    const r = manifestRecord(runRow, { ...to, runDate: '2026-12-20', position: 4 });
    expect(r.slice(0, 2)).toEqual(['2026-12-20', 4]);
  });

  it('reads each care answer from its own bit', () => {
    const col = (name: (typeof MANIFEST_COLUMNS)[number]) => MANIFEST_COLUMNS.indexOf(name);
    const cols = [col('Machine washable'), col('Dryer safe'), col('Smoke-free home'), col('Pet-free home')];
    const answers = (r: ReturnType<typeof manifestRecord>) => cols.map((i) => r[i]);
    expect(answers(manifestRecord(row({ care: 0 }), to))).toEqual(['no', 'no', 'no', 'no']);
    expect(answers(manifestRecord(row({ care: care({ dryerSafe: true }) }), to))).toEqual(['no', 'yes', 'no', 'no']);
    expect(answers(manifestRecord(row({ care: care({ machineWashable: true, petFree: true }) }), to))).toEqual(['yes', 'no', 'no', 'yes']);
    expect(new Set(MANIFEST_CARE.map((c) => c.bit)).size).toBe(MANIFEST_CARE.length);
  });

  it('gives each row its own words when one shaper remembers them across a manifest', () => {
    const shape = manifestShaper();
    const col = (name: (typeof MANIFEST_COLUMNS)[number]) => MANIFEST_COLUMNS.indexOf(name);
    const rows = [
      row({ fibres: '["wool"]', features: '["fringe"]', labelName: '  Ines   Harrow ', yarnWeight: 5 }),
      row({ fibres: '["acrylic","cotton"]', features: '[]', labelName: 'Maren Oakley', yarnWeight: 4 }),
      row({ fibres: '["wool"]', features: '["fringe"]', labelName: null, yarnWeight: 5 }),
      row({ fibres: '["acrylic","cotton"]', features: '[]', labelName: '', yarnWeight: 4, widthCm: 80, lengthCm: 100 }),
    ].map((r) => shape(r, to));
    expect(rows.map((r) => r[col('Fibres')])).toEqual(['wool', 'acrylic; cotton', 'wool', 'acrylic; cotton']);
    expect(rows.map((r) => r[col('Features')])).toEqual(['fringe', '', 'fringe', '']);
    expect(rows.map((r) => r[col('Made by (as on the label)')])).toEqual(['Ines', 'Maren', 'Anonymous', 'Anonymous']);
    expect(rows.map((r) => r[col('Yarn weight')])).toEqual(['5 (bulky)', '4 (medium)', '5 (bulky)', '4 (medium)']);
    // 80 × 100 cm: 80 / 2.54 = 31.5, 100 / 2.54 = 39.4 (1 in = 2.54 cm exactly).
    expect([rows[3]![col('Width (cm)')], rows[3]![col('Length (cm)')], rows[3]![col('Width (in)')], rows[3]![col('Length (in)')]]).toEqual([80, 100, 31.5, 39.4]);
  });
});

// OWASP CSV Injection page: cells beginning with =, +, -, @, tab, CR or LF (and NUL, ASVS 5.0 1.2.10) are neutralised.
describe('neutralise (OWASP CSV Injection)', () => {
  it.each([
    ['=HYPERLINK("http://x.example.org","click")'],
    ['+1+2'],
    ['-2+3+cmd|" /C calc"!A0'],
    ['@SUM(1,1)'],
    ['\t=1'],
    ['\r=1'],
    ['\n=1'],
    ['\0=1'],
  ])('prefixes %j with a single quote', (cell) => {
    expect(neutralise(cell)).toBe(`'${cell}`);
  });

  it.each([['-3'], ['-2.5'], ['+7'], ['plain text'], ['Matron = nice'], ['3-ply'], ['']])('leaves %j alone', (cell) => {
    expect(neutralise(cell)).toBe(cell);
  });
});

describe('manifest pages in keyset order', () => {
  const BOX = MANIFEST_SOURCE_FIELDS.indexOf('box');
  const ID = MANIFEST_SOURCE_FIELDS.indexOf('blanketId');
  it('leaves an ordered page as it came and sorts one that came otherwise, by box then blanket', () => {
    const ordered = [row({ box: 1, blanketId: 9 }), row({ box: 2, blanketId: 3 }), row({ box: 2, blanketId: 7 })];
    expect(inKeyOrder([...ordered], [BOX, ID])).toEqual(ordered);
    const shuffled = [ordered[2]!, ordered[0]!, ordered[1]!];
    expect(inKeyOrder(shuffled, [BOX, ID]).map((r) => [r[BOX], r[ID]])).toEqual([
      [1, 9],
      [2, 3],
      [2, 7],
    ]);
    // A recipient's blankets on no run have no box; they are keyed by blanket alone.
    expect(inKeyOrder([row({ box: null, blanketId: 5 }), row({ box: 3, blanketId: 4 })], [ID]).map((r) => r[ID])).toEqual([4, 5]);
  });
});
