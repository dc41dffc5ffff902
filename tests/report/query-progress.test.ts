import { describe, expect, it } from 'vitest';
import {
  findingsQueryString,
  matchesMechanism,
  parseFindingsQuery,
  toFindingFilters,
} from '@/lib/report/findings-query';
import { overallFraction, takeLines } from '@/lib/report/progress';

describe('findings table state in the URL', () => {
  it('round-trips through the query string and leaves defaults out', () => {
    const q = parseFindingsQuery({
      verdict: 'fails,unprotected',
      mechanism: 'neighbour',
      case: 'surge',
      cabinet: '3',
      strip: '7',
      dir: 'desc',
      page: '2',
    });
    expect(q).toMatchObject({
      verdict: ['fails', 'unprotected'],
      mechanism: ['neighbour'],
      caseKind: ['surge'],
      cabinetId: 3,
      stripId: 7,
      sort: 'margin',
      dir: 'desc',
      page: 2,
    });
    expect(
      parseFindingsQuery(Object.fromEntries(new URLSearchParams(findingsQueryString(q).slice(1)))),
    ).toEqual(q);
    expect(findingsQueryString(parseFindingsQuery({}))).toBe('');
  });

  it('takes repeated checkbox values (verdict=a&verdict=b) like a comma list', () => {
    expect(parseFindingsQuery({ verdict: ['fails', 'holds'] }).verdict).toEqual(['fails', 'holds']);
  });

  it('drops words it does not know and ids that are not positive whole numbers', () => {
    const q = parseFindingsQuery({
      verdict: 'fails,broken',
      case: 'lightning',
      cabinet: '-1',
      strip: '2.5',
      sort: 'colour',
    });
    expect(q.verdict).toEqual(['fails']);
    expect(q.caseKind).toEqual([]);
    expect(q.cabinetId).toBeNull();
    expect(q.stripId).toBeNull();
    expect(q.sort).toBe('margin');
  });

  it('matches surge and ESD findings as "transient" itself, since that is no stored mechanism', () => {
    const q = parseFindingsQuery({ mechanism: 'transient' });
    expect(toFindingFilters(q)).not.toHaveProperty('mechanism');
    expect(matchesMechanism(q, 'transient')).toBe(true);
    expect(matchesMechanism(q, 'neighbour')).toBe(false);
    expect(matchesMechanism(parseFindingsQuery({}), null)).toBe(true);
  });
});

describe('audit progress stream', () => {
  it('splits complete lines and keeps the unfinished rest', () => {
    const a = takeLines('{"type":"progress","phase":"stress","done":1,"total":4}\n{"type":"pro');
    expect(a.lines).toEqual([{ type: 'progress', phase: 'stress', done: 1, total: 4 }]);
    expect(a.rest).toBe('{"type":"pro');
    const b = takeLines(`${a.rest}gress","phase":"saving","done":2,"total":2}\n`);
    expect(b.lines[0]).toMatchObject({ phase: 'saving' });
    expect(b.rest).toBe('');
  });

  it('names a line that is not JSON instead of dropping it', () => {
    const { lines } = takeLines('<html>\n');
    expect(lines[0]).toMatchObject({ type: 'error' });
    expect((lines[0] as { error: string }).error).toContain('<html>');
  });

  it('one bar over the phases: never goes back, ends at 1', () => {
    const steps: [string, number, number][] = [
      ['loading', 0, 1],
      ['loading', 1, 1],
      ['exposures', 0, 1],
      ['exposures', 1, 1],
      ['stress', 0, 56],
      ['stress', 28, 56],
      ['stress', 56, 56],
      ['checks', 1, 1],
      ['saving', 500, 435],
      ['done', 1, 1],
    ];
    let last = -1;
    for (const [phase, done, total] of steps) {
      const f = overallFraction(phase, done, total);
      expect(f).toBeGreaterThanOrEqual(last);
      expect(f).toBeLessThanOrEqual(1);
      last = f;
    }
    expect(last).toBe(1);
  });
});
