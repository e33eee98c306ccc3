import { lazy, Suspense, type ReactNode } from 'react';
import { ChevronDown } from 'lucide-react';
import type { Terms } from '../hooks/use-planner';

const YarnWeightTable = lazy(() => import('./reference-table-bodies').then((m) => ({ default: m.YarnWeightTable })));
const HookTable = lazy(() => import('./reference-table-bodies').then((m) => ({ default: m.HookTable })));
const RowEndTable = lazy(() => import('./reference-table-bodies').then((m) => ({ default: m.RowEndTable })));

function Section({ title, children, testId }: { title: string; children: ReactNode; testId?: string }) {
  return (
    <details className="group rounded-2xl border border-oat-200 bg-white shadow-sm" data-testid={testId}>
      <summary className="flex min-h-11 cursor-pointer list-none items-center justify-between gap-3 px-5 py-4 text-lg font-bold">
        {title}
        <ChevronDown className="size-6 shrink-0 transition-transform group-open:rotate-180" aria-hidden />
      </summary>
      <div className="space-y-3 px-5 pb-5">
        <Suspense fallback={<p className="text-ink-soft">Loading the table…</p>}>{children}</Suspense>
      </div>
    </details>
  );
}

/** The reference tables, closed until opened; their contents load once the page has painted. */
export function ReferenceTables({ terms }: { terms: Terms }) {
  return (
    <div className="space-y-3">
      <Section title="Yarn weights" testId="yarn-weight-table">
        <YarnWeightTable terms={terms} />
      </Section>
      <Section title="Hook sizes, millimetres and US" testId="hook-chart">
        <HookTable />
      </Section>
      <Section title="Row ends, corners and turning chains">
        <RowEndTable terms={terms} />
      </Section>
    </div>
  );
}
