'use client';

import { useQueryClient } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { Button } from '@/components/ui/button';
import { cn } from '@/lib/utils';
import { ApiError, keys, projectApi } from './api';
import { IMPORT_COLUMNS, type ImportCommitResult, type ImportPreview } from './types';

type Step =
  | { name: 'pick' }
  | { name: 'map'; preview: ImportPreview }
  | { name: 'preview'; preview: ImportPreview }
  | { name: 'done'; result: ImportCommitResult; rows: number };

const MAX_BYTES = 5 * 1024 * 1024;
const SHOWN_ROWS = 300;
const REQUIRED: readonly string[] = ['strip', 'position', 'label', 'circuit_class'];

/**
 * CSV/XLSX import in four steps: choose the file → match its headers to our columns → a
 * preview listing every bad row (nothing written) → commit, all rows or none.
 */
export function ImportWizard({
  projectId,
  cabinetId,
  cabinetTag,
  onClose,
}: {
  projectId: number;
  cabinetId: number;
  cabinetTag: string;
  onClose: () => void;
}) {
  const api = projectApi(projectId);
  const queryClient = useQueryClient();
  const [step, setStep] = useState<Step>({ name: 'pick' });
  const [file, setFile] = useState<File | null>(null);
  const [mapping, setMapping] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);

  const run = async <T,>(label: string, work: () => Promise<T>): Promise<T | null> => {
    setBusy(label);
    setFailure(null);
    try {
      return await work();
    } catch (error) {
      if (error instanceof ApiError && error.status === 422 && isPreview(error.body)) {
        // A commit refused because rows are bad answers with the preview: show it.
        setStep({ name: 'preview', preview: error.body });
        setFailure('Nothing was imported: the file still has rows with errors.');
      } else {
        setFailure(error instanceof Error ? error.message : String(error));
      }
      return null;
    } finally {
      setBusy(null);
    }
  };

  const readFile = async () => {
    if (!file) return setFailure('Choose a .csv or .xlsx file first.');
    if (!/\.(csv|xlsx)$/i.test(file.name))
      return setFailure(`${file.name} is not a .csv or .xlsx file.`);
    if (file.size > MAX_BYTES)
      return setFailure(
        `${file.name} is ${(file.size / 1048576).toFixed(1)} MB; the limit is 5 MB.`,
      );
    const preview = await run('Reading the file…', () => api.importPreview(cabinetId, file));
    if (!preview) return;
    setMapping(Object.fromEntries(Object.entries(preview.suggestedMapping).filter(([, v]) => v)));
    setStep({ name: 'map', preview });
  };

  const previewWithMapping = async () => {
    if (!file) return;
    const preview = await run('Checking every row…', () =>
      api.importPreview(cabinetId, file, mapping),
    );
    if (preview) setStep({ name: 'preview', preview });
  };

  const commit = async () => {
    if (!file || step.name !== 'preview') return;
    const rows = step.preview.rows.length;
    const result = await run(`Importing ${rows} rows in one transaction…`, () =>
      api.importCommit(cabinetId, file, mapping),
    );
    if (!result) return;
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: keys.terminals(projectId, cabinetId) }),
      queryClient.invalidateQueries({ queryKey: keys.strips(projectId, cabinetId) }),
      queryClient.invalidateQueries({ queryKey: keys.channels(projectId, cabinetId) }),
      queryClient.invalidateQueries({ queryKey: keys.cabinets(projectId) }),
    ]);
    setStep({ name: 'done', result, rows });
  };

  const stepIndex = { pick: 0, map: 1, preview: 2, done: 3 }[step.name];

  return (
    <div className="space-y-4" data-testid="import-wizard">
      <ol className="flex flex-wrap gap-2 text-xs" aria-label="Import steps">
        {['Choose file', 'Match columns', 'Check rows', 'Imported'].map((label, i) => (
          <li
            key={label}
            aria-current={i === stepIndex ? 'step' : undefined}
            className={cn(
              'rounded-sm border px-2 py-1',
              i === stepIndex
                ? 'border-accent bg-accent-soft text-ink'
                : i < stepIndex
                  ? 'border-line text-ink'
                  : 'border-line text-muted',
            )}
          >
            {i + 1}. {label}
          </li>
        ))}
      </ol>

      {busy ? (
        <div role="status" className="space-y-1">
          <p className="text-sm">{busy}</p>
          <progress className="h-2 w-full accent-accent" aria-label={busy} />
        </div>
      ) : null}
      {failure ? (
        <p
          role="alert"
          className="rounded-sm border border-danger bg-danger-soft p-2 text-sm text-danger"
        >
          {failure}
        </p>
      ) : null}

      {step.name === 'pick' ? (
        <div className="space-y-3">
          <p className="text-sm">
            Terminals for cabinet <span className="font-mono">{cabinetTag}</span>, one row per
            terminal, from a CSV or Excel (.xlsx) file up to 5 MB. Rows that match an existing
            terminal (same strip, position and level) update it; the rest are added. Our columns:{' '}
            <span className="font-mono text-xs">{IMPORT_COLUMNS.join(', ')}</span>.
          </p>
          <label className="block text-sm font-medium" htmlFor="import-file">
            File to import
          </label>
          <input
            id="import-file"
            type="file"
            accept=".csv,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            className="block text-sm"
          />
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={onClose}>
              Cancel
            </Button>
            <Button onClick={() => void readFile()} disabled={!file || busy !== null}>
              Read file
            </Button>
          </div>
        </div>
      ) : null}

      {step.name === 'map' ? (
        <div className="space-y-3">
          <p className="text-sm">
            {file?.name}: {step.preview.headers.length} columns, {step.preview.rows.length} rows.
            Match each of our columns to one of yours; the suggestion is filled in.
          </p>
          <div className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
            {IMPORT_COLUMNS.map((ours) => (
              <label key={ours} className="flex items-center justify-between gap-2 text-sm">
                <span className="font-mono text-xs">
                  {ours}
                  {REQUIRED.includes(ours) ? <span className="text-danger"> *</span> : null}
                </span>
                <select
                  aria-label={`Their column for ${ours}`}
                  value={mapping[ours] ?? ''}
                  onChange={(e) => setMapping((m) => ({ ...m, [ours]: e.target.value }))}
                  className="h-9 w-44 rounded-sm border border-line bg-panel px-2 text-sm"
                >
                  <option value="">— not in file —</option>
                  {step.preview.headers.map((h) => (
                    <option key={h} value={h}>
                      {h}
                    </option>
                  ))}
                </select>
              </label>
            ))}
          </div>
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={() => setStep({ name: 'pick' })}>
              Back
            </Button>
            <Button onClick={() => void previewWithMapping()} disabled={busy !== null}>
              Check rows
            </Button>
          </div>
        </div>
      ) : null}

      {step.name === 'preview' ? (
        <PreviewStep
          preview={step.preview}
          mapping={mapping}
          busy={busy !== null}
          onBack={() => setStep({ name: 'map', preview: step.preview })}
          onPickAnother={() => {
            setFile(null);
            setStep({ name: 'pick' });
          }}
          onCommit={() => void commit()}
        />
      ) : null}

      {step.name === 'done' ? (
        <div className="space-y-3" role="status">
          <p className="text-base font-medium">
            Imported {step.rows} rows: {step.result.created} terminals added, {step.result.updated}{' '}
            updated.
          </p>
          <div className="flex justify-end">
            <Button onClick={onClose}>Close</Button>
          </div>
        </div>
      ) : null}
    </div>
  );
}

function PreviewStep({
  preview,
  mapping,
  busy,
  onBack,
  onPickAnother,
  onCommit,
}: {
  preview: ImportPreview;
  mapping: Record<string, string>;
  busy: boolean;
  onBack: () => void;
  onPickAnother: () => void;
  onCommit: () => void;
}) {
  const bad = preview.rows.filter((r) => r.errors.length > 0);
  const columns = useMemo(() => IMPORT_COLUMNS.filter((c) => mapping[c]), [mapping]);
  const shown = preview.rows.slice(0, SHOWN_ROWS);
  return (
    <div className="space-y-3">
      <p className="text-sm" data-testid="import-summary">
        {preview.rows.length} rows read: <strong>{preview.validCount} ready</strong>,{' '}
        <strong className={preview.errorCount ? 'text-danger' : undefined}>
          {bad.length} with errors
        </strong>
        . Nothing has been written yet.
      </p>
      {bad.length > 0 ? (
        <div className="max-h-64 overflow-auto rounded-sm border border-danger">
          <table
            className="w-full text-sm"
            aria-label="Rows with errors"
            data-testid="import-errors"
          >
            <thead className="sticky top-0 bg-danger-soft text-left text-xs">
              <tr>
                <th className="px-2 py-1">Row</th>
                <th className="px-2 py-1">Column</th>
                <th className="px-2 py-1">Why</th>
              </tr>
            </thead>
            <tbody>
              {bad.flatMap((r) =>
                r.errors.map((e, i) => (
                  <tr key={`${r.row}-${i}`} className="border-t border-line">
                    <td className="px-2 py-1 font-mono">{r.row}</td>
                    <td className="px-2 py-1 font-mono">{e.column || '—'}</td>
                    <td className="px-2 py-1">{e.message}</td>
                  </tr>
                )),
              )}
            </tbody>
          </table>
        </div>
      ) : null}
      <details open={bad.length === 0}>
        <summary className="cursor-pointer text-sm">
          Preview of the rows
          {preview.rows.length > SHOWN_ROWS
            ? ` (first ${SHOWN_ROWS} of ${preview.rows.length})`
            : ''}
        </summary>
        <div className="mt-2 max-h-80 overflow-auto rounded-sm border border-line">
          <table className="text-xs" aria-label="Rows to import">
            <thead className="sticky top-0 bg-paper text-left">
              <tr>
                <th className="px-2 py-1">Row</th>
                {columns.map((c) => (
                  <th key={c} className="px-2 py-1 font-mono font-medium">
                    {c}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {shown.map((r) => {
                const badColumns = new Set(r.errors.map((e) => e.column));
                return (
                  <tr
                    key={r.row}
                    className={cn('border-t border-line', r.errors.length && 'bg-danger-soft')}
                  >
                    <td className="px-2 py-1 font-mono">{r.row}</td>
                    {columns.map((c) => (
                      <td
                        key={c}
                        className={cn(
                          'px-2 py-1 font-mono',
                          badColumns.has(c) && 'text-danger underline decoration-wavy',
                        )}
                      >
                        {r.values[c] ?? ''}
                      </td>
                    ))}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </details>
      <div className="flex flex-wrap justify-end gap-2">
        <Button variant="secondary" onClick={onBack}>
          Back to columns
        </Button>
        {bad.length > 0 ? (
          <Button variant="secondary" onClick={onPickAnother}>
            Choose the fixed file
          </Button>
        ) : null}
        <Button onClick={onCommit} disabled={busy || bad.length > 0 || preview.rows.length === 0}>
          Import {preview.rows.length} rows
        </Button>
      </div>
      {bad.length > 0 ? (
        <p className="text-xs text-muted">
          Imports are all or nothing: fix the rows listed above in your file, then choose it again.
        </p>
      ) : null}
    </div>
  );
}

function isPreview(body: unknown): body is ImportPreview {
  return typeof body === 'object' && body !== null && Array.isArray((body as ImportPreview).rows);
}
