import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { BellOff, BellRing, CalendarCheck2, HeartHandshake, MailX, CalendarClock, MapPin, PackageOpen } from 'lucide-react';
import type { BookingView, SlotView } from '@shared/schemas/booking';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardTitle } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { Button, ButtonLink } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';
import { Checkbox } from '@/components/ui/field';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { DEMO_TOWN_CENTRE, PinMap } from '@/components/ui/pin-map';
import { cn } from '@/components/ui/cn';
import { useSites } from '@/features/sites/api/get-sites';
import { useSoonest } from '@/features/drop-off/api/get-soonest';
import { useMyBookings } from '@/features/drop-off/api/get-bookings';
import { useFinishedBlankets } from '@/features/drop-off/api/get-finished-blankets';
import { useDriveClock, useDriveToday } from '@/lib/drive-clock';
import { useReminders, useSetReminders } from '@/features/drop-off/api/reminders';
import { useSetThankYouMail, useThankYouMail } from '@/features/drop-off/api/thank-you-mail';
import { useCancelBooking, useCreateBooking, useMoveBooking } from '@/features/drop-off/api/book';
import { SlotPicker } from '@/features/drop-off/components/slot-picker';
import { dayIn, isoDayIn, slotLabel, timeIn } from '@/features/drop-off/components/when';

interface Choice {
  siteId: number;
  slot: SlotView;
}

/** The maker's drop-offs: what is booked, and booking finished blankets into a free time at a site. */
export default function DropOffPage() {
  const [params] = useSearchParams();
  const preselected = Number(params.get('blanket')) || null;
  const clock = useDriveClock();
  const zone = clock.data?.timeZone ?? 'UTC';
  const today = useDriveToday();
  const mine = useMyBookings();
  const finished = useFinishedBlankets();
  const sites = useSites('true');
  const soonest = useSoonest();
  const create = useCreateBooking();
  const move = useMoveBooking();
  const cancel = useCancelBooking();

  const [picked, setPicked] = useState<number[] | null>(null);
  const chosenBlankets = picked ?? (preselected ? [preselected] : []);
  const [siteId, setSiteId] = useState<number | null>(null);
  const [day, setDay] = useState<string | null>(null);
  const [choice, setChoice] = useState<Choice | null>(null);
  const [moving, setMoving] = useState<BookingView | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const upcoming = (mine.data?.bookings ?? []).filter((b) => b.status === 'booked' && b.arrival === 'expected');
  const siteName = (id: number) => sites.data?.find((s) => s.id === id)?.name ?? 'the site';
  const pickSite = (id: number) => {
    setSiteId(id);
    const next = soonest.data?.nextBySite[id];
    setDay(next ? isoDayIn(next.start, zone) : today);
    setChoice(null);
  };
  const chooseSoonest = (s: { siteId: number } & SlotView) => {
    setSiteId(s.siteId);
    setDay(isoDayIn(s.start, zone));
    setChoice({ siteId: s.siteId, slot: s });
  };
  const resetChoice = () => {
    setChoice(null);
    setMoving(null);
  };
  const busy = create.isPending || move.isPending;
  const error = create.error ?? move.error;

  const submit = () => {
    if (!choice) return;
    const label = `${siteName(choice.siteId)}, ${slotLabel(choice.slot, zone)}`;
    if (moving) {
      move.mutate({ id: moving.id, siteId: choice.siteId, start: choice.slot.start }, { onSuccess: () => { setDone(`Moved to ${label}. A new invitation is on its way.`); resetChoice(); } });
    } else {
      create.mutate(
        { siteId: choice.siteId, start: choice.slot.start, blanketIds: chosenBlankets },
        { onSuccess: () => { setDone(`Booked: ${label}. We have e-mailed you a calendar invitation.`); setPicked([]); resetChoice(); } },
      );
    }
  };

  if (clock.isPending || mine.isPending || finished.isPending || sites.isPending) return <Loading />;
  const failed = clock.error ?? mine.error ?? finished.error ?? sites.error;
  if (failed || !sites.data || !finished.data) return <QueryError error={failed} />;
  const siteList = sites.data;
  const finishedList = finished.data;

  const pins = siteList
    .filter((s) => s.lat !== null && s.lng !== null)
    .map((s) => {
      const next = soonest.data?.nextBySite[s.id];
      return {
        id: s.id,
        lat: s.lat!,
        lng: s.lng!,
        kind: 'site' as const,
        selected: s.id === siteId,
        label: next ? `${s.name}: next free ${dayIn(next.start, zone, { weekday: 'short' })} ${timeIn(next.start, zone)}` : `${s.name}: no free time soon`,
      };
    });
  const canBook = moving !== null || chosenBlankets.length > 0;

  return (
    <div className="space-y-8">
      <PageHeader
        title="Drop-off"
        lead={<>Book a time to bring finished blankets to a drop-off point, so the desk is ready for you. All times are <strong>{zone}</strong> time.</>}
      />
      {done && <Alert kind="success" title="Done">{done}</Alert>}

      <section aria-labelledby="booked-heading" className="space-y-3">
        <h2 id="booked-heading" className="text-2xl font-bold">Your drop-offs</h2>
        {upcoming.length === 0 ? (
          <EmptyState icon={CalendarClock} title="Nothing booked yet">
            When you book a time it appears here, and you can move or cancel it until it begins.
          </EmptyState>
        ) : (
          <ul className="grid gap-4 md:grid-cols-2" aria-label="Booked drop-offs">
            {upcoming.map((b) => (
              <li key={b.id}>
                <Card className={cn('h-full space-y-2', moving?.id === b.id && 'border-2 border-heather-500')} data-testid="my-booking">
                  <p className="text-xl font-bold">{slotLabel(b, zone)}</p>
                  <p>
                    {b.siteName}, {b.siteAddress}
                  </p>
                  <p className="text-ink-soft">Bringing {b.blankets.map((x) => x.code).join(', ')}</p>
                  <div className="flex flex-wrap gap-2 pt-2">
                    <Button variant="secondary" onClick={() => { setMoving(b); pickSite(b.siteId); setDone(null); }}>
                      Move to another time
                    </Button>
                    <Button
                      variant="quiet"
                      busy={cancel.isPending && cancel.variables === b.id}
                      onClick={() => {
                        if (window.confirm(`Cancel the drop-off on ${slotLabel(b, zone)}? Your blankets stay finished, ready to book again.`)) {
                          cancel.mutate(b.id, { onSuccess: () => setDone('Drop-off cancelled. We have e-mailed you the cancellation for your calendar.') });
                        }
                      }}
                    >
                      Cancel it
                    </Button>
                  </div>
                </Card>
              </li>
            ))}
          </ul>
        )}
        {cancel.error && <Alert kind="error">{cancel.error.message}</Alert>}
        <ReminderToggle />
        <ThankYouToggle />
      </section>

      <section aria-labelledby="book-heading" className="space-y-6">
        <h2 id="book-heading" className="text-2xl font-bold">{moving ? `Move your drop-off of ${moving.blankets.map((x) => x.code).join(', ')}` : 'Book a drop-off'}</h2>
        {moving ? (
          <Alert kind="info" title="Choose the new time">
            Pick a site and a free time below; the old time is released when you confirm.{' '}
            <button type="button" className="font-bold underline" onClick={resetChoice}>Keep the old time</button>
          </Alert>
        ) : (
          <Card>
            <CardTitle>1. Which blankets are you bringing?</CardTitle>
            {finishedList.length === 0 ? (
              <EmptyState icon={PackageOpen} title="No finished blankets waiting" action={<ButtonLink to="/blankets" variant="secondary">My blankets</ButtonLink>}>
                Mark a blanket as finished on its page, then come back to book its drop-off.
              </EmptyState>
            ) : (
              <fieldset>
                <legend className="sr-only">Finished blankets</legend>
                {finishedList.map((b) => (
                  <Checkbox
                    key={b.id}
                    checked={chosenBlankets.includes(b.id)}
                    onChange={(e) => setPicked(e.target.checked ? [...chosenBlankets, b.id] : chosenBlankets.filter((x) => x !== b.id))}
                    label={<><span className="font-bold">{b.code}</span> · {b.colours}</>}
                  />
                ))}
              </fieldset>
            )}
          </Card>
        )}

        {canBook && (
          <Card className="space-y-5">
            <CardTitle>{moving ? 'Where and when?' : '2. Where and when?'}</CardTitle>
            <div className="space-y-2">
              <h3 className="text-lg font-bold">Soonest free times</h3>
              {soonest.isPending ? (
                <Loading />
              ) : soonest.data && soonest.data.soonest.length > 0 ? (
                <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3" aria-label="Soonest free times">
                  {soonest.data.soonest.map((s) => (
                    <li key={`${s.siteId}-${s.start}`}>
                      <button
                        type="button"
                        aria-pressed={choice?.slot.start === s.start && choice.siteId === s.siteId}
                        onClick={() => chooseSoonest(s)}
                        className={cn(
                          'w-full rounded-xl border-2 px-3 py-2 text-left min-h-11',
                          choice?.slot.start === s.start && choice.siteId === s.siteId
                            ? 'border-heather-700 bg-heather-700 text-white hover:bg-heather-800'
                            : 'border-heather-300 bg-white hover:bg-heather-50',
                        )}
                      >
                        <span className="block font-bold">{dayIn(s.start, zone, { weekday: 'short' })}, {timeIn(s.start, zone)}</span>
                        <span className="block text-sm">{s.siteName} · {s.remaining === 1 ? '1 place left' : `${s.remaining} places left`}</span>
                      </button>
                    </li>
                  ))}
                </ul>
              ) : (
                <p className="text-ink-soft">No free times in the next four weeks. The organisers add more as the drive goes on.</p>
              )}
            </div>

            <div className="space-y-3">
              <h3 className="text-lg font-bold">Or choose a site</h3>
              {pins.length > 0 && <PinMap label="Map of the drop-off sites; choose one" fallbackCentre={DEMO_TOWN_CENTRE} pins={pins} onSelect={(id) => pickSite(Number(id))} />}
              <ul className="grid gap-2 md:grid-cols-3" aria-label="Drop-off sites">
                {siteList.map((s) => {
                  const next = soonest.data?.nextBySite[s.id];
                  return (
                    <li key={s.id}>
                      <button
                        type="button"
                        aria-pressed={siteId === s.id}
                        onClick={() => pickSite(s.id)}
                        className={cn('h-full w-full rounded-xl border-2 p-3 text-left', siteId === s.id ? 'border-heather-700 bg-heather-50' : 'border-oat-300 bg-white hover:bg-oat-50')}
                      >
                        <span className="flex items-center gap-2 font-bold"><MapPin className="size-5 text-moss-700" aria-hidden />{s.name}</span>
                        <span className="block text-sm">{s.address}</span>
                        <span className="block text-sm text-ink-soft">{next ? `Next free: ${dayIn(next.start, zone, { weekday: 'short' })} ${timeIn(next.start, zone)}` : 'No free time soon'}</span>
                      </button>
                    </li>
                  );
                })}
              </ul>
              {siteId !== null && siteList.find((s) => s.id === siteId)?.notes && (
                <p className="rounded-xl bg-oat-100 p-3"><strong>At {siteName(siteId)}:</strong> {siteList.find((s) => s.id === siteId)!.notes}</p>
              )}
              {siteId !== null && day !== null && (
                <SlotPicker
                  siteId={siteId}
                  day={day}
                  minDay={today}
                  onDay={(d) => { setDay(d); setChoice(null); }}
                  chosen={choice?.siteId === siteId ? choice.slot.start : null}
                  onChoose={(slot) => setChoice({ siteId, slot })}
                />
              )}
            </div>

            {error && <Alert kind="error" title="That did not work">{error.message}</Alert>}
            <div className="flex flex-wrap items-center gap-3 border-t border-oat-200 pt-4">
              <Button size="lg" disabled={!choice || (!moving && chosenBlankets.length === 0)} busy={busy} onClick={submit}>
                <CalendarCheck2 className="size-5" aria-hidden />
                {choice ? `${moving ? 'Move to' : 'Book'} ${dayIn(choice.slot.start, zone, { weekday: 'short' })} ${timeIn(choice.slot.start, zone)} at ${siteName(choice.siteId)}` : 'Choose a time'}
              </Button>
              {!moving && chosenBlankets.length > 0 && <Badge tone="heather">{chosenBlankets.length} {chosenBlankets.length === 1 ? 'blanket' : 'blankets'}</Badge>}
            </div>
          </Card>
        )}
      </section>
    </div>
  );
}

function ReminderToggle() {
  const reminders = useReminders();
  const set = useSetReminders();
  if (!reminders.data) return null;
  // The box shows the choice at once; it falls back to the saved answer if saving fails.
  const on = set.isPending && set.variables !== undefined ? set.variables : reminders.data.bookingReminders;
  return (
    <div className="flex flex-wrap items-start gap-3 rounded-xl bg-oat-100 p-3">
      {on ? <BellRing className="mt-1.5 size-5 shrink-0 text-heather-700" aria-hidden /> : <BellOff className="mt-1.5 size-5 shrink-0 text-ink-soft" aria-hidden />}
      <Checkbox
        label="E-mail me a reminder the day before each drop-off"
        checked={on}
        disabled={set.isPending}
        onChange={(e) => set.mutate(e.target.checked)}
      />
      {set.error && <p role="alert" className="w-full font-bold text-brick-700">Your reminder choice was not saved: {set.error.message}</p>}
    </div>
  );
}

/** The maker's opt-in to hear where their blankets went: the recipient's name, once they are delivered. */
function ThankYouToggle() {
  const pref = useThankYouMail();
  const set = useSetThankYouMail();
  if (!pref.data) return null;
  const on = pref.data.thankYouMail;
  return (
    <div className="flex items-start gap-3 rounded-xl bg-oat-100 p-3">
      {on ? <HeartHandshake className="mt-1.5 size-5 shrink-0 text-heather-700" aria-hidden /> : <MailX className="mt-1.5 size-5 shrink-0 text-ink-soft" aria-hidden />}
      <Checkbox
        label="E-mail me a thank-you saying where my blankets went once they are delivered"
        checked={on}
        disabled={set.isPending}
        onChange={(e) => set.mutate(e.target.checked)}
      />
    </div>
  );
}
