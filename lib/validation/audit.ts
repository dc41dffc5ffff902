import { z } from 'zod';
import { EXPOSURE_MECHANISMS, FINDING_KINDS, STRESS_CASE_KINDS, VERDICTS } from '@/models/enums';

/** "a,b,c" → ['a','b','c'], each checked against the allowed values. */
function commaList<T extends string>(allowed: readonly T[], what: string) {
  return z
    .string()
    .optional()
    .transform((s) =>
      s
        ? s
            .split(',')
            .map((p) => p.trim())
            .filter(Boolean)
        : undefined,
    )
    .pipe(
      z
        .array(
          z.enum(allowed as unknown as [T, ...T[]], {
            message: `${what} must be one of: ${allowed.join(', ')}.`,
          }),
        )
        .optional(),
    );
}

const id = (what: string) =>
  z.coerce.number().int().positive(`${what} must be a positive whole number.`);

export const runIdParams = z.object({ runId: id('Audit run id') });

export const findingsQuerySchema = z.object({
  verdict: commaList(VERDICTS, 'verdict'),
  mechanism: commaList([...EXPOSURE_MECHANISMS, 'transient'] as const, 'mechanism'),
  caseKind: commaList(STRESS_CASE_KINDS, 'caseKind'),
  caseId: z
    .string()
    .optional()
    .transform((s) =>
      s
        ? s
            .split(',')
            .map((p) => p.trim())
            .filter(Boolean)
        : undefined,
    ),
  kind: commaList(FINDING_KINDS, 'kind'),
  cabinetId: id('cabinetId').optional(),
  stripId: id('stripId').optional(),
  channelId: id('channelId').optional(),
  sort: z
    .enum(['margin', 'utilisation', 'channel', 'verdict'], {
      message: 'sort must be margin, utilisation, channel or verdict.',
    })
    .optional(),
  dir: z.enum(['asc', 'desc'], { message: 'dir must be asc or desc.' }).optional(),
  page: z.coerce.number().int().min(1, 'page must be 1 or more.').optional(),
  pageSize: z.coerce.number().int().min(1).max(2000, 'pageSize must be at most 2000.').optional(),
});

export type FindingsQuery = z.infer<typeof findingsQuerySchema>;
