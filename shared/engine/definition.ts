import { resolveDefinitionWith, type ResolvedDefinition } from './definition-core';
import { lookupEpsg } from './epsg';

export * from './definition-core';

/**
 * Resolves a PROJ string, "EPSG:n" (from the bundled index, no network) or WKT to the engine's
 * description of a projection. Throws an Error that names what is wrong.
 * Example: resolveDefinition('EPSG:5070').family.id === 'aea'.
 */
export function resolveDefinition(definition: string): ResolvedDefinition {
  return resolveDefinitionWith(definition, lookupEpsg);
}
