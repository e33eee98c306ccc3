import { Alert } from './alert';

export function QueryError({ error, title = 'We could not load this' }: { error: unknown; title?: string }) {
  const message = error instanceof Error ? error.message : 'Please try again in a moment.';
  return (
    <Alert kind="error" title={title}>
      {message}
    </Alert>
  );
}
