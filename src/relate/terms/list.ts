/**
 * The one list of function families the formula search applies to terms, in the order they are
 * tried (the order decides which of two equal terms is kept). Adding a family: one file in this
 * folder exporting a FunctionFamily, and one entry here.
 */
import { abs } from './abs.ts';
import { cos } from './cos.ts';
import { exp } from './exp.ts';
import { log } from './log.ts';
import { sin } from './sin.ts';

export const FUNCTION_FAMILIES = [log, exp, sin, cos, abs] as const;
