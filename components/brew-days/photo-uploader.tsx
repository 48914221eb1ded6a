'use client';

import { useRouter } from 'next/navigation';
import { useRef, useState } from 'react';
import { toast } from 'sonner';
import { uploadForm } from '@/lib/http/client';

type State =
  | { kind: 'idle' }
  | { kind: 'uploading'; percent: number }
  | { kind: 'processing' }
  | { kind: 'error'; message: string };

/** The brewer uploads a photo, with its progress; the server checks and re-encodes the picture, so the page waits for that too. */
export function PhotoUploader({ brewDayId, maxMb }: { brewDayId: string; maxMb: number }) {
  const router = useRouter();
  const fileRef = useRef<HTMLInputElement>(null);
  const [caption, setCaption] = useState('');
  const [state, setState] = useState<State>({ kind: 'idle' });
  const busy = state.kind === 'uploading' || state.kind === 'processing';

  const upload = async () => {
    const file = fileRef.current?.files?.[0];
    if (!file) {
      setState({ kind: 'error', message: 'Choose a photo first.' });
      return;
    }
    if (file.size > maxMb * 1024 * 1024) {
      setState({ kind: 'error', message: `The photo is larger than ${maxMb} MB.` });
      return;
    }
    const form = new FormData();
    form.append('photo', file);
    form.append('caption', caption);
    setState({ kind: 'uploading', percent: 0 });
    const result = await uploadForm(`/api/brew-days/${brewDayId}/photos`, form, {
      onProgress: (percent) => setState({ kind: 'uploading', percent }),
      onSent: () => setState({ kind: 'processing' }),
    });
    if (!result.ok) {
      setState({
        kind: 'error',
        message: result.status === 0 ? 'The upload was interrupted; please try again.' : result.message,
      });
      return;
    }
    setState({ kind: 'idle' });
    setCaption('');
    if (fileRef.current) fileRef.current.value = '';
    toast.success('Photo added.');
    router.refresh();
  };

  return (
    <form
      className="kf-card"
      aria-labelledby="photo-upload-title"
      onSubmit={(e) => {
        e.preventDefault();
        void upload();
      }}
    >
      <h3 id="photo-upload-title" className="font-semibold">
        Add a photo
      </h3>
      <p className="font-sans text-xs text-muted">
        JPEG, PNG or WebP up to {maxMb} MB. We store a resized copy without the camera&apos;s metadata or location.
      </p>
      <label htmlFor="photo-file" className="kf-label mt-2">
        Photo
      </label>
      <input
        id="photo-file"
        ref={fileRef}
        type="file"
        accept="image/jpeg,image/png,image/webp"
        className="kf-input"
        disabled={busy}
      />
      <label htmlFor="photo-caption" className="kf-label mt-2">
        Caption (optional)
      </label>
      <input
        id="photo-caption"
        className="kf-input"
        maxLength={200}
        value={caption}
        onChange={(e) => setCaption(e.target.value)}
        disabled={busy}
      />
      {state.kind === 'uploading' && (
        <div className="mt-2 font-sans text-sm">
          <label htmlFor="photo-progress">Uploading {state.percent}%</label>
          <progress id="photo-progress" className="ml-2 align-middle" max={100} value={state.percent}>
            {state.percent}%
          </progress>
        </div>
      )}
      {state.kind === 'processing' && (
        <p role="status" className="mt-2 font-sans text-sm text-muted">
          Uploaded; resizing…
        </p>
      )}
      {state.kind === 'error' && (
        <p role="alert" className="kf-field-error">
          {state.message}
        </p>
      )}
      <button type="submit" className="kf-btn mt-3" disabled={busy}>
        {busy ? 'Uploading…' : 'Upload photo'}
      </button>
    </form>
  );
}
