/**
 * Plain lower-case letters, digits and single dashes from any text (accents dropped, no dash at
 * either end), at most `maxLength` characters; an empty string when nothing usable is left.
 */
export function slugify(text: string, maxLength: number): string {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, maxLength)
    .replace(/-+$/g, '');
}
