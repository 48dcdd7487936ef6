export const CAUTION_TEXT =
  "Rillmark results are design aids for qualified engineers; local drainage criteria and the engineer of record govern.";

/** The standing engineering caution, in the amber reserved for cautions. */
export function Caution({ className = "" }: { className?: string }) {
  return (
    <p
      className={`flex items-start gap-2 border-l-4 border-caution-400 bg-caution-50 px-3 py-2 text-xs leading-relaxed text-caution-900 ${className}`}
    >
      <svg viewBox="0 0 16 16" className="mt-px size-3.5 shrink-0" aria-hidden="true">
        <path d="M8 1.5 15 14H1z" fill="#f2a12b" />
        <path d="M8 6v3.6M8 11.6v.3" stroke="#632e13" strokeWidth="1.6" strokeLinecap="round" />
      </svg>
      <span>{CAUTION_TEXT}</span>
    </p>
  );
}
