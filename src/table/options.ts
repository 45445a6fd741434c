/**
 * The options of profileTable (the `inspect` command): one table that the library checks against
 * and the command builds its flags from. The reading options every command shares (`--format`,
 * `--kind`, `--complex-pairs`, `--derive`) belong to readTable and withDerived, not to this table.
 */
import { seedOption, type OptionTable } from '../util/option-table.ts';

const NO_RUN = 'inspect looks at a table before any run; a run has no inspect step';

export const INSPECT_OPTIONS: OptionTable = [
  // three rows at least: on two, every rank correlation is ±1
  { key: 'sampleRows', type: 'integer', min: 3, max: 10_000_000, default: 200_000, configAbsent: NO_RUN, description: 'rows the rank correlations are computed on; a larger table is sampled with a fixed seed' },
  { ...seedOption('seed of the rows sampled for the rank correlations'), configAbsent: NO_RUN },
];
