'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { toast } from 'sonner';
import { z } from 'zod';
import { onlyFields, setServerErrors } from '@/components/form-errors';
import { describedBy } from '@/components/form-field';
import { Markdown } from '@/components/markdown';
import { RecipeDocumentView } from '@/components/recipe-document';
import { StatsPanel } from '@/components/stats-panel';
import type { RecipeDocument, RecipeStats, UnitSystem } from '@/lib/brewing';
import { requestJson } from '@/lib/http/client';
import { importFileSchema, updateRecipeSchema } from '@/lib/recipes/schemas';

interface PreviewRecipe {
  document: RecipeDocument;
  stats: RecipeStats;
  dropped: string[];
  guessed: string[];
}

interface Preview {
  format: 'beerxml' | 'beerjson';
  recipes: PreviewRecipe[];
}

/** The preview form: "work it out" is an empty choice, which the request leaves out. */
type FileValues = { text: string; format: '' | 'beerxml' | 'beerjson' };
type FileRequest = z.output<typeof importFileSchema>;

/** Where to save: a new recipe (with who may see it), or a new version of one of the member's recipes. */
const saveChoiceSchema = updateRecipeSchema.extend({ target: z.string() });
type SaveChoice = z.infer<typeof saveChoiceSchema>;

const FORMAT_WORDS = { beerxml: 'BeerXML 1.0', beerjson: 'BeerJSON 1.0' } as const;

const schemaResolver = zodResolver(importFileSchema);
/** The empty choice is sent as no format; the options only name the form's fields, which both shapes share. */
const fileResolver: Resolver<FileValues, unknown, FileRequest> = (values, context, options) =>
  schemaResolver(
    { ...values, format: values.format || undefined },
    context,
    options as unknown as Parameters<typeof schemaResolver>[2],
  );

/** Paste or upload, preview with our numbers, choose a recipe, save it. */
export function ImportForm({
  units,
  maxBytes,
  ownRecipes,
}: {
  units: UnitSystem;
  maxBytes: number;
  ownRecipes: { id: string; title: string; headNumber: number }[];
}) {
  const router = useRouter();
  const [fileError, setFileError] = useState<string>();
  const [preview, setPreview] = useState<Preview>();
  const [previewError, setPreviewError] = useState<string>();
  const [chosen, setChosen] = useState(0);
  const [saveError, setSaveError] = useState<string>();

  const fileForm = useForm<FileValues, unknown, FileRequest>({
    resolver: fileResolver,
    defaultValues: { text: '', format: '' },
  });
  const text = useWatch({ control: fileForm.control, name: 'text' });
  const fileErrors = fileForm.formState.errors;

  const saveForm = useForm<SaveChoice>({
    resolver: zodResolver(saveChoiceSchema),
    defaultValues: { target: 'new', visibility: 'private' },
  });
  const target = useWatch({ control: saveForm.control, name: 'target' });
  const saveErrors = saveForm.formState.errors;

  const onPreview = fileForm.handleSubmit(async (values) => {
    setPreviewError(undefined);
    setSaveError(undefined);
    const result = await requestJson<Preview>('/api/import', 'POST', values);
    if (!result.ok) {
      setServerErrors(fileForm.setError, result.fields, onlyFields('text', 'format'));
      setPreviewError(result.message);
      return;
    }
    setPreview(result.data);
    setChosen(0);
  });

  const onSave = saveForm.handleSubmit(async ({ target, visibility }) => {
    setSaveError(undefined);
    if (!preview) return;
    const document = preview.recipes[chosen].document;
    const message = `Imported from ${FORMAT_WORDS[preview.format]}`;
    let result;
    if (target === 'new') {
      result = await requestJson<{ recipe: { slug: string } }>('/api/recipes', 'POST', {
        document,
        visibility,
        message,
      });
    } else {
      const history = await requestJson<{ versions: { id: string }[] }>(`/api/recipes/${target}/versions`, 'GET');
      if (!history.ok || !history.data.versions[0]) {
        setSaveError(history.ok ? 'That recipe has no version to build on.' : history.message);
        return;
      }
      result = await requestJson<{ recipe: { slug: string } }>(`/api/recipes/${target}/versions`, 'POST', {
        document,
        baseVersionId: history.data.versions[0].id,
        message,
      });
    }
    if (!result.ok) {
      // Only who may see it is the member's choice here; the rest belongs to the file.
      setServerErrors(saveForm.setError, result.fields, onlyFields('visibility'));
      setSaveError(result.message);
      return;
    }
    toast.success('Imported and saved.');
    router.push(`/recipes/${result.data.recipe.slug}`);
  });

  async function readFile(file: File | undefined) {
    setFileError(undefined);
    if (!file) return;
    if (file.size > maxBytes) {
      setFileError(
        `This file is ${(file.size / (1024 * 1024)).toFixed(1)} MB; the largest we import is ${maxBytes / (1024 * 1024)} MB.`,
      );
      return;
    }
    fileForm.setValue('text', await file.text(), { shouldDirty: true });
    if (/\.xml$/i.test(file.name)) fileForm.setValue('format', 'beerxml');
    else if (/\.json$/i.test(file.name)) fileForm.setValue('format', 'beerjson');
  }

  const recipes = preview?.recipes ?? [];
  const current = recipes[chosen];
  return (
    <div className="mt-6 space-y-8">
      <form className="kf-card space-y-4" aria-label="Recipe file" noValidate onSubmit={onPreview}>
        <div>
          <label htmlFor="import-file" className="kf-label">
            Choose a file
          </label>
          <input
            id="import-file"
            type="file"
            accept=".xml,.json,application/xml,text/xml,application/json"
            className="block font-sans text-sm"
            aria-describedby="import-file-hint"
            onChange={(e) => void readFile(e.target.files?.[0])}
          />
          <p id="import-file-hint" className="mt-1 font-sans text-xs text-muted">
            A BeerXML (.xml) or BeerJSON (.json) file of at most {maxBytes / (1024 * 1024)} MB.
          </p>
          {fileError && (
            <p role="alert" className="kf-field-error">
              {fileError}
            </p>
          )}
        </div>
        <div>
          <label htmlFor="import-text" className="kf-label">
            Or paste its text
          </label>
          <textarea
            id="import-text"
            className="kf-input min-h-48 font-mono text-sm"
            spellCheck={false}
            aria-invalid={Boolean(fileErrors.text) || undefined}
            aria-describedby={fileErrors.text ? 'import-text-error' : previewError ? 'import-preview-error' : undefined}
            placeholder='<RECIPES> … </RECIPES>  or  { "beerjson": … }'
            {...fileForm.register('text')}
          />
          {fileErrors.text && (
            <p id="import-text-error" role="alert" className="kf-field-error">
              {fileErrors.text.message}
            </p>
          )}
        </div>
        <div className="max-w-xs">
          <label htmlFor="import-format" className="kf-label">
            Format
          </label>
          <select
            id="import-format"
            className="kf-input"
            aria-invalid={Boolean(fileErrors.format) || undefined}
            aria-describedby={describedBy('import-format', fileErrors.format?.message)}
            {...fileForm.register('format')}
          >
            <option value="">Work it out from the text</option>
            <option value="beerxml">BeerXML 1.0</option>
            <option value="beerjson">BeerJSON 1.0</option>
          </select>
          {fileErrors.format && (
            <p id="import-format-error" role="alert" className="kf-field-error">
              {fileErrors.format.message}
            </p>
          )}
        </div>
        {previewError && (
          <p
            id="import-preview-error"
            role="alert"
            className="rounded-md border border-danger/40 bg-danger/5 p-3 font-sans text-sm text-danger"
          >
            {previewError}
          </p>
        )}
        <button type="submit" className="kf-btn" disabled={!text.trim() || fileForm.formState.isSubmitting}>
          {fileForm.formState.isSubmitting ? 'Reading…' : 'Preview'}
        </button>
      </form>

      {current && (
        <section aria-labelledby="import-preview-title" className="space-y-6">
          <h2 id="import-preview-title" className="text-2xl font-semibold">
            Preview: {current.document.title}
          </h2>
          {recipes.length > 1 && (
            <fieldset className="kf-card">
              <legend className="font-sans text-sm font-semibold">
                This file holds {recipes.length} recipes. Choose one to save:
              </legend>
              <div className="mt-2 space-y-1 font-sans text-sm">
                {recipes.map((r, i) => (
                  <label key={i} className="flex items-center gap-2">
                    <input type="radio" name="import-choice" checked={i === chosen} onChange={() => setChosen(i)} />
                    {r.document.title}
                  </label>
                ))}
              </div>
            </fieldset>
          )}
          <div className="grid gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
            <RecipeDocumentView
              doc={current.document}
              units={units}
              notes={<Markdown source={current.document.notes} className="mt-2 leading-relaxed" />}
            />
            <aside className="space-y-6">
              <div className="kf-card">
                <h3 className="text-lg font-semibold">Kettlefork&apos;s numbers</h3>
                <div className="mt-3">
                  <StatsPanel stats={current.stats} units={units} />
                </div>
              </div>
              <ChangeList
                title="Left out"
                empty="Nothing: every part of the recipe was read."
                items={current.dropped}
              />
              <ChangeList title="Assumed" empty="Nothing: the file gave every value we need." items={current.guessed} />
              <form className="kf-card space-y-3" aria-label="Save the imported recipe" noValidate onSubmit={onSave}>
                <h3 className="text-lg font-semibold">Save it</h3>
                <div>
                  <label htmlFor="import-target" className="kf-label">
                    Save as
                  </label>
                  <select id="import-target" className="kf-input" {...saveForm.register('target')}>
                    <option value="new">A new recipe</option>
                    {ownRecipes.map((r) => (
                      <option key={r.id} value={r.id}>
                        A new version of {r.title} (after version {r.headNumber})
                      </option>
                    ))}
                  </select>
                </div>
                {target === 'new' && (
                  <div>
                    <label htmlFor="import-visibility" className="kf-label">
                      Who can see it
                    </label>
                    <select
                      id="import-visibility"
                      className="kf-input"
                      aria-invalid={Boolean(saveErrors.visibility) || undefined}
                      aria-describedby={describedBy('import-visibility', saveErrors.visibility?.message)}
                      {...saveForm.register('visibility')}
                    >
                      <option value="private">Only me (you can share it later)</option>
                      <option value="unlisted">Only people with the link</option>
                      <option value="public">Everyone</option>
                    </select>
                    {saveErrors.visibility && (
                      <p id="import-visibility-error" role="alert" className="kf-field-error">
                        {saveErrors.visibility.message}
                      </p>
                    )}
                  </div>
                )}
                {saveError && (
                  <p role="alert" className="kf-field-error">
                    {saveError}
                  </p>
                )}
                <button type="submit" className="kf-btn" disabled={saveForm.formState.isSubmitting}>
                  {saveForm.formState.isSubmitting ? 'Saving…' : 'Save'}
                </button>
              </form>
            </aside>
          </div>
        </section>
      )}
    </div>
  );
}

function ChangeList({ title, empty, items }: { title: string; empty: string; items: string[] }) {
  return (
    <div className="kf-card">
      <h3 className="text-lg font-semibold">
        {title} ({items.length})
      </h3>
      {items.length === 0 ? (
        <p className="mt-2 font-sans text-sm text-muted">{empty}</p>
      ) : (
        <ul className="mt-2 list-disc space-y-1 pl-5 font-sans text-sm">
          {items.map((item, i) => (
            <li key={i} className="break-words">
              {item}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
