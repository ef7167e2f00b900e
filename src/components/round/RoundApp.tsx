import { PhoneShell } from '../phone/PhoneShell';
import { BottomLinks } from '../phone/BottomLinks';
import { RoundScreen } from './RoundScreen';

export default function RoundApp() {
  return (
    <PhoneShell title="Today’s round">
      {(device) => (
        <>
          <RoundScreen device={device} />
          <BottomLinks
            links={[
              { href: '/van', label: 'Load list' },
              { href: '/calculators', label: 'Calculators' },
              { href: '/device', label: 'This phone' },
            ]}
          />
        </>
      )}
    </PhoneShell>
  );
}
