// Reviewing one visit: every item's result with readings and their judgement, findings with
// photos, parts, the sign-off and signature, the operations that built it and any conflicts.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { VisitDetail } from '../../lib/server/visit-review';
import { Button } from '../ui/Button';
import { SeverityBadge } from '../ui/SeverityBadge';
import { api, type Json } from './api';
import { Dialog } from './Dialog';
import { clockLabel, dateTimeLabel, dayLabel, distanceLabel, STATUS_LABEL } from './format';
import { Panel } from './Panel';
import { island } from './query-client';
import { signatureDataUrl } from './signature';
import { unitLabel } from './units';

type Detail = Json<VisitDetail>;
type Photo = Detail['otherPhotos'][number];

const CHECK_LABEL = { done: 'Done', skipped: 'Skipped', not_yet: 'Not yet' } as const;

function VisitReview({ visitId, timeZone }: { visitId: string; timeZone: string }) {
  const queryClient = useQueryClient();
  const detail = useQuery({ queryKey: ['visit', visitId], queryFn: () => api<Detail>(`/api/office/visits/${visitId}`) });
  const [photo, setPhoto] = useState<Photo | null>(null);
  const review = useMutation({
    mutationFn: () => api(`/api/office/visits/${visitId}/review`, { body: {} }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['visit', visitId] }),
  });
  if (detail.isLoading) return <p>Loading the visit…</p>;
  if (detail.isError) return <p role="alert" className="font-bold text-sev-now">{(detail.error as Error).message}</p>;
  const d = detail.data!;
  const { visit, vehicle } = d;
  const openConflicts = d.conflicts.filter((c) => c.resolvedAt === null);

  return (
    <div className="flex flex-col gap-5">
      <section aria-label="Visit" className="grid grid-cols-[minmax(0,1fr)_auto] gap-4 rounded border border-ink/20 bg-white p-4">
        <dl className="grid grid-cols-[9rem_minmax(0,1fr)_9rem_minmax(0,1fr)] gap-x-4 gap-y-1">
          <dt className="font-bold">When</dt>
          <dd>
            {dayLabel(visit.roundDate, 'EEEE d MMMM yyyy')}, {clockLabel(visit.slotStart, timeZone)}–{clockLabel(visit.slotEnd, timeZone)}
          </dd>
          <dt className="font-bold">Status</dt>
          <dd className="font-bold">{STATUS_LABEL[visit.status]}</dd>
          <dt className="font-bold">Technician</dt>
          <dd>{visit.technicianName}</dd>
          <dt className="font-bold">Checklist</dt>
          <dd>
            {d.checklist.name}, version {d.checklist.version}
          </dd>
          <dt className="font-bold">Customer</dt>
          <dd>
            <a href={`/office/customers/${d.customer.id}`} className="text-brand underline">
              {d.customer.name}
            </a>{' '}
            {d.customer.phone && <span className="text-ink/80">· {d.customer.phone}</span>}
          </dd>
          <dt className="font-bold">Vehicle</dt>
          <dd>
            <a href={`/office/vehicles/${vehicle.id}`} className="font-mono font-bold text-brand underline">
              {vehicle.registration}
            </a>{' '}
            {vehicle.make} {vehicle.model} {vehicle.engine}
          </dd>
          <dt className="font-bold">Address</dt>
          <dd className="col-span-3">
            {visit.addressLines} {visit.postcode}
          </dd>
          {visit.reviewedAt && (
            <>
              <dt className="font-bold">Reviewed</dt>
              <dd className="col-span-3">
                {dateTimeLabel(visit.reviewedAt, timeZone)} by {visit.reviewedByName}
              </dd>
            </>
          )}
        </dl>
        <div className="flex w-72 flex-col items-stretch gap-2">
          <Button variant="primary" disabled={!d.review.allowed || review.isPending} onClick={() => review.mutate()}>
            {review.isPending ? 'Marking…' : 'Mark reviewed'}
          </Button>
          {d.review.reason && <p className="text-sm">{d.review.reason}</p>}
          {review.isError && (
            <p role="alert" className="text-sm font-bold text-sev-now">
              {(review.error as Error).message}
            </p>
          )}
          {['signed_off', 'reviewed', 'invoiced', 'paid'].includes(visit.status) && (
            <a href={`/office/visits/${visit.id}/follow-up`} className="text-brand underline">
              Follow-up: service record, invoice, advised work
            </a>
          )}
          {openConflicts.length > 0 && (
            <a href={`/office/conflicts?visitId=${visit.id}`} className="font-bold text-sev-now underline">
              Resolve {openConflicts.length} open conflict{openConflicts.length === 1 ? '' : 's'}
            </a>
          )}
        </div>
      </section>

      <div className="grid grid-cols-[minmax(0,7fr)_minmax(0,5fr)] items-start gap-5">
        <div className="flex flex-col gap-5">
          {d.checklist.sections.map((section) => (
            <Panel key={section.id} title={section.title}>
              <table className="w-full text-left text-[15px]">
                <thead className="sr-only">
                  <tr>
                    <th>Item</th>
                    <th>Result</th>
                    <th>Judgement</th>
                  </tr>
                </thead>
                <tbody>
                  {section.items.map((item) => (
                    <tr key={item.id} className="border-b border-ink/10 align-top last:border-0">
                      <td className="w-[45%] py-1.5 pr-3">{item.label}</td>
                      <td className="py-1.5 pr-3 whitespace-nowrap">
                        {item.kind === 'check' && (item.check ? <strong>{CHECK_LABEL[item.check.state]}</strong> : <span className="text-ink/60">No result</span>)}
                        {item.kind === 'reading' &&
                          (item.reading ? (
                            <strong className="font-mono">
                              {item.reading.value ?? item.reading.textValue} {unitLabel(item.reading.unit ?? item.unit)}
                            </strong>
                          ) : (
                            <span className="text-ink/60">No reading</span>
                          ))}
                        {item.kind === 'part' &&
                          (item.partLines.length ? (
                            <ul>
                              {item.partLines.map((line) => (
                                <li key={line.id}>
                                  <strong>
                                    {line.quantity} {unitLabel(line.unit)}
                                  </strong>{' '}
                                  <span className="font-mono">{line.partNumber}</span>
                                </li>
                              ))}
                            </ul>
                          ) : (
                            <span className="text-ink/60">None fitted</span>
                          ))}
                      </td>
                      <td className="py-1.5">
                        {item.reading?.judgement && (
                          <span className="flex flex-wrap items-center gap-2">
                            {item.reading.judgement.severity ? (
                              <SeverityBadge severity={item.reading.judgement.severity} size={16} />
                            ) : (
                              <strong className="text-sm">Not judged</strong>
                            )}
                            <span className="text-sm">{item.reading.judgement.message}</span>
                          </span>
                        )}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </Panel>
          ))}
        </div>

        <div className="flex flex-col gap-5">
          <Panel title={`Findings (${d.findings.length})`}>
            {d.findings.length === 0 ? (
              <p>No findings recorded.</p>
            ) : (
              <ul className="flex flex-col gap-3">
                {d.findings.map((finding) => (
                  <li key={finding.id} className="rounded border border-ink/15 p-2">
                    <p className="flex items-center gap-2">
                      <SeverityBadge severity={finding.severity} />
                      <strong>{finding.title}</strong>
                    </p>
                    {finding.detail && <p className="mt-1">{finding.detail}</p>}
                    <Photos photos={finding.photos} onOpen={setPhoto} />
                  </li>
                ))}
              </ul>
            )}
            {d.otherPhotos.length > 0 && (
              <>
                <h3 className="mt-3 font-bold">Other photos</h3>
                <Photos photos={d.otherPhotos} onOpen={setPhoto} />
              </>
            )}
          </Panel>

          <Panel title="Sign-off">
            {d.signOff ? (
              <div className="flex flex-col gap-2">
                <dl className="grid grid-cols-[8rem_1fr] gap-x-3 gap-y-1">
                  <dt className="font-bold">Signed</dt>
                  <dd>{dateTimeLabel(d.signOff.signedAt, timeZone)}</dd>
                  <dt className="font-bold">Technician</dt>
                  <dd>{d.signOff.technicianName}</dd>
                  <dt className="font-bold">Odometer</dt>
                  <dd>
                    {d.signOff.odometer.toLocaleString('en-GB')} {distanceLabel(d.signOff.odometerUnit)}
                  </dd>
                  <dt className="font-bold">Customer</dt>
                  <dd>{d.signOff.customerName}</dd>
                </dl>
                <img
                  src={signatureDataUrl(d.signOff.signatureSvg)}
                  alt={`Signature of ${d.signOff.customerName}`}
                  className="h-28 w-full rounded border border-ink/20 bg-white object-contain"
                />
                <p className="text-sm italic">“{d.signOff.declaration}”</p>
              </div>
            ) : (
              <p>Not signed off yet.</p>
            )}
            {d.voidedSignOffs > 0 && <p className="mt-2 text-sm">{d.voidedSignOffs} earlier sign-off(s) voided when the visit was reopened.</p>}
          </Panel>

          <Panel title={`Parts fitted (${d.partLines.length})`}>
            {d.partLines.length === 0 ? (
              <p>No parts recorded.</p>
            ) : (
              <table className="w-full text-left text-[15px]">
                <thead>
                  <tr className="border-b border-ink/20">
                    <th className="py-1 pr-2">Part</th>
                    <th className="py-1 pr-2">Description</th>
                    <th className="py-1 text-right">Quantity</th>
                  </tr>
                </thead>
                <tbody>
                  {d.partLines.map((line) => (
                    <tr key={line.id} className="border-b border-ink/10 last:border-0">
                      <td className="py-1 pr-2 font-mono">{line.partNumber}</td>
                      <td className="py-1 pr-2">{line.description}</td>
                      <td className="py-1 text-right whitespace-nowrap">
                        {line.quantity} {unitLabel(line.unit)}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
          </Panel>

          <Panel title={`Notes (${d.notes.length})`}>
            {d.notes.length === 0 ? (
              <p>No notes.</p>
            ) : (
              <ul className="flex flex-col gap-2">
                {d.notes.map((note) => (
                  <li key={note.id}>
                    <p className="text-sm text-ink/70">
                      {note.authorName}, {dateTimeLabel(note.createdAt, timeZone)}
                    </p>
                    <p className="whitespace-pre-line">{note.body}</p>
                  </li>
                ))}
              </ul>
            )}
          </Panel>

          {d.modelNotes.length > 0 && (
            <Panel title="Model notes for this vehicle">
              <ul className="flex flex-col gap-2">
                {d.modelNotes.map((note) => (
                  <li key={note.id}>
                    <strong>{note.title}</strong>
                    <p className="text-sm">{note.body}</p>
                  </li>
                ))}
              </ul>
            </Panel>
          )}

          <Panel title={`Conflicts (${d.conflicts.length})`}>
            {d.conflicts.length === 0 ? (
              <p>No conflicts.</p>
            ) : (
              <ul className="flex flex-col gap-2">
                {d.conflicts.map((c) => (
                  <li key={c.id} className="text-sm">
                    <strong>{c.resolvedAt ? 'Resolved' : 'Open'}</strong> · {c.kind} · {c.reason.replace('_', ' ')} · {dateTimeLabel(c.createdAt, timeZone)}
                    {c.resolvedAt && c.resolution && <> · {c.resolution}</>}
                  </li>
                ))}
              </ul>
            )}
            <p className="mt-2">
              <a href={`/office/conflicts?visitId=${visit.id}`} className="text-brand underline">
                Open the conflict list for this visit
              </a>
            </p>
          </Panel>
        </div>
      </div>

      <details className="rounded border border-ink/20 bg-white p-4">
        <summary className="cursor-pointer text-lg font-bold">
          History of operations ({d.operations.total}
          {d.operations.total > d.operations.shown.length ? `, latest ${d.operations.shown.length} shown` : ''})
        </summary>
        <table className="mt-3 w-full text-left text-sm">
          <thead>
            <tr className="border-b border-ink/20">
              <th className="py-1 pr-2">Received</th>
              <th className="py-1 pr-2">Kind</th>
              <th className="py-1 pr-2">Outcome</th>
              <th className="py-1 pr-2">By</th>
              <th className="py-1 pr-2">Device</th>
              <th className="py-1">Reason</th>
            </tr>
          </thead>
          <tbody>
            {d.operations.shown.map((op) => (
              <tr key={op.opId} className="border-b border-ink/10 last:border-0">
                <td className="py-1 pr-2 whitespace-nowrap">{dateTimeLabel(op.receivedAt, timeZone)}</td>
                <td className="py-1 pr-2">{op.kind}</td>
                <td className="py-1 pr-2 font-bold">{op.outcome}</td>
                <td className="py-1 pr-2">{op.userName}</td>
                <td className="py-1 pr-2 font-mono">{op.deviceId}</td>
                <td className="py-1">{op.reason ?? ''}</td>
              </tr>
            ))}
            {d.operations.shown.length === 0 && (
              <tr>
                <td colSpan={6} className="py-2">
                  No operations have synced for this visit yet.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </details>

      <Dialog open={photo !== null} title={photo?.caption || 'Photo'} onClose={() => setPhoto(null)} wide>
        {photo?.url ? <img src={photo.url} alt={photo.caption || 'Photo from the visit'} className="mx-auto max-h-[75vh]" /> : <p>The picture is not on the server.</p>}
      </Dialog>
    </div>
  );
}

function Photos({ photos, onOpen }: { photos: Photo[]; onOpen: (photo: Photo) => void }) {
  if (photos.length === 0) return null;
  return (
    <ul className="mt-2 flex flex-wrap gap-2">
      {photos.map((p) => (
        <li key={p.id}>
          <button type="button" onClick={() => onOpen(p)} className="block rounded border border-ink/30 bg-ink/5 hover:border-brand" aria-label={`Open photo${p.caption ? `: ${p.caption}` : ''}`}>
            <Thumbnail photo={p} />
          </button>
        </li>
      ))}
    </ul>
  );
}

/** The thumbnail, or what the row says about the photo when the picture cannot be shown. */
function Thumbnail({ photo }: { photo: Photo }) {
  const [failed, setFailed] = useState(false);
  const src = photo.thumbnailUrl ?? photo.url;
  if (src && !failed) return <img src={src} alt="" onError={() => setFailed(true)} className="size-24 rounded object-cover" loading="lazy" />;
  return (
    <span className="flex size-24 flex-col items-center justify-center p-1 text-center text-xs">
      <span className="font-bold">Photo</span>
      <span>{Math.round(photo.sizeBytes / 1024)} kB</span>
      <span>cannot be shown</span>
    </span>
  );
}

export default island(VisitReview);
