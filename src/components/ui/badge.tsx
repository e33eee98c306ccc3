import type { ReactNode } from 'react';
import { cn } from './cn';

export type Tone = 'neutral' | 'heather' | 'moss' | 'marigold' | 'brick' | 'sky';
const tones: Record<Tone, string> = {
  neutral: 'bg-oat-100 text-ink border-oat-300',
  heather: 'bg-heather-50 text-heather-800 border-heather-300',
  moss: 'bg-moss-100 text-moss-700 border-moss-500/40',
  marigold: 'bg-marigold-100 text-marigold-700 border-marigold-300',
  brick: 'bg-brick-100 text-brick-700 border-brick-500/40',
  sky: 'bg-sky-100 text-sky-700 border-sky-700/30',
};

export function Badge({ tone = 'neutral', children, className, ...data }: { tone?: Tone; children: ReactNode; className?: string; [key: `data-${string}`]: string }) {
  return (
    <span {...data} data-tone={tone} className={cn('inline-flex items-center gap-1 rounded-full border px-2.5 py-0.5 text-sm font-bold', tones[tone], className)}>
      {children}
    </span>
  );
}
