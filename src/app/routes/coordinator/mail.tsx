import { useState } from 'react';
import { Ban, CheckCircle2, ChevronLeft, ChevronRight, Inbox, Lock, Paperclip, RotateCw } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardTitle } from '@/components/ui/card';
import { Badge, type Tone } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { useCaughtMail } from '@/features/mail/api/get-caught-mail';
import { useOutbox } from '@/features/mail/api/get-outbox';
import { useGiveUp, useSendAgain } from '@/features/mail/api/outbox-actions';
import { cn } from '@/components/ui/cn';
import { pageCount } from '@shared/schemas/page';
import type { MailStatus, OutboxItem, OutboxShow } from '@shared/schemas/mail';
import { useDriveClock } from '@/lib/drive-clock';
import { ZoneNote } from '@/components/ui/zone-note';

/** Formats moments on the drive's clock (its zone, named once on the page). */
function useWhen() {
  const zone = useDriveClock().data?.timeZone;
  return (iso: string) => new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: zone }).format(new Date(iso));
}

/**
 * Plain-text mail as text. Only links back to Kindloop itself become clickable: anything else in a
 * message may have been typed by a person (an organiser's note, a maker's name), so it stays text.
 */
function MailText({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/\S+)/g);
  const own = (p: string) => {
    try {
      return new URL(p).origin === window.location.origin;
    } catch {
      return false;
    }
  };
  return (
    <pre className="font-sans break-words whitespace-pre-wrap">
      {parts.map((p, i) => (/^https?:\/\//.test(p) && own(p) ? <a key={i} href={p}>{p}</a> : <span key={i}>{p}</span>))}
    </pre>
  );
}

function Pager({ page, pages, onPage, label }: { page: number; pages: number; onPage: (p: number) => void; label: string }) {
  if (pages <= 1) return null;
  return (
    <nav aria-label={label} className="mt-3 flex items-center justify-between gap-2">
      <Button variant="quiet" size="sm" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        <ChevronLeft className="size-4" aria-hidden /> Newer
      </Button>
      <span className="text-sm text-ink-soft">
        Page {page} of {pages}
      </span>
      <Button variant="quiet" size="sm" disabled={page >= pages} onClick={() => onPage(page + 1)}>
        Older <ChevronRight className="size-4" aria-hidden />
      </Button>
    </nav>
  );
}

const statusWords: Record<MailStatus, { tone: Tone; text: string }> = {
  pending: { tone: 'marigold', text: 'Waiting' },
  failed: { tone: 'brick', text: 'Not sent' },
  'given-up': { tone: 'neutral', text: 'Given up' },
  sent: { tone: 'moss', text: 'Sent' },
};

function OutboxRow({ m }: { m: OutboxItem }) {
  const when = useWhen();
  const again = useSendAgain();
  const stop = useGiveUp();
  const status = statusWords[m.status];
  const error = again.error ?? stop.error;
  return (
    <li className="flex flex-col gap-2 py-3 sm:flex-row sm:items-start sm:justify-between">
      <div className="min-w-0">
        <p className="font-bold break-words">{m.subject}</p>
        <p className="text-sm break-words text-ink-soft">
          to {m.to} · written {when(m.createdAt)}
        </p>
        <p className="mt-1 flex flex-wrap items-center gap-2 text-sm">
          <Badge tone={status.tone}>{status.text}</Badge>
          <span>
            {m.attempts === 0 ? 'Not tried yet' : `Tried ${m.attempts} ${m.attempts === 1 ? 'time' : 'times'}`}
            {m.status === 'pending' && ` · next try ${when(m.nextAttemptAt)} · keeps trying until ${when(m.retryUntil)}`}
            {m.status === 'given-up' && m.givenUpAt && ` · given up ${when(m.givenUpAt)}`}
          </span>
        </p>
        {m.lastError && <p className="mt-1 text-sm break-words text-ink-soft">Mail server said: {m.lastError}</p>}
        {error && <p className="mt-1 text-sm text-brick-700" role="alert">{error.message}</p>}
      </div>
      <div className="flex shrink-0 flex-wrap gap-2">
        <Button size="sm" variant="secondary" busy={again.isPending} onClick={() => again.mutate(m.id)}>
          <RotateCw className="size-4" aria-hidden /> {m.status === 'pending' ? 'Send now' : 'Send again'}
          <span className="sr-only"> to {m.to}</span>
        </Button>
        {m.status !== 'given-up' && (
          <Button size="sm" variant="quiet" busy={stop.isPending} onClick={() => stop.mutate(m.id)}>
            <Ban className="size-4" aria-hidden /> Give up
            <span className="sr-only"> on the message to {m.to}</span>
          </Button>
        )}
      </div>
    </li>
  );
}

function Outbox() {
  const [show, setShow] = useState<OutboxShow>('unsent');
  const [page, setPage] = useState(1);
  const { data, isPending, error } = useOutbox(show, page);
  const choose = (s: OutboxShow) => {
    setShow(s);
    setPage(1);
  };
  return (
    <Card className="mb-6">
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <CardTitle>Not sent yet</CardTitle>
        <div role="group" aria-label="Which messages" className="flex gap-1">
          {(
            [
              ['unsent', 'Waiting or not sent'],
              ['given-up', 'Given up'],
            ] as const
          ).map(([value, label]) => (
            <Button key={value} size="sm" variant={show === value ? 'primary' : 'quiet'} aria-pressed={show === value} onClick={() => choose(value)}>
              {label}
            </Button>
          ))}
        </div>
      </div>
      <p className="mb-2 text-ink-soft">
        When the mail server can't be reached, Kindloop tries each message again, at most an hour apart, for seven days. A
        message the server refused, or one still unsent after a week, waits here for you to send it again.
      </p>
      {isPending ? (
        <Loading />
      ) : error ? (
        <QueryError error={error} />
      ) : data.messages.items.length === 0 ? (
        <p className="flex items-center gap-2 py-2 text-moss-700">
          <CheckCircle2 className="size-5" aria-hidden />
          {show === 'unsent' ? 'Everything has been sent.' : 'No message has been given up.'}
        </p>
      ) : (
        <>
          <ul className="divide-y divide-oat-200" aria-label={show === 'unsent' ? 'Messages not sent yet' : 'Messages given up'}>
            {data.messages.items.map((m) => (
              <OutboxRow key={m.id} m={m} />
            ))}
          </ul>
          <Pager page={page} pages={pageCount(data.messages)} onPage={setPage} label="Pages of unsent mail" />
        </>
      )}
    </Card>
  );
}

export default function MailPage() {
  const [page, setPage] = useState(1);
  const { data, isPending, error } = useCaughtMail(page);
  const [openId, setOpenId] = useState<number | null>(null);
  const items = data?.mail.items ?? [];
  const open = items.find((m) => m.id === openId) ?? items[0];
  const when = useWhen();
  const zone = useDriveClock().data?.timeZone;
  return (
    <div>
      <PageHeader
        title="Mail"
        lead="What Kindloop has sent and what is still waiting. With no mail server set up, every message it sends is kept here, so you can see what makers received."
        actions={data && (
          <div className="flex flex-wrap gap-2">
            <Badge tone="moss">{data.outbox.sent} sent</Badge>
            <Badge tone="marigold">{data.outbox.pending} waiting</Badge>
            {data.outbox.failed > 0 && <Badge tone="brick">{data.outbox.failed} not sent</Badge>}
            {data.outbox.givenUp > 0 && <Badge tone="neutral">{data.outbox.givenUp} given up</Badge>}
          </div>
        )}
      />
      <ZoneNote zone={zone} className="mb-4" />
      <Outbox />
      <h2 className="mb-2 text-2xl font-bold">Kept here</h2>
      <Alert kind="info" className="mb-4" title="Reset links are for their owner only">
        A link that works once, such as a password reset, is hidden unless the message was sent to you: anyone holding it
        could sign in as that person. Links to other sites are shown as plain text, since someone may have typed them.
      </Alert>
      {isPending ? (
        <Loading />
      ) : error ? (
        <QueryError error={error} />
      ) : items.length === 0 ? (
        <EmptyState icon={Inbox} title="No mail yet">
          Messages appear here a few seconds after Kindloop sends them: welcome notes, reset links, fix requests.
        </EmptyState>
      ) : (
        <div className="grid gap-4 md:grid-cols-[2fr_3fr]">
          <Card className="min-w-0 p-2 sm:p-2">
            <ul aria-label="Messages">
              {items.map((m) => (
                <li key={m.id}>
                  <button
                    type="button"
                    onClick={() => setOpenId(m.id)}
                    aria-current={open?.id === m.id || undefined}
                    className={cn('w-full rounded-xl px-3 py-2 text-left hover:bg-oat-100', open?.id === m.id && 'bg-heather-50')}
                  >
                    <span className="block font-bold break-words">{m.subject}</span>
                    <span className="block text-sm break-words text-ink-soft">
                      to {m.to} · {when(m.receivedAt)}
                    </span>
                  </button>
                </li>
              ))}
            </ul>
            <Pager page={page} pages={pageCount(data.mail)} onPage={setPage} label="Pages of kept mail" />
          </Card>
          {open && (
            <Card aria-live="polite" className="min-w-0">
              <h3 className="text-xl font-bold break-words">{open.subject}</h3>
              <p className="mb-4 text-sm break-words text-ink-soft">
                From {open.from} to {open.to}
              </p>
              {open.linksHidden > 0 && (
                <p className="mb-3 flex items-center gap-2 rounded-xl bg-oat-100 px-3 py-2 text-sm">
                  <Lock className="size-4 shrink-0" aria-hidden />
                  {open.linksHidden === 1 ? 'Its single-use link is hidden' : `${open.linksHidden} single-use links are hidden`}: only {open.to} can
                  use it.
                </p>
              )}
              <MailText text={open.text} />
              {open.attachments && open.attachments.length > 0 && (
                <ul aria-label="Attachments" className="mt-4 flex flex-wrap gap-2 border-t border-oat-200 pt-4">
                  {open.attachments.map((a, i) => (
                    <li key={i}>
                      <a
                        className="inline-flex items-center gap-2 rounded-xl border border-oat-300 px-3 py-2"
                        download={a.filename}
                        href={`data:${a.contentType};charset=utf-8,${encodeURIComponent(a.content)}`}
                      >
                        <Paperclip aria-hidden className="size-4" />
                        {a.filename}
                      </a>
                    </li>
                  ))}
                </ul>
              )}
            </Card>
          )}
        </div>
      )}
    </div>
  );
}
