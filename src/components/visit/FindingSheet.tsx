// Adding or changing a finding: what was seen, how serious (our colours and shapes), photos.
// A saved severity can only go up on the phone; lowering one is the office's call.
import { useEffect, useState } from 'react';
import type { Device } from '../../lib/device/boot';
import { markUnsaved } from '../../lib/device/boot';
import type { Severity } from '../../lib/sync/operations';
import { SEVERITY_RANK, addPhoto, saveFinding, type PreparedPhoto } from '../../lib/device/visit-actions';
import { SEVERITY_LABEL, SEVERITY_MEANING, SeverityIcon } from '../ui/SeverityIcon';
import { Sheet } from '../ui/Sheet';
import { PhotoPicker } from './PhotoPicker';
import { PhotoThumb } from './PhotoThumb';
import type { VisitData } from './visit-data';

export type FindingDraft = {
  findingId?: string;
  itemId: string | null;
  title: string;
  detail: string;
  severity: Severity;
  /** Opened by the number pad after a flagged reading. */
  suggested?: boolean;
};

const LEVELS: Severity[] = ['ok', 'watch', 'soon', 'now'];

type Props = { device: Device; data: VisitData; draft: FindingDraft; onClose: () => void };

export default function FindingSheet({ device, data, draft, onClose }: Props) {
  const [title, setTitle] = useState(draft.title);
  const [detail, setDetail] = useState(draft.detail);
  const [severity, setSeverity] = useState<Severity>(draft.severity);
  const [pending, setPending] = useState<PreparedPhoto[]>([]);
  const [problem, setProblem] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const saved = draft.findingId ? data.findings.find((f) => f.id === draft.findingId) : undefined;
  const floor = saved ? SEVERITY_RANK[saved.severity] : -1;
  const photos = draft.findingId ? data.photos.filter((p) => p.findingId === draft.findingId && !p.removed) : [];
  const item = draft.itemId ? data.version?.sections.flatMap((s) => s.items).find((i) => i.id === draft.itemId) : undefined;

  useEffect(() => {
    markUnsaved('finding', 'the open finding');
    return () => markUnsaved('finding', null);
  }, []);

  async function save() {
    setSaving(true);
    setProblem(null);
    try {
      const op = await saveFinding(device.db, data.visit.id, { findingId: draft.findingId, itemId: draft.itemId, title, detail, severity });
      for (const photo of pending) {
        await addPhoto(device.db, data.visit.id, photo, { findingId: op.payload.findingId, itemId: draft.itemId, caption: title.trim() });
      }
      device.sync.changed();
      onClose();
    } catch (error) {
      setProblem(error instanceof Error ? error.message : String(error));
      setSaving(false);
    }
  }

  return (
    <Sheet
      title={draft.findingId ? 'Change finding' : draft.suggested ? 'Add a finding?' : 'New finding'}
      onClose={onClose}
      closeLabel={draft.suggested ? 'Not now' : 'Cancel'}
      footer={
        <button type="button" onClick={save} disabled={saving || title.trim().length === 0} className="min-h-16 w-full rounded-lg bg-brand text-xl font-bold text-white disabled:bg-ink/30">
          {saving ? 'Saving…' : 'Save finding'}
        </button>
      }
    >
      <div className="flex flex-col gap-4">
        {draft.suggested && <p className="text-base">The reading was flagged. Record a finding so the customer hears about it.</p>}
        {item && <p className="text-base">On: {item.label}</p>}
        <label className="flex flex-col gap-1 font-bold">
          What did you see?
          <input value={title} onChange={(e) => setTitle(e.target.value)} maxLength={200} className="min-h-14 rounded-lg border-2 border-ink/60 bg-white px-3 text-lg font-normal" />
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Details for the customer (optional)
          <textarea value={detail} onChange={(e) => setDetail(e.target.value)} maxLength={4000} rows={3} className="rounded-lg border-2 border-ink/60 bg-white p-3 text-lg font-normal" />
        </label>
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 font-bold">How serious?</legend>
          {LEVELS.map((level) => {
            const below = SEVERITY_RANK[level] < floor;
            const chosen = severity === level;
            return (
              <label
                key={level}
                className={`flex min-h-14 items-center gap-3 rounded-lg border-[3px] bg-white px-3 ${chosen ? 'border-ink' : 'border-ink/20'} ${below ? 'opacity-50' : ''}`}
              >
                <input type="radio" name="severity" value={level} checked={chosen} disabled={below} onChange={() => setSeverity(level)} className="size-6 accent-brand" />
                <SeverityIcon severity={level} size={30} />
                <span>
                  <span className="block text-lg font-bold">{SEVERITY_LABEL[level]}</span>
                  <span className="block text-base">{SEVERITY_MEANING[level]}</span>
                </span>
              </label>
            );
          })}
          {saved && floor > 0 && <p className="text-base">Only the office can lower a severity once it is saved.</p>}
        </fieldset>
        <div className="flex flex-col gap-2">
          <p className="font-bold">Photos</p>
          {(photos.length > 0 || pending.length > 0) && (
            <div className="grid grid-cols-3 gap-2">
              {photos.map((p) => (
                <PhotoThumb key={p.id} db={device.db} photo={p} className="aspect-square w-full rounded-lg" />
              ))}
              {pending.map((p) => (
                <PendingThumb key={p.sha256} photo={p} />
              ))}
            </div>
          )}
          <PhotoPicker label="Take photo" onPhoto={async (photo) => setPending((list) => [...list, photo])} />
        </div>
        {problem && (
          <p role="alert" className="rounded-lg border-2 border-sev-now bg-white p-3 font-bold text-sev-now">
            {problem}
          </p>
        )}
      </div>
    </Sheet>
  );
}

function PendingThumb({ photo }: { photo: PreparedPhoto }) {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    const u = URL.createObjectURL(photo.blob);
    setUrl(u);
    return () => URL.revokeObjectURL(u);
  }, [photo.blob]);
  return url ? <img src={url} alt="New photo, saved with the finding" className="aspect-square w-full rounded-lg object-cover" /> : null;
}
