import { NextResponse } from 'next/server';
import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { commitImport, ImportRejectedError, previewImport } from '@/lib/data/schedule/import';
import { ValidationError } from '@/lib/errors';
import { MAX_IMPORT_BYTES, parseMappingField } from '@/lib/schedule-io';
import { idParam } from '@/lib/validation/cabinet';

const params = z.object({ cabinetId: idParam('cabinetId') });

// Room for the multipart envelope and the mapping field around a file at the limit.
const MAX_REQUEST_BYTES = MAX_IMPORT_BYTES + 256 * 1024;

function refuse(field: string, message: string): never {
  throw new ValidationError(message, { [field]: [message] });
}

/**
 * multipart/form-data: file (.csv or .xlsx, ≤ 5 MB), mapping (JSON, optional), mode =
 * preview (default) | commit. A commit with any row error answers 422 with the preview.
 */
export const POST = projectRoute(
  { capability: 'schedule:write', params },
  async ({ actor, params, request }) => {
    const declared = Number(request.headers.get('content-length') ?? '0');
    if (declared > MAX_REQUEST_BYTES)
      refuse('file', 'The upload is larger than the 5 MB import limit.');
    let form: FormData;
    try {
      form = await request.formData();
    } catch {
      refuse('file', 'Send the file as multipart/form-data with a "file" field.');
    }
    const file = form.get('file');
    if (!(file instanceof File))
      refuse('file', 'Choose a .csv or .xlsx file to import (form field "file").');
    const modeValue = form.get('mode') ?? 'preview';
    if (modeValue !== 'preview' && modeValue !== 'commit')
      refuse('mode', 'mode must be preview or commit.');
    const mappingValue = form.get('mapping');
    const { mapping, problems } = parseMappingField(
      typeof mappingValue === 'string' ? mappingValue : null,
    );
    if (file.size > MAX_IMPORT_BYTES) {
      refuse(
        'file',
        `"${file.name}" is ${(file.size / (1024 * 1024)).toFixed(1)} MB; the import limit is 5 MB.`,
      );
    }
    const upload = {
      name: file.name,
      bytes: new Uint8Array(await file.arrayBuffer()),
      mapping,
      mappingProblems: problems,
    };
    const actorRef = { userId: actor.user.id, projectId: actor.projectId };

    if (modeValue === 'preview') return previewImport(actor.projectId, params.cabinetId, upload);
    try {
      return await commitImport(actorRef, params.cabinetId, upload);
    } catch (err) {
      if (err instanceof ImportRejectedError) {
        return NextResponse.json({ error: err.message, ...err.preview }, { status: 422 });
      }
      throw err;
    }
  },
);
