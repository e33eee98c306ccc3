import { stringify, type CastReturnObject, type Options, type Stringifier } from 'csv-stringify';
import { sizeCategoryFor } from '@shared/guidelines/size-categories';
import { featureLabel, fibreLabel, yarnWeightName } from '@shared/guidelines/wording';
import type { Feature, Fibre } from '@shared/schemas/blanket';
import { fromCm } from '@shared/sizing/units';

/** The manifest's columns, in our own words, in the order a driver and a recipient read them. */
export const MANIFEST_COLUMNS = [
  'Run date',
  'Stop',
  'Recipient',
  'Address',
  'Box',
  'Blanket code',
  'Size category',
  'Width (cm)',
  'Length (cm)',
  'Width (in)',
  'Length (in)',
  'Yarn weight',
  'Fibres',
  'Colours',
  'Features',
  'Machine washable',
  'Dryer safe',
  'Smoke-free home',
  'Pet-free home',
  'Made by (as on the label)',
  'Checked by',
  'Checked on',
] as const;

/**
 * One blanket as the page query hands it over: a JSON array with the fields in this order (the
 * service builds its SQL from the same list). An array parsed from one JSON text per page costs far
 * less than an object per row from the driver: most of a large manifest's time went into making and
 * copying those objects. Every value in that text is work twice over, once for SQLite to write it
 * and once for JSON.parse to read it, so SQLite hands over what it can decide exactly and no more:
 * the size on record (measured where both sides were), the four care answers as one number
 * (MANIFEST_CARE), the maker's name only where the label carries it, the check's day ready made (the
 * drive's local day of its UTC timestamp). JSON columns come as text. The run's date and the stop's
 * position come last, and only in a recipient's rows: a run's rows leave them out.
 */
export const MANIFEST_SOURCE_FIELDS = [
  'box',
  'blanketId',
  'code',
  'widthCm',
  'lengthCm',
  'yarnWeight',
  'fibres',
  'colours',
  'features',
  'care',
  'labelName',
  'checkedBy',
  'checkedOn',
  'runDate',
  'position',
] as const;

export type ManifestSourceRow = [
  box: number | null,
  blanketId: number,
  code: string,
  /** The size on record (sizeOnRecord): the measured size where both sides were measured. */
  widthCm: number,
  lengthCm: number,
  yarnWeight: number,
  fibres: string,
  colours: string,
  features: string,
  /** The care answers, one bit each (MANIFEST_CARE). */
  care: number,
  /** The maker's name, or null where the label says "Anonymous" (or the maker has no name). */
  labelName: string | null,
  checkedBy: string | null,
  checkedOn: string | null,
  runDate?: string | null,
  position?: number | null,
];

/** The yes/no columns, in column order, each with its blanket field and its bit in a source row's `care`. */
export const MANIFEST_CARE = [
  { field: 'machineWashable', bit: 8 },
  { field: 'dryerSafe', bit: 4 },
  { field: 'smokeFree', bit: 2 },
  { field: 'petFree', bit: 1 },
] as const;
const [WASHABLE, DRYER, SMOKE, PET] = MANIFEST_CARE.map((c) => c.bit) as [number, number, number, number];

/** Where the blanket goes: the same for every row of a stop, so it is passed once, not read per row. */
export interface ManifestDestination {
  recipient: string;
  address: string;
  /** A run's date and the stop's place in it, for rows that leave them out (all rows of one stop). */
  runDate?: string;
  position?: number;
}

export type ManifestRecord = Array<string | number>;

const yesNo = (care: number, bit: number) => (care & bit ? 'yes' : 'no');
const oneDecimal = (n: number) => Math.round(n * 10) / 10;

/** The label name as the maker chose it: their first name, or "Anonymous". */
function label(labelName: string, makerName: string | null): string {
  if (labelName === 'anonymous' || !makerName) return 'Anonymous';
  return makerName.trim().split(/\s+/)[0] ?? 'Anonymous';
}

/** Remembers a few thousand answers of a pure function of one text; a manifest repeats them on most rows. */
function remembered<K, V>(fn: (k: K) => V, limit = 4096): (k: K) => V {
  const seen = new Map<K, V>();
  return (k) => {
    let v = seen.get(k);
    if (v === undefined) {
      if (seen.size >= limit) seen.clear();
      v = fn(k);
      seen.set(k, v);
    }
    return v;
  };
}

/**
 * A shaper for one manifest: turns page rows into records in column order. The words that depend on
 * a stored list or a table (fibres, features, yarn weight, the maker's first name) are worked out once
 * per distinct value and remembered for the rest of the manifest. SQLite could not spell these out
 * exactly as JavaScript does (a first name is cut at any Unicode space), and handing over finished
 * words measured slower: longer text to write and to parse (bench/README.md).
 */
export function manifestShaper(): (r: ManifestSourceRow, to: ManifestDestination) => ManifestRecord {
  const fibres = remembered((text: string) => (JSON.parse(text) as Fibre[]).map(fibreLabel).join('; '));
  const features = remembered((text: string) => (JSON.parse(text) as Feature[]).map(featureLabel).join('; '));
  const weight = remembered((w: number) => `${w} (${yarnWeightName(w)})`);
  const firstName = remembered((name: string | null) => label('first-name', name));
  return (r, to) => {
    const widthCm = r[3];
    const lengthCm = r[4];
    const care = r[9];
    return [
      r[13] ?? to.runDate ?? '',
      r[14] ?? to.position ?? '',
      to.recipient,
      to.address,
      r[0] ?? '',
      r[2],
      sizeCategoryFor(widthCm, lengthCm) ?? 'outside the size table',
      oneDecimal(widthCm),
      oneDecimal(lengthCm),
      oneDecimal(fromCm(widthCm, 'in')),
      oneDecimal(fromCm(lengthCm, 'in')),
      weight(r[5]),
      fibres(r[6]),
      r[7],
      features(r[8]),
      yesNo(care, WASHABLE),
      yesNo(care, DRYER),
      yesNo(care, SMOKE),
      yesNo(care, PET),
      firstName(r[10]),
      r[11] ?? '',
      r[12] ?? '',
    ];
  };
}

/** One row's record, for a caller with a single row; a manifest uses one shaper for all its rows. */
export function manifestRecord(r: ManifestSourceRow, to: ManifestDestination): ManifestRecord {
  return manifestShaper()(r, to);
}

/** A plain number with an optional sign ("-3", "+2.5"): data, not a formula, so left as it is. */
const PLAIN_NUMBER = /^[+-]?\d+(?:[.,]\d+)?$/;
/**
 * OWASP CSV Injection: a cell must not begin with =, +, -, @, tab, CR or LF (ASVS 5.0 1.2.10 adds NUL),
 * or a spreadsheet may run it as a formula. Such a cell is prefixed with a single quote, inside a
 * quoted field, so the program shows it as text.
 */
const FORMULA_START = /^[=+\-@\t\r\n\0]/;

export function neutralise(cell: string): string {
  return FORMULA_START.test(cell) && !PLAIN_NUMBER.test(cell) ? `'${cell}` : cell;
}

/**
 * A text cell as written: a neutralised cell is quoted, and so is one holding a lone CR or LF (an
 * address typed on two lines), since RFC 4180's unquoted text holds neither and a spreadsheet
 * program would start a new row there; csv-stringify itself quotes only the record delimiter, CRLF.
 * Decided here, in the one pass over each cell, rather than by csv-stringify's per-cell regular
 * expressions (`quoted_match`, `quote_record_delimiter`): 100,000 rows went from about 1.8 s to 1.2-1.9 s
 * from memory (bench/README.md).
 */
function castCell(cell: string): string | CastReturnObject {
  const value = neutralise(cell);
  return value !== cell || value.includes('\n') || value.includes('\r') ? { value, quoted: true } : value;
}

/**
 * csv-stringify set up for RFC 4180: CRLF after every record, one header row, fields quoted where
 * they hold a comma, a quote, a CR or an LF (quotes doubled), plus every neutralised cell.
 */
export function manifestStringifier(opts: { bom: boolean }): Stringifier {
  const options: Options = {
    header: true,
    // Records are arrays in column order; the names only head the file.
    columns: [...MANIFEST_COLUMNS],
    record_delimiter: 'windows',
    bom: opts.bom,
    cast: { string: castCell },
  };
  return stringify(options);
}
