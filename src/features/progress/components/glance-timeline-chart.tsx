import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { GLANCE_STEPS, STEP_LABELS, type GlanceStep } from '@shared/drive/glance';
import type { GlanceWeek } from '@shared/schemas/glance';
import { formatDay } from '@/components/ui/format-day';

/** One colour per step from the yarn palette, dark enough to read as a line on white. */
export const STEP_COLOURS: Record<GlanceStep | 'pledged', string> = {
  pledged: 'var(--color-sky-700)',
  finished: 'var(--color-heather-500)',
  received: 'var(--color-marigold-700)',
  checked: 'var(--color-moss-500)',
  assigned: 'var(--color-heather-800)',
  packed: 'var(--color-brick-500)',
  delivered: 'var(--color-moss-700)',
};

const DASH: Partial<Record<GlanceStep | 'pledged', string>> = { pledged: '6 4', assigned: '2 3', packed: '8 3 2 3' };

/** Running totals week by week: how many were pledged, and how many blankets had reached each step by then. */
export function runningTotals(weeks: GlanceWeek[]) {
  const sum: Record<GlanceStep | 'pledged', number> = { pledged: 0, finished: 0, received: 0, checked: 0, assigned: 0, packed: 0, delivered: 0 };
  return weeks.map((w) => {
    sum.pledged += w.pledged;
    for (const s of GLANCE_STEPS) sum[s] += w.reached[s];
    return { label: formatDay(w.week).replace(/ \d{4}$/, ''), ...sum };
  });
}

/**
 * The drive over time as lines, one per step. A picture of the week-by-week table beside it, so it
 * stays out of the tab order and the accessibility tree.
 */
export function GlanceTimelineChart({ weeks }: { weeks: GlanceWeek[] }) {
  const data = runningTotals(weeks);
  const axis = { fontSize: 14, fill: 'var(--color-ink)' };
  return (
    <div aria-hidden className="h-80" data-testid="chart-timeline">
      <ResponsiveContainer width="100%" height="100%">
        <LineChart accessibilityLayer={false} data={data} margin={{ left: 0, right: 12, top: 8, bottom: 8 }}>
          <CartesianGrid strokeDasharray="3 3" vertical={false} />
          <XAxis dataKey="label" tick={axis} minTickGap={16} />
          <YAxis allowDecimals={false} tick={axis} width={44} />
          <Tooltip />
          <Legend wrapperStyle={{ fontSize: 14 }} formatter={(value: string) => <span style={{ color: 'var(--color-ink)' }}>{value}</span>} />
          <Line dataKey="pledged" name="Pledged" stroke={STEP_COLOURS.pledged} strokeDasharray={DASH.pledged} strokeWidth={2.5} dot={false} isAnimationActive={false} />
          {GLANCE_STEPS.map((s) => (
            <Line key={s} dataKey={s} name={STEP_LABELS[s]} stroke={STEP_COLOURS[s]} strokeDasharray={DASH[s]} strokeWidth={2.5} dot={false} isAnimationActive={false} />
          ))}
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
