// Findings with their severity, the visit's photos, and notes for the office.
import { lazy, Suspense, useState } from 'react';
import { addNote, addPhoto, removePhoto } from '../../lib/device/visit-actions';
import { formatTime } from '../phone/format';
import { SeverityBadge } from '../ui/SeverityIcon';
import type { FindingDraft } from './FindingSheet';
import { PhotoPicker } from './PhotoPicker';
import { PhotoThumb } from './PhotoThumb';
import type { TabProps } from './VisitScreen';
import { useRecorder } from './use-recorder';

const FindingSheet = lazy(() => import('./FindingSheet'));

export default function FindingsTab({ device, data, locked }: TabProps) {
  const [draft, setDraft] = useState<FindingDraft | null>(null);
  const [note, setNote] = useState('');
  const { db } = device;
  const { run, alert } = useRecorder(device);
  const visitId = data.visit.id;
  const photos = data.photos.filter((p) => !p.removed);
  const itemLabel = (itemId: string | null) => (itemId ? data.version?.sections.flatMap((s) => s.items).find((i) => i.id === itemId)?.label : undefined);

  return (
    <div className="flex flex-col gap-6 p-3">
      {alert}
      <section className="flex flex-col gap-2" aria-labelledby="findings-heading">
        <h2 id="findings-heading" className="text-xl font-bold">
          Findings
        </h2>
        {data.findings.length === 0 && <p>No findings yet. Add one for anything the customer should know about.</p>}
        <ul className="flex flex-col gap-2">
          {data.findings.map((finding) => {
            const attached = photos.filter((p) => p.findingId === finding.id);
            return (
              <li key={finding.id}>
                <button
                  type="button"
                  disabled={locked}
                  onClick={() => setDraft({ findingId: finding.id, itemId: finding.itemId, title: finding.title, detail: finding.detail, severity: finding.severity })}
                  className="flex w-full flex-col gap-1 rounded-xl border-2 border-ink/15 bg-white p-3 text-left"
                >
                  <span className="flex items-start gap-2">
                    <span className="min-w-0 flex-1 text-lg font-bold">{finding.title}</span>
                    <SeverityBadge severity={finding.severity} />
                  </span>
                  {itemLabel(finding.itemId) && <span className="text-base text-ink/80">On: {itemLabel(finding.itemId)}</span>}
                  {finding.detail && <span>{finding.detail}</span>}
                  {attached.length > 0 && (
                    <span className="mt-1 grid grid-cols-4 gap-1">
                      {attached.map((p) => (
                        <PhotoThumb key={p.id} db={db} photo={p} className="aspect-square w-full rounded" />
                      ))}
                    </span>
                  )}
                </button>
              </li>
            );
          })}
        </ul>
        {!locked && (
          <button
            type="button"
            onClick={() => setDraft({ itemId: null, title: '', detail: '', severity: 'watch' })}
            className="min-h-14 rounded-lg bg-brand text-lg font-bold text-white"
          >
            Add finding
          </button>
        )}
      </section>

      <section className="flex flex-col gap-2" aria-labelledby="photos-heading">
        <h2 id="photos-heading" className="text-xl font-bold">
          Photos
        </h2>
        {photos.length === 0 && <p>No photos yet.</p>}
        <ul className="grid grid-cols-2 gap-2">
          {photos.map((photo) => (
            <li key={photo.id} className="flex flex-col gap-1 rounded-xl border-2 border-ink/15 bg-white p-1.5">
              <PhotoThumb db={db} photo={photo} className="aspect-[4/3] w-full rounded-lg" />
              <span className="text-base font-bold" data-testid="photo-state">
                {photo.uploaded ? 'Uploaded' : 'On this phone'}
              </span>
              {photo.caption && <span className="text-base">{photo.caption}</span>}
              {!locked && (
                <button
                  type="button"
                  onClick={() => {
                    if (window.confirm('Remove this photo from the visit?')) void run(() => removePhoto(db, visitId, photo.id));
                  }}
                  className="min-h-12 rounded-lg border-2 border-ink/40 font-bold"
                >
                  Remove
                </button>
              )}
            </li>
          ))}
        </ul>
        {!locked && <PhotoPicker label="Take photo" onPhoto={async (photo) => void (await run(() => addPhoto(db, visitId, photo)))} />}
      </section>

      <section className="flex flex-col gap-2" aria-labelledby="notes-heading">
        <h2 id="notes-heading" className="text-xl font-bold">
          Notes for the office
        </h2>
        <ul className="flex flex-col gap-2">
          {data.notes.map((n) => (
            <li key={n.id} className="rounded-lg border-2 border-ink/15 bg-white p-3">
              {n.body}
            </li>
          ))}
        </ul>
        {!locked && (
          <form
            className="flex flex-col gap-2"
            onSubmit={async (event) => {
              event.preventDefault();
              if (note.trim() && (await run(() => addNote(db, visitId, note)))) setNote('');
            }}
          >
            <label className="flex flex-col gap-1 font-bold">
              New note
              <textarea value={note} onChange={(e) => setNote(e.target.value)} rows={2} maxLength={4000} className="rounded-lg border-2 border-ink/60 bg-white p-3 text-lg font-normal" />
            </label>
            <button type="submit" disabled={!note.trim()} className="min-h-14 rounded-lg border-2 border-brand bg-white text-lg font-bold text-brand disabled:opacity-50">
              Add note
            </button>
          </form>
        )}
      </section>

      <Suspense fallback={null}>{draft && <FindingSheet device={device} data={data} draft={draft} onClose={() => setDraft(null)} />}</Suspense>
      {data.signOff && <p className="text-base">Signed off {formatTime(data.signOff.signedAt)}: findings, photos and notes are read-only.</p>}
    </div>
  );
}
