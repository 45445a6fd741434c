/** Moved to options.ts (defaults and ranges together); kept so that imports of this path still work. */
export { RANK_LIMITS } from './options.ts';
