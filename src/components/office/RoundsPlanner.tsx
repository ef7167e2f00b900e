// The week's rounds by technician and day. Book, move, cancel and reorder visits; clashes
// (two visits at once, a slot outside working hours) show on the visit itself.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { minutesToClock } from '../../lib/office/form-values';
import { shiftDate } from '../../lib/office/local-time';
import type { roundsWeek } from '../../lib/server/rounds';
import { Button } from '../ui/Button';
import { api, ApiError, type Json } from './api';
import { Dialog } from './Dialog';
import { dayLabel, STATUS_LABEL } from './format';
import { island } from './query-client';
import { BookVisitForm, MoveVisitForm, type BookingResult } from './visit-forms';
import { ClashIcon } from './ClashIcon';

type Week = Json<Awaited<ReturnType<typeof roundsWeek>>>;
type PlannedVisit = Week['visits'][number];

function RoundsPlanner({ initialWeek }: { initialWeek: string | null }) {
  const [week, setWeek] = useState<string | null>(initialWeek);
  const [booking, setBooking] = useState<{ technicianId?: string; roundDate: string } | null>(null);
  const [openVisit, setOpenVisit] = useState<string | null>(null);
  const [notice, setNotice] = useState<{ text: string; clashes: string[] } | null>(null);
  const queryClient = useQueryClient();
  const data = useQuery({
    queryKey: ['rounds', week],
    queryFn: () => api<Week>('/api/office/rounds', { query: { week } }),
  });
  const reorder = useMutation({
    mutationFn: (body: { technicianId: string; roundDate: string; visitIds: string[] }) =>
      api('/api/office/rounds/order', { method: 'PUT', body }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ['rounds'] }),
    onError: (error) => setNotice({ text: (error as Error).message, clashes: [] }),
  });

  const go = (date: string) => {
    setWeek(date);
    window.history.replaceState(null, '', `/office/rounds?week=${date}`);
  };
  const afterSave = (verb: string) => (result: BookingResult) => {
    setBooking(null);
    setOpenVisit(null);
    setNotice({ text: `Visit ${verb}.`, clashes: result.clashes.map((c) => c.message) });
  };

  if (data.isLoading) return <p>Loading the week…</p>;
  if (data.isError) return <p role="alert" className="font-bold text-sev-now">{(data.error as Error).message}</p>;
  const w = data.data!;
  const selected = w.visits.find((v) => v.id === openVisit) ?? null;

  const move = (visit: PlannedVisit, step: -1 | 1) => {
    const round = w.visits.filter((v) => v.technicianId === visit.technicianId && v.roundDate === visit.roundDate);
    const ids = round.map((v) => v.id);
    const at = ids.indexOf(visit.id);
    const to = at + step;
    if (to < 0 || to >= ids.length) return;
    [ids[at], ids[to]] = [ids[to]!, ids[at]!];
    reorder.mutate({ technicianId: visit.technicianId, roundDate: visit.roundDate, visitIds: ids });
  };

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-2">
        <Button onClick={() => go(shiftDate(w.days[0]!, -7))}>‹ Previous week</Button>
        <Button onClick={() => go(w.today)}>This week</Button>
        <Button onClick={() => go(shiftDate(w.days[0]!, 7))}>Next week ›</Button>
        <label className="ml-2 flex items-center gap-2 font-bold">
          Week of
          <input type="date" value={w.days[0]} onChange={(e) => e.target.value && go(e.target.value)} className="min-h-10 rounded border border-ink/40 bg-white px-2 font-normal" />
        </label>
        <span className="text-sm text-ink/80">
          Working hours {minutesToClock(w.workday.start)}–{minutesToClock(w.workday.end)} · times in {w.timeZone}
        </span>
        <Button variant="primary" className="ml-auto" onClick={() => setBooking({ roundDate: w.days.includes(w.today) ? w.today : w.days[0]! })}>
          Book a visit
        </Button>
      </div>
      {notice && (
        <div role="status" className={`flex items-start gap-3 rounded border-2 bg-white p-3 ${notice.clashes.length ? 'border-sev-soon' : 'border-sev-ok'}`}>
          <div>
            <p className="font-bold">{notice.text}</p>
            {notice.clashes.map((c) => (
              <p key={c} className="flex items-center gap-2 text-sev-soon">
                <ClashIcon /> {c}
              </p>
            ))}
          </div>
          <button type="button" className="ml-auto underline" onClick={() => setNotice(null)}>
            Dismiss
          </button>
        </div>
      )}
      <div className="overflow-x-auto rounded border border-ink/20 bg-white">
        <table className="w-full table-fixed border-collapse text-left text-sm">
          <caption className="sr-only">Rounds for the week of {dayLabel(w.days[0]!, 'd MMMM yyyy')}</caption>
          <colgroup>
            <col className="w-36" />
            {w.days.map((d) => (
              <col key={d} />
            ))}
          </colgroup>
          <thead>
            <tr className="bg-ink/5">
              <th scope="col" className="border-b border-ink/20 px-2 py-2">
                Technician
              </th>
              {w.days.map((d) => (
                <th key={d} scope="col" className={`border-b border-l border-ink/20 px-2 py-2 ${d === w.today ? 'bg-accent/30' : ''}`}>
                  {dayLabel(d)} {d === w.today && <span className="text-xs font-normal">(today)</span>}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {w.technicians.length === 0 && (
              <tr>
                <td colSpan={8} className="p-6 text-center">
                  No technicians yet. The owner adds people under People.
                </td>
              </tr>
            )}
            {w.technicians.map((tech) => (
              <tr key={tech.id} className="align-top">
                <th scope="row" className="border-b border-ink/20 px-2 py-2 text-base">
                  {tech.name}
                </th>
                {w.days.map((d) => {
                  const round = w.visits.filter((v) => v.technicianId === tech.id && v.roundDate === d);
                  return (
                    <td key={d} className={`border-b border-l border-ink/20 p-1 ${d === w.today ? 'bg-accent/10' : ''}`}>
                      <ol aria-label={`${tech.name}, ${dayLabel(d)}`} className="flex flex-col gap-1">
                        {round.map((visit, index) => (
                          <li key={visit.id}>
                            <VisitCard
                              visit={visit}
                              first={index === 0}
                              last={index === round.length - 1}
                              busy={reorder.isPending}
                              onOpen={() => setOpenVisit(visit.id)}
                              onMove={(step) => move(visit, step)}
                            />
                          </li>
                        ))}
                      </ol>
                      <button
                        type="button"
                        onClick={() => setBooking({ technicianId: tech.id, roundDate: d })}
                        className="mt-1 min-h-8 w-full rounded border border-dashed border-ink/30 text-ink/70 hover:border-brand hover:text-brand"
                        aria-label={`Book a visit for ${tech.name} on ${dayLabel(d)}`}
                      >
                        + Book
                      </button>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <Dialog open={booking !== null} title="Book a visit" onClose={() => setBooking(null)} wide>
        {booking && <BookVisitForm technicians={w.technicians} defaults={booking} onBooked={afterSave('booked')} />}
      </Dialog>
      <Dialog open={selected !== null} title={selected ? `${selected.registration} · ${selected.customerName}` : ''} onClose={() => setOpenVisit(null)} wide>
        {selected && <VisitPanel visit={selected} technicians={w.technicians} onMoved={afterSave('moved')} onCancelled={() => { setOpenVisit(null); setNotice({ text: 'Visit cancelled.', clashes: [] }); }} />}
      </Dialog>
    </div>
  );
}

function VisitCard({ visit, first, last, busy, onOpen, onMove }: { visit: PlannedVisit; first: boolean; last: boolean; busy: boolean; onOpen: () => void; onMove: (step: -1 | 1) => void }) {
  const clash = visit.clashes.length > 0;
  const arrow = 'min-h-6 min-w-6 rounded border border-ink/30 bg-white text-[10px] disabled:opacity-30';
  return (
    <div className={`rounded border ${clash ? 'border-2 border-sev-soon' : 'border-ink/30'} ${visit.status === 'booked' ? 'bg-white' : 'bg-ink/5'}`}>
      <div className="flex items-center gap-1 px-2 pt-1">
        <span className="font-bold whitespace-nowrap">
          {minutesToClock(visit.start)}–{minutesToClock(visit.end)}
        </span>
        <span className="ml-auto flex gap-1">
          <button type="button" disabled={first || busy} onClick={() => onMove(-1)} aria-label={`Move ${visit.registration} earlier in the round`} className={arrow}>
            ▲
          </button>
          <button type="button" disabled={last || busy} onClick={() => onMove(1)} aria-label={`Move ${visit.registration} later in the round`} className={arrow}>
            ▼
          </button>
        </span>
      </div>
      <button type="button" onClick={onOpen} className="block w-full px-2 pb-1 text-left hover:bg-brand/5" aria-label={`${visit.registration}, ${visit.customerName}: open`}>
        <span className="block font-mono font-bold">{visit.registration}</span>
        <span className="block truncate">{visit.customerName}</span>
        <span className="block truncate text-xs text-ink/70">
          {visit.checklist} · {STATUS_LABEL[visit.status]}
        </span>
      </button>
      {clash && (
        <ul className="px-2 pb-1 text-xs font-bold text-sev-soon">
          {visit.clashes.map((c) => (
            <li key={c.message} className="flex items-start gap-1">
              <ClashIcon size={14} /> {c.message}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

function VisitPanel({ visit, technicians, onMoved, onCancelled }: { visit: PlannedVisit; technicians: { id: string; name: string }[]; onMoved: (r: BookingResult) => void; onCancelled: () => void }) {
  const queryClient = useQueryClient();
  const [confirming, setConfirming] = useState(false);
  const cancel = useMutation({
    mutationFn: () => api(`/api/office/visits/${visit.id}/cancel`, { body: {} }),
    onSuccess: async () => {
      await queryClient.invalidateQueries();
      onCancelled();
    },
  });
  return (
    <div className="flex flex-col gap-4">
      <dl className="grid grid-cols-[10rem_1fr] gap-x-4 gap-y-1">
        <dt className="font-bold">Vehicle</dt>
        <dd>
          <span className="font-mono font-bold">{visit.registration}</span> {visit.make} {visit.model}
        </dd>
        <dt className="font-bold">Checklist</dt>
        <dd>
          {visit.checklist} (version {visit.templateVersion})
        </dd>
        <dt className="font-bold">Status</dt>
        <dd>{STATUS_LABEL[visit.status]}</dd>
      </dl>
      <p className="flex gap-4">
        <a className="text-brand underline" href={`/office/visits/${visit.id}`}>
          Open the visit
        </a>
        <a className="text-brand underline" href={`/office/customers/${visit.customerId}`}>
          Customer’s page
        </a>
      </p>
      {visit.status === 'booked' ? (
        <>
          <MoveVisitForm visit={visit} technicians={technicians} onMoved={onMoved} />
          <div className="border-t border-ink/20 pt-4">
            {confirming ? (
              <div className="flex flex-wrap items-center gap-3">
                <span className="font-bold">Cancel this visit? It drops off the technician’s phone at the next sync.</span>
                <Button variant="danger" onClick={() => cancel.mutate()} disabled={cancel.isPending}>
                  Yes, cancel the visit
                </Button>
                <Button onClick={() => setConfirming(false)}>Keep it</Button>
              </div>
            ) : (
              <Button variant="danger" onClick={() => setConfirming(true)}>
                Cancel visit…
              </Button>
            )}
            {cancel.isError && <p role="alert" className="mt-2 font-bold text-sev-now">{(cancel.error as ApiError).message}</p>}
          </div>
        </>
      ) : (
        <p>This visit has started on the technician’s phone, so it can no longer be moved or cancelled here.</p>
      )}
    </div>
  );
}

export default island(RoundsPlanner);
