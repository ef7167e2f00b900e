// The frame of every technician screen: starts the device (who is signed in, their database, sync
// and the service worker), then shows the header, the outbox bar and the screen itself.
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { bootDevice, type Device } from '../../lib/device/boot';
import { OutboxBar } from './OutboxBar';
import { UpdateBanner } from './UpdateBanner';

type Props = {
  title: string;
  back?: { href: string; label: string };
  children: (device: Device) => ReactNode;
};

type State = { kind: 'starting' } | { kind: 'ready'; device: Device } | { kind: 'needs-network' } | { kind: 'failed'; message: string };

export function PhoneShell({ title, back, children }: Props) {
  const [state, setState] = useState<State>({ kind: 'starting' });
  const header = useRef<HTMLElement>(null);

  // Sticky headings below the shell's header sit under it, however tall the outbox line wraps.
  useEffect(() => {
    const element = header.current;
    if (!element) return;
    const observer = new ResizeObserver(() => document.documentElement.style.setProperty('--shell-header-h', `${element.offsetHeight}px`));
    observer.observe(element);
    return () => observer.disconnect();
  }, []);

  useEffect(() => {
    let cancelled = false;
    bootDevice()
      .then((result) => {
        if (cancelled) return;
        if (result.kind === 'redirect') window.location.replace(result.to);
        else if (result.kind === 'needs-network') setState({ kind: 'needs-network' });
        else setState({ kind: 'ready', device: result.device });
      })
      .catch((error: unknown) => {
        console.error('[tickover] could not start', error);
        const message =
          error instanceof Error && error.name === 'MissingAPIError'
            ? 'This browser does not allow the app to store data (private browsing?). Open Tickover in a normal window.'
            : 'The app could not open its storage on this phone. Close the app fully and open it again.';
        if (!cancelled) setState({ kind: 'failed', message });
      });
    return () => {
      cancelled = true;
    };
  }, []);

  return (
    <div className="flex min-h-dvh flex-col">
      <header ref={header} className="sticky top-0 z-20 bg-brand-dark text-white">
        <div className="flex min-h-16 items-center gap-2 px-2">
          {back ? (
            <a href={back.href} className="flex min-h-12 min-w-12 items-center gap-1 rounded-lg px-2 font-bold">
              <svg width="24" height="24" viewBox="0 0 24 24" aria-hidden="true">
                <path d="M15 5l-7 7 7 7" fill="none" stroke="currentColor" strokeWidth="3" strokeLinecap="round" strokeLinejoin="round" />
              </svg>
              {back.label}
            </a>
          ) : (
            <img src="/icons/icon.svg" alt="" width="36" height="36" className="ml-2" />
          )}
          <h1 className="min-w-0 flex-1 truncate px-1 text-xl font-bold">{title}</h1>
        </div>
        {state.kind === 'ready' && <OutboxBar />}
      </header>
      {state.kind === 'ready' && <UpdateBanner />}
      <div className="flex flex-1 flex-col">
        {state.kind === 'starting' && <p className="p-6 text-lg">Opening…</p>}
        {state.kind === 'needs-network' && (
          <div className="flex flex-col gap-4 p-6">
            <h2 className="text-2xl font-bold">Sign in needs the network once</h2>
            <p>This phone does not know who you are yet. Find a signal, sign in, and the round will then work without one.</p>
            <a href="/sign-in" className="flex min-h-14 items-center justify-center rounded-lg bg-brand px-4 text-lg font-bold text-white">
              Sign in
            </a>
          </div>
        )}
        {state.kind === 'failed' && (
          <p role="alert" className="m-4 rounded-lg border-2 border-sev-now bg-white p-4 font-bold text-sev-now">
            {state.message}
          </p>
        )}
        {state.kind === 'ready' && children(state.device)}
      </div>
    </div>
  );
}
