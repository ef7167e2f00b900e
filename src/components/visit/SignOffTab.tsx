// The end of the visit: odometer, the customer's signature drawn on the screen, the technician's
// declaration. Once signed off, the visit is read-only on this phone.
import { useEffect, useRef, useState } from 'react';
import SignaturePad from 'signature_pad';
import { markUnsaved } from '../../lib/device/boot';
import { signOff } from '../../lib/device/visit-actions';
import { itemsLeft, visitProgress } from '../../lib/device/visit-progress';
import { formatDate, formatTime, unitLabel } from '../phone/format';
import { SEVERITY_LABEL, SeverityIcon } from '../ui/SeverityIcon';
import type { TabProps } from './VisitScreen';

export default function SignOffTab({ device, data, locked, go }: TabProps) {
  if (data.signOff) return <SignedOff data={data} />;
  return <SignOffForm device={device} data={data} locked={locked} go={go} />;
}

function declarationText(technician: string, registration: string): string {
  return `I, ${technician}, carried out the work recorded here on ${registration}, and the readings, findings and parts are recorded as I found and fitted them.`;
}

function SignOffForm({ device, data, go }: TabProps) {
  const vehicle = data.vehicle;
  const odometerUnit = vehicle?.odometerUnit ?? '[mi_i]';
  const [odometer, setOdometer] = useState('');
  const [customerName, setCustomerName] = useState(data.customer?.name ?? '');
  const [signed, setSigned] = useState(false);
  const [confirmed, setConfirmed] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const canvas = useRef<HTMLCanvasElement>(null);
  const pad = useRef<SignaturePad | null>(null);

  useEffect(() => {
    const element = canvas.current;
    if (!element) return;
    // Draw at the screen's pixel density so the line is sharp; the SVG scales anyway.
    const ratio = Math.max(window.devicePixelRatio || 1, 1);
    element.width = element.offsetWidth * ratio;
    element.height = element.offsetHeight * ratio;
    element.getContext('2d')?.scale(ratio, ratio);
    const signature = new SignaturePad(element, { penColor: '#14202b', minWidth: 1.2, maxWidth: 3.2 });
    signature.addEventListener('endStroke', () => setSigned(!signature.isEmpty()));
    pad.current = signature;
    return () => signature.off();
  }, []);

  useEffect(() => {
    markUnsaved('sign-off', odometer || signed ? 'the sign-off' : null);
    return () => markUnsaved('sign-off', null);
  }, [odometer, signed]);

  const recorded = { checks: data.checks, readings: data.readings, partLines: data.partLines };
  const progress = data.version ? visitProgress(data.version, recorded) : null;
  const left = data.version ? itemsLeft(data.version, recorded) : [];
  const odometerValue = /^\d{1,7}$/.test(odometer.trim()) ? Number(odometer.trim()) : null;
  const lowOdometer = odometerValue !== null && vehicle?.lastServiceOdometer != null && odometerValue < vehicle.lastServiceOdometer;
  const declaration = declarationText(device.user.name, vehicle?.registration ?? 'this vehicle');
  const ready = odometerValue !== null && customerName.trim().length > 0 && signed && confirmed;

  function clear() {
    pad.current?.clear();
    setSigned(false);
  }

  async function submit() {
    if (!ready || !pad.current) return;
    setSaving(true);
    setProblem(null);
    try {
      const svg = pad.current.toSVG().trim();
      await signOff(device.db, data.visit.id, { odometer: odometerValue!, odometerUnit, customerName, signatureSvg: svg.slice(svg.indexOf('<svg')), declaration });
      device.sync.changed();
      window.scrollTo(0, 0);
    } catch (error) {
      setProblem(error instanceof Error ? error.message : String(error));
      setSaving(false);
    }
  }

  const counts = (['now', 'soon', 'watch', 'ok'] as const).map((s) => [s, data.findings.filter((f) => f.severity === s).length] as const).filter(([, n]) => n > 0);

  return (
    <div className="flex flex-col gap-4 p-3">
      <section className="rounded-xl border-2 border-ink/15 bg-white p-3">
        <h2 className="text-xl font-bold">Before you sign off</h2>
        {progress && (
          <p className="mt-1">
            {progress.done} of {progress.total} checklist items dealt with.
          </p>
        )}
        {left.length > 0 && (
          <div className="mt-2 rounded-lg border-2 border-sev-soon bg-sev-soon/10 p-2">
            <p className="font-bold">{left.length === 1 ? '1 item is' : `${left.length} items are`} not done; the service record will say so:</p>
            <ul className="list-disc pl-6 text-base">
              {left.slice(0, 8).map((item) => (
                <li key={item.id}>{item.label}</li>
              ))}
              {left.length > 8 && <li>and {left.length - 8} more</li>}
            </ul>
            <button type="button" onClick={() => go('checklist')} className="mt-2 min-h-12 rounded-lg border-2 border-ink/40 bg-white px-3 font-bold">
              Back to the checklist
            </button>
          </div>
        )}
        <p className="mt-2 flex flex-wrap items-center gap-x-3 gap-y-1">
          Findings: {counts.length === 0 && 'none'}
          {counts.map(([severity, n]) => (
            <span key={severity} className="inline-flex items-center gap-1 font-bold">
              <SeverityIcon severity={severity} size={20} /> {n} {SEVERITY_LABEL[severity]}
            </span>
          ))}
        </p>
      </section>

      <label className="flex flex-col gap-1 font-bold">
        Odometer ({unitLabel(odometerUnit)})
        <input
          value={odometer}
          onChange={(e) => setOdometer(e.target.value.replace(/[^\d]/g, ''))}
          inputMode="numeric"
          autoComplete="off"
          className="min-h-16 rounded-lg border-2 border-ink/60 bg-white px-3 font-mono text-3xl"
        />
      </label>
      {lowOdometer && (
        <p className="rounded-lg border-2 border-sev-watch bg-white p-2 text-base">
          That is less than at the last service ({vehicle!.lastServiceOdometer!.toLocaleString('en-GB')}). Check the figure; record it as read if it is right.
        </p>
      )}

      <label className="flex flex-col gap-1 font-bold">
        Customer’s name
        <input value={customerName} onChange={(e) => setCustomerName(e.target.value)} maxLength={120} className="min-h-14 rounded-lg border-2 border-ink/60 bg-white px-3 text-lg font-normal" />
      </label>

      <div className="flex flex-col gap-1">
        <p className="font-bold" id="signature-label">
          Customer’s signature
        </p>
        <canvas ref={canvas} aria-labelledby="signature-label" data-testid="signature-pad" className="h-48 w-full touch-none rounded-lg border-2 border-ink/60 bg-white" />
        <button type="button" onClick={clear} className="min-h-12 self-start rounded-lg border-2 border-ink/40 bg-white px-4 font-bold">
          Clear signature
        </button>
      </div>

      <label className="flex items-start gap-3 rounded-lg border-2 border-ink/20 bg-white p-3">
        <input type="checkbox" checked={confirmed} onChange={(e) => setConfirmed(e.target.checked)} className="mt-1 size-8 shrink-0 accent-brand" />
        <span>{declaration}</span>
      </label>

      {problem && (
        <p role="alert" className="rounded-lg border-2 border-sev-now bg-white p-3 font-bold text-sev-now">
          {problem}
        </p>
      )}

      <button type="button" onClick={submit} disabled={!ready || saving} className="min-h-16 rounded-lg bg-brand text-xl font-bold text-white disabled:bg-ink/30 disabled:text-ink/70">
        {saving ? 'Signing off…' : 'Sign off and lock the visit'}
      </button>
      {!ready && <p className="text-base">To sign off: odometer, the customer’s name and signature, and your confirmation.</p>}
    </div>
  );
}

function SignedOff({ data }: { data: TabProps['data'] }) {
  const s = data.signOff!;
  return (
    <div className="flex flex-col gap-3 p-3">
      <section className="rounded-xl border-2 border-sev-ok bg-white p-4">
        <h2 className="text-xl font-bold">Signed off</h2>
        <p>
          {formatDate(s.signedAt)} at {formatTime(s.signedAt)} · odometer {s.odometer.toLocaleString('en-GB')} {unitLabel(s.odometerUnit)}
        </p>
        <p className="mt-2">Signed by {s.customerName}:</p>
        <img src={`data:image/svg+xml;charset=utf-8,${encodeURIComponent(s.signatureSvg)}`} alt={`Signature of ${s.customerName}`} className="mt-1 h-32 w-full rounded-lg border border-ink/20 bg-white object-contain" />
        <p className="mt-2 text-base">{s.declaration}</p>
        <p className="mt-2 font-bold">{data.unsent > 0 ? `${data.unsent} changes of this visit wait to be sent.` : 'Everything on this visit has reached the office.'}</p>
      </section>
      <a href="/round" className="flex min-h-14 items-center justify-center rounded-lg bg-brand text-lg font-bold text-white">
        Back to the round
      </a>
    </div>
  );
}
