/** The reference tables' contents: loaded when the page has painted, as they sit closed below the plan. */
import { CYC_SOURCE, REGIONAL_NAMES_SOURCE, REGIONAL_YARN_NAMES, YARN_WEIGHTS, CATEGORY_6_HOOK_MM_ALTERNATIVE, type Range } from '@shared/sizing/yarn-weights';
import { HOOK_CHART_SOURCE, HOOK_SIZES } from '@shared/sizing/hooks';
import { ROW_END_ALLOWANCES, CORNER_STITCHES } from '@shared/border/row-ends';
import { TURNING_CHAINS, TURNING_CHAIN_SOURCE } from '@shared/sizing/turning-chains';
import { US_TO_UK, US_UK_SOURCE } from '@shared/sizing/stitch-names';
import type { Terms } from '../hooks/use-planner';

const mm = (v: number) => v.toLocaleString('en-GB', { maximumFractionDigits: 2 });
function range(r: Range, unit = ''): string {
  if (r.min === null) return `${r.max}${unit} and fewer`;
  if (r.max === null) return `${mm(r.min)}${unit} and larger`;
  return `${mm(r.min)}–${mm(r.max)}${unit}`;
}

const th = 'px-3 py-2 text-left align-bottom';
const td = 'px-3 py-2 align-top';

export function YarnWeightTable({ terms }: { terms: Terms }) {
  const regional = new Map(REGIONAL_YARN_NAMES.map((r) => [r.category, r]));
  const name = (us: string) => (terms === 'uk' && us in US_TO_UK ? US_TO_UK[us as keyof typeof US_TO_UK] : us);
  return (
    <>
      <div className="overflow-x-auto">
        <table className="w-full min-w-[40rem] text-base">
          <caption className="sr-only">Standard yarn weights, crochet gauge and hooks</caption>
          <thead className="bg-oat-100">
            <tr>
              <th className={th}>Weight</th>
              <th className={th}>Often called</th>
              <th className={th}>UK / Australia (about)</th>
              <th className={th}>Crochet gauge per 10 cm (4 in)</th>
              <th className={th}>Hook</th>
            </tr>
          </thead>
          <tbody>
            {YARN_WEIGHTS.map((w) => {
              const r = regional.get(w.category);
              return (
                <tr key={w.category} className="border-t border-oat-200">
                  <td className={td}>
                    <span className="font-bold">#{w.category}</span> {w.name}
                  </td>
                  <td className={td}>{w.typicalYarns.join(', ')}</td>
                  <td className={td}>{[r?.uk, r?.au].filter(Boolean).join(' / ') || '—'}</td>
                  <td className={td}>
                    {range(w.crochetGauge)} {name(w.crochetGauge.stitch)}
                  </td>
                  <td className={td}>
                    {range(w.hookMm, ' mm')}
                    <span className="block text-sm text-ink-soft">US {w.hookUs}</span>
                    {w.category === 6 && <span className="block text-sm text-ink-soft">some reprints: {range(CATEGORY_6_HOOK_MM_ALTERNATIVE, ' mm')}</span>}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="text-sm text-ink-soft">Source: {CYC_SOURCE}. UK and Australian names: {REGIONAL_NAMES_SOURCE}.</p>
    </>
  );
}

export function HookTable() {
  return (
    <>
      <div className="overflow-x-auto">
        <table className="w-full max-w-md text-base">
          <caption className="sr-only">Crochet hook sizes</caption>
          <thead className="bg-oat-100">
            <tr>
              <th className={th}>Millimetres</th>
              <th className={th}>US</th>
            </tr>
          </thead>
          <tbody>
            {HOOK_SIZES.map((h) => (
              <tr key={h.mm} className="border-t border-oat-200">
                <td className={td}>
                  {mm(h.mm)} mm{h.brandVariantMm !== undefined && <span className="block text-sm text-ink-soft">some brands: {mm(h.brandVariantMm)} mm</span>}
                </td>
                <td className={td}>{h.us}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-sm text-ink-soft">Source: {HOOK_CHART_SOURCE}. Brands disagree on the two smallest US sizes; the millimetres printed on the hook are what count.</p>
    </>
  );
}

export function RowEndTable({ terms }: { terms: Terms }) {
  const name = (us: string) => (terms === 'uk' && us in US_TO_UK ? US_TO_UK[us as keyof typeof US_TO_UK] : us);
  return (
    <>
      <div className="overflow-x-auto">
        <table className="w-full max-w-xl text-base">
          <caption className="sr-only">Foundation stitches per row end and turning chains</caption>
          <thead className="bg-oat-100">
            <tr>
              <th className={th}>Row of</th>
              <th className={th}>Foundation stitches per row end</th>
              <th className={th}>Turning chain</th>
            </tr>
          </thead>
          <tbody>
            {Object.values(ROW_END_ALLOWANCES).map((a) => (
              <tr key={a.row} className="border-t border-oat-200">
                <td className={td}>{name(a.row)}</td>
                <td className={td}>
                  {a.stitches}
                  <span className="block text-sm text-ink-soft">{a.source}</span>
                </td>
                <td className={td}>
                  {TURNING_CHAINS[a.row].chains} ch{TURNING_CHAINS[a.row].countsAsStitch ? ', counts as a stitch' : ", doesn't count"}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-sm text-ink-soft">
        Corners: {CORNER_STITCHES} stitches into each corner stitch (common practice, no published source); a border that needs a wider corner to sit a repeat on it says so in its plan. Turning chains: {TURNING_CHAIN_SOURCE}.{' '}
        {terms === 'uk' ? `Stitch names: ${US_UK_SOURCE}.` : ''}
      </p>
    </>
  );
}
