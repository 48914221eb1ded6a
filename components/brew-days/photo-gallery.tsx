'use client';

import { useRouter } from 'next/navigation';
import { useRef, useState } from 'react';
import { toast } from 'sonner';
import { requestJson } from '@/lib/http/client';

export interface GalleryPhoto {
  id: string;
  caption: string;
  width: number;
  height: number;
}

/** Thumbnails that open a larger view in a modal dialog (focus kept inside, Escape closes). */
export function PhotoGallery({ photos, canDelete }: { photos: GalleryPhoto[]; canDelete: boolean }) {
  const router = useRouter();
  const dialogRef = useRef<HTMLDialogElement>(null);
  const [open, setOpen] = useState<GalleryPhoto | null>(null);
  const [deleting, setDeleting] = useState(false);

  if (photos.length === 0) return <p className="font-sans text-sm text-muted">No photos yet.</p>;

  const show = (photo: GalleryPhoto) => {
    setOpen(photo);
    dialogRef.current?.showModal();
  };
  const close = () => dialogRef.current?.close();

  const remove = async (photo: GalleryPhoto) => {
    if (!window.confirm('Delete this photo for good?')) return;
    setDeleting(true);
    const result = await requestJson(`/api/photos/${photo.id}`, 'DELETE');
    setDeleting(false);
    if (!result.ok) {
      toast.error(result.message);
      return;
    }
    close();
    toast.success('Photo deleted.');
    router.refresh();
  };

  return (
    <>
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 md:grid-cols-4" aria-label="Photos">
        {photos.map((photo, i) => (
          <li key={photo.id}>
            <button
              type="button"
              className="block w-full overflow-hidden rounded-md border border-line"
              onClick={() => show(photo)}
              aria-label={`Open photo ${i + 1}${photo.caption ? `: ${photo.caption}` : ''}`}
            >
              {/* eslint-disable-next-line @next/next/no-img-element -- served by our own access-checked route */}
              <img
                src={`/api/photos/${photo.id}/thumb`}
                alt={photo.caption || `Brew day photo ${i + 1}`}
                className="aspect-square w-full object-cover"
                loading="lazy"
              />
            </button>
            {photo.caption && <p className="mt-1 truncate font-sans text-xs text-muted">{photo.caption}</p>}
          </li>
        ))}
      </ul>
      <dialog
        ref={dialogRef}
        aria-labelledby="photo-dialog-title"
        className="m-auto max-h-[95vh] max-w-[95vw] rounded-lg border border-line bg-card p-4 text-ink backdrop:bg-black/70"
        onClose={() => setOpen(null)}
        onClick={(e) => {
          if (e.target === dialogRef.current) close();
        }}
      >
        {open && (
          <figure>
            <div className="mb-2 flex items-center justify-between gap-4">
              <h2 id="photo-dialog-title" className="font-sans text-sm font-semibold">
                {open.caption || 'Brew day photo'}
              </h2>
              <div className="flex gap-2">
                {canDelete && (
                  <button
                    type="button"
                    className="kf-btn-quiet text-danger"
                    onClick={() => remove(open)}
                    disabled={deleting}
                  >
                    {deleting ? 'Deleting…' : 'Delete photo'}
                  </button>
                )}
                <button type="button" className="kf-btn-quiet" onClick={close} autoFocus>
                  Close
                </button>
              </div>
            </div>
            {/* eslint-disable-next-line @next/next/no-img-element -- served by our own access-checked route */}
            <img
              src={`/api/photos/${open.id}/display`}
              alt={open.caption || 'Brew day photo, larger'}
              width={open.width}
              height={open.height}
              className="max-h-[80vh] w-auto max-w-full"
            />
          </figure>
        )}
      </dialog>
    </>
  );
}
