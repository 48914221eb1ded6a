import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { assertWithinLimit } from './limits';
import { InterchangeError } from './types';

/**
 * Safe XML reading for BeerXML. A document type declaration is refused before the parser
 * sees the text: BeerXML needs none, and it is the door to external entities (XXE) and
 * entity expansion (billion laughs). The size is checked first of all.
 */
export function parseXmlSafely(text: string): Record<string, unknown> {
  assertWithinLimit(text);
  if (/<!DOCTYPE/i.test(text)) {
    throw new InterchangeError(
      'a document type declaration (<!DOCTYPE …>) is not allowed in a recipe file',
      'DOCTYPE',
      'unsafe',
    );
  }
  if (/<!ENTITY/i.test(text)) {
    throw new InterchangeError(
      'entity declarations (<!ENTITY …>) are not allowed in a recipe file',
      'ENTITY',
      'unsafe',
    );
  }
  const valid = XMLValidator.validate(text, { allowBooleanAttributes: true });
  if (valid !== true) {
    const { msg, line, col } = valid.err;
    throw new InterchangeError(`the XML is malformed: ${msg}`, `line ${line}, column ${col}`, 'malformed');
  }
  assertShallow(text);
  const parser = new XMLParser({
    ignoreAttributes: true,
    parseTagValue: false,
    trimValues: true,
    ignoreDeclaration: true,
    ignorePiTags: true,
    // Entities are decoded below in one pass (the parser's own pass would run before ours and
    // decode `&amp;#39;` twice). Declared entities never get this far: they are refused above.
    processEntities: false,
    htmlEntities: false,
    transformTagName: (name) => name.toUpperCase(),
    isArray: (name) => REPEATED.has(name.toUpperCase()),
    tagValueProcessor: (_name, value) => decodeReferences(value),
  });
  return parser.parse(text) as Record<string, unknown>;
}

/** BeerXML nests about five elements deep; a file nested deeper than this is not a recipe. */
const MAX_XML_DEPTH = 32;

/** Refuses a well-formed document nested deeper than MAX_XML_DEPTH, before the parser walks it. */
function assertShallow(text: string): void {
  const body = text.replace(/<!--[\s\S]*?-->|<!\[CDATA\[[\s\S]*?\]\]>|<\?[\s\S]*?\?>/g, '');
  let depth = 0;
  for (const tag of body.matchAll(/<(\/?)[^>]*?(\/?)>/g)) {
    if (tag[1]) depth--;
    else if (!tag[2]) depth++;
    if (depth > MAX_XML_DEPTH) {
      throw new InterchangeError(`the XML is nested more than ${MAX_XML_DEPTH} elements deep`, 'nesting', 'malformed');
    }
  }
}

const PREDEFINED: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

/**
 * Decodes XML's five predefined entities and its decimal and hexadecimal character references
 * (XML 1.0, §4.1 and §4.6) in one pass, so `&amp;#39;` stays the text `&#39;`.
 */
function decodeReferences(value: string): string {
  return value.replace(
    /&(?:(amp|lt|gt|quot|apos)|#x([0-9a-fA-F]{1,6})|#([0-9]{1,7}));/g,
    (ref, name: string | undefined, hex: string | undefined, dec: string | undefined) => {
      if (name) return PREDEFINED[name];
      const code = hex ? Number.parseInt(hex, 16) : Number(dec);
      // NUL, surrogates and values past Unicode's range name no character: keep the text as written.
      if (code === 0 || (code >= 0xd800 && code <= 0xdfff) || code > 0x10ffff) return ref;
      return String.fromCodePoint(code);
    },
  );
}

/** BeerXML record tags that may repeat inside their plural group. */
const REPEATED = new Set([
  'RECIPE',
  'HOP',
  'FERMENTABLE',
  'MISC',
  'YEAST',
  'WATER',
  'MASH_STEP',
  'STYLE',
  'EQUIPMENT',
  'MASH',
]);

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Appendix tags of BeerXML 1.0 are for display only and never data (the specification says so). */
const DISPLAY_ONLY = /^(DISPLAY_|INVENTORY$|VERSION$)/;

/**
 * One BeerXML record with the path that names it in messages. It remembers which tags were
 * read, so whatever else the record carried can be listed as dropped.
 */
export class XmlRecord {
  private readonly read = new Set<string>();

  constructor(
    readonly node: Record<string, unknown>,
    readonly path: string,
  ) {}

  at(tag: string): string {
    return `${this.path} › ${tag}`;
  }

  text(tag: string, opts: { required?: boolean } = {}): string | undefined {
    this.read.add(tag);
    const value = this.node[tag];
    if (value === undefined || value === '') {
      if (opts.required) throw new InterchangeError('is required', this.at(tag));
      return undefined;
    }
    if (typeof value !== 'string') throw new InterchangeError('must be text, not a group of elements', this.at(tag));
    return value;
  }

  num(tag: string, opts: { required?: boolean; min?: number } = {}): number | undefined {
    const raw = this.text(tag, opts);
    if (raw === undefined) return undefined;
    if (!NUMBER.test(raw)) throw new InterchangeError(`"${raw.slice(0, 40)}" is not a number`, this.at(tag));
    const value = Number(raw);
    if (opts.min !== undefined && value < opts.min) {
      throw new InterchangeError(
        opts.min === 0 ? `must not be negative (got ${raw})` : `must be at least ${opts.min} (got ${raw})`,
        this.at(tag),
      );
    }
    return value;
  }

  bool(tag: string): boolean | undefined {
    const raw = this.text(tag);
    if (raw === undefined) return undefined;
    if (/^true$/i.test(raw)) return true;
    if (/^false$/i.test(raw)) return false;
    throw new InterchangeError(`"${raw.slice(0, 40)}" is not TRUE or FALSE`, this.at(tag));
  }

  child(tag: string): XmlRecord | undefined {
    this.read.add(tag);
    const value = this.node[tag];
    const first = Array.isArray(value) ? value[0] : value;
    if (first === undefined || first === '') return undefined;
    if (typeof first !== 'object' || first === null) throw new InterchangeError('must be a record', this.at(tag));
    return new XmlRecord(first as Record<string, unknown>, this.at(tag));
  }

  /** The records of a plural group (`HOPS` › `HOP`), each named by its position and NAME. */
  list(group: string, item: string): XmlRecord[] {
    this.read.add(group);
    const container = this.node[group];
    if (container === undefined || container === '') return [];
    if (typeof container !== 'object' || container === null || Array.isArray(container)) {
      throw new InterchangeError(`must hold ${item} records`, this.at(group));
    }
    const items = (container as Record<string, unknown>)[item];
    if (items === undefined) return [];
    const list = Array.isArray(items) ? items : [items];
    return list.map((entry, index) => {
      const label = `${this.at(group)} › ${item} ${index + 1}`;
      if (typeof entry !== 'object' || entry === null) throw new InterchangeError('must be a record', label);
      const name = (entry as Record<string, unknown>).NAME;
      return new XmlRecord(
        entry as Record<string, unknown>,
        typeof name === 'string' && name ? `${label} (${name.slice(0, 60)})` : label,
      );
    });
  }

  markRead(...tags: string[]): void {
    for (const tag of tags) this.read.add(tag);
  }

  /** Tags with a value that no reader asked for (display-only appendix tags aside). */
  unread(): string[] {
    return Object.keys(this.node).filter(
      (tag) => !this.read.has(tag) && !DISPLAY_ONLY.test(tag) && this.node[tag] !== '',
    );
  }
}

export function escapeXml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}
