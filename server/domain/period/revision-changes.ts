import type { LimitRow, PeriodSummaryCore, RevisionChanges } from '../../contracts/periods.js';

/** How a row is named in a list of changes: point, parameter, statistic, unit (and the version's days when split). */
const rowName = (row: LimitRow) => `${row.pointCode} ${row.parameter} ${row.statistic} (${row.unit}) ${row.appliesFrom}–${row.appliesTo}`;
const verdict = (row: LimitRow) => (row.exceeded ? 'over the limit' : row.computedValue === null ? 'no data' : 'within the limit');
const exceedanceKey = (row: string, e: { date: string; shownValue: string }) => `${row}|${e.date}|${e.shownValue}`;

/**
 * What changed from one signed revision to the next: reported values, verdicts, and exceedances
 * added or removed. Rows are matched by their name, so a limit version added or ended shows as
 * a value from or to nothing.
 */
export function revisionChanges(before: Pick<PeriodSummaryCore, 'rows'>, after: Pick<PeriodSummaryCore, 'rows'>): RevisionChanges {
  const earlier = new Map(before.rows.map((row) => [rowName(row), row]));
  const later = new Map(after.rows.map((row) => [rowName(row), row]));
  const changes: RevisionChanges = { values: [], verdicts: [], exceedancesAdded: [], exceedancesRemoved: [] };
  for (const name of new Set([...earlier.keys(), ...later.keys()])) {
    const a = earlier.get(name);
    const b = later.get(name);
    if ((a?.shownValue ?? null) !== (b?.shownValue ?? null) || !a !== !b) {
      changes.values.push({ row: name, before: a?.shownValue ?? null, after: b?.shownValue ?? null });
    }
    if (a && b && verdict(a) !== verdict(b)) changes.verdicts.push({ row: name, before: verdict(a), after: verdict(b) });
    const was = new Map((a?.exceedances ?? []).map((e) => [exceedanceKey(name, e), e]));
    const is = new Map((b?.exceedances ?? []).map((e) => [exceedanceKey(name, e), e]));
    for (const [key, e] of is) if (!was.has(key)) changes.exceedancesAdded.push({ row: name, date: e.date, value: e.shownValue });
    for (const [key, e] of was) if (!is.has(key)) changes.exceedancesRemoved.push({ row: name, date: e.date, value: e.shownValue });
  }
  return changes;
}
