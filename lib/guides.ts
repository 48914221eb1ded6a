import 'server-only';
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { compileMDX } from 'next-mdx-remote/rsc';
import { cache, type ReactElement } from 'react';
import { guideComponents } from '@/components/guides/mdx-components';

const GUIDES_DIR = path.join(process.cwd(), 'content', 'guides');

export interface GuideMeta {
  slug: string;
  title: string;
  summary: string;
  order: number;
}

/** Slugs from the files in content/guides: `water.mdx` → `water`. */
export async function listGuideSlugs(): Promise<string[]> {
  const files = await readdir(GUIDES_DIR);
  return files.filter((f) => f.endsWith('.mdx')).map((f) => f.slice(0, -'.mdx'.length));
}

/**
 * One guide compiled from MDX. JavaScript in the content is never run: next-mdx-remote's
 * blockJS and blockDangerousJS stay on, so only Markdown and plain tags render. Cached per request,
 * so a guide's page and its metadata compile it once.
 */
export const loadGuide = cache(async (slug: string): Promise<{ meta: GuideMeta; content: ReactElement } | null> => {
  if (!/^[a-z0-9-]+$/.test(slug)) return null;
  let source: string;
  try {
    source = await readFile(path.join(GUIDES_DIR, `${slug}.mdx`), 'utf8');
  } catch {
    return null;
  }
  const { content, frontmatter } = await compileMDX<{ title: string; summary: string; order?: number }>({
    source,
    components: guideComponents,
    options: { parseFrontmatter: true, blockJS: true, blockDangerousJS: true },
  });
  return {
    meta: { slug, title: frontmatter.title, summary: frontmatter.summary, order: frontmatter.order ?? 99 },
    content,
  };
});

export async function listGuides(): Promise<GuideMeta[]> {
  const guides = await Promise.all((await listGuideSlugs()).map((slug) => loadGuide(slug)));
  return guides
    .filter((g): g is NonNullable<typeof g> => g !== null)
    .map((g) => g.meta)
    .sort((a, b) => a.order - b.order || a.title.localeCompare(b.title));
}
