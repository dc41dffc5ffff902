import Papa from 'papaparse';
import type { StoredFinding } from './audits';

/** The findings table as CSV, one row per finding, figures in SI units. */
export function findingsCsv(items: StoredFinding[]): string {
  return Papa.unparse(
    items.map((f) => ({
      verdict: f.verdict,
      kind: f.kind,
      channel: f.channelTag ?? '',
      cabinet: f.cabinetTag ?? '',
      strip: f.stripTag ?? '',
      case: f.finding?.caseLabel ?? f.caseId ?? '',
      mechanism: f.mechanism ?? '',
      hazard: f.finding?.exposure?.hazardLabel ?? '',
      margin: f.margin ?? '',
      source_peak_current_A: f.finding?.sourcePeakCurrent ?? '',
      reason: f.reason,
      basis: f.finding?.basis ?? f.check?.clause ?? '',
      key: f.key,
    })),
  );
}
