import { useState } from 'react';
import { Inbox, Paperclip } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { useCaughtMail } from '@/features/mail/api/get-caught-mail';
import { cn } from '@/components/ui/cn';

const timeFmt = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** Turns bare links in plain-text mail into links, and nothing else into markup. */
function Linkified({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/\S+)/g);
  return (
    <pre className="whitespace-pre-wrap font-sans">
      {parts.map((p, i) => (/^https?:\/\//.test(p) ? <a key={i} href={p}>{p}</a> : <span key={i}>{p}</span>))}
    </pre>
  );
}

export default function MailPage() {
  const { data, isPending, error } = useCaughtMail();
  const [openId, setOpenId] = useState<number | null>(null);
  const open = data?.mail.find((m) => m.id === openId) ?? data?.mail[0];
  return (
    <div>
      <PageHeader
        title="Mail"
        lead="With no mail server set up, Kindloop keeps every message it sends here, so you can see what makers received."
        actions={data && (
          <div className="flex gap-2">
            <Badge tone="moss">{data.outbox.sent} sent</Badge>
            <Badge tone="marigold">{data.outbox.pending} waiting</Badge>
            {data.outbox.failed > 0 && <Badge tone="brick">{data.outbox.failed} failed</Badge>}
          </div>
        )}
      />
      {isPending ? (
        <Loading />
      ) : error ? (
        <QueryError error={error} />
      ) : data.mail.length === 0 ? (
        <EmptyState icon={Inbox} title="No mail yet">
          Messages appear here a few seconds after Kindloop sends them: welcome notes, reset links, fix requests.
        </EmptyState>
      ) : (
        <div className="grid gap-4 md:grid-cols-[2fr_3fr]">
          <Card className="p-2 sm:p-2">
            <ul aria-label="Messages">
              {data.mail.map((m) => (
                <li key={m.id}>
                  <button
                    type="button"
                    onClick={() => setOpenId(m.id)}
                    className={cn('w-full rounded-xl px-3 py-2 text-left hover:bg-oat-100', open?.id === m.id && 'bg-heather-50')}
                  >
                    <span className="block font-bold">{m.subject}</span>
                    <span className="block text-sm text-ink-soft">
                      to {m.to} · {timeFmt.format(new Date(m.receivedAt))}
                    </span>
                  </button>
                </li>
              ))}
            </ul>
          </Card>
          {open && (
            <Card aria-live="polite">
              <h2 className="text-xl font-bold">{open.subject}</h2>
              <p className="mb-4 text-sm text-ink-soft">
                From {open.from} to {open.to}
              </p>
              <Linkified text={open.text} />
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
