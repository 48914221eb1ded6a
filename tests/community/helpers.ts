import { expect } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '@/db';
import { comments, users } from '@/db/schema';
import type { TestClient } from '../helpers/http';

export interface CommentBody {
  comment: { id: string; state: string; parentId: string | null };
  held: boolean;
}

export async function commentVia(client: TestClient, recipeId: string, body: string, parentId?: string) {
  return client.post<CommentBody & { error?: { message: string; fields?: { path: string }[] } }>(
    `/api/recipes/${recipeId}/comments`,
    { body, parentId },
  );
}

export interface ListedComment {
  id: string;
  body: string;
  state: string;
  hiddenReason: string | null;
  authorHandle: string | null;
  replies: ListedComment[];
}

export async function commentsOf(client: TestClient, recipeId: string): Promise<ListedComment[]> {
  const res = await client.get<{ comments: ListedComment[] }>(`/api/recipes/${recipeId}/comments`);
  if (res.status !== 200) throw new Error(`comments: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.comments;
}

/** Makes an account look older than the new-member rule's window. */
export async function ageAccount(userId: string, days = 30): Promise<void> {
  await db
    .update(users)
    .set({ createdAt: new Date(Date.now() - days * 24 * 60 * 60 * 1000) })
    .where(eq(users.id, userId));
}

export async function backdateComment(commentId: string, minutes: number): Promise<void> {
  await db
    .update(comments)
    .set({ createdAt: new Date(Date.now() - minutes * 60_000) })
    .where(eq(comments.id, commentId));
}

/** The visible text of a served page: scripts, comments and tags removed, spaces collapsed. */
export function textOf(html: string): string {
  return html
    .replace(/<script[\s\S]*?<\/script>/gi, ' ')
    .replace(/<!--[\s\S]*?-->/g, '')
    .replace(/<[^>]+>/g, '')
    .replace(/&amp;/g, '&')
    .replace(/&quot;/g, '"')
    .replace(/&#x27;/g, "'")
    .replace(/\s+/g, ' ');
}

/** A member reports a recipe as spam and a moderator hides it through that report, as the moderation queue does. */
export async function hideRecipeThroughReport(
  reporter: TestClient,
  moderator: TestClient,
  recipeId: string,
): Promise<void> {
  const report = await reporter.post<{ id: string }>('/api/reports', {
    targetType: 'recipe',
    targetId: recipeId,
    reason: 'spam',
    note: '',
  });
  expect(report.status).toBe(201);
  const hide = await moderator.post(`/api/moderation/reports/${report.body.id}`, {
    action: 'hide',
    reason: 'Advertising',
  });
  expect(hide.status).toBe(200);
}
