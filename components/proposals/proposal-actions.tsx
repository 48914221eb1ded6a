'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';
import type { ConflictView } from '@/lib/proposals/merge-words';

function ErrorLine({ error }: { error?: string }) {
  if (!error) return null;
  return (
    <p role="alert" className="kf-field-error">
      {error}
    </p>
  );
}

/** The owner accepts: one choice per conflicting field, then a new version of their recipe. */
export function AcceptForm({
  proposalId,
  headVersionId,
  headNumber,
  conflicts,
}: {
  proposalId: string;
  headVersionId: string;
  headNumber: number;
  conflicts: ConflictView[];
}) {
  const id = useId();
  const router = useRouter();
  const [picks, setPicks] = useState<Record<string, 'ours' | 'theirs'>>({});
  const [message, setMessage] = useState('');
  const [error, setError] = useState<string>();
  const send = useMutation({
    mutationFn: () =>
      sendJson<{ version: { number: number } }>(`/api/proposals/${proposalId}/accept`, 'POST', {
        sourceHeadVersionId: headVersionId,
        picks,
        message,
      }),
    onSuccess: (res) => {
      toast.success(`Accepted. Version ${res.version.number} of your recipe credits the proposer.`);
      router.refresh();
    },
    onError: (err) => setError(err.message),
  });
  const unpicked = conflicts.filter((c) => !picks[c.path]).length;
  return (
    <form
      className="kf-card"
      onSubmit={(e) => {
        e.preventDefault();
        setError(undefined);
        send.mutate();
      }}
    >
      <h3 className="text-lg font-semibold">Accept</h3>
      <p className="mt-1 font-sans text-sm text-muted">
        Saves a new version on top of version {headNumber} of your recipe, with the proposer credited as co-author.
      </p>
      {conflicts.length > 0 && (
        <div className="mt-3 space-y-3">
          <p className="font-sans text-sm">
            Both sides changed these fields since the fork. Choose which value to keep for each:
          </p>
          {conflicts.map((c, i) => (
            <fieldset key={c.path} className="rounded-md border border-line p-3 font-sans text-sm">
              <legend className="px-1 font-semibold">{c.label}</legend>
              <p className="text-xs text-muted">When forked: {c.base}</p>
              <label className="mt-2 flex items-start gap-2">
                <input
                  type="radio"
                  name={`${id}-pick-${i}`}
                  value="ours"
                  checked={picks[c.path] === 'ours'}
                  onChange={() => setPicks({ ...picks, [c.path]: 'ours' })}
                />
                <span>
                  Keep yours: <span className="kf-data whitespace-pre-wrap">{c.ours}</span>
                </span>
              </label>
              <label className="mt-1 flex items-start gap-2">
                <input
                  type="radio"
                  name={`${id}-pick-${i}`}
                  value="theirs"
                  checked={picks[c.path] === 'theirs'}
                  onChange={() => setPicks({ ...picks, [c.path]: 'theirs' })}
                />
                <span>
                  Take the proposal’s: <span className="kf-data whitespace-pre-wrap">{c.theirs}</span>
                </span>
              </label>
            </fieldset>
          ))}
        </div>
      )}
      <label htmlFor={`${id}-message`} className="kf-label mt-3">
        Version message (optional)
      </label>
      <input
        id={`${id}-message`}
        className="kf-input"
        value={message}
        maxLength={500}
        onChange={(e) => setMessage(e.target.value)}
      />
      <ErrorLine error={error} />
      <button type="submit" className="kf-btn mt-3" disabled={send.isPending || unpicked > 0}>
        {send.isPending
          ? 'Accepting…'
          : unpicked > 0
            ? `Choose ${unpicked} more ${unpicked === 1 ? 'field' : 'fields'}`
            : 'Accept and save a new version'}
      </button>
    </form>
  );
}

/** The owner declines or asks for changes, saying why. */
export function DecisionForm({ proposalId }: { proposalId: string }) {
  const id = useId();
  const router = useRouter();
  const [comment, setComment] = useState('');
  const [error, setError] = useState<string>();
  const send = useMutation({
    mutationFn: (decision: 'declined' | 'changes_requested') =>
      sendJson(`/api/proposals/${proposalId}/decision`, 'POST', { decision, comment }),
    onSuccess: (_res, decision) => {
      toast.success(
        decision === 'declined'
          ? 'Declined. The proposer has been told why.'
          : 'Asked for changes. The proposer has been told.',
      );
      setComment('');
      router.refresh();
    },
    onError: (err) => setError(err.message),
  });
  return (
    <form className="kf-card" onSubmit={(e) => e.preventDefault()}>
      <h3 className="text-lg font-semibold">Decline or ask for changes</h3>
      <label htmlFor={`${id}-comment`} className="kf-label mt-2">
        Your comment to the proposer
      </label>
      <textarea
        id={`${id}-comment`}
        className="kf-input"
        rows={3}
        maxLength={5000}
        value={comment}
        onChange={(e) => setComment(e.target.value)}
      />
      <ErrorLine error={error} />
      <div className="mt-3 flex flex-wrap gap-2 font-sans text-sm">
        <button
          type="button"
          className="kf-btn-quiet"
          disabled={send.isPending}
          onClick={() => (setError(undefined), send.mutate('changes_requested'))}
        >
          Ask for changes
        </button>
        <button
          type="button"
          className="kf-btn-quiet text-danger"
          disabled={send.isPending}
          onClick={() => (setError(undefined), send.mutate('declined'))}
        >
          Decline
        </button>
      </div>
    </form>
  );
}

/** The proposer moves the proposal to a newer version of their fork, or withdraws it. */
export function ProposerActions({
  proposalId,
  newerVersions,
}: {
  proposalId: string;
  newerVersions: { id: string; number: number; message: string }[];
}) {
  const id = useId();
  const router = useRouter();
  const [versionId, setVersionId] = useState(newerVersions[0]?.id ?? '');
  const [error, setError] = useState<string>();
  const update = useMutation({
    mutationFn: () => sendJson(`/api/proposals/${proposalId}`, 'PATCH', { versionId }),
    onSuccess: () => {
      toast.success('The proposal now offers the newer version.');
      router.refresh();
    },
    onError: (err) => setError(err.message),
  });
  const withdraw = useMutation({
    mutationFn: () => sendJson(`/api/proposals/${proposalId}/withdraw`, 'POST'),
    onSuccess: () => {
      toast.success('Withdrawn.');
      router.refresh();
    },
    onError: (err) => setError(err.message),
  });
  return (
    <div className="kf-card font-sans text-sm">
      <h3 className="font-serif text-lg font-semibold">Your proposal</h3>
      {newerVersions.length > 0 ? (
        <form
          className="mt-2"
          onSubmit={(e) => {
            e.preventDefault();
            setError(undefined);
            update.mutate();
          }}
        >
          <label htmlFor={`${id}-version`} className="kf-label">
            Offer a newer version of your fork
          </label>
          <select
            id={`${id}-version`}
            className="kf-input"
            value={versionId}
            onChange={(e) => setVersionId(e.target.value)}
          >
            {newerVersions.map((v) => (
              <option key={v.id} value={v.id}>
                Version {v.number}
                {v.message ? `: ${v.message}` : ''}
              </option>
            ))}
          </select>
          <button type="submit" className="kf-btn mt-2" disabled={update.isPending}>
            Update the proposal
          </button>
        </form>
      ) : (
        <p className="mt-1 text-muted">Save a new version of your fork to offer it here instead.</p>
      )}
      <ErrorLine error={error} />
      <button
        type="button"
        className="kf-btn-quiet mt-3"
        disabled={withdraw.isPending}
        onClick={() => (setError(undefined), withdraw.mutate())}
      >
        Withdraw the proposal
      </button>
    </div>
  );
}

/** A message in the proposal's discussion. */
export function ProposalCommentForm({ proposalId }: { proposalId: string }) {
  const id = useId();
  const router = useRouter();
  const [body, setBody] = useState('');
  const [error, setError] = useState<string>();
  const send = useMutation({
    mutationFn: () => sendJson(`/api/proposals/${proposalId}/comments`, 'POST', { body }),
    onSuccess: () => {
      setBody('');
      toast.success('Comment posted.');
      router.refresh();
    },
    onError: (err) => setError(err.message),
  });
  return (
    <form
      className="mt-3"
      onSubmit={(e) => {
        e.preventDefault();
        setError(undefined);
        send.mutate();
      }}
    >
      <label htmlFor={`${id}-body`} className="kf-label">
        Add to the discussion
      </label>
      <textarea
        id={`${id}-body`}
        className="kf-input"
        rows={3}
        maxLength={5000}
        value={body}
        onChange={(e) => setBody(e.target.value)}
      />
      <p className="mt-1 font-sans text-xs text-muted">Markdown works: **bold**, _italic_, lists and links.</p>
      <ErrorLine error={error} />
      <button type="submit" className="kf-btn mt-2 font-sans text-sm" disabled={send.isPending || body.trim() === ''}>
        {send.isPending ? 'Sending…' : 'Post comment'}
      </button>
    </form>
  );
}
