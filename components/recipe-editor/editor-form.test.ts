import { describe, expect, it } from 'vitest';
import paleAle from '@/lib/brewing/examples/pale-ale.json';
import { setServerErrors } from '@/components/form-errors';
import { editorFieldFor, editorFormSchema, newHop, withoutEmpty } from './editor-form';

describe('editorFieldFor with setServerErrors', () => {
  it('marks paths that name an input and sends the rest to the summary', () => {
    const marked: Array<[string, string | undefined]> = [];
    const unplaced = setServerErrors(
      (name, error) => marked.push([name, error.message]),
      [
        { path: 'document.hops.2.alphaPct', message: 'Alpha acid must be at most 30%' },
        { path: 'document.fermentables', message: 'Fermentables total 40 kg, too much' },
        { path: 'message', message: 'Say in a few words what changed.' },
        { path: 'document.style.code', message: 'Style code cannot be empty' },
        { path: 'document', message: 'Recipe must be an object' },
        { path: 'baseVersionId', message: 'The version you started from must be a version id.' },
      ],
      editorFieldFor,
    );
    expect(marked).toEqual([
      ['document.hops.2.alphaPct', 'Alpha acid must be at most 30%'],
      ['document.fermentables', 'Fermentables total 40 kg, too much'],
      ['message', 'Say in a few words what changed.'],
      ['document.style', 'Style code cannot be empty'],
    ]);
    expect(unplaced.map((issue) => issue.path)).toEqual(['document', 'baseVersionId']);
  });
});

describe('editorFormSchema', () => {
  it('asks for a message in edit mode only', () => {
    const values = { document: paleAle, message: '  ', visibility: 'public' };
    expect(editorFormSchema('create').safeParse(values).success).toBe(true);
    expect(editorFormSchema('edit').safeParse(values).success).toBe(false);
  });

  it('says an empty amount is required', () => {
    const values = {
      document: { ...paleAle, hops: [{ ...newHop(), name: 'Cascade', alphaPct: 6, timeMin: 10 }] },
      message: 'x',
    };
    const result = editorFormSchema('edit').safeParse(withoutEmpty(values));
    expect(result.error?.issues.map((issue) => [issue.path.join('.'), issue.message])).toEqual([
      ['document.hops.0.amountG', 'Hop amount is required'],
    ]);
  });
});

describe('withoutEmpty', () => {
  it('leaves out empty inputs at any depth and keeps everything else', () => {
    expect(withoutEmpty({ a: null, b: 0, c: [{ d: null, e: '' }], f: { g: null } })).toEqual({
      b: 0,
      c: [{ e: '' }],
      f: {},
    });
  });
});
