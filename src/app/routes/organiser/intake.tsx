import { useEffect, useRef, useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { ListChecks, Printer, ScanLine, Search } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardTitle } from '@/components/ui/card';
import { Button, ButtonLink } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { Cautions } from '@/components/ui/cautions';
import { ApiError } from '@/lib/api-client';
import { useBlanketByCode } from '@/features/intake/api/get-blanket-by-code';
import { BlanketSummary } from '@/features/intake/components/blanket-summary';
import { StatusBadge } from '@/components/ui/status-badge';
import { BlanketHistory } from '@/components/ui/blanket-history';
import { ReceivePanel } from '@/features/intake/components/receive-panel';
import { InspectionPanel } from '@/features/intake/components/inspection-panel';
import { CheckResult } from '@/features/intake/components/check-result';
import { normaliseCode } from '@shared/blankets/code';
import { cautionsFor } from '@shared/guidelines/cautions';
import { RECEIVABLE_STATUSES } from '@shared/intake/rules';
import { codeFromScan } from '@shared/blankets/code';
import type { IntakeBlanketView } from '@shared/schemas/intake-views';
import type { Population } from '@shared/schemas/blanket';

const OUTCOME_WORDS: Partial<Record<IntakeBlanketView['status'], string>> = {
  checked: 'It passed the check and is ready to be assigned.',
  needs_fix: 'It went back to its maker for a fix; they have an e-mail saying what to do.',
  declined: 'It was declined.',
};

function Outcome({ blanket }: { blanket: IntakeBlanketView }) {
  if (blanket.status === 'in_progress') {
    return <Alert kind="warning" title="Not finished yet">The maker hasn't marked this blanket as finished. Ask them to, or check the code.</Alert>;
  }
  const words = OUTCOME_WORDS[blanket.status];
  const last = [...blanket.history].reverse().find((e) => e.kind === 'inspection');
  return (
    <Alert kind={blanket.status === 'checked' ? 'success' : 'info'} title="Inspected">
      {words ?? 'It is past intake.'}
      {blanket.recipient && ` Going to ${blanket.recipient.name}.`}
      {last?.reason && <span className="block text-sm">Reason given: {last.reason}</span>}
    </Alert>
  );
}

export default function IntakePage() {
  const [params, setParams] = useSearchParams();
  const code = params.get('code') ? (normaliseCode(codeFromScan(params.get('code')!)) ?? '') : '';
  const [typed, setTyped] = useState(params.get('code') ?? '');
  const [typedError, setTypedError] = useState<string | undefined>();
  const input = useRef<HTMLInputElement>(null);
  const found = useBlanketByCode(code);

  useEffect(() => {
    if (!code) input.current?.focus();
  }, [code]);

  const find = (e: FormEvent) => {
    e.preventDefault();
    const c = normaliseCode(codeFromScan(typed));
    if (!c) return setTypedError('Type the code printed on the tag, e.g. KL-7Q4M, or scan its QR code');
    setTypedError(undefined);
    setTyped(c);
    setParams({ code: c });
  };

  const b = found.data?.blanket;
  const population = b?.recipient?.population as Population | undefined;

  return (
    <div>
      <PageHeader
        title="Intake"
        lead="Find a blanket by the code on its tag, receive it at your drop-off site, and check it against where it's going."
        actions={
          <ButtonLink to="/organiser/queue" variant="secondary">
            <ListChecks className="size-5" aria-hidden /> Today's queue
          </ButtonLink>
        }
      />
      <Card className="mb-6">
        <form onSubmit={find} noValidate className="flex flex-wrap items-end gap-3">
          <Field label="Blanket code" hint="Type it, or scan the tag's QR code with a handheld scanner into this box." error={typedError} className="min-w-64 flex-1">
            {(a) => (
              <Input
                ref={input}
                id={a.id}
                aria-describedby={a.describedBy}
                aria-invalid={a.invalid}
                autoComplete="off"
                spellCheck={false}
                className="font-mono text-xl uppercase tracking-widest"
                placeholder="KL-7Q4M"
                value={typed}
                onChange={(e) => setTyped(e.target.value)}
              />
            )}
          </Field>
          <Button type="submit" size="lg">
            <Search className="size-5" aria-hidden /> Find
          </Button>
        </form>
        <p className="mt-2 flex items-center gap-2 text-sm text-ink-soft">
          <ScanLine className="size-4" aria-hidden /> A phone camera that opens the tag's link lands here with the code filled in.
        </p>
      </Card>

      {code === '' ? null : found.isPending ? (
        <Loading label="Finding the blanket…" />
      ) : found.error ? (
        found.error instanceof ApiError && found.error.status === 404 ? (
          <Alert kind="warning" title={`No blanket ${code}`}>
            Check the code on the tag. Codes use the letters and digits 2–9 and A–Z without O or I.
          </Alert>
        ) : (
          <QueryError error={found.error} />
        )
      ) : b ? (
        <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
          <div className="space-y-6">
            <Card>
              <div className="mb-3 flex flex-wrap items-center gap-3">
                <h2 className="font-mono text-3xl font-bold tracking-widest" data-testid="blanket-code">
                  {b.code}
                </h2>
                <StatusBadge status={b.status} />
                <ButtonLink to={`/tags?ids=${b.id}`} size="sm" variant="quiet" className="ml-auto">
                  <Printer className="size-4" aria-hidden /> Print its tag
                </ButtonLink>
              </div>
              <p className="mb-3">
                Made by <strong>{b.maker.name}</strong> (on labels: {b.maker.label})
                {b.recipient ? (
                  <>
                    {' '}
                    for <strong>{b.recipient.name}</strong>
                  </>
                ) : (
                  ', pledged for wherever it is needed most'
                )}
                {b.site && <> · at {b.site.name}</>}
              </p>
              {population ? <Cautions cautions={cautionsFor(population)} compact /> : <Cautions cautions={cautionsFor('adult')} compact />}
            </Card>
            <Card>
              {(RECEIVABLE_STATUSES as readonly string[]).includes(b.status) ? (
                <>
                  <CardTitle>Receive it</CardTitle>
                  <ReceivePanel key={`${b.id}:${b.version}`} blanket={b} />
                </>
              ) : b.status === 'received' ? (
                <>
                  <CardTitle>Inspect it</CardTitle>
                  <InspectionPanel key={`${b.id}:${b.version}`} blanket={b} />
                </>
              ) : (
                <div className="space-y-4">
                  <Outcome blanket={b} />
                  {found.data.check && <CheckResult check={found.data.check} />}
                  <Button variant="secondary" onClick={() => { setParams({}); setTyped(''); }}>
                    Next blanket
                  </Button>
                </div>
              )}
            </Card>
          </div>
          <div className="space-y-6">
            <Card>
              <CardTitle>What the maker logged</CardTitle>
              <BlanketSummary blanket={b} />
            </Card>
            <Card>
              <CardTitle>History</CardTitle>
              <BlanketHistory events={b.history} />
            </Card>
            <p className="text-sm">
              <Link to="/organiser/queue">Back to the queue</Link>
            </p>
          </div>
        </div>
      ) : null}
    </div>
  );
}
