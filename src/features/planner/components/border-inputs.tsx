import { Card, CardTitle } from '@/components/ui/card';
import { Field, Select } from '@/components/ui/field';
import { Badge } from '@/components/ui/badge';
import { BORDER_LIBRARY, BORDER_YARN_ADVICE, borderDepthCm, type BorderPattern } from '@shared/border/library';
import type { PlannerState } from '../hooks/use-planner';
import { usLabelForMm } from '@shared/sizing/hooks';
import { ChoiceGroup } from './choice-group';
import { SafetyNotes } from './safety-notes';
import { inTerms } from './terms';

const DIFFICULTY: Record<BorderPattern['difficulty'], { word: string; tone: 'moss' | 'marigold' | 'brick' }> = {
  1: { word: 'Easy', tone: 'moss' },
  2: { word: 'Some practice', tone: 'marigold' },
  3: { word: 'Takes practice', tone: 'brick' },
};

export const multipleText = (b: BorderPattern) =>
  b.multiple === 1 ? 'any number of stitches' : `multiple of ${b.multiple} plus ${b.offset}`;

export function BorderInputs({ state, border, update }: { state: PlannerState; border: BorderPattern; update: (p: Partial<PlannerState>) => void }) {
  const t = (s: string) => inTerms(s, state.terms);
  const d = DIFFICULTY[border.difficulty];
  return (
    <Card>
      <CardTitle>Border</CardTitle>
      <div className="space-y-5">
        <ChoiceGroup
          legend="Stitch names"
          value={state.terms}
          onChange={(terms) => update({ terms })}
          columns={2}
          choices={[
            { value: 'us', label: 'US terms', hint: 'sc, hdc, dc' },
            { value: 'uk', label: 'UK terms', hint: 'dc, htr, tr' },
          ]}
        />
        <Field label="Border pattern">
          {({ id }) => (
            <Select id={id} value={state.borderId} onChange={(e) => update({ borderId: e.target.value })}>
              {BORDER_LIBRARY.map((b) => (
                <option key={b.id} value={b.id}>
                  {t(b.name)} — {multipleText(b)}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <div className="rounded-xl border-2 border-oat-200 bg-oat-50 p-4" data-testid="border-details">
          <p className="text-lg font-bold">{t(border.name)}</p>
          <p className="mt-1">{t(border.look)}</p>
          <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="font-bold">Repeat</dt>
            <dd>{multipleText(border)}</dd>
            <dt className="font-bold">Rounds</dt>
            <dd>{border.rounds}</dd>
            <dt className="font-bold">Depth</dt>
            <dd>about {borderDepthCm(border).toLocaleString('en-GB')} cm in medium yarn</dd>
            <dt className="font-bold">Difficulty</dt>
            <dd>
              <Badge tone={d.tone}>{d.word}</Badge>
            </dd>
          </dl>
          <p className="mt-3 text-sm text-ink-soft">
            Suits medium (#4) yarn on a {BORDER_YARN_ADVICE.hookMm} mm (US {usLabelForMm(BORDER_YARN_ADVICE.hookMm)}) hook. {BORDER_YARN_ADVICE.ruffleFix.note} Common practice, no published source.
          </p>
        </div>
        <SafetyNotes border={border} />
        <ChoiceGroup
          legend="When an edge does not fit"
          value={state.strategy}
          onChange={(strategy) => update({ strategy })}
          choices={[
            { value: 'add', label: 'Only add stitches', hint: 'What most makers do: extra stitches hide well' },
            { value: 'fewest', label: 'Fewest changes', hint: 'Add or skip, whichever changes fewer stitches' },
          ]}
        />
        <ChoiceGroup
          legend="How the border goes round"
          value={state.mode}
          onChange={(mode) => update({ mode })}
          choices={[
            { value: 'per-edge', label: 'Edge by edge', hint: 'Each edge fits the repeat between its corners, so the corners match' },
            { value: 'continuous', label: 'One continuous round', hint: 'The whole round fits the repeat, so the last repeat closes onto the first' },
          ]}
        />
      </div>
    </Card>
  );
}
