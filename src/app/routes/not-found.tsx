import { MapPinOff } from 'lucide-react';
import { EmptyState } from '@/components/ui/empty-state';
import { ButtonLink } from '@/components/ui/button';
import { useDocumentTitle } from '@/components/ui/document-title';

export default function NotFoundPage() {
  useDocumentTitle('Page not found');
  return (
    <EmptyState as="h1" icon={MapPinOff} title="We can't find that page" action={<ButtonLink to="/">Back to the start</ButtonLink>}>
      The link may be old, or the page may have moved. Nothing you made is lost.
    </EmptyState>
  );
}
