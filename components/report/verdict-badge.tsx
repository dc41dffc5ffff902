import type { Verdict } from '@/lib/stress/types';
import { VERDICT_LABEL } from '@/lib/report/format';
import { cn } from '@/lib/utils';

// Full class names so Tailwind's scanner sees them.
const TEXT: Record<Verdict, string> = {
  holds: 'text-verdict-holds',
  marginal: 'text-verdict-marginal',
  fails: 'text-verdict-fails',
  unprotected: 'text-verdict-unprotected',
  incomplete: 'text-verdict-incomplete',
};
const BORDER: Record<Verdict, string> = {
  holds: 'border-verdict-holds',
  marginal: 'border-verdict-marginal',
  fails: 'border-verdict-fails',
  unprotected: 'border-verdict-unprotected',
  incomplete: 'border-verdict-incomplete',
};

/**
 * Our verdict shapes (never colour alone): holds a filled disc, marginal a half-filled
 * diamond, fails a square with a cross, unprotected an open triangle with a bar, incomplete a
 * dashed ring with a gap.
 */
export function VerdictShape({ verdict, className }: { verdict: Verdict; className?: string }) {
  return (
    <svg
      aria-hidden
      viewBox="0 0 16 16"
      className={cn('h-3.5 w-3.5 shrink-0', TEXT[verdict], className)}
    >
      {verdict === 'holds' && <circle cx={8} cy={8} r={6} fill="currentColor" />}
      {verdict === 'marginal' && (
        <>
          <path
            d="M8 1.5 14.5 8 8 14.5 1.5 8Z"
            fill="none"
            stroke="currentColor"
            strokeWidth={1.6}
          />
          <path d="M8 1.5 14.5 8H1.5Z" fill="currentColor" />
        </>
      )}
      {verdict === 'fails' && (
        <>
          <rect x={2} y={2} width={12} height={12} fill="currentColor" />
          <path d="M5 5l6 6M11 5l-6 6" className="stroke-panel" strokeWidth={1.8} />
        </>
      )}
      {verdict === 'unprotected' && (
        <>
          <path d="M8 1.8 14.6 14H1.4Z" fill="none" stroke="currentColor" strokeWidth={1.8} />
          <path d="M8 6v4.2M8 11.6v1.2" stroke="currentColor" strokeWidth={1.8} />
        </>
      )}
      {verdict === 'incomplete' && (
        <circle
          cx={8}
          cy={8}
          r={5.5}
          fill="none"
          stroke="currentColor"
          strokeWidth={1.8}
          strokeDasharray="3 2.2"
        />
      )}
    </svg>
  );
}

export function VerdictBadge({ verdict, size = 'sm' }: { verdict: Verdict; size?: 'sm' | 'lg' }) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1.5 rounded-sm border bg-panel font-medium whitespace-nowrap',
        BORDER[verdict],
        TEXT[verdict],
        size === 'lg' ? 'px-2.5 py-1 text-base' : 'px-1.5 py-0.5 text-xs',
      )}
      data-verdict={verdict}
    >
      <VerdictShape verdict={verdict} className={size === 'lg' ? 'h-4 w-4' : undefined} />
      {VERDICT_LABEL[verdict]}
    </span>
  );
}
