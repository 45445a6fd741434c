/**
 * The one list of base-quantity families, in the order their quantities enter the search (the
 * order decides which of two equal terms is kept). Adding a family: one file in this folder
 * exporting a BaseFamily, and one entry here.
 */
import { column } from './column.ts';
import { complexParts } from './complex-parts.ts';
import { quotients } from './quotients.ts';

export const BASE_FAMILIES = [column, complexParts, quotients] as const;
