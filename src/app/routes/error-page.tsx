import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { useDocumentTitle } from '@/components/ui/document-title';

/** Shown when a page fails to load or render; it keeps its own simple frame in case the shell is what failed. */
export function ErrorPage() {
  const error = useRouteError();
  useDocumentTitle('Something went wrong');
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : 'Unknown error';
  return (
    <div className="mx-auto max-w-xl px-4 py-16">
      <h1 className="text-3xl font-bold">Something went wrong</h1>
      <p className="mt-3 text-lg">This page ran into a problem. Your saved work is safe. Try reloading, or go back to the start.</p>
      <p className="mt-3 rounded-xl bg-oat-100 p-3 text-sm text-ink-soft">{message}</p>
      <p className="mt-6">
        <Link to="/">Back to the start</Link>
      </p>
    </div>
  );
}
