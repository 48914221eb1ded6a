import type { ErrorOption } from 'react-hook-form';
import { describe, expect, it } from 'vitest';
import { onlyFields, setServerErrors, showRefusal } from './form-errors';

function recorder() {
  const marked: Array<[string, string | undefined, string | undefined]> = [];
  const setError = (name: string, error: ErrorOption) => {
    marked.push([name, error.message, error.type]);
  };
  return { marked, setError };
}

describe('setServerErrors', () => {
  it('marks every path as a field of the form by default', () => {
    const { marked, setError } = recorder();
    const unplaced = setServerErrors(setError, [
      { path: 'og.value', message: 'OG must be at least 1.000' },
      { path: 'fg.value', message: 'FG cannot be above the OG' },
    ]);
    expect(unplaced).toEqual([]);
    expect(marked).toEqual([
      ['og.value', 'OG must be at least 1.000', 'server'],
      ['fg.value', 'FG cannot be above the OG', 'server'],
    ]);
  });

  it('renames a server path to the field the member typed into', () => {
    const { marked, setError } = recorder();
    setServerErrors(setError, [{ path: 'defaultBatchVolumeL', message: 'A batch is at most 2,000 litres.' }], (path) =>
      path === 'defaultBatchVolumeL' ? 'batchVolume' : path,
    );
    expect(marked).toEqual([['batchVolume', 'A batch is at most 2,000 litres.', 'server']]);
  });
});

describe('showRefusal', () => {
  const placeTitle = onlyFields('title');

  it('says nothing above the button when every message sits beside its field', () => {
    const { marked, setError } = recorder();
    const said = showRefusal(
      setError,
      {
        message: 'Please check these fields: title: Give your fork a title.',
        fields: [{ path: 'title', message: 'Give your fork a title.' }],
      },
      placeTitle,
    );
    expect(said).toBeUndefined();
    expect(marked).toEqual([['title', 'Give your fork a title.', 'server']]);
  });

  it('says the messages no field shows', () => {
    const { marked, setError } = recorder();
    const said = showRefusal(
      setError,
      {
        message: 'Please check these fields.',
        fields: [
          { path: 'title', message: 'Keep the title under 120 characters.' },
          { path: 'versionId', message: 'Name the version you propose by its id.' },
        ],
      },
      placeTitle,
    );
    expect(said).toBe('Name the version you propose by its id.');
    expect(marked.map(([name]) => name)).toEqual(['title']);
  });

  it("says the refusal's own message when it names no field", () => {
    const { setError } = recorder();
    expect(
      showRefusal(setError, { message: 'Too many attempts; please wait a little and try again.', fields: [] }),
    ).toBe('Too many attempts; please wait a little and try again.');
  });
});
