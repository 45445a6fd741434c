/**
 * The registered attribution methods (list.ts) and what is derived from them: the type
 * AttributionMethod and the names read by the library's check (rankFeatures, attributeRepeat),
 * `--method` (choices and help), the config key `attribution.methods`; the report names each
 * method of a result as the result names it.
 */
import { ATTRIBUTION_REGISTRY } from './list.ts';
import type { AttributionStrategy } from './strategy.ts';
import { SurmiseError } from '../../errors.ts';

export { ATTRIBUTION_REGISTRY };

export type AttributionMethod = (typeof ATTRIBUTION_REGISTRY)[number]['name'];

/** The method names, in registry order; the config schema's enum needs at least one. */
export const ATTRIBUTION_METHODS = Object.freeze(ATTRIBUTION_REGISTRY.map((m) => m.name)) as readonly [AttributionMethod, ...AttributionMethod[]];

/** The strategy of a registered method name; any other name is refused (`option.badValue`, as RANK_OPTIONS.methods). */
export function attributionStrategy(name: string): AttributionStrategy<AttributionMethod> {
  const s = ATTRIBUTION_REGISTRY.find((m) => m.name === name) as AttributionStrategy<AttributionMethod> | undefined;
  if (!s) throw new SurmiseError('option.badValue', `'${String(name)}' in \`methods\` is not an attribution method; expected ${ATTRIBUTION_METHODS.join(', ')}`, { option: 'methods' });
  return s;
}

export type { AttributionStrategy, MethodInput, MethodOutput, MethodSettings } from './strategy.ts';
