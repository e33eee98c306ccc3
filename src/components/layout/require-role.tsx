import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { Lock } from 'lucide-react';
import { useMe } from '@/features/auth/api/get-me';
import type { Role } from '@shared/schemas/user';
import { Loading } from '../ui/spinner';
import { EmptyState } from '../ui/empty-state';

/** Pages behind sign-in: send strangers to sign in (and back), and tell a signed-in person when a page isn't for their role. */
export function RequireRole({ roles, children }: { roles?: Role[]; children: ReactNode }) {
  const { data: user, isPending } = useMe();
  const location = useLocation();
  if (isPending) return <Loading />;
  if (!user) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  if (roles && !roles.includes(user.role)) {
    return (
      <EmptyState as="h1" icon={Lock} title="This page is for another role">
        Your account can't open this page. If you think it should, ask the drive's coordinator.
      </EmptyState>
    );
  }
  return <>{children}</>;
}
