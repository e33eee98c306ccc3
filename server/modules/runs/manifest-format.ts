import { stringify, type CastReturnObject, type Options, type Stringifier } from 'csv-stringify';
import { sizeCategoryFor } from '@shared/guidelines/size-categories';
import { featureLabel, fibreLabel, yarnWeightName } from '@shared/guidelines/wording';
import { sizeOnRecord, type Feature, type Fibre } from '@shared/schemas/blanket';
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
 * copying those objects. SQLite gives JSON columns as text, booleans as 0/1 and the check's day
 * ready made: the drive's local day of its UTC timestamp.
 */
export const MANIFEST_SOURCE_FIELDS = [
  'runDate',
  'position',
  'box',
  'blanketId',
  'code',
  'widthCm',
  'lengthCm',
  'measuredWidthCm',
  'measuredLengthCm',
  'yarnWeight',
  'fibres',
  'colours',
  'features',
  'machineWashable',
  'dryerSafe',
  'smokeFree',
  'petFree',
  'labelName',
  'makerName',
  'checkedBy',
  'checkedOn',
] as const;

export type ManifestSourceRow = [
  runDate: string | null,
  position: number | null,
  box: number | null,
  blanketId: number,
  code: string,
  widthCm: number,
  lengthCm: number,
  measuredWidthCm: number | null,
  measuredLengthCm: number | null,
  yarnWeight: number,
  fibres: string,
  colours: string,
  features: string,
  machineWashable: number,
  dryerSafe: number,
  smokeFree: number,
  petFree: number,
  labelName: string,
  makerName: string | null,
  checkedBy: string | null,
  checkedOn: string | null,
];

/** Where the blanket goes: the same for every row of a stop, so it is passed once, not read per row. */
export interface ManifestDestination {
  recipient: string;
  address: string;
  /** A run's date and the stop's place in it, for rows that leave them out (all rows of one stop). */
  runDate?: string;
  position?: number;
}

export type ManifestRecord = Array<string | number>;

const yesNo = (v: number | boolean) => (v ? 'yes' : 'no');
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
 * per distinct value and remembered for the rest of the manifest.
 */
export function manifestShaper(): (r: ManifestSourceRow, to: ManifestDestination) => ManifestRecord {
  const fibres = remembered((text: string) => (JSON.parse(text) as Fibre[]).map(fibreLabel).join('; '));
  const features = remembered((text: string) => (JSON.parse(text) as Feature[]).map(featureLabel).join('; '));
  const weight = remembered((w: number) => `${w} (${yarnWeightName(w)})`);
  const firstName = remembered((name: string | null) => label('first-name', name));
  return (r, to) => {
    const { widthCm, lengthCm } = sizeOnRecord({ widthCm: r[5], lengthCm: r[6], measuredWidthCm: r[7], measuredLengthCm: r[8] });
    return [
      r[0] ?? to.runDate ?? '',
      r[1] ?? to.position ?? '',
      to.recipient,
      to.address,
      r[2] ?? '',
      r[4],
      sizeCategoryFor(widthCm, lengthCm) ?? 'outside the size table',
      oneDecimal(widthCm),
      oneDecimal(lengthCm),
      oneDecimal(fromCm(widthCm, 'in')),
      oneDecimal(fromCm(lengthCm, 'in')),
      weight(r[9]),
      fibres(r[10]),
      r[11],
      features(r[12]),
      yesNo(r[13]),
      yesNo(r[14]),
      yesNo(r[15]),
      yesNo(r[16]),
      r[17] === 'anonymous' ? 'Anonymous' : firstName(r[18]),
      r[19] ?? '',
      r[20] ?? '',
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
