import { useState } from 'react';

export default function SignOutButton({ variant = 'light' }: { variant?: 'light' | 'dark' }) {
  const [busy, setBusy] = useState(false);
  async function signOut() {
    setBusy(true);
    try {
      await fetch('/api/auth/sign-out', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' });
    } finally {
      window.location.assign('/sign-in');
    }
  }
  return (
    <button
      type="button"
      onClick={signOut}
      disabled={busy}
      className={
        variant === 'dark'
          ? 'min-h-12 rounded border border-white/40 px-4 font-bold whitespace-nowrap text-white hover:bg-white/10'
          : 'min-h-12 rounded border-2 border-ink px-4 font-bold'
      }
    >
      Sign out
    </button>
  );
}
