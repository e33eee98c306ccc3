import type { BlanketFields, Feature, Fibre, Population } from '../schemas/blanket';
import { FEATURES } from '../schemas/blanket-values';
import type {
  GuidelineCheckResult,
  GuidelineReason,
  GuidelineSet,
  RuleId,
  Verdict,
} from '../schemas/guidelines';
import { sizeCategoryFor, sizeCategoryRow } from './size-categories';
import {
  capitalise,
  featureLabel,
  featurePronoun,
  fibreLabel,
  formatCm,
  formatYarnWeights,
  isInfantPopulation,
  joinWords,
  yarnWeightName,
} from './wording';

export interface OtherRecipient {
  recipientId: number;
  name: string;
  guidelines: GuidelineSet;
}

export interface CheckOptions {
  /** The recipient being checked against; it is left out of `alsoFits` if `others` holds it. */
  recipientId?: number;
}

/** Keeps a reading that lands exactly on a bound inside it despite binary fractions (55 × 1.05). */
const EPSILON_CM = 1e-9;

const FIX_AT_HOME: Partial<Record<Feature, string>> = {
  fringe: 'Take the fringe off and finish the edge with a round of single crochet.',
  tassels: 'Cut the tassels off at the base and weave the ends in securely.',
  pompoms: 'Cut the pompoms off and weave the ends in securely.',
  buttons: 'Unpick the buttons and close any buttonholes with a few stitches.',
  beads: 'Unpick the beads and weave the ends in securely.',
  applique: 'Unpick the appliqué and weave the ends in securely.',
  ribbons: 'Draw the ribbon out and weave the ends in securely.',
};

/** Trims a maker can take off at home: those with a fix above. Open lace is part of the fabric, so it is not one. */
export const REMOVABLE_FEATURES: readonly Feature[] = FEATURES.filter((f) => FIX_AT_HOME[f] !== undefined);

type Audience = 'infant' | 'elder' | 'general';
const audienceOf = (p: Population): Audience =>
  isInfantPopulation(p) ? 'infant' : p === 'elder' ? 'elder' : 'general';

/** Why a unit refuses a feature, in the maker's terms; general recipients just refuse. */
const FEATURE_WHY: Record<Exclude<Audience, 'general'>, Record<Feature, string>> = {
  infant: {
    fringe: 'Fringe can wrap around tiny fingers and toes',
    tassels: 'Tassels can come loose and wrap around tiny fingers',
    pompoms: "Pompoms can come loose and end up in a baby's mouth",
    buttons: 'Buttons can come off and be swallowed',
    beads: 'Beads can come off and be swallowed',
    applique: 'Appliqué can work loose and be pulled off',
    ribbons: "Ribbons can wrap around a baby's neck, fingers or toes",
    'open-lace': 'Holes a finger can pass through can trap little fingers and toes',
  },
  elder: {
    fringe: 'Fringe can catch in wheelchair wheels and on walkers',
    tassels: 'Tassels can catch in wheelchair wheels and on walkers',
    pompoms: 'Pompoms can catch and come loose',
    buttons: 'Buttons press into fragile skin and can come off',
    beads: 'Beads press into fragile skin and can come off',
    applique: 'Appliqué can work loose and catch',
    ribbons: 'Ribbons can trail and catch in wheels and walkers',
    'open-lace': 'Open lace can catch fingers, rings and walking aids',
  },
};

/** Why a fibre is commonly refused, where there is a reason beyond the unit's say-so. */
const FIBRE_WHY: Partial<Record<Fibre, string>> = {
  wool: 'wool can felt and shrink in a hot wash',
  'wool-blend': 'wool blends can felt and shrink in a hot wash',
  'superwash-wool': 'many units take no wool of any kind, washable or not',
  mohair: 'mohair sheds fine hairs',
  alpaca: 'alpaca sheds fine hairs',
};

function toleranceText(g: GuidelineSet): string {
  if (g.toleranceValue === 0) return 'no leeway';
  return g.toleranceUnit === 'cm' ? `±${formatCm(g.toleranceValue)} cm` : `±${formatCm(g.toleranceValue)}%`;
}

function bounds(min: number, max: number, g: GuidelineSet): [number, number] {
  if (g.toleranceUnit === 'cm') return [min - g.toleranceValue, max + g.toleranceValue];
  const f = g.toleranceValue / 100;
  return [min * (1 - f), max * (1 + f)];
}

const within = (v: number, [lo, hi]: [number, number]) => v >= lo - EPSILON_CM && v <= hi + EPSILON_CM;

interface Evaluation {
  reasons: GuidelineReason[];
  notes: string[];
}

function sizeReasons(b: BlanketFields, g: GuidelineSet): Evaluation {
  const widthBounds = bounds(g.minWidthCm, g.maxWidthCm, g);
  const lengthBounds = bounds(g.minLengthCm, g.maxLengthCm, g);
  const failsAs = (across: number, along: number) => ({
    width: !within(across, widthBounds),
    length: !within(along, lengthBounds),
  });
  const asMeasured = failsAs(b.widthCm, b.lengthCm);
  const turned = failsAs(b.lengthCm, b.widthCm);
  const count = (f: { width: boolean; length: boolean }) => Number(f.width) + Number(f.length);

  const measured = `${formatCm(b.widthCm)} × ${formatCm(b.lengthCm)} cm`;
  if (count(asMeasured) === 0) return { reasons: [], notes: [] };
  if (count(turned) === 0) {
    return {
      reasons: [],
      notes: [
        `Measured ${measured}, it fits turned the other way round: ${formatCm(b.lengthCm)} cm wide × ${formatCm(b.widthCm)} cm long.`,
      ],
    };
  }

  // Report against whichever way round is the nearer miss, so the maker hears the fewest problems.
  const useTurned = count(turned) < count(asMeasured);
  const fails = useTurned ? turned : asMeasured;
  const across = useTurned ? b.lengthCm : b.widthCm;
  const along = useTurned ? b.widthCm : b.lengthCm;
  const category = sizeCategoryFor(b.widthCm, b.lengthCm);
  const suits = category ? ` At this size it would suit a ${sizeCategoryRow(category).label}.` : '';
  const tol = toleranceText(g);

  const reasons: GuidelineReason[] = [];
  const side = (rule: RuleId, v: number, min: number, max: number, dim: 'wide' | 'long') => {
    const word = v > max ? dim : dim === 'wide' ? 'narrow' : 'short';
    const by = v > max ? v - max : min - v;
    const off = by < 0.05 ? `a touch too ${word}` : `${formatCm(by)} cm too ${word}`;
    reasons.push({
      rule,
      message:
        `It measures ${measured}; this unit takes ${formatCm(min)}–${formatCm(max)} cm ${dim} (${tol}), ` +
        `so it is ${off}, whichever way round it goes.` +
        (reasons.length === 0 ? suits : ''),
    });
  };
  if (fails.width) side('size.width', across, g.minWidthCm, g.maxWidthCm, 'wide');
  if (fails.length) side('size.length', along, g.minLengthCm, g.maxLengthCm, 'long');
  return { reasons, notes: [] };
}

function fibreReasons(b: BlanketFields, g: GuidelineSet): GuidelineReason[] {
  const fibres = [...new Set(b.fibres)];
  const reasons: GuidelineReason[] = [];
  const refused = fibres.filter((f) => g.refusedFibres.includes(f));
  if (refused.length > 0) {
    const whys = [...new Set(refused.map((f) => FIBRE_WHY[f]).filter((w): w is string => !!w))];
    reasons.push({
      rule: 'fibre.refused',
      message:
        `It contains ${joinWords(refused.map(fibreLabel))}; this unit does not take ${refused.length === 1 ? 'it' : 'them'}.` +
        (whys.length > 0 ? ` ${capitalise(joinWords(whys))}.` : ''),
    });
  }
  if (g.acceptedFibres.length > 0) {
    const outside = fibres.filter((f) => !g.acceptedFibres.includes(f) && !refused.includes(f));
    if (outside.length > 0) {
      reasons.push({
        rule: 'fibre.not-accepted',
        message: `It contains ${joinWords(outside.map(fibreLabel))}; this unit takes only ${joinWords(
          g.acceptedFibres.map(fibreLabel),
          'or',
        )}.`,
      });
    }
  }
  return reasons;
}

function featureReasons(b: BlanketFields, g: GuidelineSet): GuidelineReason[] {
  const audience = audienceOf(g.population);
  const present = [...new Set(b.features)].filter((f) => g.refusedFeatures.includes(f));
  return present.map((f) => {
    const why = audience === 'general' ? null : FEATURE_WHY[audience][f];
    const takes = `this unit does not take ${featurePronoun(f)}`;
    const fix = FIX_AT_HOME[f];
    const message = why
      ? `${why}; ${takes}.`
      : `It has ${featureLabel(f)}; ${takes}.`;
    return fix
      ? { rule: `feature.${f}` as RuleId, message, fix }
      : { rule: `feature.${f}` as RuleId, message: `${message} It can't be changed at home.` };
  });
}

function careReasons(b: BlanketFields, g: GuidelineSet): GuidelineReason[] {
  const reasons: GuidelineReason[] = [];
  if (g.requireMachineWashable && !b.machineWashable) {
    reasons.push({
      rule: 'washable',
      message: "It isn't machine washable; this unit washes everything by machine.",
    });
  }
  if (g.requireDryerSafe && !b.dryerSafe) {
    reasons.push({
      rule: 'dryer-safe',
      message: "It isn't safe in a tumble dryer; this unit dries everything by machine.",
    });
  }
  if (g.requireSmokeFree && !b.smokeFree) {
    reasons.push({
      rule: 'smoke-free',
      message:
        'It comes from a home where someone smokes; this unit takes blankets from smoke-free homes only, because smoke stays in yarn through washing.',
    });
  }
  if (g.requirePetFree && !b.petFree) {
    reasons.push({
      rule: 'pet-free',
      message:
        'It comes from a home with pets; this unit takes blankets from pet-free homes only, because pet hair and dander cling to yarn and can set off allergies.',
    });
  }
  if (g.requireNewYarn && !b.newYarn) {
    reasons.push({
      rule: 'new-yarn',
      message: "It's made with used or reclaimed yarn; this unit takes blankets made with new yarn only.",
    });
  }
  return reasons;
}

/** Every rule of `g` the blanket fails, in a fixed order: size, yarn, fibre, features, care. */
export function evaluate(blanket: BlanketFields, g: GuidelineSet): Evaluation {
  const size = sizeReasons(blanket, g);
  const reasons: GuidelineReason[] = [...size.reasons];
  if (!g.yarnWeights.includes(blanket.yarnWeight)) {
    reasons.push({
      rule: 'yarn-weight',
      message: `It's made in yarn weight ${blanket.yarnWeight} (${yarnWeightName(blanket.yarnWeight)}); this unit takes yarn ${formatYarnWeights(g.yarnWeights)}.`,
    });
  }
  reasons.push(...fibreReasons(blanket, g), ...featureReasons(blanket, g), ...careReasons(blanket, g));
  return { reasons, notes: size.notes };
}

const fixableAtHome = (r: GuidelineReason) => r.fix !== undefined;

/**
 * Checks a blanket against one recipient's guidelines and says what to do with it.
 * Verdict precedence: no failures → ready; only at-home fixes → mend (even if another recipient
 * takes it as it is, because the organiser chose this one; `alsoFits` shows the other option);
 * any failure the maker can't fix → reroute when another recipient takes it as it is or after
 * the at-home fixes, otherwise decline.
 */
export function check(
  blanket: BlanketFields,
  guidelines: GuidelineSet,
  others: readonly OtherRecipient[] = [],
  options: CheckOptions = {},
): GuidelineCheckResult {
  const { reasons, notes } = evaluate(blanket, guidelines);

  const alsoFits: GuidelineCheckResult['alsoFits'] = [];
  const alsoFitsAfterMend: GuidelineCheckResult['alsoFitsAfterMend'] = [];
  const seen = new Set<number>();
  for (const other of others) {
    if (other.recipientId === options.recipientId || seen.has(other.recipientId)) continue;
    seen.add(other.recipientId);
    const theirs = evaluate(blanket, other.guidelines).reasons;
    if (theirs.length === 0) {
      alsoFits.push({ recipientId: other.recipientId, name: other.name });
    } else if (theirs.every(fixableAtHome)) {
      alsoFitsAfterMend.push({
        recipientId: other.recipientId,
        name: other.name,
        mend: theirs.map((r) => r.rule),
      });
    }
  }

  let verdict: Verdict;
  if (reasons.length === 0) verdict = 'ready';
  else if (reasons.every(fixableAtHome)) verdict = 'mend';
  else if (alsoFits.length > 0 || alsoFitsAfterMend.length > 0) verdict = 'reroute';
  else verdict = 'decline';

  return { ok: reasons.length === 0, verdict, reasons, alsoFits, alsoFitsAfterMend, notes };
}
