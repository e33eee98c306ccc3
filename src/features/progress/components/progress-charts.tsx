import { Bar, BarChart, CartesianGrid, Cell, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { BarChart3 } from 'lucide-react';
import { Card, CardTitle } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import type { DriveProgress } from '@shared/schemas/pledge';
import { recipientProgress, statusCounts, wrapName } from './progress-data';

const COLOURS = {
  wanted: 'var(--color-sky-700)',
  pledged: 'var(--color-heather-500)',
  inHand: 'var(--color-moss-500)',
  assigned: 'var(--color-marigold-700)',
  status: 'var(--color-heather-700)',
  attention: 'var(--color-marigold-400)',
  declined: 'var(--color-brick-500)',
};

const axis = { fontSize: 14, fill: 'var(--color-ink)' };

/** The y-axis label: the name wrapped rather than cut, with the full name on hover. */
function NameTick({ x, y, payload }: { x?: number; y?: number; payload?: { value: string } }) {
  const name = payload?.value ?? '';
  const lines = wrapName(name);
  const lineHeight = 14;
  return (
    <g transform={`translate(${x ?? 0},${y ?? 0})`} data-testid="chart-name">
      <title>{name}</title>
      <text textAnchor="end" fontSize={12} fill="var(--color-ink)" dy={-((lines.length - 1) * lineHeight) / 2 + 4}>
        {lines.map((line, i) => (
          <tspan key={i} x={-4} dy={i === 0 ? 0 : lineHeight}>
            {line}
          </tspan>
        ))}
      </text>
    </g>
  );
}

/** Charts of the drive for organisers and the coordinator, each with the same figures as a table for screen readers. */
export function ProgressCharts({ progress }: { progress: DriveProgress }) {
  const perRecipient = recipientProgress(progress.recipients);
  const perStatus = statusCounts(progress.statuses);
  const blanketCount = perStatus.reduce((n, s) => n + s.count, 0);
  if (perRecipient.length === 0 && blanketCount === 0) {
    return (
      <EmptyState icon={BarChart3} title="Nothing to chart yet">
        Once recipients have needs and makers start pledging, the drive's progress shows here.
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      {/* min-w-0: a grid item would otherwise grow to the chart's width and push the page sideways on a phone. */}
      <Card className="min-w-0">
        <CardTitle>Wanted, pledged, in hand and assigned</CardTitle>
        <p className="mb-3 text-ink-soft">Per recipient: blankets asked for, promised by makers, with the organisers now, and assigned to it.</p>
        {/* Room for each name on up to three lines. */}
        <div aria-hidden style={{ height: Math.max(320, 56 * perRecipient.length + 90) }} data-testid="chart-recipients">
          <ResponsiveContainer width="100%" height="100%">
            <BarChart accessibilityLayer={false} data={perRecipient} layout="vertical" margin={{ left: 8, right: 16 }}>
              <CartesianGrid strokeDasharray="3 3" horizontal={false} />
              <XAxis type="number" allowDecimals={false} tick={axis} />
              <YAxis type="category" dataKey="name" width={130} interval={0} tick={<NameTick />} />
              <Tooltip />
              <Legend wrapperStyle={{ fontSize: 14 }} formatter={(value: string) => <span style={{ color: 'var(--color-ink)' }}>{value}</span>} />
              <Bar dataKey="wanted" name="Wanted" fill={COLOURS.wanted} isAnimationActive={false} />
              <Bar dataKey="pledged" name="Pledged" fill={COLOURS.pledged} isAnimationActive={false} />
              <Bar dataKey="inHand" name="In hand" fill={COLOURS.inHand} isAnimationActive={false} />
              <Bar dataKey="assigned" name="Assigned" fill={COLOURS.assigned} isAnimationActive={false} />
            </BarChart>
          </ResponsiveContainer>
        </div>
        {/* The wrapper hides it: a table ignores the 1px width sr-only gives it and would widen the page. */}
        <div className="sr-only">
        <table>
          <caption>Wanted, pledged, in hand and assigned per recipient</caption>
          <thead>
            <tr>
              <th>Recipient</th>
              <th>Wanted</th>
              <th>Pledged</th>
              <th>In hand</th>
              <th>Assigned</th>
            </tr>
          </thead>
          <tbody>
            {perRecipient.map((r) => (
              <tr key={r.name}>
                <td>{r.name}</td>
                <td>{r.wanted}</td>
                <td>{r.pledged}</td>
                <td>{r.inHand}</td>
                <td>{r.assigned}</td>
              </tr>
            ))}
          </tbody>
        </table>
        </div>
      </Card>
      <Card className="min-w-0">
        <CardTitle>Where the blankets are</CardTitle>
        <p className="mb-3 text-ink-soft">Every logged blanket by the step it has reached; yellow needs a fix, red was declined.</p>
        <div aria-hidden className="h-80" data-testid="chart-statuses">
          <ResponsiveContainer width="100%" height="100%">
            <BarChart accessibilityLayer={false} data={perStatus} margin={{ bottom: 40, right: 8 }}>
              <CartesianGrid strokeDasharray="3 3" vertical={false} />
              <XAxis dataKey="label" interval={0} angle={-35} textAnchor="end" tick={{ ...axis, fontSize: 12 }} />
              <YAxis allowDecimals={false} tick={axis} />
              <Tooltip />
              <Bar dataKey="count" name="Blankets" isAnimationActive={false}>
                {perStatus.map((s) => (
                  <Cell key={s.status} fill={s.status === 'needs_fix' ? COLOURS.attention : s.status === 'declined' ? COLOURS.declined : COLOURS.status} />
                ))}
              </Bar>
            </BarChart>
          </ResponsiveContainer>
        </div>
        {/* The wrapper hides it: a table ignores the 1px width sr-only gives it and would widen the page. */}
        <div className="sr-only">
        <table>
          <caption>Blankets by status</caption>
          <tbody>
            {perStatus.map((s) => (
              <tr key={s.status}>
                <th scope="row">{s.label}</th>
                <td>{s.count}</td>
              </tr>
            ))}
          </tbody>
        </table>
        </div>
      </Card>
    </div>
  );
}
