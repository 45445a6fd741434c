/**
 * The options of a table of invariants (`surmise knots FILE`): one table that the library entry
 * (invariantsMany) checks against and the command builds its flags from. Where the table goes
 * (`--out`, `--join`/`--on`, `--force`, `--json`) is the command's own business.
 */
import type { OptionTable } from '../util/option-table.ts';
import { DIAGRAM_KINDS } from './parse.ts';
import { DEFAULT_INVARIANTS, INVARIANT_NAMES } from './invariants.ts';

const NO_RUN = 'knots make tables before any run; a run reads the table they write';

export const KNOTS_OPTIONS: OptionTable = [
  { key: 'kind', type: 'choice', choices: DIAGRAM_KINDS, default: null, configAbsent: NO_RUN, description: 'kind of every code (default: detected from each code)' },
  { key: 'column', type: 'text', default: null, configAbsent: NO_RUN, description: 'column of codes in a CSV/TSV/JSON table (default: code)' },
  { key: 'nameColumn', type: 'text', default: null, configAbsent: NO_RUN, description: 'column of names in a table (default: name)' },
  { key: 'invariants', type: 'list', min: 1, choices: INVARIANT_NAMES, noun: 'an invariant', default: DEFAULT_INVARIANTS, configAbsent: NO_RUN, description: `invariants to compute: ${INVARIANT_NAMES.join('|')}|all, or a comma list` },
  { key: 'omega', type: 'number', min: 0, max: 1, default: null, configAbsent: NO_RUN, description: 'Levine–Tristram signature at omega = exp(2 pi i x) (0.5: omega = -1); adds levine_tristram' },
  { key: 'prefix', type: 'text', default: null, configAbsent: NO_RUN, description: 'prefix for the new column names' },
  {
    key: 'workers', type: 'integer', min: 0, max: 64, default: 2, configAbsent: NO_RUN,
    description: 'worker threads for the hyperbolic invariants (0 or 1: this thread)',
    inert: 'decides only where the invariants are computed; the table is the same (tests/cli/knots-hyperbolic.test.ts)',
  },
];
