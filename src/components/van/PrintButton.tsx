export default function PrintButton() {
  return (
    <button type="button" onClick={() => window.print()} className="min-h-10 rounded bg-brand px-4 font-bold text-white">
      Print
    </button>
  );
}
