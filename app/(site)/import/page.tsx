import type { Metadata } from 'next';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { MAX_IMPORT_BYTES } from '@/lib/interchange/limits';
import { listRecipes } from '@/lib/recipes/listing';
import { ImportForm } from './_components/import-form';

export const metadata: Metadata = { title: 'Import a recipe' };

export default async function ImportPage() {
  const viewer = await requirePageViewer('/import');
  const { cards } = await listRecipes(viewer, { ownerHandle: viewer.handle });
  return (
    <div className="max-w-5xl">
      <h1 className="text-3xl font-semibold">Import a recipe</h1>
      <p className="mt-2 max-w-prose font-sans text-sm text-muted">
        Bring a recipe from a file in the open BeerXML 1.0 or BeerJSON 1.0 format. You will see it with
        Kettlefork&apos;s own numbers, and a list of anything we left out or had to assume, before anything is saved.
      </p>
      <ImportForm
        units={viewer.units}
        maxBytes={MAX_IMPORT_BYTES}
        ownRecipes={cards.map((c) => ({ id: c.id, title: c.title, headNumber: c.headNumber }))}
      />
    </div>
  );
}
