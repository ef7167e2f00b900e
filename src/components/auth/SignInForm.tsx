import { useState, type FormEvent } from 'react';
import { pathAfterSignIn } from '../../lib/route-access';

type Props = { next: string | null };

function messageFor(status: number): string {
  if (status === 401 || status === 400) return 'Wrong e-mail or password. Check both and try again.';
  if (status === 429) return 'Too many sign-in attempts from this device. Wait a minute, then try again.';
  return 'Sign-in failed on the server. Try again in a moment.';
}

export default function SignInForm({ next }: Props) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    setError(null);
    try {
      const response = await fetch('/api/auth/sign-in/email', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: String(form.get('email') ?? '').trim(), password: String(form.get('password') ?? '') }),
      });
      if (!response.ok) {
        setError(messageFor(response.status));
        return;
      }
      const body = (await response.json()) as { user?: { role?: string } };
      const home = body.user?.role === 'technician' ? '/round' : '/office';
      // Only this app's own pages are followed, so a crafted link cannot send someone elsewhere.
      window.location.assign(pathAfterSignIn(next, home, window.location.origin));
    } catch {
      setError('No connection to the server. Sign-in needs the network once; after that the round works offline.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate={false}>
      <label className="flex flex-col gap-1 font-bold">
        E-mail
        <input
          name="email"
          type="email"
          autoComplete="username"
          required
          className="min-h-14 rounded border-2 border-ink/60 bg-white px-3 text-lg font-normal"
        />
      </label>
      <label className="flex flex-col gap-1 font-bold">
        Password
        <input
          name="password"
          type="password"
          autoComplete="current-password"
          required
          className="min-h-14 rounded border-2 border-ink/60 bg-white px-3 text-lg font-normal"
        />
      </label>
      {error && (
        <p role="alert" className="rounded border-2 border-sev-now bg-white p-3 font-bold text-sev-now">
          {error}
        </p>
      )}
      <button
        type="submit"
        disabled={busy}
        className="min-h-14 rounded bg-brand px-4 text-lg font-bold text-white disabled:opacity-60"
      >
        {busy ? 'Signing in…' : 'Sign in'}
      </button>
    </form>
  );
}
