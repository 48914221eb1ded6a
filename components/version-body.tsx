'use client';

import type { ComponentProps } from 'react';
import { RecipeDocumentView } from './recipe-document';
import { StatsPanel } from './stats-panel';

/*
 * The read-only recipe and its numbers, sent to the page as the version's document and stats
 * rather than as a rendered tree: the document is a few kilobytes of JSON, the tree of its
 * tables and bars several times that, and the smaller payload makes the page cheaper to serve.
 */

export function VersionDocument(props: ComponentProps<typeof RecipeDocumentView>) {
  return <RecipeDocumentView {...props} />;
}

export function VersionStats(props: ComponentProps<typeof StatsPanel>) {
  return <StatsPanel {...props} />;
}
