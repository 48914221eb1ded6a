import Ajv, { type ErrorObject } from 'ajv';
import beer from '@beerjson/beerjson/json/beer.json';
import boil from '@beerjson/beerjson/json/boil.json';
import boilStep from '@beerjson/beerjson/json/boil_step.json';
import culture from '@beerjson/beerjson/json/culture.json';
import equipment from '@beerjson/beerjson/json/equipment.json';
import fermentable from '@beerjson/beerjson/json/fermentable.json';
import fermentation from '@beerjson/beerjson/json/fermentation.json';
import fermentationStep from '@beerjson/beerjson/json/fermentation_step.json';
import hop from '@beerjson/beerjson/json/hop.json';
import mash from '@beerjson/beerjson/json/mash.json';
import mashStep from '@beerjson/beerjson/json/mash_step.json';
import units from '@beerjson/beerjson/json/measureable_units.json';
import misc from '@beerjson/beerjson/json/misc.json';
import packaging from '@beerjson/beerjson/json/packaging.json';
import packagingGraphic from '@beerjson/beerjson/json/packaging_graphic.json';
import packagingVessel from '@beerjson/beerjson/json/packaging_vessel.json';
import recipe from '@beerjson/beerjson/json/recipe.json';
import style from '@beerjson/beerjson/json/style.json';
import timing from '@beerjson/beerjson/json/timing.json';
import water from '@beerjson/beerjson/json/water.json';

/**
 * The published BeerJSON 1.0 JSON schema (draft-07), as the BeerJSON project ships it in
 * its npm package (@beerjson/beerjson, MIT licence; see README.md beside this file).
 * The files refer to each other by relative `$ref`s under the schema's `$id` base, so each
 * is registered before the root (`beer.json`) is compiled.
 */
const PARTS: object[] = [
  boil,
  boilStep,
  culture,
  equipment,
  fermentable,
  fermentation,
  fermentationStep,
  hop,
  mash,
  mashStep,
  units,
  misc,
  packaging,
  packagingGraphic,
  packagingVessel,
  recipe,
  style,
  timing,
  water,
];

type Validator = ((data: unknown) => boolean) & { errors?: ErrorObject[] | null };

let compiled: Validator | null = null;

function validator(): Validator {
  if (compiled) return compiled;
  // strict off: the published files use `description` beside `$ref` and other draft-07 habits ajv's strict mode flags.
  const ajv = new Ajv({ allErrors: true, strict: false });
  for (const part of PARTS) ajv.addSchema(part);
  compiled = ajv.compile(beer);
  return compiled;
}

export interface SchemaProblem {
  /** Where in the file, as a dotted path (`beerjson.recipes[0].batch_size.unit`). */
  path: string;
  message: string;
}

/** Null when the data satisfies the BeerJSON 1.0 schema, else its most specific problem. */
export function checkBeerJsonSchema(data: unknown): SchemaProblem | null {
  const validate = validator();
  if (validate(data)) return null;
  const errors = validate.errors ?? [];
  // The deepest path is the most specific one; `oneOf` and `allOf` wrappers only repeat it.
  const best = [...errors].sort((a, b) => depth(b) - depth(a) || rank(a) - rank(b))[0];
  if (!best) return { path: 'beerjson', message: 'does not match the BeerJSON 1.0 schema' };
  if (best.keyword === 'enum') {
    // A `oneOf` of mass and volume gives one enum error per branch: offer every allowed value.
    const allowed = errors
      .filter((e) => e.keyword === 'enum' && e.instancePath === best.instancePath)
      .flatMap((e) => (e.params as { allowedValues: unknown[] }).allowedValues ?? []);
    const given = JSON.stringify(instanceAt(data, best.instancePath));
    return {
      path: pointerToPath(best.instancePath, best),
      message: `${given ?? 'this value'} is not allowed; use one of: ${[...new Set(allowed)].join(', ')}`,
    };
  }
  return { path: pointerToPath(best.instancePath, best), message: describeError(best) };
}

function depth(error: ErrorObject): number {
  return (
    error.instancePath.split('/').length +
    (error.keyword === 'additionalProperties' || error.keyword === 'required' ? 1 : 0)
  );
}

function rank(error: ErrorObject): number {
  return ['enum', 'type', 'required', 'additionalProperties'].includes(error.keyword) ? 0 : 1;
}

function pointerToPath(pointer: string, error: ErrorObject): string {
  const parts = pointer
    .split('/')
    .slice(1)
    .map((p) => p.replace(/~1/g, '/').replace(/~0/g, '~'));
  if (error.keyword === 'required') parts.push(String((error.params as { missingProperty: string }).missingProperty));
  if (error.keyword === 'additionalProperties')
    parts.push(String((error.params as { additionalProperty: string }).additionalProperty));
  return (
    parts.reduce((path, part) => (/^\d+$/.test(part) ? `${path}[${part}]` : path ? `${path}.${part}` : part), '') ||
    '(root)'
  );
}

function describeError(error: ErrorObject): string {
  switch (error.keyword) {
    case 'required':
      return 'is required by the BeerJSON 1.0 schema';
    case 'additionalProperties':
      return 'is not a field the BeerJSON 1.0 schema allows here';
    case 'enum':
      return `must be one of: ${((error.params as { allowedValues: unknown[] }).allowedValues ?? []).join(', ')}`;
    case 'type':
      return `must be ${(error.params as { type: string }).type === 'integer' ? 'a whole number' : `of type ${(error.params as { type: string }).type}`}`;
    default:
      return `${error.message ?? 'is not valid'} (BeerJSON 1.0 schema)`;
  }
}

function instanceAt(data: unknown, pointer: string): unknown {
  let node = data;
  for (const part of pointer.split('/').slice(1)) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string, unknown>)[part.replace(/~1/g, '/').replace(/~0/g, '~')];
  }
  return node;
}
