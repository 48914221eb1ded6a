import { db } from '@/db';
import { comments, photos, type User } from '@/db/schema';
import { proposalFrom } from '../proposals/helpers';
import type { TestClient } from './http';
import { createRecipeVia } from './recipes';

/** Real rows of one signed-in member, so a request with a well-formed id reaches past "not found". */
export interface MemberWorld {
  recipeId: string;
  versionId: string;
  commentId: string;
  brewDayId: string;
  photoId: string;
  proposalId: string;
}

export async function memberWorld(client: TestClient, user: User): Promise<MemberWorld> {
  const recipe = await createRecipeVia(client);
  const day = await client.post<{ id: string }>('/api/brew-days', {
    versionId: recipe.version.id,
    brewedOn: '2026-02-01',
  });
  if (day.status !== 201) throw new Error(`brew day: ${day.status} ${JSON.stringify(day.body)}`);
  // Written straight to the database: the member's comment budget is for the requests under test.
  const [comment] = await db
    .insert(comments)
    .values({ recipeId: recipe.recipe.id, authorId: user.id, body: 'A comment' })
    .returning({ id: comments.id });
  const [photo] = await db
    .insert(photos)
    .values({
      brewDayId: day.body.id,
      uploaderId: user.id,
      displayKey: `world/${crypto.randomUUID()}`,
      thumbKey: `world/${crypto.randomUUID()}`,
      width: 10,
      height: 10,
      storedBytes: 10,
    })
    .returning({ id: photos.id });
  const proposal = await proposalFrom(client);
  return {
    recipeId: recipe.recipe.id,
    versionId: recipe.version.id,
    commentId: comment.id,
    brewDayId: day.body.id,
    photoId: photo.id,
    proposalId: proposal.id,
  };
}

/** The world's id for a route's [id] segment, by the resource the path names. */
export function worldIdFor(world: MemberWorld, routePath: string): string {
  const resource = routePath.split('/')[2];
  switch (resource) {
    case 'recipes':
      return world.recipeId;
    case 'versions':
      return world.versionId;
    case 'comments':
      return world.commentId;
    case 'brew-days':
      return world.brewDayId;
    case 'photos':
      return world.photoId;
    case 'proposals':
      return world.proposalId;
    default:
      // Moderation and admin paths: this member's own recipe stands in (they are refused before it matters).
      return routePath.includes('/comments/') ? world.commentId : world.recipeId;
  }
}
