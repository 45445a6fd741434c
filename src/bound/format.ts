import type { BoundResult } from './find.ts';
import { fmt } from './core.ts';

/** Plain-text report of a bound search, for the terminal. */
export function formatBound(res: BoundResult): string {
  const rel = res.form === 'upper' ? '≤' : '≥';
  const word = res.form === 'upper' ? 'max' : 'min';
  const out: string[] = [];
  out.push(`${res.lhs} ${rel} c·rhs on ${res.source} (${res.n} rows; tightest c = ${word} of lhs/rhs over the rows used)`);
  if (res.dropped.total > 0) {
    out.push(
      `dropped ${res.dropped.total} rows for at least one rhs (--skip-invalid): ${res.dropped.missing} with a missing cell, ` +
        `${res.dropped.nonFinite} not finite, ${res.dropped.rhsNonPositive} with rhs ≤ 0`,
    );
  }
  for (const r of res.results) {
    out.push('');
    out.push(`rhs = ${r.rhs}:  c* = ${fmt(r.constant)}  (${r.n} rows${r.dropped.total ? `, ${r.dropped.total} dropped` : ''})`);
    out.push(`  rows closest to c*:`);
    const head = ['row', 'line', 'ratio', 'lhs', 'rhs', ...(r.by !== r.rhs ? [r.by] : []), ...Object.keys(r.witnesses[0]?.labels ?? {})];
    const body = r.witnesses.map((w) => [
      String(w.row),
      w.line === null ? '' : String(w.line),
      fmt(w.ratio),
      fmt(w.lhs),
      fmt(w.rhs),
      ...(r.by !== r.rhs ? [fmt(w.by)] : []),
      ...Object.values(w.labels).map((v) => (v === null ? 'NA' : typeof v === 'number' ? fmt(v) : v)),
    ]);
    out.push(...table(head, body, '    '));
    out.push(`  quantiles of lhs/rhs (${r.quantileDefinition}):`);
    out.push('    ' + r.quantiles.map((q) => `${pct(q.p)}: ${fmt(q.value)}`).join('   '));
    if (r.strata.length > 0) {
      out.push(`  c* in ${r.strata.length} equal-count strata of ${r.by}:`);
      out.push(
        ...table(
          [`${r.by} from`, 'to', 'median', 'n', 'c*', 'row'],
          r.strata.map((s) => [fmt(s.low, 6), fmt(s.high, 6), fmt(s.centre, 6), String(s.n), fmt(s.constant), String(s.row)]),
          '    ',
        ),
      );
    }
    out.push(`  trend: ${r.trend.verdict}`);
    if (r.trend.determined) out.push(`  caveat: ${r.trend.caveat}`);
    for (const note of r.notes) out.push(`  note: ${note}`);
  }
  if (res.results.length > 1) {
    out.push('');
    out.push('candidates side by side:');
    out.push(
      ...table(
        ['rhs', 'c*', 'witness row', 'trend'],
        res.results.map((r) => [r.rhs, fmt(r.constant), String(r.witnesses[0]?.row ?? ''), trendWords(r.trend.verdict)]),
        '  ',
      ),
    );
  }
  out.push('');
  out.push('These constants are the tightest on this table: evidence, not a proof.');
  return out.join('\n') + '\n';
}

function trendWords(verdict: string): string {
  const i = verdict.indexOf(' (');
  return i < 0 ? verdict : verdict.slice(0, i);
}

function pct(p: number): string {
  return `${Number((p * 100).toPrecision(4))}%`;
}

function table(head: string[], rows: string[][], indent: string): string[] {
  const w = head.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
  const line = (cells: string[]) => indent + cells.map((c, j) => c.padEnd(w[j]!)).join('  ').trimEnd();
  return [line(head), ...rows.map(line)];
}
