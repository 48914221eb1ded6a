'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';
import { Markdown } from '@/components/markdown';
import { RecipeDocumentView } from '@/components/recipe-document';
import { StatsPanel } from '@/components/stats-panel';
import type { RecipeDocument, RecipeStats, UnitSystem } from '@/lib/brewing';

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

interface ApiError {
  error?: { message: string; fields?: { path: string; message: string }[] };
}

const FORMAT_WORDS = { beerxml: 'BeerXML 1.0', beerjson: 'BeerJSON 1.0' } as const;

async function postJson<T>(url: string, body: unknown): Promise<T> {
  const res = await fetch(url, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(body),
  });
  const json = (await res.json().catch(() => ({}))) as T & ApiError;
  if (!res.ok) throw new Error(json.error?.message ?? `The request did not work (HTTP ${res.status}).`);
  return json;
}

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
  const [text, setText] = useState('');
  const [format, setFormat] = useState<'' | 'beerxml' | 'beerjson'>('');
  const [fileError, setFileError] = useState<string>();
  const [chosen, setChosen] = useState(0);
  const [target, setTarget] = useState('new');
  const [visibility, setVisibility] = useState<'public' | 'unlisted' | 'private'>('private');

  const preview = useMutation({
    mutationFn: () => postJson<Preview>('/api/import', { text, ...(format ? { format } : {}) }),
    onSuccess: () => setChosen(0),
  });

  const save = useMutation({
    mutationFn: async () => {
      const result = preview.data!;
      const document = result.recipes[chosen].document;
      const message = `Imported from ${FORMAT_WORDS[result.format]}`;
      if (target === 'new')
        return postJson<{ recipe: { slug: string } }>('/api/recipes', { document, visibility, message });
      const history = await fetch(`/api/recipes/${target}/versions`).then(
        (r) => r.json() as Promise<{ versions: { id: string }[] }>,
      );
      return postJson<{ recipe: { slug: string } }>(`/api/recipes/${target}/versions`, {
        document,
        baseVersionId: history.versions[0].id,
        message,
      });
    },
    onSuccess: (saved) => {
      toast.success('Imported and saved.');
      router.push(`/recipes/${saved.recipe.slug}`);
    },
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
    setText(await file.text());
    if (/\.xml$/i.test(file.name)) setFormat('beerxml');
    else if (/\.json$/i.test(file.name)) setFormat('beerjson');
  }

  const recipes = preview.data?.recipes ?? [];
  const current = recipes[chosen];
  return (
    <div className="mt-6 space-y-8">
      <form
        className="kf-card space-y-4"
        aria-label="Recipe file"
        onSubmit={(e) => {
          e.preventDefault();
          save.reset();
          preview.mutate();
        }}
      >
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
            value={text}
            onChange={(e) => setText(e.target.value)}
            spellCheck={false}
            placeholder='<RECIPES> … </RECIPES>  or  { "beerjson": … }'
          />
        </div>
        <div className="max-w-xs">
          <label htmlFor="import-format" className="kf-label">
            Format
          </label>
          <select
            id="import-format"
            className="kf-input"
            value={format}
            onChange={(e) => setFormat(e.target.value as typeof format)}
          >
            <option value="">Work it out from the text</option>
            <option value="beerxml">BeerXML 1.0</option>
            <option value="beerjson">BeerJSON 1.0</option>
          </select>
        </div>
        {preview.error && (
          <p role="alert" className="rounded-md border border-danger/40 bg-danger/5 p-3 font-sans text-sm text-danger">
            {preview.error.message}
          </p>
        )}
        <button type="submit" className="kf-btn" disabled={!text.trim() || preview.isPending}>
          {preview.isPending ? 'Reading…' : 'Preview'}
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
              <form
                className="kf-card space-y-3"
                aria-label="Save the imported recipe"
                onSubmit={(e) => {
                  e.preventDefault();
                  save.mutate();
                }}
              >
                <h3 className="text-lg font-semibold">Save it</h3>
                <div>
                  <label htmlFor="import-target" className="kf-label">
                    Save as
                  </label>
                  <select
                    id="import-target"
                    className="kf-input"
                    value={target}
                    onChange={(e) => setTarget(e.target.value)}
                  >
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
                      value={visibility}
                      onChange={(e) => setVisibility(e.target.value as typeof visibility)}
                    >
                      <option value="private">Only me (you can share it later)</option>
                      <option value="unlisted">Only people with the link</option>
                      <option value="public">Everyone</option>
                    </select>
                  </div>
                )}
                {save.error && (
                  <p role="alert" className="kf-field-error">
                    {save.error.message}
                  </p>
                )}
                <button type="submit" className="kf-btn" disabled={save.isPending}>
                  {save.isPending ? 'Saving…' : 'Save'}
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
