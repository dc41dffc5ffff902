'use client';

import { useMemo } from 'react';
import type { Guard, HazardTerminal, StressConditions } from '@/lib/stress/types';
import { remedyOptions } from '@/lib/report/remedies';
import { WhatIf, type WhatIfCase } from './what-if';

/** The sizing remedies for the channel's failing cases, each with its "what if". */
export function RemedyPanel({
  guard,
  cases,
  conditions,
}: {
  guard: Guard;
  cases: WhatIfCase[];
  conditions: Record<HazardTerminal, StressConditions>;
}) {
  const remedies = useMemo(() => remedyOptions(guard, cases, conditions), [guard, cases, conditions]);
  return <WhatIf guard={guard} cases={cases} conditions={conditions} remedies={remedies} />;
}
