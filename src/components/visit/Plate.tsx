// A registration shown as it is read off the car: bold, spaced, on a plain light plate.
export function Plate({ registration, className = '' }: { registration: string; className?: string }) {
  return (
    <span className={`rounded-md border-2 border-ink bg-accent/90 px-2 py-0.5 font-mono text-lg font-bold tracking-wider text-ink ${className}`}>
      {spaced(registration)}
    </span>
  );
}

// Stored without spaces; a 7-character registration reads as two groups of four and three.
function spaced(registration: string): string {
  return registration.length === 7 ? `${registration.slice(0, 4)} ${registration.slice(4)}` : registration;
}
