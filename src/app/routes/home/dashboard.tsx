import { lazy, Suspense } from 'react';
import { Link } from 'react-router-dom';
import { ArrowRight, Gauge } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { ProgressBar } from '@/components/ui/progress-bar';
import { navItems } from '@/components/layout/nav-items';
import { useMe } from '@/features/auth/api/get-me';
import { useDrive } from '@/features/drive/api/get-drive';
import { useDriveProgress } from '@/features/drive/api/get-drive-progress';
import { Loading } from '@/components/ui/spinner';
import { IN_HAND } from '@shared/blankets/status';
import { Badge } from '@/components/ui/badge';
import { useMyPledges } from '@/features/pledges/api/get-pledges';
import { useMyBlankets } from '@/features/blankets/api/get-blankets';
import { formatDay } from '@/components/ui/format-day';
import { useDriveToday } from '@/lib/drive-clock';
import { daysUntil } from '@/components/ui/format-day';

/** A maker's own part of the drive at a glance: what they promised, made and handed in. */
function MyPart() {
  const pledges = useMyPledges();
  const blankets = useMyBlankets();
  if (!pledges.data || !blankets.data) return <Loading label="Gathering your pledges…" />;
  const active = pledges.data.filter((p) => p.status !== 'cancelled');
  const promised = active.reduce((n, p) => n + p.quantity, 0);
  const finished = active.reduce((n, p) => n + p.blanketsFinished, 0);
  const handedIn = blankets.data.items.filter((b) => IN_HAND.includes(b.status)).length;
  const late = active.filter((p) => p.late).length;
  const next = active
    .filter((p) => p.status === 'active' && p.blanketsFinished < p.quantity)
    .sort((a, b) => a.dueDate.localeCompare(b.dueDate))[0];
  return (
    <Card>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-xl font-bold">Your part</h2>
        {late > 0 && <Badge tone="brick">{late === 1 ? 'One pledge is late' : `${late} pledges are late`}</Badge>}
      </div>
      {promised === 0 ? (
        <p className="mt-2 text-ink-soft">
          You haven't pledged yet. <Link to="/needs">See what's needed</Link> and promise what you can make.
        </p>
      ) : (
        <>
          <p className="mb-4 mt-1 text-ink-soft">
            {promised} promised · {finished} finished · {handedIn} handed in
            {next ? (next.late ? ` · one was due ${formatDay(next.dueDate)}` : ` · next due ${formatDay(next.dueDate)}`) : ''}
          </p>
          <ProgressBar value={promised ? finished / promised : 0} label="Blankets finished of those you promised" tone="moss" />
        </>
      )}
    </Card>
  );
}

// The charting library is large; only staff see the charts, so only they load it.
// The charts are pictures of the tables beside them, so they stay out of the tab order and the accessibility tree.
const ProgressCharts = lazy(() => import('@/features/progress/components/progress-charts').then((m) => ({ default: m.ProgressCharts })));

function DriveProgress() {
  const progress = useDriveProgress();
  if (!progress.data) return <Loading label="Gathering the drive’s figures…" />;
  return (
    <section aria-labelledby="progress">
      <div className="mb-3 flex flex-wrap items-center justify-between gap-3">
        <h2 id="progress" className="text-2xl font-bold">
          How the drive is going
        </h2>
        <Link to="/drive" className="inline-flex items-center gap-2 text-lg font-bold">
          <Gauge className="size-5" aria-hidden /> The whole drive at a glance <ArrowRight className="size-4" aria-hidden />
        </Link>
      </div>
      <Suspense fallback={<Loading label="Drawing the charts…" />}>
        <ProgressCharts progress={progress.data} />
      </Suspense>
    </section>
  );
}

const leads = {
  volunteer: 'See what the recipients still need, plan your next blanket and keep track of the ones you have made.',
  organiser: 'Receive, measure and check blankets against each recipient’s rules, and find a home for each one.',
  coordinator: 'Keep an eye on pledges against needs, look after recipients, sites and people, and plan the deliveries.',
} as const;

export default function DashboardPage() {
  const { data: user } = useMe();
  const { data } = useDrive();
  const today = useDriveToday();
  if (!user) return null;
  const drive = data?.drive;
  // Whole days of the drive's calendar, counted from the drive's today.
  const start = drive ? daysUntil(drive.startsOn.slice(0, 10), today) : 0;
  const end = drive ? daysUntil(drive.endsOn.slice(0, 10), today) : 0;
  const elapsed = drive && end !== start ? -start / (end - start) : 0;
  const daysLeft = drive ? Math.max(0, end) : 0;
  const items = navItems.filter((i) => i.roles.includes(user.role) && i.to !== '/home');
  return (
    <div className="space-y-8">
      <PageHeader title={`Hello, ${user.name.split(' ')[0]}`} lead={leads[user.role]} />
      {drive && (
        <Card>
          <h2 className="text-xl font-bold">{drive.name}</h2>
          <p className="mb-4 text-ink-soft">
            {daysLeft} days until the last drop-off day · {data?.volunteers ?? 0} makers taking part
          </p>
          <ProgressBar value={elapsed} label="How far through the drive we are" tone="marigold" />
        </Card>
      )}
      {user.role === 'volunteer' ? <MyPart /> : <DriveProgress />}
      <section aria-labelledby="go">
        <h2 id="go" className="mb-3 text-2xl font-bold">
          Where to go
        </h2>
        <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {items.map((i) => (
            <li key={i.to}>
              <Link to={i.to} className="group flex h-full items-center gap-4 rounded-2xl border border-oat-200 bg-white p-5 text-ink no-underline shadow-sm hover:border-heather-300 hover:bg-heather-50">
                <i.icon className="size-9 shrink-0 text-heather-700" aria-hidden />
                <span className="flex-1 text-lg font-bold">{i.label}</span>
                <ArrowRight className="size-5 text-heather-500 group-hover:translate-x-1" aria-hidden />
              </Link>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
