// Importing a phone's file of unsent changes: the office picks the file a technician sent, the
// server pushes its operations as that technician's sync would have, and this shows what became
// of them. Importing the same file twice is harmless (everything is "already received").
import { useState } from 'react';
import { Button } from '../../ui/Button';
import { api, ApiError } from '../api';
import { FormMessage } from '../form';
import { Panel } from '../Panel';
import { OPERATION_KIND_WORDS } from '../../../lib/words';

type Summary = {
  technician: { id: string; name: string };
  deviceId: string;
  operations: number;
  outcomes: Partial<Record<'applied' | 'duplicate' | 'superseded' | 'conflict' | 'locked' | 'rejected', number>>;
  rejected: { opId: string; visitId: string; kind: string; reason: string }[];
  photos: { stored: number; alreadyHeld: number; refused: { sha256: string; reason: string }[] };
};

const OUTCOME_WORDS: [keyof Summary['outcomes'], string][] = [
  ['applied', 'applied'],
  ['duplicate', 'already received (by sync or an earlier import)'],
  ['superseded', 'overtaken by a later change'],
  ['conflict', 'kept as a conflict for you to decide'],
  ['locked', 'arrived after sign-off or a move: kept as a conflict'],
  ['rejected', 'refused'],
];


export default function UnsentImport() {
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [summary, setSummary] = useState<Summary | null>(null);

  async function submit() {
    if (!file) return;
    setBusy(true);
    setError(null);
    setSummary(null);
    try {
      let body: unknown;
      try {
        body = JSON.parse(await file.text());
      } catch {
        throw new ApiError(400, `${file.name} is not a file of unsent changes (it is not JSON).`);
      }
      setSummary(await api<Summary>('/api/office/unsent-changes', { method: 'POST', body }));
    } catch (e) {
      const details = e instanceof ApiError && e.details.length ? ` ${e.details.slice(0, 3).join('; ')}` : '';
      setError(`${(e as Error).message}${details}`);
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="grid max-w-5xl gap-5">
      <Panel title="Import a file of unsent changes">
        <p className="mb-3 max-w-3xl">
          When a phone cannot reach the server for days, the technician saves its unsent changes to a file on This phone and sends it to you.
          Importing it applies the changes exactly as the phone&rsquo;s own sync would, in the technician&rsquo;s name. Nothing is applied twice:
          a change that already arrived is skipped.
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <label className="flex items-center gap-2 font-bold">
            File
            <input
              type="file"
              accept=".json,application/json"
              onChange={(e) => {
                setFile(e.target.files?.[0] ?? null);
                setSummary(null);
                setError(null);
              }}
              className="font-normal"
            />
          </label>
          <Button variant="primary" onClick={submit} disabled={!file || busy}>
            {busy ? 'Importing…' : 'Import'}
          </Button>
        </div>
      </Panel>
      <FormMessage message={error} />
      {summary && (
        <Panel title={`Imported: ${summary.technician.name}'s phone`}>
          <p role="status" className="mb-2">
            {summary.operations} {summary.operations === 1 ? 'change' : 'changes'} in the file.
          </p>
          <ul className="mb-3 list-disc pl-6">
            {OUTCOME_WORDS.filter(([key]) => summary.outcomes[key]).map(([key, words]) => (
              <li key={key} data-outcome={key}>
                {summary.outcomes[key]} {words}
              </li>
            ))}
            <li>
              Photos: {summary.photos.stored} stored, {summary.photos.alreadyHeld} already held
              {summary.photos.refused.length > 0 && `, ${summary.photos.refused.length} refused`}
            </li>
          </ul>
          {summary.rejected.length > 0 && (
            <p className="mb-3">
              Changes refused outright are also kept on{' '}
              <a href="/office/refused" className="font-bold text-brand underline">
                Refused changes
              </a>
              .
            </p>
          )}
          {(summary.outcomes.conflict || summary.outcomes.locked) && (
            <p className="mb-3">
              <a href="/office/conflicts" className="font-bold text-brand underline">
                Decide the conflicts
              </a>
            </p>
          )}
          {summary.rejected.length > 0 && (
            <table className="w-full text-left text-sm">
              <caption className="mb-1 text-left font-bold">Refused changes</caption>
              <thead>
                <tr className="border-b border-ink/30">
                  <th className="py-1 pr-3">Change</th>
                  <th className="py-1 pr-3">Visit</th>
                  <th className="py-1">Why</th>
                </tr>
              </thead>
              <tbody>
                {summary.rejected.map((r) => (
                  <tr key={r.opId} className="border-b border-ink/10">
                    <td className="py-1 pr-3">{OPERATION_KIND_WORDS[r.kind] ?? r.kind}</td>
                    <td className="py-1 pr-3">
                      <a href={`/office/visits/${r.visitId}`} className="text-brand underline">
                        {r.visitId.slice(0, 8)}
                      </a>
                    </td>
                    <td className="py-1">{r.reason}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          {summary.photos.refused.map((p) => (
            <p key={p.sha256} className="text-sm">
              Photo {p.sha256.slice(0, 12)}…: {p.reason}
            </p>
          ))}
        </Panel>
      )}
    </div>
  );
}
