import type { BodyStitch, SizeCategory } from '@shared/schemas/blanket';
import { YARN_WEIGHTS } from '@shared/sizing/yarn-weights';
import { sizeCategoryRow } from '@shared/guidelines/size-categories';
import { capitalise } from '@shared/guidelines/wording';

/** Body stitches in plain words; the abbreviation stays because patterns use it. */
export const BODY_STITCH_LABELS: Record<BodyStitch, string> = {
  sc: 'Single crochet (sc)',
  hdc: 'Half double crochet (hdc)',
  dc: 'Double crochet (dc)',
  granny: 'Granny squares or stripes',
  ripple: 'Ripple or chevron',
  moss: 'Moss (linen) stitch',
  shell: 'Shells',
  'knit-garter': 'Knitted, garter stitch',
  'knit-stockinette': 'Knitted, stockinette',
  other: 'Something else',
};

export const yarnWeightLabel = (w: number) => {
  const row = YARN_WEIGHTS.find((r) => r.category === w);
  return row ? `${w} · ${row.name} (${row.typicalYarns.slice(0, 2).join(', ')})` : String(w);
};

export const sizeLabel = (c: SizeCategory | null) => (c ? capitalise(sizeCategoryRow(c).label) : 'Any size');

/** The form's choice and the blanket's page say the same thing when no library border was used. */
export const NO_LIBRARY_BORDER = 'No border, or one of my own';
