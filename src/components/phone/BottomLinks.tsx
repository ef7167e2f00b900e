// Secondary places, at the bottom where a thumb reaches them.
export function BottomLinks({ links }: { links: { href: string; label: string }[] }) {
  return (
    <nav aria-label="More" className="sticky bottom-0 z-10 mt-auto grid gap-2 border-t-2 border-ink/15 bg-white p-2" style={{ gridTemplateColumns: `repeat(${links.length}, 1fr)` }}>
      {links.map((link) => (
        <a key={link.href} href={link.href} className="flex min-h-14 items-center justify-center rounded-lg border-2 border-ink/30 px-2 text-center font-bold">
          {link.label}
        </a>
      ))}
    </nav>
  );
}
