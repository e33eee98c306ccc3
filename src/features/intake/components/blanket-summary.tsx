import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import { featureLabel, fibreLabel, formatCm, formatIn, yarnWeightName } from '@shared/guidelines/wording';
import type { Feature, Fibre, SizeCategory } from '@shared/schemas/blanket';
import type { IntakeBlanketView } from '@shared/schemas/intake-views';


export const sizeText = (w: number, l: number) => `${formatCm(w)} × ${formatCm(l)} cm (about ${formatIn(w)} × ${formatIn(l)} in)`;

export const categoryText = (c: string | null) => (c ? sizeCategoryRow(c as SizeCategory).label : 'no usual size');

const yes = (v: boolean) => (v ? 'Yes' : 'No');

/** What the maker logged, as the table reads it. */
export function BlanketSummary({ blanket: b }: { blanket: IntakeBlanketView }) {
  const rows: Array<[string, string]> = [
    ['Size', `${sizeText(b.widthCm, b.lengthCm)}, ${categoryText(b.sizeCategory)}`],
    ['Yarn', `weight ${b.yarnWeight} (${yarnWeightName(b.yarnWeight)}), ${b.fibres.map((f) => fibreLabel(f as Fibre)).join(', ')}`],
    ['Colours', b.colours || '—'],
    ['Features', b.features.length ? b.features.map((f) => featureLabel(f as Feature)).join(', ') : 'none'],
    ['Machine washable', yes(b.machineWashable)],
    ['Dryer safe', yes(b.dryerSafe)],
    ['Smoke-free home', yes(b.smokeFree)],
    ['Pet-free home', yes(b.petFree)],
    ['New yarn', yes(b.newYarn)],
  ];
  return (
    <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[auto_1fr]">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="font-bold">{k}</dt>
          <dd>{v}</dd>
        </div>
      ))}
      {b.notes && (
        <div className="contents">
          <dt className="font-bold">Maker's notes</dt>
          <dd>{b.notes}</dd>
        </div>
      )}
    </dl>
  );
}
