import { FEATURES, FIBRES } from '../schemas/blanket-values';
import type { GuidelineSet } from '../schemas/guidelines';
import { capitalise, featureLabel, fibreLabel, formatCm, formatIn, formatYarnWeights, joinWords } from './wording';

/**
 * A guideline set as a few short lines for a volunteer's needs list, e.g.
 * "Sizes 40–55 × 40–55 cm (16–22 × 16–22 in), ±2 cm, either way round".
 */
export function describeGuidelines(g: GuidelineSet): string[] {
  const lines: string[] = [];

  const cmSpan = (lo: number, hi: number) => (lo === hi ? formatCm(lo) : `${formatCm(lo)}–${formatCm(hi)}`);
  const inSpan = (lo: number, hi: number) => (formatIn(lo) === formatIn(hi) ? formatIn(lo) : `${formatIn(lo)}–${formatIn(hi)}`);
  const leeway =
    g.toleranceValue === 0 ? '' : `, ±${formatCm(g.toleranceValue)}${g.toleranceUnit === 'cm' ? ' cm' : '%'}`;
  lines.push(
    `Sizes ${cmSpan(g.minWidthCm, g.maxWidthCm)} × ${cmSpan(g.minLengthCm, g.maxLengthCm)} cm ` +
      `(about ${inSpan(g.minWidthCm, g.maxWidthCm)} × ${inSpan(g.minLengthCm, g.maxLengthCm)} in)${leeway}, either way round`,
  );

  lines.push(`Yarn ${formatYarnWeights(g.yarnWeights)}`);

  // Keep the list order of the blanket schema so lines read the same on every page.
  const accepted = FIBRES.filter((f) => g.acceptedFibres.includes(f));
  const refused = FIBRES.filter((f) => g.refusedFibres.includes(f));
  if (accepted.length > 0) lines.push(`${capitalise(joinWords(accepted.map(fibreLabel), 'or'))} only`);
  if (refused.length > 0) lines.push(`No ${joinWords(refused.map(fibreLabel), 'or')}`);

  const features = FEATURES.filter((f) => g.refusedFeatures.includes(f));
  if (features.length > 0) lines.push(`No ${joinWords(features.map(featureLabel), 'or')}`);

  if (g.requireMachineWashable && g.requireDryerSafe) lines.push('Machine washable and dryer safe');
  else if (g.requireMachineWashable) lines.push('Machine washable');
  else if (g.requireDryerSafe) lines.push('Dryer safe');

  if (g.requireSmokeFree && g.requirePetFree) lines.push('Smoke-free and pet-free homes');
  else if (g.requireSmokeFree) lines.push('Smoke-free homes');
  else if (g.requirePetFree) lines.push('Pet-free homes');

  if (g.requireNewYarn) lines.push('New yarn only');
  return lines;
}
