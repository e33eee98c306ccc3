import { useId, type ReactNode } from 'react';
import { cn } from '@/components/ui/cn';

export interface Choice<T extends string> {
  value: T;
  label: ReactNode;
  hint?: ReactNode;
}

/** A labelled set of radio buttons drawn as large tappable tiles. */
export function ChoiceGroup<T extends string>({
  legend,
  hint,
  value,
  choices,
  onChange,
  columns = 1,
  name,
}: {
  legend: ReactNode;
  hint?: ReactNode;
  value: T;
  choices: readonly Choice<T>[];
  onChange: (value: T) => void;
  columns?: 1 | 2;
  name?: string;
}) {
  const auto = useId();
  const group = name ?? auto;
  return (
    <fieldset className="space-y-2">
      <legend className="font-bold">{legend}</legend>
      {hint && <p className="text-sm text-ink-soft">{hint}</p>}
      <div className={cn('grid gap-2', columns === 2 && 'sm:grid-cols-2')}>
        {choices.map((c) => (
          <label
            key={c.value}
            className={cn(
              'flex min-h-11 cursor-pointer items-start gap-3 rounded-xl border-2 px-3 py-2',
              value === c.value ? 'border-heather-700 bg-heather-50' : 'border-oat-300 bg-white hover:bg-oat-50',
            )}
          >
            <input type="radio" name={group} value={c.value} checked={value === c.value} onChange={() => onChange(c.value)} className="mt-1 size-5 shrink-0 accent-heather-700" />
            <span>
              <span className="block font-bold">{c.label}</span>
              {c.hint && <span className="block text-sm text-ink-soft">{c.hint}</span>}
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
