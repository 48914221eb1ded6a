import type { Metadata } from 'next';
import { RecipeEditor } from '@/components/recipe-editor/recipe-editor';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { getBrewhouseDefaultsByUserId } from '@/lib/community/settings';
import { starterDocument } from '@/lib/recipes/starter';

export const metadata: Metadata = { title: 'New recipe' };

export default async function NewRecipePage() {
  const viewer = await requirePageViewer('/recipes/new');
  const settings = await getBrewhouseDefaultsByUserId({ userId: viewer.id });
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
