import { Button, Callout, Intent } from '@blueprintjs/core';
import { CloudUploadIcon, EditIcon, TrashIcon } from '@blueprintjs/icons';
import { lazy, Suspense, useState } from 'react';

import { keptStudents } from '../../../lib/kept-me';
import { removeDraft, type Draft } from '../drafts-store';
import { useDrafts, useOnline } from '../hooks/use-drafts';
import '../drafts.css';

// Loaded when a refused miss is opened to put right, never with the list.
const EditDraftDialog = lazy(() => import('./edit-draft-dialog'));

type StudentNames = readonly { id: number; name: string }[];

function DraftRow({ draft, students }: { draft: Draft; students: StudentNames }) {
  const [confirming, setConfirming] = useState(false);
  const [editing, setEditing] = useState(false);
  const photos = draft.photos.length;
  const named = Object.values(draft.refusalFields ?? {}).filter((m) => m !== draft.refusal);
  return (
    <li className="wb-draft">
      <div className="wb-draft-text">
        <span className="wb-draft-title wb-mono">{draft.title}</span>
        <span className="wb-muted">
          {draft.detail}
          {photos > 0 ? ` · ${photos} ${photos === 1 ? 'photo' : 'photos'}` : ''}
        </span>
        {draft.refusal ? (
          <span className="wb-draft-refusal">
            Not accepted: {draft.refusal}
            {named.length > 0 ? ` (${named.join('; ')})` : ''} Put it right and send it again, or
            delete it.
          </span>
        ) : null}
      </div>
      {draft.refusal && !confirming ? (
        <Button
          size="small"
          variant="outlined"
          icon={<EditIcon />}
          aria-label={`Put the waiting miss ${draft.title} right`}
          onClick={() => setEditing(true)}
        >
          Put right
        </Button>
      ) : null}
      {editing ? (
        <Suspense fallback={null}>
          <EditDraftDialog draft={draft} students={students} onClose={() => setEditing(false)} />
        </Suspense>
      ) : null}
      {confirming ? (
        <span className="wb-draft-confirm">
          <Button
            size="small"
            intent={Intent.DANGER}
            onClick={() => void removeDraft(draft.key)}
            aria-label={`Delete the waiting miss ${draft.title} for good`}
          >
            Delete for good
          </Button>
          <Button size="small" variant="minimal" onClick={() => setConfirming(false)}>
            Keep
          </Button>
        </span>
      ) : (
        <Button
          size="small"
          variant="minimal"
          icon={<TrashIcon />}
          aria-label={`Delete the waiting miss ${draft.title}`}
          onClick={() => setConfirming(true)}
        />
      )}
    </li>
  );
}

/**
 * Misses kept on this phone that have not reached Workback yet: shown until each is sent, so
 * the parent can see nothing was lost. Nothing shows when none wait.
 */
export function WaitingList({
  householdId,
  students,
}: {
  householdId: number;
  /** The household's children, to choose another when a refused miss is put right. */
  students?: StudentNames;
}) {
  const drafts = useDrafts(householdId);
  const names = students ?? keptStudents(householdId) ?? [];
  const online = useOnline();
  if (drafts.length === 0) return null;
  const waiting = drafts.filter((d) => d.refusal === null).length;
  return (
    <section className="wb-waiting" aria-labelledby="waiting-title">
      <Callout intent={Intent.PRIMARY} icon={<CloudUploadIcon />} className="wb-waiting-callout">
        <h2 id="waiting-title" className="wb-section-title">
          Waiting to send ({drafts.length})
        </h2>
        <p className="wb-muted" role="status">
          {waiting === 0
            ? 'Nothing more will be sent from this list.'
            : online
              ? 'Kept on this phone; sending now.'
              : 'Kept on this phone. They are sent by themselves when the connection returns.'}
        </p>
        <ul className="wb-drafts" aria-label="Misses waiting to send">
          {drafts.map((d) => (
            <DraftRow key={d.key} draft={d} students={names} />
          ))}
        </ul>
      </Callout>
    </section>
  );
}
