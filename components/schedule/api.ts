/**
 * A small typed client for the schedule routes. Every non-2xx answer becomes an ApiError that
 * carries the server's body ({ error, fieldErrors, current, conflicts }) so screens can put
 * each message where it belongs.
 */
import type { LikelihoodClass, Mechanism } from '@/lib/exposure/types';
import type {
  Cabinet,
  ChannelRow,
  GuardRecipe,
  ImportCommitResult,
  ImportPreview,
  Strip,
  TerminalFields,
  TerminalRow,
} from './types';

export interface ConflictEntry<T = unknown> {
  id: number;
  current: T;
  /** Who saved the newer version, when the server says (see the contract's Changes). */
  changedBy?: { name: string; at?: string } | null;
}

export class ApiError extends Error {
  readonly status: number;
  readonly fieldErrors: Record<string, string[]>;
  readonly current: unknown;
  readonly conflicts: ConflictEntry[];
  readonly changedBy: ConflictEntry['changedBy'];
  /** The whole body, for answers that carry more (an import preview on 422). */
  readonly body: unknown;

  constructor(status: number, body: unknown) {
    const b = (typeof body === 'object' && body !== null ? body : {}) as Record<string, unknown>;
    super(typeof b.error === 'string' ? b.error : `The server answered ${status}.`);
    this.name = 'ApiError';
    this.status = status;
    this.fieldErrors = (b.fieldErrors as Record<string, string[]> | undefined) ?? {};
    this.current = b.current;
    this.conflicts = Array.isArray(b.conflicts) ? (b.conflicts as ConflictEntry[]) : [];
    this.changedBy = (b.changedBy as ConflictEntry['changedBy']) ?? null;
    this.body = body;
  }

  get isConflict() {
    return this.status === 409;
  }
  get isForbidden() {
    return this.status === 403;
  }
}

/** The first message for a field, looking at "field" and any key ending in ".field". */
export function fieldError(error: unknown, field: string): string | undefined {
  if (!(error instanceof ApiError)) return undefined;
  const exact = error.fieldErrors[field];
  if (exact?.length) return exact[0];
  const key = Object.keys(error.fieldErrors).find((k) => k.endsWith(`.${field}`));
  return key ? error.fieldErrors[key]?.[0] : undefined;
}

async function request<T>(url: string, init?: RequestInit): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      ...init,
      headers:
        init?.body instanceof FormData
          ? init.headers
          : { 'content-type': 'application/json', ...init?.headers },
      credentials: 'same-origin',
    });
  } catch {
    throw new ApiError(0, {
      error: 'The server could not be reached. Check the connection; nothing was saved.',
    });
  }
  const text = await response.text();
  let body: unknown = null;
  if (text) {
    try {
      body = JSON.parse(text);
    } catch {
      body = { error: `The server answered ${response.status} with something that is not JSON.` };
    }
  }
  if (!response.ok) throw new ApiError(response.status, body);
  return body as T;
}

const json = (value: unknown) => JSON.stringify(value);

export type TerminalChanges = Partial<TerminalFields>;
export interface TerminalUpdate {
  id: number;
  version: number;
  changes: TerminalChanges;
}

export interface TerminalQuery {
  sort?: string;
  dir?: 'asc' | 'desc';
  q?: string;
  stripId?: number;
  circuitClass?: string;
}

/** Route builders and calls for one project. */
export function projectApi(projectId: number) {
  const base = `/api/projects/${projectId}`;
  return {
    base,
    listCabinets: () => request<{ items: Cabinet[] }>(`${base}/cabinets`),
    createCabinet: (body: { tag: string; name: string; location?: string | null }) =>
      request<Cabinet>(`${base}/cabinets`, { method: 'POST', body: json(body) }),
    updateCabinet: (id: number, version: number, changes: Record<string, unknown>) =>
      request<Cabinet>(`${base}/cabinets/${id}`, {
        method: 'PATCH',
        body: json({ version, ...changes }),
      }),
    deleteCabinet: (id: number, version: number) =>
      request<{ deleted: true }>(`${base}/cabinets/${id}?version=${version}`, { method: 'DELETE' }),

    listStrips: (cabinetId: number) =>
      request<{ items: Strip[] }>(`${base}/cabinets/${cabinetId}/strips`),
    createStrip: (cabinetId: number, body: { tag: string; name?: string | null; order?: number }) =>
      request<Strip>(`${base}/cabinets/${cabinetId}/strips`, { method: 'POST', body: json(body) }),
    updateStrip: (id: number, version: number, changes: Record<string, unknown>) =>
      request<Strip>(`${base}/strips/${id}`, {
        method: 'PATCH',
        body: json({ version, ...changes }),
      }),
    deleteStrip: (id: number, version: number) =>
      request<{ deleted: true }>(`${base}/strips/${id}?version=${version}`, { method: 'DELETE' }),

    /** The whole cabinet in one page (the table virtualises; the contract allows 5 000). */
    listTerminals: (cabinetId: number, query: TerminalQuery = {}) => {
      const params = new URLSearchParams({ page: '1', pageSize: '5000' });
      for (const [k, v] of Object.entries(query))
        if (v !== undefined && v !== '') params.set(k, String(v));
      return request<{ items: TerminalRow[]; total: number }>(
        `${base}/cabinets/${cabinetId}/terminals?${params}`,
      );
    },
    createTerminal: (
      body: Partial<TerminalFields> & { stripId: number; position: number; label: string },
    ) => request<TerminalRow>(`${base}/terminals`, { method: 'POST', body: json(body) }),
    updateTerminal: (id: number, version: number, changes: TerminalChanges) =>
      request<TerminalRow>(`${base}/terminals/${id}`, {
        method: 'PATCH',
        body: json({ version, ...changes }),
      }),
    bulkUpdateTerminals: (updates: TerminalUpdate[]) =>
      request<{ items: TerminalRow[] }>(`${base}/terminals`, {
        method: 'PATCH',
        body: json({ updates }),
      }),
    deleteTerminal: (id: number, version: number) =>
      request<{ deleted: true }>(`${base}/terminals/${id}?version=${version}`, {
        method: 'DELETE',
      }),

    listChannels: (cabinetId?: number) =>
      request<{ items: ChannelRow[] }>(
        `${base}/channels${cabinetId ? `?cabinetId=${cabinetId}` : ''}`,
      ),
    createChannel: (body: Record<string, unknown>) =>
      request<ChannelRow>(`${base}/channels`, { method: 'POST', body: json(body) }),
    updateChannel: (id: number, version: number, changes: Record<string, unknown>) =>
      request<ChannelRow>(`${base}/channels/${id}`, {
        method: 'PATCH',
        body: json({ version, ...changes }),
      }),
    deleteChannel: (id: number, version: number) =>
      request<{ deleted: true }>(`${base}/channels/${id}?version=${version}`, { method: 'DELETE' }),

    listGuardRecipes: () => request<{ items: GuardRecipe[] }>(`${base}/guard-recipes`),
    createGuardRecipe: (body: { name: string; description?: string | null; guard: unknown }) =>
      request<GuardRecipe>(`${base}/guard-recipes`, { method: 'POST', body: json(body) }),
    updateGuardRecipe: (id: number, version: number, changes: Record<string, unknown>) =>
      request<GuardRecipe>(`${base}/guard-recipes/${id}`, {
        method: 'PATCH',
        body: json({ version, ...changes }),
      }),
    deleteGuardRecipe: (id: number, version: number) =>
      request<{ deleted: true }>(`${base}/guard-recipes/${id}?version=${version}`, {
        method: 'DELETE',
      }),

    /** Preview answers 200 with errors listed; commit answers 422 with the same preview when any row is bad. */
    importPreview: (cabinetId: number, file: File, mapping?: Record<string, string>) =>
      request<ImportPreview>(`${base}/cabinets/${cabinetId}/import`, {
        method: 'POST',
        body: importForm(file, 'preview', mapping),
      }),
    importCommit: (cabinetId: number, file: File, mapping?: Record<string, string>) =>
      request<ImportCommitResult>(`${base}/cabinets/${cabinetId}/import`, {
        method: 'POST',
        body: importForm(file, 'commit', mapping),
      }),
    /** The current exposure map of the whole project (computed, not stored). */
    exposures: () => request<ExposureMapView>(`${base}/exposures`),
    exportUrl: (cabinetId: number, format: 'csv' | 'xlsx') =>
      `${base}/cabinets/${cabinetId}/export?format=${format}`,
  };
}

function importForm(file: File, mode: 'preview' | 'commit', mapping?: Record<string, string>) {
  const form = new FormData();
  form.set('file', file);
  form.set('mode', mode);
  if (mapping) form.set('mapping', JSON.stringify(mapping));
  return form;
}

/** GET /exposures: lib/exposure's map; terminal ids arrive as strings. */
export interface ExposureMapView {
  targets: {
    terminalId: string;
    label: string;
    exposures: {
      hazardTerminalId: string;
      targetTerminalId: string;
      mechanism: Mechanism;
      likelihood: LikelihoodClass;
      reason: string;
    }[];
  }[];
}

export type ProjectApi = ReturnType<typeof projectApi>;

/** Query keys in one place so writes invalidate exactly what they touch. */
export const keys = {
  cabinets: (projectId: number) => ['projects', projectId, 'cabinets'] as const,
  strips: (projectId: number, cabinetId: number) =>
    ['projects', projectId, 'cabinets', cabinetId, 'strips'] as const,
  terminals: (projectId: number, cabinetId: number) =>
    ['projects', projectId, 'cabinets', cabinetId, 'terminals'] as const,
  channels: (projectId: number, cabinetId?: number) =>
    ['projects', projectId, 'channels', cabinetId ?? 'all'] as const,
  recipes: (projectId: number) => ['projects', projectId, 'guard-recipes'] as const,
  exposures: (projectId: number) => ['projects', projectId, 'exposures'] as const,
};
