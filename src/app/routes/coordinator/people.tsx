import { useState } from 'react';
import { Users } from 'lucide-react';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { Alert } from '@/components/ui/alert';
import { usePeople } from '@/features/people/api/get-people';
import { useUpdatePerson } from '@/features/people/api/update-person';
import { useMe } from '@/features/auth/api/get-me';
import { ROLES } from '@shared/schemas/user-values';
import type { Role } from '@shared/schemas/user';

const roleWords: Record<Role, string> = { volunteer: 'Maker', organiser: 'Organiser', coordinator: 'Coordinator' };

type Person = NonNullable<ReturnType<typeof usePeople>['data']>[number];

function RoleControl({ p, isMe, onChange, className }: { p: Person; isMe: boolean; onChange: (role: Role) => void; className?: string }) {
  if (isMe) return <Badge tone="heather">{roleWords[p.role]} (you)</Badge>;
  return (
    <Select aria-label={`Role of ${p.name}`} value={p.role} onChange={(e) => onChange(e.target.value as Role)} className={className}>
      {ROLES.map((r) => (
        <option key={r} value={r}>
          {roleWords[r]}
        </option>
      ))}
    </Select>
  );
}

/** Pausing locks a person out, so it asks first; reactivating needs no second thought. */
function AccountControl({ p, isMe, confirming, setConfirming, onActive }: { p: Person; isMe: boolean; confirming: boolean; setConfirming: (v: boolean) => void; onActive: (active: boolean) => void }) {
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-2">
        {p.active ? <Badge tone="moss">Active</Badge> : <Badge tone="brick">Paused</Badge>}
        {!isMe && !confirming && (
          <Button size="sm" variant="quiet" onClick={() => (p.active ? setConfirming(true) : onActive(true))}>
            {p.active ? 'Pause' : 'Reactivate'}
            <span className="sr-only"> {p.name}</span>
          </Button>
        )}
      </div>
      {confirming && (
        <div role="group" aria-label={`Pause ${p.name}?`} className="space-y-2 rounded-xl border-2 border-marigold-300 bg-marigold-100 p-3" data-testid="pause-confirm">
          <p>
            Pause <strong>{p.name}</strong>? They are signed out and cannot sign in until you reactivate the account. Nothing they logged is lost.
          </p>
          <div className="flex flex-wrap gap-2">
            <Button
              size="sm"
              variant="danger"
              onClick={() => {
                onActive(false);
                setConfirming(false);
              }}
            >
              Pause the account
            </Button>
            <Button size="sm" variant="secondary" onClick={() => setConfirming(false)} autoFocus>
              Keep it active
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}

export default function PeoplePage() {
  const { data, isPending, error } = usePeople();
  const update = useUpdatePerson();
  const { data: me } = useMe();
  const [confirming, setConfirming] = useState<number | null>(null);
  const controls = (p: Person) => ({
    isMe: p.id === me?.id,
    role: (role: Role) => update.mutate({ id: p.id, role }),
    account: {
      confirming: confirming === p.id,
      setConfirming: (v: boolean) => setConfirming(v ? p.id : null),
      onActive: (active: boolean) => update.mutate({ id: p.id, active }),
    },
  });
  return (
    <div>
      <PageHeader title="People" lead="Everyone with an account. Give organisers and coordinators their roles here, or pause an account." />
      {update.error && <Alert kind="error" className="mb-4">{update.error.message}</Alert>}
      {isPending ? (
        <Loading />
      ) : error ? (
        <QueryError error={error} />
      ) : data.length === 0 ? (
        <EmptyState icon={Users} title="Nobody here yet" />
      ) : (
        <>
          {/* On a phone each person is a card: a four-column table would cut names and role names. */}
          <ul className="space-y-3 md:hidden" aria-label="People and their roles">
            {data.map((p) => {
              const c = controls(p);
              return (
                <li key={p.id}>
                  <Card className="space-y-3">
                    <div>
                      <p className="text-lg font-bold break-words">{p.name}</p>
                      <p className="break-all text-ink-soft">{p.email}</p>
                    </div>
                    <RoleControl p={p} isMe={c.isMe} onChange={c.role} className="w-full" />
                    <AccountControl p={p} isMe={c.isMe} {...c.account} />
                  </Card>
                </li>
              );
            })}
          </ul>
          <Card className="hidden overflow-x-auto p-0 sm:p-0 md:block">
            <table className="w-full text-left">
              <caption className="sr-only">People and their roles</caption>
              <thead className="bg-oat-100">
                <tr>
                  <th className="px-4 py-3">Name</th>
                  <th className="px-4 py-3">E-mail</th>
                  <th className="px-4 py-3">Role</th>
                  <th className="px-4 py-3">Account</th>
                </tr>
              </thead>
              <tbody>
                {data.map((p) => {
                  const c = controls(p);
                  return (
                    <tr key={p.id} className="border-t border-oat-200 align-top">
                      <td className="px-4 py-3 font-bold">{p.name}</td>
                      <td className="px-4 py-3 break-all">{p.email}</td>
                      <td className="px-4 py-3">
                        <RoleControl p={p} isMe={c.isMe} onChange={c.role} className="w-44" />
                      </td>
                      <td className="px-4 py-3">
                        <AccountControl p={p} isMe={c.isMe} {...c.account} />
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </Card>
        </>
      )}
    </div>
  );
}
