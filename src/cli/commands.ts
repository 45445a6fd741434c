import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { registerInspect } from './inspect.ts';
import { registerDemoData } from './demo-data.ts';
import { registerRank } from './rank.ts';
import { registerFit } from './fit.ts';
import { registerSearch } from './search.ts';
import { registerBound } from './bound.ts';
import { registerKnots } from './knots.ts';
import { registerRun } from './run.ts';
import { registerDemo } from './demo.ts';
import { registerRerun } from './rerun.ts';
import { registerCompare } from './compare.ts';
import { registerResidual } from './residual.ts';

/** Every command, in the order --help lists them. */
export const commandRegistrations: Array<(program: Command, io: CliIO) => void> = [
  registerInspect,
  registerDemoData,
  registerRank,
  registerFit,
  registerSearch,
  registerResidual,
  registerBound,
  registerKnots,
  registerRun,
  registerDemo,
  registerRerun,
  registerCompare,
];
