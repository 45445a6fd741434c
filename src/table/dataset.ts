import { SurmiseError, didYouMean } from '../errors.ts';
import type { Column, Table } from './types.ts';
import type { Dataset, DatasetSpec, DropCount, DropReport, FeatureGroup } from './dataset-types.ts';
import { type KeyColumn, type UsedColumn, dropDuplicates, validRows } from './dataset-rows.ts';
import { deriveColumn, expressionColumns, parseExpression } from './expr/index.ts';

export type { Dataset, DatasetSpec, DropCount, DropReport, FeatureGroup } from './dataset-types.ts';

const DEDUPE = ['all', 'key', 'none'] as const;

function unknown(what: string, name: string, candidates: string[]): never {
  throw new SurmiseError(
    'dataset.unknownColumn',
    `${what} '${name}' is not a column of the table${didYouMean(name, candidates)}; columns: ${candidates.slice(0, 12).join(', ')}${candidates.length > 12 ? ', …' : ''}`,
    { column: name },
  );
}

/** A feature: its name, the values, and the table column it came from (for drop counts and groups). */
interface Feature {
  name: string;
  values: Float64Array;
  source: Column;
}

function featuresOf(col: Column, part?: 're' | 'im'): Feature[] {
  if (col.kind === 'label') return [];
  if (col.kind === 'complex') {
    const all: Feature[] = [
      { name: `${col.name}.re`, values: col.re, source: col },
      { name: `${col.name}.im`, values: col.im, source: col },
    ];
    return part === undefined ? all : all.filter((f) => f.name.endsWith(`.${part}`));
  }
  return [{ name: col.name, values: col.values, source: col }];
}

/** A column named exactly `name`, or the part `X.re` / `X.im` of a complex column X. */
function lookup(cols: Column[], name: string): { col: Column; part?: 're' | 'im' } | undefined {
  const exact = cols.find((c) => c.name === name);
  if (exact) return { col: exact };
  const m = /^(.*)\.(re|im)$/.exec(name);
  if (m) {
    const base = cols.find((c) => c.name === m[1]);
    if (base && base.kind === 'complex') return { col: base, part: m[2] as 're' | 'im' };
  }
  return undefined;
}

/**
 * Apply the row policy: compute derived columns, pick the target and features, drop rows with a
 * missing or non-finite used value (counted per column and reason) and repeated rows (counted),
 * and return column arrays of the kept rows. Nothing is dropped without being counted in `drops`.
 *
 * Defaults: features are every real, integer and complex column except the target, `exclude`, and
 * the columns the target is computed from (directly or through derived columns), since those would
 * predict it by construction; a complex column X gives features X.re and X.im in one group X.
 * Every label column is carried in `labels` for witness tables.
 */
export function buildDataset(table: Table, spec: DatasetSpec): Dataset {
  // ---- validate the spec once
  if (typeof spec.target !== 'string' || spec.target.trim() === '') {
    throw new SurmiseError('dataset.badSpec', 'no target given: name a column or an expression to predict');
  }
  const dedupe = spec.dedupe ?? (spec.key && spec.key.length > 0 ? 'key' : 'all');
  if (!DEDUPE.includes(dedupe)) {
    throw new SurmiseError('dataset.badSpec', `expected dedupe to be one of ${DEDUPE.join(', ')}, got '${String(dedupe)}'`);
  }
  if (dedupe === 'key' && (!spec.key || spec.key.length === 0)) {
    throw new SurmiseError('dataset.badSpec', "dedupe 'key' needs key columns (e.g. key: [name])");
  }
  if (dedupe !== 'key' && spec.key && spec.key.length > 0) {
    throw new SurmiseError('dataset.badSpec', `key columns were given but dedupe is '${dedupe}'; use dedupe 'key'`);
  }

  // ---- derived columns, in order; each may use the earlier ones
  const columns: Column[] = [...table.columns];
  const derivedInputs = new Map<string, string[]>();
  for (const d of spec.derive ?? []) {
    if (columns.some((c) => c.name === d.name)) {
      throw new SurmiseError(
        'table.duplicateColumn',
        `derived column '${d.name}' would replace an existing column of the same name; choose another name`,
        { column: d.name },
      );
    }
    const work: Table = { ...table, columns };
    const col = deriveColumn(work, d.name, d.source);
    derivedInputs.set(d.name, expressionColumns(parseExpression(d.source)));
    columns.push(col);
  }
  const names = columns.map((c) => c.name);
  const work: Table = { ...table, columns };
  const n = table.nRows;

  // ---- target: a column, or else an expression
  const targetText = spec.target.trim();
  let targetCol: Column;
  let targetDirect: string[];
  const found = lookup(columns, targetText);
  if (found) {
    const { col, part } = found;
    if (col.kind === 'label') {
      throw new SurmiseError(
        'dataset.labelTarget',
        `target '${targetText}' holds labels (text); the target must be numeric (derive a number from it first)`,
        { column: targetText },
      );
    }
    if (col.kind === 'complex' && part === undefined) {
      throw new SurmiseError(
        'dataset.complexTarget',
        `target '${targetText}' is complex; predict a real quantity such as re(${targetText}), im(${targetText}), abs(${targetText}) or arg(${targetText})`,
        { column: targetText },
      );
    }
    targetCol =
      part === undefined || col.kind !== 'complex'
        ? col
        : { name: targetText, kind: 'real', values: part === 're' ? col.re : col.im, missing: col.missing };
    targetDirect = [col.name];
  } else {
    const expr = parseExpression(targetText);
    if (expr.type === 'column') unknown('target', expr.name, names);
    targetCol = deriveColumn(work, targetText, targetText);
    if (targetCol.kind === 'complex') {
      throw new SurmiseError(
        'dataset.complexTarget',
        `target '${targetText}' has complex values; predict re(…), im(…), abs(…) or arg(…) of it`,
        { column: targetText },
      );
    }
    targetDirect = expressionColumns(expr).map((c) => lookup(columns, c)?.col.name ?? c);
  }
  // columns the target is computed from, through derived columns
  const targetInputs = new Set<string>();
  const stack = [...targetDirect];
  while (stack.length > 0) {
    const c = stack.pop()!;
    if (targetInputs.has(c)) continue;
    targetInputs.add(c);
    for (const d of derivedInputs.get(c) ?? []) stack.push(lookup(columns, d)?.col.name ?? d);
  }

  // ---- features
  for (const e of spec.exclude ?? []) if (!lookup(columns, e)) unknown('excluded column', e, names);
  const excluded = (f: Feature): boolean => (spec.exclude ?? []).some((e) => e === f.name || e === f.source.name);
  let features: Feature[] = [];
  if (spec.features && spec.features.length > 0) {
    for (const fname of spec.features) {
      const r = lookup(columns, fname);
      if (!r) unknown('feature', fname, names);
      if (r.col.kind === 'label') {
        throw new SurmiseError('dataset.labelFeature', `feature '${fname}' holds labels (text); features must be numeric`, { column: fname });
      }
      if (found && r.col === found.col && (found.part === undefined || r.part === undefined || r.part === found.part)) {
        throw new SurmiseError('dataset.targetAsFeature', `'${fname}' is the target; it cannot also be a feature`, { column: fname });
      }
      features.push(...featuresOf(r.col, r.part).filter((f) => !excluded(f)));
    }
  } else {
    for (const col of columns) {
      if (col.kind === 'label' || targetInputs.has(col.name) || col === targetCol) continue;
      features.push(...featuresOf(col).filter((f) => !excluded(f)));
    }
  }
  const seen = new Map<string, Feature>();
  features = features.filter((f) => {
    const before = seen.get(f.name);
    if (before === undefined) {
      seen.set(f.name, f);
      return true;
    }
    if (before.source === f.source) return false; // listed twice: keep once
    throw new SurmiseError(
      'dataset.nameClash',
      `two features would be called '${f.name}': a part of complex column '${(before.source.kind === 'complex' ? before : f).source.name}' and the column '${f.name}'; rename one of them`,
      { column: f.name },
    );
  });
  if (features.length === 0) {
    throw new SurmiseError(
      'dataset.noFeatures',
      `no numeric features are left for target '${targetText}' (after exclusions and the target's own inputs: ${[...targetInputs].join(', ') || 'none'})`,
    );
  }
  const featureNames = features.map((f) => f.name);
  const groups = buildGroups(features, spec.groups ?? {}, columns);

  // ---- rows: missing / non-finite, then duplicates
  const used: UsedColumn[] = [];
  const usedSources = new Map<Column, Float64Array[]>();
  for (const f of features) {
    const parts = usedSources.get(f.source) ?? [];
    parts.push(f.values);
    usedSources.set(f.source, parts);
  }
  const targetValues = (targetCol as { values: Float64Array }).values;
  used.push({ name: targetText, parts: [targetValues], missing: targetCol.missing });
  for (const [col, parts] of usedSources) used.push({ name: col.name, parts, missing: col.missing });
  const { keep, dropped, invalidRows } = validRows(n, used);

  let keys: KeyColumn[];
  let duplicateRule: string;
  if (dedupe === 'key') {
    keys = spec.key!.map((k) => {
      const r = lookup(columns, k);
      if (!r) unknown('key column', k, names);
      const c = r.col;
      if (c.kind === 'label') return { strings: c.values, missing: c.missing };
      if (c.kind === 'complex') return { numbers: r.part === 'im' ? c.im : c.re, missing: c.missing };
      return { numbers: c.values, missing: c.missing };
    });
    // a complex key column compares both parts
    for (const k of spec.key!) {
      const r = lookup(columns, k)!;
      if (r.col.kind === 'complex' && r.part === undefined) keys.push({ numbers: r.col.im, missing: r.col.missing });
    }
    duplicateRule = `rows with equal ${spec.key!.join(', ')} (first kept)`;
  } else if (dedupe === 'all') {
    keys = [{ numbers: targetValues }, ...features.map((f) => ({ numbers: f.values }))];
    duplicateRule = 'rows equal in the target and every feature (first kept)';
  } else {
    keys = [];
    duplicateRule = 'none (duplicates kept)';
  }
  const duplicates = dedupe === 'none' ? 0 : dropDuplicates(keep, keys);

  let kept = 0;
  for (let i = 0; i < n; i++) kept += keep[i]!;
  const rows = new Int32Array(kept);
  for (let i = 0, k = 0; i < n; i++) if (keep[i]) rows[k++] = i;
  const pick = (v: Float64Array): Float64Array => {
    const o = new Float64Array(kept);
    for (let k = 0; k < kept; k++) o[k] = v[rows[k]!]!;
    return o;
  };
  const drops: DropReport = { inputRows: n, keptRows: kept, dropped, invalidRows, duplicates, duplicateRule };
  if (kept === 0) {
    throw new SurmiseError('dataset.empty', `no rows are left for target '${targetText}': ${formatDropReport(drops)}`, { drops });
  }

  // ---- labels carried for witness tables
  const labels: Record<string, string[]> = {};
  const labelNames = [...columns.filter((c) => c.kind === 'label').map((c) => c.name)];
  for (const l of spec.keepLabels ?? []) {
    if (!lookup(columns, l)) unknown('label column', l, names);
    if (!labelNames.includes(l)) labelNames.push(l);
  }
  for (const l of labelNames) {
    const r = lookup(columns, l)!;
    const c = r.col;
    const text: string[] = new Array(kept);
    for (let k = 0; k < kept; k++) {
      const i = rows[k]!;
      if (c.missing[i]) text[k] = '';
      else if (c.kind === 'label') text[k] = c.values[i]!;
      else if (c.kind === 'complex') text[k] = r.part === 're' ? String(c.re[i]) : r.part === 'im' ? String(c.im[i]) : complexText(c.re[i]!, c.im[i]!);
      else text[k] = String(c.values[i]);
    }
    labels[l] = text;
  }

  return {
    featureNames,
    groups,
    x: features.map((f) => pick(f.values)),
    y: pick(targetValues),
    targetName: targetText,
    targetKind: targetCol.kind === 'integer' ? 'integer' : 'real',
    rows,
    labels,
    drops,
    targetInputs: [...targetInputs].filter((c) => columns.some((col) => col.name === c)),
  };
}

function complexText(a: number, b: number): string {
  return `${a}${b < 0 || Object.is(b, -0) ? '-' : '+'}${Math.abs(b)}i`;
}

/**
 * Groups: each complex column is one group (X.re, X.im); each user group merges the groups of its
 * members; every other feature is a group of its own. Ordered by first member.
 */
function buildGroups(features: Feature[], userGroups: Record<string, string[]>, columns: Column[]): FeatureGroup[] {
  const groupOf = new Array<number>(features.length).fill(-1);
  const groupNames: string[] = [];
  // complex columns first
  features.forEach((f, k) => {
    const key = f.source.kind === 'complex' ? f.source.name : f.name;
    let g = groupNames.indexOf(key);
    if (g < 0 || f.source.kind !== 'complex') {
      g = groupNames.length;
      groupNames.push(key);
    }
    groupOf[k] = g;
  });
  const claimed = new Map<number, string>();
  const userGroup = new Set<number>();
  for (const [gname, members] of Object.entries(userGroups)) {
    if (!Array.isArray(members) || members.length === 0) {
      throw new SurmiseError('dataset.badGroup', `group '${gname}' lists no members`, { group: gname });
    }
    const idx: number[] = [];
    for (const m of members) {
      const hits = features.map((f, k) => (f.name === m || f.source.name === m ? k : -1)).filter((k) => k >= 0);
      if (hits.length === 0) {
        const isColumn = columns.some((c) => c.name === m);
        throw new SurmiseError(
          'dataset.unknownColumn',
          isColumn
            ? `group '${gname}' lists '${m}', which is not among the features`
            : `group '${gname}' lists '${m}', which is not a column${didYouMean(m, features.map((f) => f.name))}`,
          { group: gname, column: m },
        );
      }
      idx.push(...hits);
    }
    const target = groupNames.length;
    groupNames.push(gname);
    userGroup.add(target);
    for (const k of idx) {
      const other = claimed.get(k);
      if (other !== undefined && other !== gname) {
        throw new SurmiseError('dataset.badGroup', `feature '${features[k]!.name}' is in two groups: '${other}' and '${gname}'`, {
          group: gname,
        });
      }
      const old = groupOf[k]!;
      if (old !== target && userGroup.has(old)) {
        throw new SurmiseError('dataset.badGroup', `feature '${features[k]!.name}' is in two groups: '${groupNames[old]}' and '${gname}'`, {
          group: gname,
        });
      }
      claimed.set(k, gname);
      // move the whole current group of k (e.g. both parts of a complex column) into the user group
      for (let j = 0; j < features.length; j++) if (groupOf[j] === old) groupOf[j] = target;
    }
  }
  const out = new Map<number, FeatureGroup>();
  features.forEach((_, k) => {
    const g = groupOf[k]!;
    if (!out.has(g)) out.set(g, { name: groupNames[g]!, members: [] });
    out.get(g)!.members.push(k);
  });
  return [...out.values()];
}

/** A short human summary, e.g. "kept 9,812 of 10,000 rows; dropped 150 rows with bad values (ux: 120 missing; …) and 38 duplicates". */
export function formatDropReport(d: DropReport): string {
  const fmt = (x: number): string => x.toLocaleString('en-US');
  const parts: string[] = [`kept ${fmt(d.keptRows)} of ${fmt(d.inputRows)} rows`];
  if (d.invalidRows > 0) {
    const byCol = new Map<string, string[]>();
    for (const c of d.dropped) {
      const l = byCol.get(c.column) ?? [];
      l.push(`${fmt(c.rows)} ${c.reason}`);
      byCol.set(c.column, l);
    }
    const detail = [...byCol].map(([c, l]) => `${c}: ${l.join(', ')}`).join('; ');
    parts.push(`dropped ${fmt(d.invalidRows)} row${d.invalidRows === 1 ? '' : 's'} with missing or non-finite values (${detail})`);
  }
  if (d.duplicates > 0) parts.push(`dropped ${fmt(d.duplicates)} duplicate${d.duplicates === 1 ? '' : 's'}: ${d.duplicateRule}`);
  if (d.invalidRows === 0 && d.duplicates === 0) parts.push('nothing dropped');
  return parts.join('; ');
}
