import { Link } from 'react-router-dom';
import { Filter } from 'lucide-react';

/** A day from the address (YYYY-MM-DD), or nothing. */
export const dayParam = (v: string | null) => (v && /^\d{4}-\d{2}-\d{2}$/.test(v) ? v : undefined);

/** A positive whole id from the address, or nothing. */
export function idParam(v: string | null): number | undefined {
  const n = Number(v);
  return Number.isInteger(n) && n > 0 ? n : undefined;
}

/** The last day inside a week window whose `to` is the first day after it. */
export const lastDayBefore = (to: string) => new Date(Date.parse(`${to}T00:00:00Z`) - 86_400_000).toISOString().slice(0, 10);

/**
 * What a list opened from the drive at a glance is narrowed to, with the ways back: to the drive at a
 * glance, or to the whole list. Nothing is drawn when no filter applies.
 */
export function ListFilterNote({ noun, parts, allTo }: { noun: string; parts: string[]; allTo: string }) {
  if (parts.length === 0) return null;
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-xl border border-heather-300 bg-heather-50 p-4" data-testid="list-filter">
      <Filter className="size-5 shrink-0 text-heather-700" aria-hidden />
      <p className="flex-1">
        <span className="font-bold">Showing {noun} </span>
        {parts.join(', ')}.
      </p>
      <Link to="/drive" className="font-bold">Back to the drive at a glance</Link>
      <Link to={allTo} className="font-bold">Show all {noun}</Link>
    </div>
  );
}
