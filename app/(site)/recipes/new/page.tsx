import { eq } from 'drizzle-orm';
import type { Metadata } from 'next';
import { RecipeEditor } from '@/components/recipe-editor/recipe-editor';
import { db } from '@/db';
import { users } from '@/db/schema';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { starterDocument } from '@/lib/recipes/starter';

export const metadata: Metadata = { title: 'New recipe' };

export default async function NewRecipePage() {
  const viewer = await requirePageViewer('/recipes/new');
  const [settings] = await db
    .select({ volumeL: users.defaultBatchVolumeL, efficiencyPct: users.defaultEfficiencyPct })
    .from(users)
    .where(eq(users.id, viewer.id));
  return (
    <div>
      <h1 className="text-3xl font-semibold">New recipe</h1>
      <p className="mt-1 font-sans text-sm text-muted">The numbers update as you type. Saving makes version 1.</p>
      <div className="mt-6">
        <RecipeEditor
          mode="create"
          units={viewer.units}
          initialDocument={starterDocument(settings)}
          initialVisibility="public"
        />
      </div>
    </div>
  );
}
