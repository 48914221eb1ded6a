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
  const parser = new XMLParser({
    ignoreAttributes: true,
    parseTagValue: false,
    trimValues: true,
    ignoreDeclaration: true,
    ignorePiTags: true,
    // Only the five built-in XML entities and numeric references remain possible here.
    processEntities: true,
    htmlEntities: false,
    transformTagName: (name) => name.toUpperCase(),
    isArray: (name) => REPEATED.has(name.toUpperCase()),
  });
  return parser.parse(text) as Record<string, unknown>;
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
