/**
 * Parser for the search engine's filter expression language.
 *
 * Grammar (NOT binds tighter than AND, AND tighter than OR):
 *   expression := or
 *   or         := and ("OR" and)*
 *   and        := not ("AND" not)*
 *   not        := "NOT" not | "(" expression ")" | condition
 *   condition  := attribute ( comparison value | value "TO" value | "EXISTS" | "NOT" "EXISTS"
 *                 | "IN" list | "NOT" "IN" list | "IS" ["NOT"] ("NULL" | "EMPTY") )
 *   list       := "[" [value ("," value)*] "]"
 * Attributes and values are bare words or quoted strings ('…' or "…", backslash escapes).
 * Keywords are upper case, as the engine documents them.
 */

export type Comparison = '=' | '!=' | '>' | '>=' | '<' | '<=';

export type FilterNode =
  | { kind: 'and'; children: FilterNode[] }
  | { kind: 'or'; children: FilterNode[] }
  | { kind: 'not'; child: FilterNode }
  | { kind: 'compare'; attribute: string; op: Comparison; value: string }
  | { kind: 'range'; attribute: string; from: string; to: string }
  | { kind: 'in'; attribute: string; values: string[] }
  | { kind: 'exists'; attribute: string }
  | { kind: 'isNull'; attribute: string }
  | { kind: 'isEmpty'; attribute: string };

/** What the HTTP layer accepts as `filter`: a string, or an array meaning AND of elements (nested array = OR). */
export type FilterInput = string | Array<string | string[]>;

export class FilterSyntaxError extends Error {
  constructor(
    message: string,
    readonly source: string,
    readonly position: number,
  ) {
    super(`${message}\n${position + 1}:${source.length + 1} ${source}`);
    this.name = 'FilterSyntaxError';
  }
}

type Token =
  | { type: 'word'; text: string; quoted: boolean; start: number }
  | { type: 'op'; text: Comparison; start: number }
  | { type: 'punct'; text: '(' | ')' | '[' | ']' | ','; start: number }
  | { type: 'end'; start: number };

const PUNCTUATION = new Set(['(', ')', '[', ']', ',']);
const WORD_STOP = /[\s()[\],=!<>'"]/;

function readQuoted(source: string, start: number): { text: string; end: number } {
  const quote = source[start];
  let text = '';
  for (let i = start + 1; i < source.length; i++) {
    const ch = source[i];
    if (ch === '\\' && i + 1 < source.length) {
      text += source[i + 1];
      i++;
    } else if (ch === quote) {
      return { text, end: i + 1 };
    } else {
      text += ch;
    }
  }
  throw new FilterSyntaxError(`Expression \`${source.slice(start)}\` is missing the closing quote`, source, start);
}

function readOperator(source: string, i: number): Comparison | null {
  const two = source.slice(i, i + 2);
  if (two === '!=' || two === '>=' || two === '<=') return two;
  const one = source[i];
  if (one === '=' || one === '>' || one === '<') return one;
  return null;
}

export function tokenize(source: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < source.length) {
    const ch = source[i];
    if (/\s/.test(ch)) {
      i++;
    } else if (PUNCTUATION.has(ch)) {
      tokens.push({ type: 'punct', text: ch as '(' | ')' | '[' | ']' | ',', start: i });
      i++;
    } else if (ch === '"' || ch === "'") {
      const { text, end } = readQuoted(source, i);
      tokens.push({ type: 'word', text, quoted: true, start: i });
      i = end;
    } else {
      const op = readOperator(source, i);
      if (op) {
        tokens.push({ type: 'op', text: op, start: i });
        i += op.length;
      } else if (ch === '!') {
        throw new FilterSyntaxError(`Unexpected character \`!\` at \`${source.slice(i)}\``, source, i);
      } else {
        let end = i;
        while (end < source.length && !WORD_STOP.test(source[end])) end++;
        tokens.push({ type: 'word', text: source.slice(i, end), quoted: false, start: i });
        i = end;
      }
    }
  }
  tokens.push({ type: 'end', start: source.length });
  return tokens;
}

const EXPECTED_OPERATION =
  'Was expecting an operation `=`, `!=`, `>=`, `>`, `<=`, `<`, `IN`, `NOT IN`, `TO`, `EXISTS`, `NOT EXISTS`, `IS NULL`, `IS NOT NULL`, `IS EMPTY`, `IS NOT EMPTY`';
const EXPECTED_VALUE = 'Was expecting a value';

class Parser {
  private index = 0;

  constructor(
    private readonly source: string,
    private readonly tokens: Token[],
  ) {}

  parse(): FilterNode {
    const node = this.parseOr();
    const next = this.peek();
    if (next.type !== 'end') this.fail(`Found unexpected characters at the end of the filter: \`${this.rest()}\``);
    return node;
  }

  private peek(offset = 0): Token {
    return this.tokens[Math.min(this.index + offset, this.tokens.length - 1)];
  }

  private next(): Token {
    const token = this.peek();
    this.index++;
    return token;
  }

  private rest(): string {
    return this.source.slice(this.peek().start);
  }

  private fail(message: string): never {
    throw new FilterSyntaxError(message, this.source, this.peek().start);
  }

  private isKeyword(word: string, offset = 0): boolean {
    const token = this.peek(offset);
    return token.type === 'word' && !token.quoted && token.text === word;
  }

  private isPunct(text: string): boolean {
    const token = this.peek();
    return token.type === 'punct' && token.text === text;
  }

  private parseOr(): FilterNode {
    const children = [this.parseAnd()];
    while (this.isKeyword('OR')) {
      this.next();
      children.push(this.parseAnd());
    }
    return children.length === 1 ? children[0] : { kind: 'or', children };
  }

  private parseAnd(): FilterNode {
    const children = [this.parseNot()];
    while (this.isKeyword('AND')) {
      this.next();
      children.push(this.parseNot());
    }
    return children.length === 1 ? children[0] : { kind: 'and', children };
  }

  private parseNot(): FilterNode {
    if (this.isKeyword('NOT')) {
      this.next();
      return { kind: 'not', child: this.parseNot() };
    }
    if (this.isPunct('(')) {
      this.next();
      const inner = this.parseOr();
      if (!this.isPunct(')')) this.fail(`Expression \`${this.rest()}\` is missing the closing parenthesis`);
      this.next();
      return inner;
    }
    return this.parseCondition();
  }

  private parseValue(): string {
    const token = this.peek();
    if (token.type !== 'word') this.fail(`${EXPECTED_VALUE} but instead got \`${this.rest()}\``);
    this.next();
    return (token as { text: string }).text;
  }

  private parseList(): string[] {
    if (!this.isPunct('[')) this.fail(`Expected \`[\` after \`IN\` keyword at \`${this.rest()}\``);
    this.next();
    const values: string[] = [];
    while (!this.isPunct(']')) {
      values.push(this.parseValue());
      if (this.isPunct(',')) this.next();
      else if (!this.isPunct(']')) this.fail(`Expected matching \`]\` after the list at \`${this.rest()}\``);
    }
    this.next();
    return values;
  }

  private parseCondition(): FilterNode {
    const attributeToken = this.peek();
    if (attributeToken.type !== 'word' || (!attributeToken.quoted && isReserved(attributeToken.text))) {
      this.fail(`${EXPECTED_OPERATION} at \`${this.rest()}\``);
    }
    const attribute = this.parseValue();
    const token = this.peek();
    if (token.type === 'op') {
      this.next();
      return { kind: 'compare', attribute, op: token.text, value: this.parseValue() };
    }
    if (this.isKeyword('EXISTS')) {
      this.next();
      return { kind: 'exists', attribute };
    }
    if (this.isKeyword('IN')) {
      this.next();
      return { kind: 'in', attribute, values: this.parseList() };
    }
    if (this.isKeyword('NOT')) return this.parseNegatedCondition(attribute);
    if (this.isKeyword('IS')) return this.parseIsCondition(attribute);
    if (token.type === 'word' && this.isKeyword('TO', 1)) {
      const from = this.parseValue();
      this.next();
      return { kind: 'range', attribute, from, to: this.parseValue() };
    }
    return this.fail(`${EXPECTED_OPERATION} at \`${this.source.slice(attributeToken.start)}\``);
  }

  private parseNegatedCondition(attribute: string): FilterNode {
    this.next();
    if (this.isKeyword('EXISTS')) {
      this.next();
      return { kind: 'not', child: { kind: 'exists', attribute } };
    }
    if (this.isKeyword('IN')) {
      this.next();
      return { kind: 'not', child: { kind: 'in', attribute, values: this.parseList() } };
    }
    return this.fail(`${EXPECTED_OPERATION} at \`${this.rest()}\``);
  }

  private parseIsCondition(attribute: string): FilterNode {
    this.next();
    const negated = this.isKeyword('NOT');
    if (negated) this.next();
    let node: FilterNode;
    if (this.isKeyword('NULL')) node = { kind: 'isNull', attribute };
    else if (this.isKeyword('EMPTY')) node = { kind: 'isEmpty', attribute };
    else return this.fail(`Was expecting \`NULL\` or \`EMPTY\` at \`${this.rest()}\``);
    this.next();
    return negated ? { kind: 'not', child: node } : node;
  }
}

const RESERVED = new Set(['AND', 'OR', 'NOT', 'TO', 'IN', 'EXISTS', 'IS']);

function isReserved(word: string): boolean {
  return RESERVED.has(word);
}

/** Parses one filter string; an empty or blank string means "no filter" and yields null. */
export function parseFilterString(source: string): FilterNode | null {
  if (source.trim() === '') return null;
  return new Parser(source, tokenize(source)).parse();
}

function combine(kind: 'and' | 'or', nodes: FilterNode[]): FilterNode | null {
  if (nodes.length === 0) return null;
  return nodes.length === 1 ? nodes[0] : { kind, children: nodes };
}

/** Parses the string or array form; array elements are ANDed, a nested array's elements ORed. */
export function parseFilter(input: FilterInput): FilterNode | null {
  if (typeof input === 'string') return parseFilterString(input);
  const parts = input.map((element) => {
    const inner = Array.isArray(element) ? element : [element];
    const nodes = inner.map(parseFilterString).filter((node): node is FilterNode => node !== null);
    return combine('or', nodes);
  });
  return combine(
    'and',
    parts.filter((node): node is FilterNode => node !== null),
  );
}

/** Every attribute a filter tree names, so the caller can check them against the filterable list. */
export function filterAttributes(node: FilterNode): string[] {
  switch (node.kind) {
    case 'and':
    case 'or':
      return node.children.flatMap(filterAttributes);
    case 'not':
      return filterAttributes(node.child);
    default:
      return [node.attribute];
  }
}
