import type { HTMLAttributes, ReactNode } from 'react';
import { cn } from './cn';

export function Card({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return <div className={cn('rounded-2xl border border-oat-200 bg-white p-5 shadow-sm sm:p-6', className)} {...rest} />;
}

export function CardTitle({ children, className, as: As = 'h2' }: { children: ReactNode; className?: string; as?: 'h2' | 'h3' }) {
  return <As className={cn('mb-3 text-xl font-bold text-ink', className)}>{children}</As>;
}
