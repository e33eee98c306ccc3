import { lazy, Suspense, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { AlarmClock, ArrowRight, CircleCheck, FileSpreadsheet, Hourglass, Truck } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { formatDay, formatMoment } from '@/components/ui/format-day';
import { useDriveGlance, useGlanceWeeks } from '@/features/drive/api/get-drive-glance';
import { Field, Select } from '@/components/ui/field';
import { sizeLabel } from '@/features/blankets/components/labels';
import { RunStateBadge } from '@/features/runs/components/run-state-badge';
import { glanceLinks } from '@/features/progress/components/glance-links';
import { AT_RISK_RULE, GLANCE_STEPS, STEP_LABELS, STEP_MEANS, type GlanceStep } from '@shared/drive/glance';
import type { DriveGlance, GlanceNeed } from '@shared/schemas/glance';

// The charting library is large: it loads only when this page draws its chart.
const GlanceTimelineChart = lazy(() => import('@/features/progress/components/glance-timeline-chart').then((m) => ({ default: m.GlanceTimelineChart })));

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** A figure and the list behind it; a zero has no list worth opening, so it stays plain. */
function Figure({ n, to, label }: { n: number; to: string; label: string }) {
  if (n === 0) return <span className="text-ink-soft">0</span>;
  return (
    <Link to={to} aria-label={label} className="font-bold">
      {n}
    </Link>
  );
}

function StepTiles({ g }: { g: DriveGlance }) {
  const tiles: Array<{ key: string; n: number; label: string; note: string; to: string }> = [
    { key: 'pledged', n: g.totals.pledged, label: 'Pledged', note: `of ${g.totals.wanted} wanted by the open needs`, to: '/needs' },
    ...GLANCE_STEPS.map((s) => ({ key: s, n: g.totals[s], label: STEP_LABELS[s], note: s === 'delivered' ? 'so far' : 'now', to: glanceLinks.step(s) })),
  ];
  return (
    <section aria-labelledby="steps-heading">
      <h2 id="steps-heading" className="mb-3 text-2xl font-bold">
        Every blanket, step by step
      </h2>
      <ol className="grid grid-cols-2 gap-3 sm:grid-cols-4 lg:grid-cols-7">
        {tiles.map((t) => (
          <li key={t.key}>
            <Link
              to={t.to}
              data-testid={`tile-${t.key}`}
              className="flex h-full flex-col rounded-2xl border border-oat-200 bg-white p-4 text-ink no-underline shadow-sm hover:border-heather-300 hover:bg-heather-50"
            >
              <span className="text-4xl font-bold text-heather-800">{t.n}</span>
              <span className="text-lg font-bold">{t.label}</span>
              <span className="text-sm text-ink-soft">{t.note}</span>
            </Link>
          </li>
        ))}
      </ol>
      <p className="mt-3 text-ink-soft">
        Each step counts the blankets standing there now: finished includes those booked in for a drop-off, received includes those waiting for a fix.
        {g.totals.inProgress > 0 && ` ${plural(g.totals.inProgress, 'blanket is', 'blankets are')} still on the hook`}
        {g.totals.declined > 0 && `${g.totals.inProgress > 0 ? ', and' : ''} ${plural(g.totals.declined, 'was', 'were')} declined at the check`}
        {g.totals.inProgress > 0 || g.totals.declined > 0 ? '.' : ''}
      </p>
    </section>
  );
}

function needName(n: GlanceNeed) {
  return `${n.recipientName}, ${sizeLabel(n.sizeCategory).toLowerCase()}`;
}

function AtRisk({ g }: { g: DriveGlance }) {
  const risky = g.needs.filter((n) => n.atRisk);
  return (
    <section aria-labelledby="risk-heading">
      <Card>
        <div className="flex flex-wrap items-center gap-3">
          <AlarmClock className="size-7 text-brick-700" aria-hidden />
          <h2 id="risk-heading" className="text-2xl font-bold">
            Needs at risk
          </h2>
          <Badge tone={risky.length ? 'brick' : 'moss'}>{risky.length ? plural(risky.length, 'need') : 'None'}</Badge>
        </div>
        <p className="mt-2 max-w-prose text-ink-soft">{AT_RISK_RULE}</p>
        {risky.length === 0 ? (
          <p className="mt-4 flex items-center gap-2 text-lg">
            <CircleCheck className="size-6 text-moss-700" aria-hidden /> No open need is at risk by this rule today.
          </p>
        ) : (
          <ul className="mt-4 space-y-3">
            {risky.map((n) => (
              <li key={n.needId} className="rounded-xl border border-brick-500/40 bg-brick-100/50 p-4">
                <p className="text-lg font-bold">
                  <Link to={glanceLinks.recipient(n.recipientId)}>{needName(n)}</Link>
                </p>
                <p className="text-ink-soft">
                  Due {formatDay(n.deadline, true)} · {n.daysLeft === 0 ? 'today' : `${plural(n.daysLeft, 'day')} left`}
                </p>
                <ul className="mt-2 flex flex-wrap gap-2">
                  {n.reasons.includes('pledged') && (
                    <li>
                      <Badge tone="brick">Pledged {n.pledged} of {n.wanted}</Badge>
                    </li>
                  )}
                  {n.reasons.includes('assigned') && (
                    <li>
                      <Badge tone="brick">Assigned {n.assignedSoFar} of {n.wanted}</Badge>
                    </li>
                  )}
                </ul>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </section>
  );
}

/** A table that may be wider than a phone scrolls inside itself, and can be reached by keyboard to scroll. */
function Scroller({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div role="region" aria-label={label} tabIndex={0} className="overflow-x-auto rounded-2xl border border-oat-200 bg-white shadow-sm">
      {children}
    </div>
  );
}

const th = 'px-3 py-2 font-bold';
const td = 'px-3 py-2 tabular-nums';

function PerNeed({ g }: { g: DriveGlance }) {
  return (
    <section aria-labelledby="needs-heading" className="space-y-3">
      <h2 id="needs-heading" className="text-2xl font-bold">
        Per need
      </h2>
      <p className="max-w-prose text-ink-soft">
        Each open need: blankets wanted and pledged, and its blankets now at each step. A blanket counts for the need it is assigned to, or else the need it was pledged for.
      </p>
      {g.needs.length === 0 ? (
        <EmptyState icon={Hourglass} title="No open needs">
          Needs appear here once a recipient asks for blankets with a deadline still ahead.
        </EmptyState>
      ) : (
        <>
          <ul className="space-y-3 md:hidden" data-testid="needs-cards">
            {g.needs.map((n) => (
              <li key={n.needId}>
                <Card className="p-4">
                  <p className="text-lg font-bold leading-snug">
                    <Link to={glanceLinks.recipient(n.recipientId)}>{n.recipientName}</Link>
                  </p>
                  <p className="text-ink-soft">
                    {sizeLabel(n.sizeCategory)} · due {formatDay(n.deadline)}
                  </p>
                  {n.atRisk && <Badge tone="brick" className="mt-1">At risk</Badge>}
                  <dl className="mt-3 grid grid-cols-4 gap-x-2 gap-y-2 text-center">
                    <div className="rounded-lg bg-oat-50 py-1">
                      <dt className="text-sm text-ink-soft">Wanted</dt>
                      <dd className="text-lg tabular-nums">{n.wanted}</dd>
                    </div>
                    <div className="rounded-lg bg-oat-50 py-1">
                      <dt className="text-sm text-ink-soft">Pledged</dt>
                      <dd className="text-lg tabular-nums">
                        <Figure n={n.pledged} to={glanceLinks.pledged(n.needId)} label={`${n.pledged} pledged for ${needName(n)}`} />
                      </dd>
                    </div>
                    {GLANCE_STEPS.map((s) => (
                      <div key={s} className="rounded-lg bg-oat-50 py-1">
                        <dt className="text-sm text-ink-soft">{STEP_LABELS[s]}</dt>
                        <dd className="text-lg tabular-nums">
                          <Figure n={n.now[s]} to={glanceLinks.step(s, n.needId)} label={`${n.now[s]} ${STEP_LABELS[s].toLowerCase()} for ${needName(n)}`} />
                        </dd>
                      </div>
                    ))}
                  </dl>
                </Card>
              </li>
            ))}
          </ul>
          <div className="hidden md:block">
          <Scroller label="Blankets per need, scrolls sideways">
            <table className="w-full min-w-[52rem] text-left">
              <caption className="sr-only">Blankets now at each step, per open need</caption>
              <thead className="bg-oat-50 text-sm">
                <tr>
                  <th scope="col" className={th}>Need</th>
                  <th scope="col" className={th}>Due</th>
                  <th scope="col" className={th}>Wanted</th>
                  <th scope="col" className={th}>Pledged</th>
                  {GLANCE_STEPS.map((s) => (
                    <th key={s} scope="col" className={th}>{STEP_LABELS[s]}</th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {g.needs.map((n) => (
                  <tr key={n.needId} className="border-t border-oat-200">
                    <th scope="row" className="px-3 py-2 font-normal">
                      <Link to={glanceLinks.recipient(n.recipientId)} className="font-bold">{n.recipientName}</Link>
                      <span className="block text-sm text-ink-soft">{sizeLabel(n.sizeCategory)}</span>
                    </th>
                    <td className={`${td} whitespace-nowrap`}>
                      {formatDay(n.deadline)}
                      {n.atRisk && <span className="block"><Badge tone="brick">At risk</Badge></span>}
                    </td>
                    <td className={td}>{n.wanted}</td>
                    <td className={td}>
                      <Figure n={n.pledged} to={glanceLinks.pledged(n.needId)} label={`${n.pledged} pledged for ${needName(n)}`} />
                    </td>
                    {GLANCE_STEPS.map((s) => (
                      <td key={s} className={td}>
                        <Figure n={n.now[s]} to={glanceLinks.step(s, n.needId)} label={`${n.now[s]} ${STEP_LABELS[s].toLowerCase()} for ${needName(n)}`} />
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </Scroller>
          </div>
        </>
      )}
    </section>
  );
}

function OverTime({ g }: { g: DriveGlance }) {
  const [needId, setNeedId] = useState<number | null>(null);
  const forNeed = useGlanceWeeks(needId);
  const need = g.needs.find((n) => n.needId === needId);
  const weeks = needId === null ? g.weeks : forNeed.data;
  const whose = need ? ` for ${needName(need)}` : '';
  return (
    <section aria-labelledby="time-heading">
      <Card className="min-w-0">
        <h2 id="time-heading" className="mb-3 text-2xl font-bold">
          Week by week
        </h2>
        <p className="mb-3 max-w-prose text-ink-soft">
          Running totals from each blanket’s history: blankets pledged, and blankets that had reached each step by the end of each week (weeks start on Monday). The table below has the figures for each week, each one opening the blankets behind it.
        </p>
        <Field label="Show the weeks of" className="mb-4 max-w-md">
          {({ id }) => (
            <Select id={id} value={needId ?? ''} onChange={(e) => setNeedId(e.target.value ? Number(e.target.value) : null)}>
              <option value="">The whole drive</option>
              {g.needs.map((n) => (
                <option key={n.needId} value={n.needId}>
                  {needName(n)}
                </option>
              ))}
            </Select>
          )}
        </Field>
        {weeks === undefined ? (
          forNeed.error ? <QueryError error={forNeed.error} /> : <Loading label="Counting the weeks…" />
        ) : weeks.length === 0 ? (
          <EmptyState icon={Hourglass} title="No history yet">
            {need ? 'Nothing has been pledged or made for this need yet.' : 'The weeks fill in as makers pledge and log blankets.'}
          </EmptyState>
        ) : (
          <>
            <Suspense fallback={<Loading label="Drawing the chart…" />}>
              <GlanceTimelineChart weeks={weeks} />
            </Suspense>
            <details className="mt-4">
              <summary className="cursor-pointer text-lg font-bold text-heather-800">The figures week by week, as a table</summary>
              <div className="mt-3">
                <Scroller label="Week by week, scrolls sideways">
                  <table className="w-full min-w-[44rem] text-left">
                    <caption className="sr-only">Blankets pledged, and blankets that reached each step, each week{whose}</caption>
                    <thead className="bg-oat-50 text-sm">
                      <tr>
                        <th scope="col" className={th}>Week of</th>
                        <th scope="col" className={th}>Pledged</th>
                        {GLANCE_STEPS.map((s) => (
                          <th key={s} scope="col" className={th}>{STEP_LABELS[s]}</th>
                        ))}
                      </tr>
                    </thead>
                    <tbody>
                      {[...weeks].reverse().map((w) => (
                        <tr key={w.week} className="border-t border-oat-200">
                          <th scope="row" className={`${th} whitespace-nowrap`}>{formatDay(w.week)}</th>
                          <td className={td}>
                            <Figure n={w.pledged} to={glanceLinks.pledged(needId ?? undefined, w.week)} label={`${w.pledged} pledged in the week of ${formatDay(w.week)}${whose}`} />
                          </td>
                          {GLANCE_STEPS.map((s) => (
                            <td key={s} className={td}>
                              <Figure
                                n={w.reached[s]}
                                to={glanceLinks.reached(s, w.week, needId ?? undefined)}
                                label={`${w.reached[s]} ${STEP_LABELS[s].toLowerCase()} in the week of ${formatDay(w.week)}${whose}`}
                              />
                            </td>
                          ))}
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </Scroller>
              </div>
            </details>
          </>
        )}
      </Card>
    </section>
  );
}

function Waiting({ g }: { g: DriveGlance }) {
  return (
    <section aria-labelledby="waiting-heading" className="space-y-3">
      <h2 id="waiting-heading" className="text-2xl font-bold">
        Waiting longest
      </h2>
      <p className="max-w-prose text-ink-soft">At each step, the blankets that have stood there longest since they arrived.</p>
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {g.waiting.map((w) => (
          <li key={w.step}>
            <Card className="h-full">
              <h3 className="text-xl font-bold">{STEP_LABELS[w.step]}</h3>
              <p className="mb-3 text-ink-soft">
                {w.count === 0 ? 'None here now' : <Link to={glanceLinks.step(w.step)}>{plural(w.count, 'blanket')} here now</Link>}
              </p>
              {w.longest.length > 0 && (
                <ol className="space-y-2">
                  {w.longest.map((b) => (
                    <li key={b.id} className="flex flex-wrap items-baseline justify-between gap-x-3">
                      <Link to={glanceLinks.blanket(b.id)} className="font-mono text-lg font-bold">{b.code}</Link>
                      <span className="font-bold">{b.days === 0 ? 'since today' : plural(b.days, 'day')}</span>
                      <span className="basis-full text-sm text-ink-soft">{b.recipientName ?? 'Not yet given a recipient'}</span>
                    </li>
                  ))}
                </ol>
              )}
            </Card>
          </li>
        ))}
      </ul>
      <dl className="grid gap-x-6 gap-y-1 text-ink-soft sm:grid-cols-2">
        {GLANCE_STEPS.filter((s) => s !== 'delivered').map((s: GlanceStep) => (
          <div key={s}>
            <dt className="inline font-bold text-ink">{STEP_LABELS[s]}: </dt>
            <dd className="inline">{STEP_MEANS[s]}.</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}

/** A side card of the page: a heading with its icon, the list (or what stands in for it), and a link to the full page. */
function SideCard({ id, icon: Icon, title, empty, footer, children }: { id: string; icon: typeof Truck; title: string; empty: ReactNode | null; footer: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={id}>
      <Card className="h-full">
        <div className="mb-3 flex items-center gap-3">
          <Icon className="size-7 text-heather-700" aria-hidden />
          <h2 id={id} className="text-2xl font-bold">{title}</h2>
        </div>
        {empty ?? <ul className="space-y-3">{children}</ul>}
        <p className="mt-4">{footer}</p>
      </Card>
    </section>
  );
}

function Runs({ g }: { g: DriveGlance }) {
  const { items, total } = g.upcomingRuns;
  return (
    <SideCard
      id="runs-heading"
      icon={Truck}
      title="Upcoming runs"
      empty={items.length === 0 ? <p className="text-ink-soft">No delivery run is planned. <Link to="/runs">Plan one on Delivery runs</Link>.</p> : null}
      footer={
        <Link to="/runs" className="inline-flex items-center gap-1 font-bold">
          {total > items.length ? `All ${total} upcoming runs` : 'All delivery runs'} <ArrowRight className="size-4" aria-hidden />
        </Link>
      }
    >
      {items.map((r) => (
        <li key={r.id}>
          <Link to={glanceLinks.run(r.id)} className="block rounded-xl border border-oat-200 p-3 text-ink no-underline hover:border-heather-300 hover:bg-heather-50">
            <span className="flex flex-wrap items-center justify-between gap-2">
              <span className="text-lg font-bold">{formatDay(r.runDate, true)}</span>
              <RunStateBadge state={r.state} />
            </span>
            <span className="block text-ink-soft">
              {r.driver.name} from {r.startSite.name} · {plural(r.stopCount, 'stop')} · {plural(r.blanketCount, 'blanket')}
            </span>
          </Link>
        </li>
      ))}
    </SideCard>
  );
}

function Exports({ g }: { g: DriveGlance }) {
  const { items, total } = g.recentExports;
  return (
    <SideCard
      id="exports-heading"
      icon={FileSpreadsheet}
      title="Recent exports"
      empty={items.length === 0 ? <p className="text-ink-soft">No delivery list has been exported yet.</p> : null}
      footer={
        <Link to="/exports" className="inline-flex items-center gap-1 font-bold">
          {total > 0 ? `All ${plural(total, 'export')}, to download again` : 'Exports'} <ArrowRight className="size-4" aria-hidden />
        </Link>
      }
    >
      {items.map((e) => (
        <li key={e.id} className="rounded-xl border border-oat-200 p-3">
          <span className="block font-bold">{e.title}</span>
          <span className="block text-ink-soft">
            {plural(e.rows, 'row')} · {formatMoment(e.createdAt)}
            {e.createdBy ? ` · ${e.createdBy.name}` : ''}
          </span>
        </li>
      ))}
    </SideCard>
  );
}

/** The whole drive for the coordinator and organisers: every figure counted by the server, each one opening its list. */
export default function DriveGlancePage() {
  const glance = useDriveGlance();
  return (
    <div className="space-y-10">
      <PageHeader
        title="The drive at a glance"
        lead="Where every blanket is, what each need still lacks, and what is coming up. Each figure opens the list behind it."
      />
      {glance.isPending ? (
        <Loading label="Counting the whole drive…" />
      ) : glance.error ? (
        <QueryError error={glance.error} />
      ) : (
        <>
          <StepTiles g={glance.data} />
          <AtRisk g={glance.data} />
          <PerNeed g={glance.data} />
          <OverTime g={glance.data} />
          <Waiting g={glance.data} />
          <div className="grid gap-6 lg:grid-cols-2">
            <Runs g={glance.data} />
            <Exports g={glance.data} />
          </div>
        </>
      )}
    </div>
  );
}
