import type { BoundResult } from './find.ts';
import type { DiscoverResult } from './discover.ts';
import { fmt, TREND_CAVEAT } from './core.ts';

/** Plain-text report of a bound search, for the terminal. */
export function formatBound(res: BoundResult): string {
  const rel = res.form === 'upper' ? '≤' : '≥';
  const word = res.form === 'upper' ? 'max' : 'min';
  const out: string[] = [];
  out.push(`${res.lhs} ${rel} c·rhs on ${res.source} (${res.n} rows; tightest c = ${word} of lhs/rhs over the rows used)`);
  if (res.dropped.total > 0) {
    out.push(
      `dropped ${res.dropped.total} rows for at least one rhs (invalid rows skipped as asked): ${res.dropped.missing} with a missing cell, ` +
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
    for (const a of r.affine ?? []) {
      out.push(
        `  affine ${a.form} bound: ${res.lhs} ${a.form === 'upper' ? '≤' : '≥'} ${fmt(a.slope)}·(${r.rhs}) ${a.offset < 0 ? '−' : '+'} ${fmt(Math.abs(a.offset))}` +
          ` (mean gap ${fmt(a.meanGap)}; closest rows ${a.witnesses.map((w) => w.row).join(', ')})${a.atLimit ? '; the slope sits at its search limit' : ''}`,
      );
    }
    for (const note of r.notes) out.push(`  note: ${note.text}`);
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

/** Plain-text report of a right-hand-side search, for the terminal. */
export function formatDiscovery(res: DiscoverResult): string {
  const rel = res.form === 'upper' ? '≤' : '≥';
  const out: string[] = [];
  out.push(`${res.lhs} ${rel} c·Π x^k over ${res.from.join(', ')} on ${res.source}`);
  out.push(
    `${res.used} of ${res.n} rows used; exponents fitted on ${res.selectionRows} selection rows, checked on ${res.heldOutRows} held-out rows (seed ${res.seed}); ${res.candidates} exponent vectors checked`,
  );
  if (res.dropped.total > 0) out.push(`dropped ${res.dropped.total} rows (invalid rows skipped as asked): ${res.dropped.missing} with a missing cell, ${res.dropped.nonFinite} not finite, ${res.dropped.rhsNonPositive} with a value ≤ 0`);
  for (const note of res.notes) out.push(`note: ${note.text}`);
  out.push('');
  out.push(
    ...table(
      ['#', 'rhs', 'c*', 'held-out max', 'beyond c', 'supremum (95%)', 'trend'],
      res.proposals.map((p, i) => [
        String(i + 1),
        p.rhs,
        fmt(p.constant),
        fmt(p.heldOutConstant),
        String(p.heldOutExceed),
        p.supremum ? `${fmt(p.supremum.estimate)} [${p.supremum.low === null ? '−∞' : fmt(p.supremum.low)}, ${p.supremum.high === null ? '∞' : fmt(p.supremum.high)}]` : 'none suggested',
        p.trend.verdict,
      ]),
      '',
    ),
  );
  res.proposals.forEach((p, i) => {
    out.push('');
    out.push(`${i + 1}. ${res.lhs} ${rel} ${fmt(p.constant)}·${p.rhs.includes('/') || p.rhs.includes('*') ? `(${p.rhs})` : p.rhs}`);
    out.push(`   exponents ${Object.entries(p.exponentText).map(([k, v]) => `${k}: ${v}`).join(', ')} (envelope before snapping: ${Object.entries(p.envelopeExponents).map(([k, v]) => `${k}: ${fmt(v)}`).join(', ')})`);
    out.push(`   c* on the selection rows ${fmt(p.selectionConstant)}; held-out largest ratio ${fmt(p.heldOutConstant)}, ${p.heldOutExceed} held-out rows beyond it; mean log gap ${fmt(p.heldOutMeanLogGap)}`);
    out.push(`   true constant from the tail: ${p.supremum ? `${fmt(p.supremum.estimate)}, 95% interval [${p.supremum.low === null ? '−∞' : fmt(p.supremum.low)}, ${p.supremum.high === null ? '∞' : fmt(p.supremum.high)}]` : 'no estimate'} — ${p.supremumNote}`);
    out.push(`   witnesses (row: ratio): ${p.witnesses.map((w) => `${w.row}${Object.keys(w.labels).length ? ` (${Object.values(w.labels).join(', ')})` : ''}: ${fmt(w.ratio)}`).join('; ')}`);
    for (const [q, t] of Object.entries(p.trend.along)) out.push(`   along ${q}: ${t.verdict}`);
  });
  out.push('');
  out.push(`ranking: ${res.method.ranking}`);
  out.push(`caveat: ${TREND_CAVEAT}`);
  out.push('These constants are the tightest on this table: evidence, not a proof.');
  return out.join('\n') + '\n';
}
