/** Evaluates a parsed filter into the set of document slots it selects. */
import { Bitset } from './bitset';
import { badRequest } from './errors';
import { parseNumber } from './facets';
import { filterAttributes, FilterSyntaxError, parseFilter, type FilterInput, type FilterNode } from './filter';
import type { FakeIndex } from './store';

/** Filter errors carry the route's code: `invalid_search_filter` for search, `invalid_document_filter` for documents. */
type FilterErrorCode = 'invalid_search_filter' | 'invalid_document_filter';

class FilterValueError extends Error {}

function numberOrFail(value: string, attribute: string): number {
  const n = parseNumber(value);
  if (n === null) {
    throw new FilterValueError(
      `The filter \`${attribute}\` compares with \`${value}\`, which is not a number; range operators compare numbers.`,
    );
  }
  return n;
}

function evaluateNode(index: FakeIndex, node: FilterNode, live: Bitset): Bitset {
  const size = index.capacity;
  switch (node.kind) {
    case 'and':
      return node.children.map((child) => evaluateNode(index, child, live)).reduce((acc, set) => acc.and(set));
    case 'or':
      return node.children.map((child) => evaluateNode(index, child, live)).reduce((acc, set) => acc.or(set));
    case 'not':
      return evaluateNode(index, node.child, live).not().and(live);
    default:
      break;
  }
  const facet = index.facet(node.attribute);
  if (!facet) return new Bitset(size);
  switch (node.kind) {
    case 'compare':
      return compare(node, facet, size, live);
    case 'range':
      return facet.range(
        numberOrFail(node.from, node.attribute),
        true,
        numberOrFail(node.to, node.attribute),
        true,
        size,
      );
    case 'in':
      return facet.equals(node.values, size);
    case 'exists':
      return facet.exists(size);
    case 'isNull':
      return facet.isNull(size);
    case 'isEmpty':
      return facet.isEmpty(size);
  }
}

function compare(
  node: Extract<FilterNode, { kind: 'compare' }>,
  facet: NonNullable<ReturnType<FakeIndex['facet']>>,
  size: number,
  live: Bitset,
): Bitset {
  const { op, value, attribute } = node;
  if (op === '=') return facet.equals([value], size);
  if (op === '!=') return facet.equals([value], size).not().and(live);
  const n = numberOrFail(value, attribute);
  if (op === '>') return facet.range(n, false, Infinity, true, size);
  if (op === '>=') return facet.range(n, true, Infinity, true, size);
  if (op === '<') return facet.range(-Infinity, true, n, false, size);
  return facet.range(-Infinity, true, n, true, size);
}

function checkFilterable(index: FakeIndex, node: FilterNode, code: FilterErrorCode): void {
  for (const attribute of filterAttributes(node)) {
    if (!index.isFilterable(attribute)) {
      const available = index.settings.filterableAttributes;
      throw badRequest(
        code,
        available.length === 0
          ? `Attribute \`${attribute}\` is not filterable. This index does not have configured filterable attributes.`
          : `Attribute \`${attribute}\` is not filterable. Available filterable attributes are: \`${[...available].sort().join(', ')}\`.`,
      );
    }
  }
}

function isFilterInput(input: unknown): input is FilterInput {
  if (typeof input === 'string') return true;
  return (
    Array.isArray(input) &&
    input.every(
      (item) => typeof item === 'string' || (Array.isArray(item) && item.every((inner) => typeof inner === 'string')),
    )
  );
}

/** Parses a filter without evaluating it; null when it is empty. */
export function parseFilterOrFail(input: unknown, code: FilterErrorCode = 'invalid_search_filter'): FilterNode | null {
  if (!isFilterInput(input)) {
    throw badRequest(
      code,
      'Invalid value type at `.filter`: expected a string or an array of strings and arrays of strings',
    );
  }
  try {
    return parseFilter(input);
  } catch (error) {
    if (error instanceof FilterSyntaxError) throw badRequest(code, error.message);
    throw error;
  }
}

/** Parses and evaluates a filter; null when there is none. Syntax and attribute errors carry `code`. */
export function evaluateFilter(
  index: FakeIndex,
  input: unknown,
  code: FilterErrorCode = 'invalid_search_filter',
): Bitset | null {
  if (input === undefined || input === null) return null;
  const node = parseFilterOrFail(input, code);
  if (node === null) return null;
  checkFilterable(index, node, code);
  const live = index.liveSlots();
  try {
    return evaluateNode(index, node, live).and(live);
  } catch (error) {
    if (error instanceof FilterValueError) throw badRequest(code, error.message);
    throw error;
  }
}
