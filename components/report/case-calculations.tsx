import type { Guard, StressConditions, StressResult, Waveform } from '@/lib/stress/types';
import { formatEng } from '@/lib/units';
import { caseInputs, checkCells, formatMargin } from '@/lib/report/format';
import { formulasFor } from '@/lib/report/formulas';
import { VerdictBadge } from './verdict-badge';

/**
 * One solved stress case written out: the inputs, the calculations with the engine's numbers
 * substituted, and every element's stress against its derated rating. No hooks, so it renders
 * on the server and inside the client "what if" alike.
 */
export function CaseCalculations({
  guard,
  result,
  conditions,
  basis,
  label,
  waveform,
}: {
  guard: Guard;
  result: Pick<
    StressResult,
    'case' | 'verdict' | 'reason' | 'elements' | 'input' | 'rails' | 'sourcePeakCurrent'
  >;
  conditions: StressConditions;
  basis?: string;
  label?: string;
  /** The same case solved with its waveform: places the current peak in time for the hand form. */
  waveform?: Waveform | null;
}) {
  const full: StressResult = { ...result };
  const lines = formulasFor(guard, full, waveform ?? undefined);
  return (
    <div className="space-y-5">
      <div className="grid gap-4 md:grid-cols-2">
        <div>
          <h4 className="mb-1 text-xs font-semibold tracking-wide text-muted uppercase">Inputs</h4>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            {label && (
              <>
                <dt className="text-muted">Case</dt>
                <dd>{label}</dd>
              </>
            )}
            {caseInputs(result.case).map((row) => (
              <div key={row.label} className="contents">
                <dt className="text-muted">{row.label}</dt>
                <dd className="font-mono">{row.text}</dd>
              </div>
            ))}
            <dt className="text-muted">Applied to</dt>
            <dd>
              {conditions.appliedTo === 'return'
                ? 'the return terminal (reversed polarity)'
                : 'the signal terminal'}
            </dd>
            {basis && (
              <>
                <dt className="text-muted">Source</dt>
                <dd>{basis}</dd>
              </>
            )}
          </dl>
        </div>
        <div>
          <h4 className="mb-1 text-xs font-semibold tracking-wide text-muted uppercase">
            Assumptions
          </h4>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            <dt className="text-muted">Cabinet ambient</dt>
            <dd className="font-mono">{conditions.ambientC} °C</dd>
            <dt className="text-muted">Power derating</dt>
            <dd className="font-mono">
              use ≤ {Math.round(conditions.powerDerating * 100)} % of rating
            </dd>
            <dt className="text-muted">Voltage derating</dt>
            <dd className="font-mono">
              use ≤ {Math.round(conditions.voltageDerating * 100)} % of rating
            </dd>
          </dl>
        </div>
      </div>

      <div className="flex flex-wrap items-start gap-3 rounded-sm border border-line bg-paper p-3">
        <VerdictBadge verdict={result.verdict} size="lg" />
        <p className="min-w-0 flex-1 text-sm" data-testid="case-reason">
          {result.reason}
        </p>
      </div>

      {lines.length > 0 && (
        <div>
          <h4 className="mb-2 text-xs font-semibold tracking-wide text-muted uppercase">
            Calculations
          </h4>
          <ol className="space-y-2">
            {lines.map((l) => (
              <li
                key={l.id}
                className="rounded-sm border border-line p-2 text-sm"
                data-formula={l.id}
              >
                <div className="text-muted">{l.title}</div>
                <div className="font-mono break-words">
                  {l.symbolic} = {l.substituted} = <strong>{l.result.text}</strong>
                </div>
                {l.note && <p className="mt-1 text-xs text-muted">{l.note}</p>}
              </li>
            ))}
          </ol>
        </div>
      )}

      <div>
        <h4 className="mb-2 text-xs font-semibold tracking-wide text-muted uppercase">
          Stress against rating
        </h4>
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <caption className="sr-only">
              Every element&apos;s stress against its derated rating
            </caption>
            <thead className="text-left text-xs text-muted">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Element
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Peak V / peak I
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Quantity
                </th>
                <th scope="col" className="py-1 pr-3 text-right font-medium">
                  Stress
                </th>
                <th scope="col" className="py-1 pr-3 text-right font-medium">
                  Rated
                </th>
                <th scope="col" className="py-1 pr-3 text-right font-medium">
                  Derated
                </th>
                <th scope="col" className="py-1 pr-3 text-right font-medium">
                  Margin
                </th>
                <th scope="col" className="py-1 font-medium">
                  Verdict
                </th>
              </tr>
            </thead>
            <tbody>
              {result.elements.map((e) => {
                const rows = e.checks.length > 0 ? e.checks : [null];
                return rows.map((c, k) => {
                  const cells = c ? checkCells(c) : null;
                  return (
                    <tr
                      key={`${e.elementId}-${k}`}
                      className={k === 0 ? 'border-t border-line align-top' : 'align-top'}
                    >
                      {k === 0 && (
                        <>
                          <th
                            scope="row"
                            rowSpan={rows.length}
                            className="py-1.5 pr-3 text-left font-mono font-semibold"
                          >
                            {e.elementId}
                            <span className="block text-xs font-normal text-muted">{e.kind}</span>
                          </th>
                          <td
                            rowSpan={rows.length}
                            className="py-1.5 pr-3 font-mono whitespace-nowrap"
                          >
                            {formatEng(e.peakVoltage, 'V')}
                            <span className="block">{formatEng(e.peakCurrent, 'A')}</span>
                          </td>
                        </>
                      )}
                      <td className="py-1.5 pr-3">{cells?.quantity ?? '—'}</td>
                      <td className="py-1.5 pr-3 text-right font-mono">{cells?.value ?? '—'}</td>
                      <td className="py-1.5 pr-3 text-right font-mono">
                        {cells?.rating ?? '—'}
                        {cells?.atAmbient && (
                          <span className="block text-xs text-muted">
                            {cells.atAmbient} at ambient
                          </span>
                        )}
                      </td>
                      <td className="py-1.5 pr-3 text-right font-mono">{cells?.derated ?? '—'}</td>
                      <td className="py-1.5 pr-3 text-right font-mono">{cells?.margin ?? '—'}</td>
                      <td className="py-1.5">
                        <VerdictBadge verdict={c?.verdict ?? e.verdict} />
                      </td>
                    </tr>
                  );
                });
              })}
              <tr className="border-t border-line align-top">
                <th scope="row" className="py-1.5 pr-3 text-left font-semibold">
                  Protected input
                </th>
                <td className="py-1.5 pr-3 font-mono whitespace-nowrap">
                  {formatEng(result.input.peakVoltage, 'V')}
                  <span className="block">{formatEng(result.input.peakCurrent, 'A')}</span>
                </td>
                <td colSpan={5} className="py-1.5 pr-3 text-sm">
                  {result.input.reason}
                </td>
                <td className="py-1.5">
                  <VerdictBadge verdict={result.input.verdict} />
                </td>
              </tr>
              {result.rails.map((r) => (
                <tr key={r.rail} className="border-t border-line align-top">
                  <th scope="row" className="py-1.5 pr-3 text-left font-semibold">
                    {r.rail === 'positive' ? 'Positive rail' : 'Negative rail'}
                  </th>
                  <td className="py-1.5 pr-3 font-mono whitespace-nowrap">
                    {formatEng(r.injectedCurrent, 'A')}
                  </td>
                  <td colSpan={5} className="py-1.5 pr-3 text-sm">
                    injected; minimum load{' '}
                    {r.minLoad === null ? 'not given' : formatEng(r.minLoad, 'A')}
                    {r.pumpsUp === true
                      ? ': the rail can rise'
                      : r.pumpsUp === false
                        ? ': absorbed'
                        : ''}
                  </td>
                  <td className="py-1.5 text-xs text-muted">
                    {r.pumpsUp === true ? 'pump-up' : ''}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="mt-1 text-xs text-muted">
          Margin = (derated − stress) / derated; {formatMargin(0.2)} means 20 % of the derated
          rating is left.
        </p>
      </div>
    </div>
  );
}
