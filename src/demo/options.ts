/**
 * The options of generateDemoKnots (`surmise demo-data`): one table the library checks against and
 * the command builds its flags from. Where the table is written (`--out`, `--force`) is the
 * command's own business.
 */
import { seedOption, type OptionTable } from '../util/option-table.ts';

export const DEMO_DATA_OPTIONS: OptionTable = [
  {
    ...seedOption('seed of the twisted and random families and of the decoy column'),
    configAbsent: 'the demo table is made by its own command before any run; a run reads it like any other table',
  },
];
