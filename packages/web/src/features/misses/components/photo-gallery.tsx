import { useState } from 'react';

import type { MissPhoto } from '../types';
import { PhotoDialog } from './photo-dialog';

/** The miss's photos as thumbnails; a tap opens one at full size to look closer and pin. */
export function PhotoGallery({ missId, photos }: { missId: number; photos: readonly MissPhoto[] }) {
  const [open, setOpen] = useState<number | null>(null);
  if (photos.length === 0) {
    return <p className="wb-muted">No photos yet.</p>;
  }
  const current = open === null ? null : (photos.find((p) => p.id === open) ?? null);
  return (
    <>
      <ul className="wb-gallery" aria-label="Photos">
        {photos.map((photo, i) => (
          <li key={photo.id}>
            <button type="button" className="wb-gallery-item" onClick={() => setOpen(photo.id)}>
              <span className="wb-gallery-frame">
                <img src={photo.thumbUrl} alt="" />
                {photo.marks.map((pin, j) => (
                  <span
                    key={j}
                    className="wb-pin wb-pin-small"
                    style={{ left: `${pin.x * 100}%`, top: `${pin.y * 100}%` }}
                    aria-hidden="true"
                  >
                    {j + 1}
                  </span>
                ))}
              </span>
              <span className="wb-gallery-caption">
                Photo {i + 1}
                {photo.marks.length > 0
                  ? ` · ${photo.marks.length} ${photo.marks.length === 1 ? 'pin' : 'pins'}`
                  : ''}
                <span className="wb-sr-only">: open it to look closer or place pins</span>
              </span>
            </button>
          </li>
        ))}
      </ul>
      <PhotoDialog
        missId={missId}
        photo={current}
        index={current ? photos.indexOf(current) : 0}
        onClose={() => setOpen(null)}
      />
    </>
  );
}
