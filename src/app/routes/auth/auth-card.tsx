import type { ReactNode } from 'react';
import { Card } from '@/components/ui/card';
import { useDocumentTitle } from '@/components/ui/document-title';

export function AuthCard({ title, lead, children }: { title: string; lead?: ReactNode; children: ReactNode }) {
  useDocumentTitle(title);
  return (
    <div className="mx-auto max-w-lg">
      <Card>
        <h1 className="text-3xl font-bold">{title}</h1>
        {lead && <p className="mt-2 text-ink-soft">{lead}</p>}
        <div className="mt-6">{children}</div>
      </Card>
    </div>
  );
}
