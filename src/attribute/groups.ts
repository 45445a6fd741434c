import type { FeatureGroup, RepeatScores } from './types.ts';
import { SurmiseError, didYouMean } from '../errors.ts';

/**
 * Default groups from feature names: `name.re` and `name.im` form the group `name` (one complex
 * column); any other feature is its own group. Order follows the first member's position.
 * @example defaultGroups(['a', 'za.re', 'za.im']) // [{name:'a',members:[0]}, {name:'za',members:[1,2]}]
 */
export function defaultGroups(featureNames: readonly string[]): FeatureGroup[] {
  const out: FeatureGroup[] = [];
  const byName = new Map<string, FeatureGroup>();
  featureNames.forEach((f, j) => {
    const m = /^(.*)\.(re|im)$/.exec(f);
    const name = m && featureNames.includes(`${m[1]}.${m[2] === 're' ? 'im' : 're'}`) ? m[1]! : f;
    let g = byName.get(name);
    if (!g) {
      g = { name, members: [] };
      byName.set(name, g);
      out.push(g);
    }
    g.members.push(j);
  });
  return out;
}

/**
 * Merge user-declared groups (name → member feature or column names) into the default grouping:
 * a declared member may be a feature (`za.re`) or a default group (`za`). A feature may belong
 * to one group only; unknown names are refused (code `attribute.unknownGroupMember`).
 */
export function declareGroups(
  featureNames: readonly string[],
  declared: Record<string, readonly string[]>,
  where = 'groups',
): FeatureGroup[] {
  const base = defaultGroups(featureNames);
  const owner = new Map<number, string>();
  const made: FeatureGroup[] = [];
  for (const [gname, members] of Object.entries(declared)) {
    const idx: number[] = [];
    for (const m of members) {
      const bg = base.find((g) => g.name === m);
      const j = featureNames.indexOf(m);
      const cols = bg ? bg.members : j >= 0 ? [j] : undefined;
      if (!cols) {
        throw new SurmiseError(
          'attribute.unknownGroupMember',
          `${where}: group '${gname}' names '${m}', which is not a feature${didYouMean(m, [...base.map((g) => g.name), ...featureNames])}`,
        );
      }
      for (const c of cols) {
        const prev = owner.get(c);
        if (prev !== undefined && prev !== gname) {
          throw new SurmiseError('attribute.overlappingGroups', `${where}: feature '${featureNames[c]}' is in both group '${prev}' and group '${gname}'`);
        }
        owner.set(c, gname);
        if (!idx.includes(c)) idx.push(c);
      }
    }
    made.push({ name: gname, members: idx });
  }
  const rest = base
    .map((g) => ({ name: g.name, members: g.members.filter((c) => !owner.has(c)) }))
    .filter((g) => g.members.length > 0);
  return [...made, ...rest];
}

/**
 * Group scores of a per-feature gradient method: the sum of the members' scores (for a complex
 * column, |∂f/∂re| + |∂f/∂im|; the L1 norm of the gradient restricted to the group). perRow is
 * summed the same way.
 */
export function sumOverGroups(rs: RepeatScores, p: number, groups: readonly FeatureGroup[]): RepeatScores {
  const G = groups.length;
  const scores = new Float64Array(G);
  groups.forEach((g, k) => {
    for (const j of g.members) scores[k] += rs.scores[j]!;
  });
  if (!rs.perRow) return { scores, n: rs.n };
  const perRow = new Float64Array(rs.n * G);
  for (let i = 0; i < rs.n; i++) {
    groups.forEach((g, k) => {
      let s = 0;
      for (const j of g.members) s += rs.perRow![i * p + j]!;
      perRow[i * G + k] = s;
    });
  }
  return { scores, perRow, n: rs.n };
}
