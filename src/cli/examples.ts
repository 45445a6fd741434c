/**
 * Real examples that end each command's --help, run from the project folder (they read
 * demo-data/knots.csv and configs/demo.yaml). tests/cli/examples.test.ts runs every one of them in
 * order, in a scratch folder holding copies of those two files.
 */
export const EXAMPLES: Readonly<Record<string, readonly string[]>> = {
  inspect: [
    'surmise inspect demo-data/knots.csv',
    'surmise inspect demo-data/knots.csv --derive "b1=crossings - seifert_circles + 1" --json',
  ],
  'demo-data': ['surmise demo-data --out demo-data/knots.csv --force', 'surmise demo-data --seed 2 --out knots-seed2.csv'],
  rank: [
    'surmise rank demo-data/knots.csv --target signature --exclude seifert_circles --seeds 1 --epochs 5',
    'surmise rank demo-data/knots.csv --target signature --method permutation --seeds 1 --epochs 5 --json',
  ],
  fit: [
    'surmise fit demo-data/knots.csv --target genus_bound --terms "crossings; strands"',
    'surmise fit demo-data/knots.csv --target alexander_at_minus1 --terms "determinant*cos(pi*signature/2)" --no-intercept --json',
  ],
  search: [
    'surmise search demo-data/knots.csv --target genus_bound --from crossings,strands,writhe --max-terms 2',
    'surmise search demo-data/knots.csv --target signature --from writhe,levine_tristram_1_3 --powers -1..1 --json',
  ],
  bound: [
    'surmise bound demo-data/knots.csv --lhs "abs(signature)" --rhs "crossings - seifert_circles + 1" --rhs strands --by crossings',
    'surmise bound demo-data/knots.csv --lhs "abs(signature)" --rhs "2*alexander_degree" --skip-invalid --id name,family --top 3 --json',
  ],
  knots: [
    'surmise knots generate torus --p 2..3 --q 3..8 --coprime --out torus.txt',
    'surmise knots torus.txt --invariants all --omega 0.25',
    'surmise knots generate twist --braid "1 -2 1 -2" --on 1..2 --twists -3..3 --out twist.txt',
  ],
  run: ['surmise run configs/demo.yaml --out my-run'],
  demo: ['surmise demo', 'surmise demo --out my-demo --json'],
  rerun: ['surmise rerun my-run --table demo-data/knots.csv --out my-rerun'],
  compare: ['surmise compare my-run my-rerun', 'surmise compare my-run my-rerun --json'],
};

/** The help text after a command's options: its examples, two spaces in. */
export function examplesHelp(command: string): string {
  const list = EXAMPLES[command];
  return list && list.length > 0 ? `\nExamples:\n${list.map((e) => `  ${e}`).join('\n')}\n` : '';
}

/** An example's arguments after `surmise`, split at blanks outside double quotes. */
export function exampleArgs(example: string): string[] {
  const out: string[] = [];
  for (const m of example.replace(/^surmise\s+/, '').matchAll(/"([^"]*)"|(\S+)/g)) out.push(m[1] ?? m[2]!);
  return out;
}
