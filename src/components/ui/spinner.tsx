export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="flex items-center gap-3 py-8 text-ink-soft" role="status">
      <span className="size-6 animate-spin rounded-full border-4 border-heather-300 border-t-heather-700" aria-hidden />
      {label}
    </div>
  );
}
