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
import { ROLES, type Role } from '@shared/schemas/user';

const roleWords: Record<Role, string> = { volunteer: 'Maker', organiser: 'Organiser', coordinator: 'Coordinator' };

export default function PeoplePage() {
  const { data, isPending, error } = usePeople();
  const update = useUpdatePerson();
  const { data: me } = useMe();
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
        <Card className="overflow-x-auto p-0 sm:p-0">
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
              {data.map((p) => (
                <tr key={p.id} className="border-t border-oat-200">
                  <td className="px-4 py-3 font-bold">{p.name}</td>
                  <td className="px-4 py-3">{p.email}</td>
                  <td className="px-4 py-3">
                    {p.id === me?.id ? (
                      <Badge tone="heather">{roleWords[p.role]} (you)</Badge>
                    ) : (
                      <Select aria-label={`Role of ${p.name}`} value={p.role} onChange={(e) => update.mutate({ id: p.id, role: e.target.value as Role })} className="w-44">
                        {ROLES.map((r) => (
                          <option key={r} value={r}>
                            {roleWords[r]}
                          </option>
                        ))}
                      </Select>
                    )}
                  </td>
                  <td className="px-4 py-3">
                    {p.active ? <Badge tone="moss">Active</Badge> : <Badge tone="brick">Paused</Badge>}{' '}
                    {p.id !== me?.id && (
                      <Button size="sm" variant="quiet" onClick={() => update.mutate({ id: p.id, active: !p.active })}>
                        {p.active ? 'Pause' : 'Reactivate'}
                      </Button>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </Card>
      )}
    </div>
  );
}
