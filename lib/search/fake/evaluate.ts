/** Evaluates a parsed filter into the set of document slots it selects. */
import { Bitset } from './bitset';
import { badRequest } from './errors';
import { parseNumber } from './facets';
import { filterAttributes, FilterSyntaxError, parseFilter, type FilterInput, type FilterNode } from './filter';
import type { FakeIndex } from './store';

const invalidFilter = (message: string) => badRequest('invalid_search_filter', message);

function numberOrFail(value: string, attribute: string): number {
  const n = parseNumber(value);
  if (n === null) {
    throw invalidFilter(
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

function checkFilterable(index: FakeIndex, node: FilterNode): void {
  for (const attribute of filterAttributes(node)) {
    if (!index.isFilterable(attribute)) {
      const available = index.settings.filterableAttributes;
      throw invalidFilter(
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

/** Parses and evaluates a filter; null when there is none. Syntax and attribute errors are `invalid_search_filter`. */
export function evaluateFilter(index: FakeIndex, input: unknown): Bitset | null {
  if (input === undefined || input === null) return null;
  if (!isFilterInput(input)) {
    throw invalidFilter(
      'Invalid value type at `.filter`: expected a string or an array of strings and arrays of strings',
    );
  }
  let node: FilterNode | null;
  try {
    node = parseFilter(input);
  } catch (error) {
    if (error instanceof FilterSyntaxError) throw invalidFilter(error.message);
    throw error;
  }
  if (node === null) return null;
  checkFilterable(index, node);
  const live = index.liveSlots();
  return evaluateNode(index, node, live).and(live);
}
