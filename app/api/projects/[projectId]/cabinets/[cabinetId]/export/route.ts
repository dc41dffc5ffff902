import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { exportRows } from '@/lib/data/schedule/import';
import { toExportRows, writeCsv, writeXlsx } from '@/lib/schedule-io';
import { idParam } from '@/lib/validation/cabinet';

const params = z.object({ cabinetId: idParam('cabinetId') });
const query = z.object({
  format: z.enum(['csv', 'xlsx'], { error: 'format must be csv or xlsx.' }).default('csv'),
});

/** The cabinet's schedule as a download, in the import's columns. */
export const GET = projectRoute(
  { capability: 'schedule:read', params, query },
  async ({ actor, params, query }) => {
    const { cabinet, items } = await exportRows(actor.projectId, params.cabinetId);
    const rows = toExportRows(items);
    const base = `schedule-${cabinet.tag.replace(/[^A-Za-z0-9._-]+/g, '') || cabinet.id}`;
    if (query.format === 'xlsx') {
      const bytes = await writeXlsx(rows, cabinet.tag);
      return new Response(new Blob([bytes as BlobPart]), {
        headers: {
          'content-type': 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
          'content-disposition': `attachment; filename="${base}.xlsx"`,
        },
      });
    }
    return new Response(writeCsv(rows), {
      headers: {
        'content-type': 'text/csv; charset=utf-8',
        'content-disposition': `attachment; filename="${base}.csv"`,
      },
    });
  },
);
