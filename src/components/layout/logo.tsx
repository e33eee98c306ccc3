/** Kindloop's mark: a loop of yarn closing on itself. */
export function Logo({ className = 'size-9' }: { className?: string }) {
  return (
    <svg viewBox="0 0 40 40" className={className} aria-hidden>
      <circle cx="20" cy="20" r="18" fill="var(--color-marigold-400)" />
      <path d="M11 24c0-7 6-12 11-12s7 4 7 7-3 6-7 6-6-3-6-6 3-7 9-7" fill="none" stroke="var(--color-heather-800)" strokeWidth="3" strokeLinecap="round" />
      <path d="M12 29c5 2 12 2 17-2" fill="none" stroke="var(--color-moss-700)" strokeWidth="3" strokeLinecap="round" />
    </svg>
  );
}
