// Books approved advised work as a visit in one step: technician, day, start time, length.
import { useState } from 'react';
import { requestJson } from './request';

export default function BookAdvisedForm(props: { advisedId: string; technicians: { id: string; name: string }[]; defaultDate: string }) {
  const [technicianId, setTechnicianId] = useState(props.technicians[0]?.id ?? '');
  const [date, setDate] = useState(props.defaultDate);
  const [start, setStart] = useState('09:00');
  const [duration, setDuration] = useState('60');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function book() {
    setBusy(true);
    setError(null);
    try {
      await requestJson(`/api/office/advised-work/${props.advisedId}/book`, 'POST', { technicianId, date, start, durationMinutes: Number(duration) });
      window.location.reload();
    } catch (e) {
      setError((e as Error).message);
      setBusy(false);
    }
  }
  const field = 'min-h-10 rounded border border-ink/30 px-2';
  return (
    <div className="flex flex-wrap items-end gap-2 text-sm">
      <label className="flex flex-col">
        <span>Technician</span>
        <select value={technicianId} onChange={(e) => setTechnicianId(e.target.value)} className={field}>
          {props.technicians.map((t) => (
            <option key={t.id} value={t.id}>{t.name}</option>
          ))}
        </select>
      </label>
      <label className="flex flex-col"><span>Day</span><input type="date" value={date} onChange={(e) => setDate(e.target.value)} className={field} /></label>
      <label className="flex flex-col"><span>Start</span><input type="time" value={start} onChange={(e) => setStart(e.target.value)} className={field} /></label>
      <label className="flex flex-col">
        <span>Minutes</span>
        <input value={duration} inputMode="numeric" onChange={(e) => setDuration(e.target.value)} className={`${field} w-20`} />
      </label>
      <button type="button" disabled={busy} onClick={book} className="min-h-10 rounded bg-brand px-4 font-bold text-white disabled:opacity-60">
        Book visit
      </button>
      {error && <span role="alert" className="font-bold text-sev-now">{error}</span>}
    </div>
  );
}
