import type { InputHTMLAttributes } from 'react';
import { cn } from '@/lib/utils';

export function Input({ className, ...props }: InputHTMLAttributes<HTMLInputElement>) {
  return (
    <input
      className={cn(
        'h-10 w-full rounded-sm border border-line bg-panel px-3 text-sm text-ink placeholder:text-muted aria-invalid:border-danger',
        className,
      )}
      {...props}
    />
  );
}
