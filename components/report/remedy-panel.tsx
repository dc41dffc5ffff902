'use client';

import { useQuery } from '@tanstack/react-query';
import type { RemedyOptionData } from '@/lib/report/remedies';
import type { Guard, HazardTerminal, StressConditions } from '@/lib/stress/types';
import { WhatIf, type WhatIfCase } from './what-if';

/**
 * The sizing remedies and the "what if". The sizing re-solves every case for each candidate,
 * which can take seconds, so it is fetched after the page has rendered; the "what if" with a
 * figure of one's own works meanwhile.
 */
export function RemedyPanel({
  projectId,
  channelId,
  guard,
  cases,
  conditions,
  needed,
}: {
  projectId: number;
  channelId: number;
  guard: Guard;
  cases: WhatIfCase[];
  conditions: Record<HazardTerminal, StressConditions>;
  /** false when every case holds: nothing to size. */
  needed: boolean;
}) {
  const remedies = useQuery({
    queryKey: ['channel-remedies', projectId, channelId],
    enabled: needed,
    staleTime: Infinity,
    queryFn: async (): Promise<RemedyOptionData[]> => {
      const res = await fetch(`/projects/${projectId}/audit/channels/${channelId}/remedies`);
      const body = (await res.json().catch(() => null)) as {
        items?: RemedyOptionData[];
        error?: string;
      } | null;
      if (!res.ok || !body?.items)
        throw new Error(body?.error ?? `The server answered ${res.status}.`);
      return body.items;
    },
  });

  const status = !needed ? (
    <p className="text-sm text-muted">Every case holds: no change is needed.</p>
  ) : remedies.isPending ? (
    <p className="text-sm text-muted" role="status" aria-live="polite">
      Working out the smallest changes that would hold (each candidate is re-solved against every
      case)…
    </p>
  ) : remedies.isError ? (
    <p role="alert" className="text-sm text-danger">
      The sizing could not be worked out: {remedies.error.message}
    </p>
  ) : null;

  return (
    <WhatIf
      guard={guard}
      cases={cases}
      conditions={conditions}
      remedies={remedies.data ?? []}
      status={status}
    />
  );
}
