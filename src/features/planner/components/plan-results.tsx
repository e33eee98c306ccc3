import { Card, CardTitle } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import type { BorderPlan } from '@shared/border/plan';
import { instructionsUk, type BorderPattern } from '@shared/border/library';
import { EDGE_ORDER, type CornerName } from '@shared/border/round';
import type { Terms } from '../hooks/use-planner';
import { multipleText } from './border-inputs';
import { inTerms, signed } from './terms';

const CORNER_WORD: Record<CornerName, string> = { 'top-right': 'Top right', 'bottom-right': 'Bottom right', 'bottom-left': 'Bottom left', 'top-left': 'Top left' };
/** Reading order on the page: the two top corners, then the two bottom ones. */
const CORNER_GRID: CornerName[] = ['top-left', 'top-right', 'bottom-left', 'bottom-right'];

function ChangeBadge({ change }: { change: number }) {
  if (change === 0) return <Badge tone="moss">fits</Badge>;
  return <Badge tone={change > 0 ? 'marigold' : 'brick'}>{signed(change)}</Badge>;
}

export function PlanResults({ plan, border, terms }: { plan: BorderPlan; border: BorderPattern; terms: Terms }) {
  const t = (s: string) => inTerms(s, terms);
  const corners = new Map(plan.cornerReport.map((c) => [c.corner, c]));
  const written = terms === 'uk' ? instructionsUk(border) : border.instructions;
  return (
    <div className="space-y-6">
      <Card className="break-inside-avoid" data-testid="edge-plan">
        <CardTitle>Foundation round</CardTitle>
        <p className="mb-4 text-ink-soft">
          {t(`Work 1 round of hdc all the way round the body, changing these stitches so the ${border.name.toLowerCase()} fits (${multipleText(border)}).`)}
        </p>
        <ol className="space-y-3">
          {EDGE_ORDER.map((edge) => (
            <li key={edge} className="flex flex-col gap-1 sm:flex-row sm:gap-3" data-testid={`sentence-${edge}`}>
              <span className="shrink-0 pt-0.5 sm:w-14 sm:text-center">
                <ChangeBadge change={plan.edges[edge].change} />
              </span>
              <span className="text-lg">{t(plan.sentences[edge])}</span>
            </li>
          ))}
        </ol>
        <ul className="mt-5 list-disc space-y-1 pl-6 text-ink">
          {plan.notes.map((n) => (
            <li key={n}>{t(n)}</li>
          ))}
        </ul>
      </Card>

      <Card className="break-inside-avoid" data-testid="corner-plan">
        <CardTitle>Corners</CardTitle>
        {border.multiple === 1 ? (
          <p>{t(`This border has no repeat to centre: work it evenly all round, with the usual extra stitches at each corner.`)}</p>
        ) : (
          <>
            <p className="mb-3 text-ink-soft">Where the border's repeats land when you work the round as planned.</p>
            <ul className="grid grid-cols-2 gap-3">
              {CORNER_GRID.map((name) => {
                const c = corners.get(name)!;
                const d = c.offsetFromCentre;
                return (
                  <li key={name} className={`rounded-xl border-2 p-3 ${c.centred ? 'border-moss-500/40 bg-moss-100' : 'border-brick-500/40 bg-brick-100'}`}>
                    <p className="font-bold">{CORNER_WORD[name]}</p>
                    <p>
                      {c.centred
                        ? 'A repeat is centred on the corner'
                        : d === null
                          ? 'No repeat in the round'
                          : `Not centred: nearest repeat ${Math.abs(d)} stitch${Math.abs(d) === 1 ? '' : 'es'} ${d > 0 ? 'after' : 'before'} the corner`}
                    </p>
                  </li>
                );
              })}
            </ul>
          </>
        )}
      </Card>

      <Card className="break-inside-avoid">
        <CardTitle>Working the border</CardTitle>
        <p className="text-lg">{written}</p>
        <p className="mt-3 text-ink-soft">
          Round of {plan.round.total} stitches
          {border.multiple > 1 ? `, ${plan.round.repeats} repeats` : ''}. Written in {terms === 'uk' ? 'UK' : 'US'} terms.
        </p>
      </Card>
    </div>
  );
}
