import type { ReactNode } from 'react';

/**
 * The standing caution: results support engineering judgement and defer to local codes.
 * Shown on every report screen, channel page and the handover pack.
 */
export function Caution({ children }: { children?: ReactNode }) {
  return (
    <aside
      role="note"
      aria-label="Safety caution"
      className="flex gap-3 rounded-sm border border-caution bg-caution-soft p-3 text-sm text-ink"
    >
      <svg aria-hidden viewBox="0 0 20 20" className="mt-0.5 h-5 w-5 shrink-0 fill-caution">
        <path d="M10 1.5 19 18H1L10 1.5Zm-1 6v5h2v-5H9Zm0 6.5v2h2v-2H9Z" />
      </svg>
      <div>
        {children ?? (
          <>
            Crossfault supports engineering judgement; it does not replace it. Check every result
            against the applicable local electrical codes and standards and have it approved by a
            qualified, licensed person. Live-work and lock-out rules apply on site.
          </>
        )}
      </div>
    </aside>
  );
}
