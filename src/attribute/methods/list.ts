/**
 * The one list of attribution methods, in their default order. Adding a method: one file in this
 * folder exporting an AttributionStrategy, and one entry here. Everything else reads index.ts.
 */
import { integrated } from './integrated.ts';
import { permutation } from './permutation.ts';
import { saliency } from './saliency.ts';
import { smoothgrad } from './smoothgrad.ts';

export const ATTRIBUTION_REGISTRY = [saliency, smoothgrad, integrated, permutation] as const;
