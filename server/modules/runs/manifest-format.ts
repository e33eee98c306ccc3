import { stringify, type Options, type Stringifier } from 'csv-stringify';
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

/** One blanket's row as the database query returns it (SQLite gives JSON as text and booleans as 0/1). */
export interface ManifestSourceRow {
  runDate: string | null;
  position: number | null;
  recipient: string;
  address: string;
  box: number | null;
  code: string;
  widthCm: number;
  lengthCm: number;
  measuredWidthCm: number | null;
  measuredLengthCm: number | null;
  yarnWeight: number;
  fibres: string | Fibre[];
  colours: string;
  features: string | Feature[];
  machineWashable: number | boolean;
  dryerSafe: number | boolean;
  smokeFree: number | boolean;
  petFree: number | boolean;
  labelName: string;
  makerName: string | null;
  checkedBy: string | null;
  checkedAt: string | Date | null;
}

export type ManifestRecord = Array<string | number>;

const yesNo = (v: number | boolean) => (v ? 'yes' : 'no');
const list = <T>(v: string | T[]): T[] => (typeof v === 'string' ? (JSON.parse(v) as T[]) : v);
const oneDecimal = (n: number) => Math.round(n * 10) / 10;

/** "2026-12-03", whatever form the date came in. */
function isoDay(v: string | Date | null): string {
  if (v === null) return '';
  const d = typeof v === 'string' ? new Date(v.includes('T') || v.includes(' ') ? v.replace(' ', 'T').replace(/ \+00:00$/, 'Z') : v) : v;
  return Number.isNaN(d.getTime()) ? String(v).slice(0, 10) : d.toISOString().slice(0, 10);
}

/** The label name as the maker chose it: their first name, or "Anonymous". */
function label(labelName: string, makerName: string | null): string {
  if (labelName === 'anonymous' || !makerName) return 'Anonymous';
  return makerName.trim().split(/\s+/)[0] ?? 'Anonymous';
}

export function manifestRecord(r: ManifestSourceRow): ManifestRecord {
  const size = sizeOnRecord(r);
  return [
    r.runDate ?? '',
    r.position ?? '',
    r.recipient,
    r.address,
    r.box ?? '',
    r.code,
    sizeCategoryFor(size.widthCm, size.lengthCm) ?? 'outside the size table',
    oneDecimal(size.widthCm),
    oneDecimal(size.lengthCm),
    oneDecimal(fromCm(size.widthCm, 'in')),
    oneDecimal(fromCm(size.lengthCm, 'in')),
    `${r.yarnWeight} (${yarnWeightName(r.yarnWeight)})`,
    list<Fibre>(r.fibres).map(fibreLabel).join('; '),
    r.colours,
    list<Feature>(r.features).map(featureLabel).join('; '),
    yesNo(r.machineWashable),
    yesNo(r.dryerSafe),
    yesNo(r.smokeFree),
    yesNo(r.petFree),
    label(r.labelName, r.makerName),
    r.checkedBy ?? '',
    isoDay(r.checkedAt),
  ];
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
 * csv-stringify set up for RFC 4180: CRLF after every record, one header row, fields quoted where
 * they hold a comma, a quote or a line break (quotes doubled), plus every neutralised cell.
 */
export function manifestStringifier(opts: { bom: boolean }): Stringifier {
  const options: Options = {
    header: true,
    // Records are arrays in column order; the names only head the file.
    columns: [...MANIFEST_COLUMNS],
    record_delimiter: 'windows',
    bom: opts.bom,
    quoted_match: /^'[=+\-@\t\r\n\0]/,
    cast: { string: (v) => neutralise(v) },
  };
  return stringify(options);
}
