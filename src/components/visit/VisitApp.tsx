import { PhoneShell } from '../phone/PhoneShell';
import { VisitScreen } from './VisitScreen';

export default function VisitApp() {
  const visitId = new URLSearchParams(window.location.search).get('id') ?? '';
  return (
    <PhoneShell title="Visit" back={{ href: '/round', label: 'Round' }}>
      {(device) => <VisitScreen device={device} visitId={visitId} />}
    </PhoneShell>
  );
}
