import type { Feature, Fibre, Population } from '../schemas/blanket';
import type { Verdict } from '../schemas/guidelines';
import { YARN_WEIGHTS } from '../sizing/yarn-weights';
import { fromCm } from '../sizing/units';

/** The Craft Yarn Council category name in running text: "super bulky". */
export const yarnWeightName = (weight: number): string =>
  YARN_WEIGHTS.find((r) => r.category === weight)?.name.toLowerCase() ?? `weight ${weight}`;

const FIBRE_LABELS: Record<Fibre, string> = {
  acrylic: 'acrylic',
  cotton: 'cotton',
  wool: 'wool',
  'superwash-wool': 'superwash wool',
  'acrylic-blend': 'acrylic blend',
  'cotton-blend': 'cotton blend',
  'wool-blend': 'wool blend',
  bamboo: 'bamboo',
  polyester: 'polyester',
  chenille: 'chenille',
  nylon: 'nylon',
  alpaca: 'alpaca',
  mohair: 'mohair',
  silk: 'silk',
  other: 'other fibres',
};
export const fibreLabel = (f: Fibre): string => FIBRE_LABELS[f];

interface FeatureWords {
  label: string;
  /** "it" or "them", for "this unit does not take it". */
  pronoun: 'it' | 'them';
}
const FEATURE_WORDS: Record<Feature, FeatureWords> = {
  fringe: { label: 'fringe', pronoun: 'it' },
  tassels: { label: 'tassels', pronoun: 'them' },
  pompoms: { label: 'pompoms', pronoun: 'them' },
  buttons: { label: 'buttons', pronoun: 'them' },
  beads: { label: 'beads', pronoun: 'them' },
  applique: { label: 'appliqué', pronoun: 'it' },
  ribbons: { label: 'ribbons', pronoun: 'them' },
  'open-lace': { label: 'open lace with holes a finger can pass through', pronoun: 'it' },
};
export const featureLabel = (f: Feature): string => FEATURE_WORDS[f].label;
export const featurePronoun = (f: Feature): 'it' | 'them' => FEATURE_WORDS[f].pronoun;

export const isInfantPopulation = (p: Population): boolean => p === 'preemie' || p === 'infant';

export const VERDICT_TEXT: Record<Verdict, string> = {
  ready: 'Ready to go',
  mend: 'A small fix at home, then it can go',
  reroute: 'Better suited to another recipient',
  decline: "We can't place this one",
};

/** "a", "a and b", "a, b and c" (or "or" for choices). */
export function joinWords(words: readonly string[], last: 'and' | 'or' = 'and'): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} ${last} ${words.slice(-1).join('')}`;
}

export const capitalise = (s: string): string => s.charAt(0).toUpperCase() + s.slice(1);

/** Centimetres for a maker: at most one decimal, no trailing ".0". */
export const formatCm = (cm: number): string => String(Math.round(cm * 10) / 10);

/** Inches rounded to the whole inch, as makers measure. */
export const formatIn = (cm: number): string => String(Math.round(fromCm(cm, 'in')));

/** "weight 3 (light)", "weights 2–4 (fine to medium)" for a run, "weights 2, 4 and 6" otherwise. */
export function formatYarnWeights(weights: readonly number[]): string {
  const sorted = [...new Set(weights)].sort((a, b) => a - b);
  const lo = sorted[0];
  const hi = sorted[sorted.length - 1];
  if (lo === undefined || hi === undefined) return 'no yarn weight';
  if (lo === hi) return `weight ${lo} (${yarnWeightName(lo)})`;
  const isRun = hi - lo === sorted.length - 1;
  if (isRun) return `weights ${lo}–${hi} (${yarnWeightName(lo)} to ${yarnWeightName(hi)})`;
  return `weights ${joinWords(sorted.map(String))}`;
}
