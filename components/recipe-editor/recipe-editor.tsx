'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useEffect, useRef, useState, useSyncExternalStore } from 'react';
import { FormProvider, useForm, useFormContext, useFormState, useWatch, type Resolver } from 'react-hook-form';
import { toast } from 'sonner';
import { setServerErrors } from '@/components/form-errors';
import { describedBy } from '@/components/form-field';
import type { RecipeDocumentInput } from '@/lib/brewing/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import type { FieldIssue } from '@/lib/errors';
import { ApiError } from '@/lib/http/client';
import type { Visibility } from '@/lib/recipes/schemas';
import { ConflictPanel } from './conflict-panel';
import { EditorSection, TextField, fieldId, useErrorAt } from './editor-fields';
import {
  MESSAGE_MAX_LENGTH,
  editorFieldFor,
  editorFormSchema,
  withoutEmpty,
  type CreateBody,
  type EditBody,
  type EditorValues,
} from './editor-form';
import { CarbonationSection, NotesSection, WaterSection } from './extra-sections';
import { FitToBrewhouse } from './fit-section';
import { FermentablesSection, HopsSection, YeastsSection } from './ingredient-sections';
import { LiveNumbers, NumbersBar, useLiveStats } from './live-numbers';
import { BatchSection, FermentationSection, MashSection, StyleField } from './process-sections';
import { conflictingHead, saveRecipe, type HeadVersion, type SaveRequest } from './save-recipe';

export interface RecipeEditorProps {
  mode: 'create' | 'edit';
  recipeId?: string;
  slug?: string;
  /** The version this edit started from. */
  baseVersionId?: string;
  baseVersionNumber?: number;
  initialDocument: RecipeDocumentInput;
  initialVisibility?: Visibility;
  /** The member's preferred units: amounts show and are typed in these, and are stored metric. */
  units: UnitSystem;
}

interface BaseVersion {
  id?: string;
  number?: number;
  document: RecipeDocumentInput;
}

interface FormAlert {
  message: string;
  details?: string[];
  signIn?: boolean;
}

const VISIBILITY_CHOICES: readonly { value: Visibility; label: string; hint: string }[] = [
  { value: 'public', label: 'Everyone', hint: 'Listed in search and on your profile.' },
  { value: 'unlisted', label: 'Anyone with the link', hint: 'Left out of search and lists.' },
  { value: 'private', label: 'Only you', hint: 'You can share it later.' },
];

function alertFor(error: ApiError): FormAlert | null {
  if (error.status === 401)
    return {
      message: 'You are signed out. Sign in again in a new tab, then save here: your changes stay in this form.',
      signIn: true,
    };
  return error.status >= 400 && error.status < 500 ? { message: error.summary } : null;
}

// false in the server's HTML and while hydrating, true once React runs in the browser.
const noSubscription = () => () => {};
const hydratedOnClient = () => true;
const notHydratedOnServer = () => false;

export function RecipeEditor({
  mode,
  recipeId,
  slug,
  baseVersionId,
  baseVersionNumber,
  initialDocument,
  initialVisibility = 'public',
  units,
}: RecipeEditorProps) {
  const router = useRouter();
  // The server's body schema; its input type spells defaulted fields as optional, the form always holds them.
  const schemaResolver = zodResolver(editorFormSchema(mode)) as Resolver<EditorValues, unknown, CreateBody | EditBody>;
  const form = useForm<EditorValues, unknown, CreateBody | EditBody>({
    resolver: (values, context, options) => schemaResolver(withoutEmpty(values), context, options),
    mode: 'onBlur',
    reValidateMode: 'onChange',
    defaultValues: { document: initialDocument, message: '', visibility: initialVisibility },
  });
  const { isDirty } = form.formState;
  const live = useLiveStats(form);

  const [base, setBase] = useState<BaseVersion>({
    id: baseVersionId,
    number: baseVersionNumber,
    document: initialDocument,
  });
  const attemptedBase = useRef<BaseVersion>(base);
  const [conflict, setConflict] = useState<HeadVersion | null>(null);
  const [alert, setAlert] = useState<FormAlert | null>(null);
  const alertBox = useRef<HTMLDivElement>(null);
  const leaving = useRef(false);
  // Until the editor has hydrated, typing could be lost and Save would post the raw form: it stays off.
  const ready = useSyncExternalStore(noSubscription, hydratedOnClient, notHydratedOnServer);

  useEffect(() => {
    if (!isDirty) return;
    const warn = (event: BeforeUnloadEvent) => {
      if (leaving.current) return;
      event.preventDefault();
      event.returnValue = '';
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [isDirty]);

  useEffect(() => {
    if (alert) alertBox.current?.focus();
  }, [alert]);

  const showServerIssues = (fields: FieldIssue[], message: string) => {
    const unplaced = setServerErrors(form.setError, fields, editorFieldFor);
    const placed = fields.length - unplaced.length;
    setAlert({
      message,
      details: [
        ...(placed > 0 ? [`${placed === 1 ? 'One field is' : `${placed} fields are`} marked below.`] : []),
        ...unplaced.map((issue) => issue.message),
      ],
    });
  };

  const mutation = useMutation({
    mutationFn: saveRecipe,
    onSuccess: (saved) => {
      leaving.current = true;
      toast.success(mode === 'create' ? 'Recipe saved.' : `Saved as version ${saved.version.number}.`);
      router.push(
        mode === 'create' ? `/recipes/${saved.recipe.slug}` : `/recipes/${saved.recipe.slug}/v/${saved.version.number}`,
      );
    },
    onError: (error) => {
      if (!(error instanceof ApiError) || error.status === 0 || error.status >= 500) {
        toast.error(
          'Saving did not work: the server did not answer. Your changes are still here; try again in a moment.',
        );
        return;
      }
      if (error.status === 400) {
        showServerIssues(error.fields, error.summary);
        return;
      }
      const head = conflictingHead(error);
      if (head) {
        setBase(attemptedBase.current);
        setConflict(head);
        return;
      }
      setAlert(alertFor(error));
    },
  });

  const submit = (saveOnTopOf?: BaseVersion) =>
    form.handleSubmit((values) => {
      setAlert(null);
      const saveBase = saveOnTopOf ?? base;
      attemptedBase.current = saveBase;
      let request: SaveRequest;
      if (mode === 'create') {
        const visibility = 'visibility' in values ? values.visibility : initialVisibility;
        request = { mode, body: { document: values.document, visibility, message: values.message } };
      } else {
        if (!recipeId || !saveBase.id) {
          setAlert({ message: 'This editor does not know which version it edits. Reload the page and try again.' });
          return;
        }
        request = {
          mode,
          recipeId,
          body: { document: values.document, baseVersionId: saveBase.id, message: values.message },
        };
      }
      mutation.mutate(request);
    })();

  return (
    <FormProvider {...form}>
      <form
        noValidate
        data-ready={ready || undefined}
        className="pb-24 lg:pb-0"
        onSubmit={(event) => {
          event.preventDefault();
          void submit();
        }}
      >
        {mode === 'edit' && base.number !== undefined && (
          <p className="mb-4 font-sans text-sm text-muted">
            You are editing from{' '}
            {slug ? (
              <a href={`/recipes/${slug}/v/${base.number}`} className="underline">
                version {base.number}
              </a>
            ) : (
              `version ${base.number}`
            )}
            . Saving adds a new version; the earlier ones stay as they are.
          </p>
        )}
        {alert && (
          <div
            ref={alertBox}
            role="alert"
            tabIndex={-1}
            className="mb-4 rounded-md border-2 border-danger bg-card p-4 font-sans text-sm"
          >
            <p className="font-semibold text-danger">{alert.message}</p>
            {alert.details && alert.details.length > 0 && (
              <ul className="mt-1 ml-5 list-disc">
                {alert.details.map((detail) => (
                  <li key={detail}>{detail}</li>
                ))}
              </ul>
            )}
            {alert.signIn && (
              <p className="mt-2">
                <a href="/sign-in" target="_blank" rel="noopener noreferrer">
                  Sign in<span className="sr-only"> (opens in a new tab)</span>
                </a>
              </p>
            )}
          </div>
        )}
        {conflict && (
          <div className="mb-6">
            <ConflictPanel
              head={conflict}
              baseDocument={base.document}
              baseVersionNumber={base.number}
              slug={slug}
              units={units}
              saving={mutation.isPending}
              onSaveOnTop={() => void submit({ id: conflict.id, number: conflict.number, document: conflict.document })}
            />
          </div>
        )}
        <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_24rem] lg:items-start">
          <div className="space-y-6">
            <EditorSection id="recipe" title="Recipe">
              <div className="grid gap-3 sm:grid-cols-2">
                <TextField path="document.title" label="Title" />
                <StyleField />
              </div>
            </EditorSection>
            <BatchSection units={units}>
              <FitToBrewhouse doc={live.document} current={live.current} units={units} />
            </BatchSection>
            <FermentablesSection units={units} />
            <HopsSection units={units} />
            <YeastsSection units={units} />
            <MashSection units={units} />
            <FermentationSection units={units} />
            <WaterSection units={units} />
            <CarbonationSection units={units} />
            <NotesSection />
          </div>
          <aside
            aria-label="Numbers for this recipe"
            className="lg:sticky lg:top-4 lg:row-span-2 lg:max-h-[calc(100vh-2rem)] lg:overflow-y-auto"
          >
            <LiveNumbers live={live} units={units} />
          </aside>
          <SaveSection mode={mode} saving={mutation.isPending} ready={ready} />
        </div>
      </form>
      <NumbersBar live={live} units={units} />
    </FormProvider>
  );
}

function SaveSection({ mode, saving, ready }: { mode: 'create' | 'edit'; saving: boolean; ready: boolean }) {
  const { register } = useFormContext<EditorValues>();
  const { errors, submitCount } = useFormState<EditorValues>();
  const message = useWatch<EditorValues, 'message'>({ name: 'message' }) ?? '';
  const messageError = useErrorAt('message');
  const id = fieldId('message');
  const hint = `${message.length} of ${MESSAGE_MAX_LENGTH} characters.`;
  const hasErrors = Object.keys(errors).length > 0;
  return (
    <EditorSection id="save" title={mode === 'create' ? 'Publish' : 'Save a new version'}>
      {mode === 'create' && <VisibilityChoice />}
      <div className={mode === 'create' ? 'mt-4' : ''}>
        <label htmlFor={id} className="kf-label">
          {mode === 'edit' ? 'What changed in this version' : 'A note for this first version (optional)'}
        </label>
        <input
          id={id}
          type="text"
          maxLength={MESSAGE_MAX_LENGTH}
          className="kf-input"
          placeholder={mode === 'edit' ? 'e.g. mashed 2 °C warmer for more body' : undefined}
          aria-invalid={Boolean(messageError) || undefined}
          aria-describedby={describedBy(id, messageError, hint)}
          {...register('message')}
        />
        {messageError ? (
          <p id={`${id}-error`} className="kf-field-error">
            {messageError}
          </p>
        ) : (
          <p id={`${id}-hint`} className="mt-1 font-sans text-xs text-muted">
            {hint}
          </p>
        )}
      </div>
      {submitCount > 0 && hasErrors && (
        <p className="kf-field-error mt-3" role="status">
          Some fields need a fix before saving; they are marked above.
        </p>
      )}
      <button type="submit" className="kf-btn mt-4 w-full sm:w-auto" disabled={saving || !ready}>
        {saving ? 'Saving…' : mode === 'create' ? 'Save recipe' : 'Save new version'}
      </button>
    </EditorSection>
  );
}

function VisibilityChoice() {
  const { register } = useFormContext<EditorValues>();
  return (
    <fieldset>
      <legend className="kf-label">Who can see this recipe</legend>
      <div className="mt-1 grid gap-2 sm:grid-cols-3">
        {VISIBILITY_CHOICES.map((choice) => {
          const id = `kf-visibility-${choice.value}`;
          return (
            <div key={choice.value} className="flex items-start gap-2 rounded-md border border-line p-3">
              <input
                id={id}
                type="radio"
                value={choice.value}
                className="mt-1 h-4 w-4 accent-copper"
                aria-describedby={`${id}-hint`}
                {...register('visibility')}
              />
              <div>
                <label htmlFor={id} className="font-sans text-sm font-semibold">
                  {choice.label}
                </label>
                <p id={`${id}-hint`} className="font-sans text-xs text-muted">
                  {choice.hint}
                </p>
              </div>
            </div>
          );
        })}
      </div>
    </fieldset>
  );
}
