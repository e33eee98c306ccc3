import { useEffect, useRef, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { Printer, RotateCcw } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Button } from '@/components/ui/button';
import { Card, CardTitle } from '@/components/ui/card';
import { Alert } from '@/components/ui/alert';
import { useMe } from '@/features/auth/api/get-me';
import { usePlanner, ROW_PRESETS, toPlanInput, type PlannerResult, type PlannerState } from '@/features/planner/hooks/use-planner';
import { planQueryOptions } from '@/features/planner/api/get-plan';
import { BodyInputs } from '@/features/planner/components/body-inputs';
import { BorderInputs, multipleText } from '@/features/planner/components/border-inputs';
import { PlanResults } from '@/features/planner/components/plan-results';
import { BlanketDrawing } from '@/features/planner/components/blanket-drawing';
import { TYPICAL_ROW_HEIGHT } from '@/features/planner/components/drawing-geometry';
import { GaugePanel } from '@/features/planner/components/gauge-panel';
import { YarnPanel } from '@/features/planner/components/yarn-panel';
import { ReferenceTables } from '@/features/planner/components/reference-tables';
import { SavedPlans } from '@/features/planner/components/saved-plans';
import { inTerms } from '@/features/planner/components/terms';
import { rowCount } from '@shared/border/row-ends';
import { gaugePerCm } from '@shared/sizing/gauge';
import type { PlanInput } from '@shared/schemas/plan';

/** Body proportions: from the swatch when there is one, otherwise from typical row heights. */
function bodyShape(r: PlannerResult): { w: number; h: number; note: string } | null {
  if (r.across === undefined || r.rows === undefined) return null;
  const rows = rowCount(r.rows);
  if (r.gauge) {
    const { stitchesPerCm, rowsPerCm } = gaugePerCm(r.gauge);
    return { w: r.across / stitchesPerCm, h: rows / rowsPerCm, note: 'Drawn to the proportions of your swatch.' };
  }
  const pattern = r.pattern ?? ['hdc'];
  let h = 0;
  for (let i = 0; i < rows; i++) h += TYPICAL_ROW_HEIGHT[pattern[i % pattern.length]!] ?? 1.3;
  return { w: r.across, h, note: 'Drawn to typical proportions for these stitches (no swatch given).' };
}

function headline(s: PlannerState, r: PlannerResult): string {
  const preset = ROW_PRESETS.find((p) => p.id === s.rowPreset)!;
  const rowWords = s.rowPreset === 'custom' ? `rows repeating ${r.pattern?.join(', ') ?? '?'}` : preset.label.toLowerCase();
  const rows = r.rows === undefined ? '?' : rowCount(r.rows);
  return inTerms(
    `${r.across ?? '?'} stitches across × ${rows} rows (${rowWords}) · ${r.border.name}, ${multipleText(r.border)} · ` +
      `${s.strategy === 'add' ? 'only adding stitches' : 'fewest changes'} · ${s.mode === 'per-edge' ? 'edge by edge' : 'one continuous round'}`,
    s.terms,
  );
}

export default function PlannerPage() {
  const { state, result, update, load, reset } = usePlanner();
  const { data: me } = useMe();
  const [loaded, setLoaded] = useState<string | null>(null);
  const [params, setParams] = useSearchParams();
  const qc = useQueryClient();
  const top = useRef<HTMLDivElement>(null);
  const shape = bodyShape(result);
  const input = toPlanInput(state, result);
  const suggestedName = `${result.border.name}, ${result.across ?? '?'} × ${result.rows === undefined ? '?' : rowCount(result.rows)}`;

  function onLoad(plan: PlanInput, name: string) {
    load(plan);
    setLoaded(name);
    top.current?.scrollIntoView({ behavior: 'smooth', block: 'start' });
  }

  // /planner?plan=12 opens a saved plan, e.g. from a blanket's page.
  const wanted = Number(params.get('plan'));
  useEffect(() => {
    if (!me || !Number.isInteger(wanted) || wanted <= 0) return;
    let live = true;
    qc.fetchQuery(planQueryOptions(wanted))
      .then((plan) => {
        if (!live) return;
        load(plan.input);
        setLoaded(plan.name);
      })
      .catch(() => live && setLoaded(null))
      .finally(() => live && setParams({}, { replace: true }));
    return () => {
      live = false;
    };
  }, [me, wanted, qc, load, setParams]);

  return (
    <div ref={top} className="scroll-mt-4">
      <PageHeader
        title="Blanket planner"
        lead="Make the border fit before you start it: where to add stitches in the foundation round, how the corners fall, what size you'll get and how much yarn to buy."
        actions={
          <>
            <Button variant="secondary" onClick={() => window.print()}>
              <Printer className="size-5" aria-hidden /> Print this plan
            </Button>
            <Button
              variant="quiet"
              onClick={() => {
                reset();
                setLoaded(null);
              }}
            >
              <RotateCcw className="size-5" aria-hidden /> Start again
            </Button>
          </>
        }
      />
      {loaded && (
        <Alert kind="success" className="no-print mb-6">
          Loaded your plan "{loaded}".
        </Alert>
      )}

      <p className="mb-6 rounded-xl bg-heather-100 px-4 py-3 text-lg font-bold text-heather-800" data-testid="plan-headline">
        {headline(state, result)}
      </p>
      <p className="no-print -mt-3 mb-6 lg:hidden">
        <a href="#plan-result" className="font-bold">
          Skip to the drawing and the instructions
        </a>
      </p>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)] print:block">
        <div className="no-print space-y-6">
          <BodyInputs state={state} errors={result.errors} update={update} />
          <BorderInputs state={state} border={result.border} update={update} />
        </div>
        <div id="plan-result" className="scroll-mt-4 space-y-6">
          {result.plan && shape ? (
            <>
              <Card className="break-inside-avoid">
                <CardTitle>The blanket and its border</CardTitle>
                <BlanketDrawing plan={result.plan} border={result.border} bodyWidth={shape.w} bodyHeight={shape.h} rows={rowCount(result.rows!)} proportion={shape.note} />
              </Card>
              <PlanResults plan={result.plan} border={result.border} terms={state.terms} />
            </>
          ) : (
            <Alert kind="warning" title="Nothing to plan yet">
              {result.errors.across ?? result.errors.rows ?? result.errors.customPattern ?? result.planError ?? 'Enter the stitches across and the rows.'}
            </Alert>
          )}
        </div>
      </div>

      <div className="mt-6 grid gap-6 lg:grid-cols-2 print:block print:space-y-6">
        <GaugePanel state={state} result={result} errors={result.errors} update={update} />
        <YarnPanel state={state} result={result} errors={result.errors} update={update} />
      </div>

      <div className="mt-6 grid gap-6 lg:grid-cols-2">
        <SavedPlans signedIn={Boolean(me)} input={input} suggestedName={suggestedName} onLoad={onLoad} />
        <section aria-labelledby="tables" className="no-print">
          <h2 id="tables" className="mb-3 text-xl font-bold">
            Tables
          </h2>
          <ReferenceTables terms={state.terms} />
        </section>
      </div>
    </div>
  );
}
