/** Rillmark's mark: a rill winding down to its outlet, with a ripple at the design point. */
export function LogoMark({
  className = "size-8",
  plate = "#18252e",
}: {
  className?: string;
  /** The tile colour; a lighter one keeps the mark visible on the dark top bar. */
  plate?: string;
}) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="8" fill={plate} />
      <path
        d="M8 6.5c4.5 2.5 1.5 7 5.8 9.6 4 2.4 7.4.8 9.2 6.4"
        fill="none"
        stroke="#77ccc8"
        strokeWidth="2.6"
        strokeLinecap="round"
      />
      <path
        d="M17.2 26.2a6.8 6.8 0 0 1 9.4-9.2"
        fill="none"
        stroke="#77ccc8"
        strokeOpacity=".5"
        strokeWidth="1.5"
        strokeLinecap="round"
      />
      <circle cx="23.6" cy="23.4" r="2.3" fill="#f2a12b" />
    </svg>
  );
}

export function Wordmark({ tone = "dark" }: { tone?: "dark" | "light" }) {
  return (
    <span className="flex items-center gap-2.5">
      <LogoMark plate={tone === "light" ? "#263640" : "#18252e"} />
      <span
        className={`text-lg font-semibold tracking-tight ${tone === "light" ? "text-white" : "text-ink-900"}`}
      >
        Rillmark
      </span>
    </span>
  );
}
