import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';

const slugs = readdirSync(new URL('../../content/guides', import.meta.url))
  .filter((f) => f.endsWith('.mdx'))
  .map((f) => f.replace(/\.mdx$/, ''));

/** The HTML of each formula section: from an h2 to the next h2. */
function sections(html: string): { heading: string; id?: string; body: string }[] {
  const parts = html.split(/<h2\b/).slice(1);
  return parts.map((part) => {
    const end = part.indexOf('</h2>');
    const id = /\bid="([^"]+)"/.exec(part.slice(0, end))?.[1];
    return { heading: part.slice(part.indexOf('>') + 1, end), id, body: part.slice(end) };
  });
}

describe('guides', () => {
  it('has every guide the product links to', () => {
    expect(slugs.sort()).toEqual([
      'carbonation',
      'designing',
      'dry-hopping',
      'fermentation',
      'hops',
      'numbers',
      'safety',
      'water',
    ]);
  });

  it('lists them on the index', async () => {
    const res = await new TestClient().fetch('/guides');
    expect(res.status).toBe(200);
    const html = await res.text();
    for (const slug of slugs) expect(html).toContain(`href="/guides/${slug}"`);
  });

  for (const slug of slugs) {
    it(`renders ${slug}, and every section with a formula names its source`, async () => {
      const res = await new TestClient().fetch(`/guides/${slug}`);
      expect(res.status).toBe(200);
      const html = await res.text();
      expect(html).toMatch(/<h1[^>]*>[^<]+<\/h1>/);
      for (const section of sections(html)) {
        if (section.body.includes('<pre')) expect(section.body, `${slug}: ${section.heading}`).toMatch(/Source:/);
      }
    });
  }

  it('has the anchors the numbers panel links to, each with its source', async () => {
    const html = await (await new TestClient().fetch('/guides/numbers')).text();
    const byId = new Map(sections(html).map((s) => [s.id, s]));
    for (const anchor of ['og', 'fg', 'abv', 'ibu', 'colour', 'water', 'carbonation', 'style-fit']) {
      expect(byId.get(anchor), anchor).toBeDefined();
      expect(byId.get(anchor)!.body, anchor).toMatch(/Source:/);
    }
  });

  it('has the anchors the design tools link to, each with its source', async () => {
    const html = await (await new TestClient().fetch('/guides/designing')).text();
    const byId = new Map(sections(html).map((s) => [s.id, s]));
    for (const anchor of ['water-targets', 'mash-ph', 'rest-temperature', 'spunding', 'fit']) {
      expect(byId.get(anchor), anchor).toBeDefined();
      expect(byId.get(anchor)!.body, anchor).toMatch(/Source:/);
    }
  });

  it('answers 404 for a guide that does not exist', async () => {
    expect((await new TestClient().fetch('/guides/no-such-guide')).status).toBe(404);
  });
});
