// A clash warning is shown with a shape (a warning triangle) and words, never colour alone.
export function ClashIcon({ size = 16 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="mt-0.5 shrink-0">
      <path d="M10 1.5l9 16.5H1z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
      <path d="M10 7.5v4.5" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
      <circle cx="10" cy="15" r="1.2" fill="currentColor" />
    </svg>
  );
}
