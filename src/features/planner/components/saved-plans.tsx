import { lazy, Suspense } from 'react';
import { LogIn } from 'lucide-react';
import { Card, CardTitle } from '@/components/ui/card';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import type { PlanInput, PlanInputDraft } from '@shared/schemas/plan';

/** Below the plan, out of sight when the page opens: it loads after the page has painted. */
const SignedInPlans = lazy(() => import('./signed-in-plans').then((m) => ({ default: m.SignedInPlans })));

interface Props {
  signedIn: boolean;
  input: PlanInputDraft | null;
  suggestedName: string;
  onLoad: (input: PlanInput, name: string) => void;
}

export function SavedPlans({ signedIn, input, suggestedName, onLoad }: Props) {
  if (!signedIn) {
    return (
      <Card className="no-print">
        <CardTitle>Save this plan</CardTitle>
        <p className="mb-4">Sign in to save this plan, find it again later and attach it to the blanket when you log it.</p>
        <ButtonLink to="/sign-in?next=%2Fplanner" variant="secondary">
          <LogIn className="size-5" aria-hidden /> Sign in to save
        </ButtonLink>
      </Card>
    );
  }
  return (
    <Suspense
      fallback={
        <Card className="no-print">
          <CardTitle>Save this plan</CardTitle>
          <Loading />
        </Card>
      }
    >
      <SignedInPlans input={input} suggestedName={suggestedName} onLoad={onLoad} />
    </Suspense>
  );
}
