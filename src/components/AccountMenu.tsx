import { useEffect, useId, useRef, useState } from "react";
import { Link, useLocation } from "react-router-dom";

interface AccountMenuProps {
  name: string;
  email: string;
  onSignOut: () => void;
  signingOut: boolean;
}

function initials(name: string): string {
  const parts = name.trim().split(/\s+/);
  return (
    (parts[0]?.[0] ?? "") + (parts.length > 1 ? (parts.at(-1)?.[0] ?? "") : "")
  ).toUpperCase();
}

/** A disclosure (button + panel) with the account link and sign-out. */
export function AccountMenu({ name, email, onSignOut, signingOut }: AccountMenuProps) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const rootRef = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const location = useLocation();

  // Close after any navigation the menu (or anything else) caused.
  const [lastPath, setLastPath] = useState(location.pathname);
  if (lastPath !== location.pathname) {
    setLastPath(location.pathname);
    setOpen(false);
  }

  useEffect(() => {
    if (!open) return;
    const onPointer = (event: PointerEvent) => {
      if (!rootRef.current?.contains(event.target as Node)) setOpen(false);
    };
    const onKey = (event: KeyboardEvent) => {
      if (event.key === "Escape") {
        setOpen(false);
        buttonRef.current?.focus();
      }
    };
    document.addEventListener("pointerdown", onPointer);
    document.addEventListener("keydown", onKey);
    return () => {
      document.removeEventListener("pointerdown", onPointer);
      document.removeEventListener("keydown", onKey);
    };
  }, [open]);

  return (
    <div ref={rootRef} className="relative">
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((v) => !v)}
        className="flex items-center gap-2 rounded-md px-2 py-1.5 text-sm text-ink-100 hover:bg-ink-800 focus-visible:outline-rill-300"
      >
        <span
          aria-hidden="true"
          className="grid size-7 place-items-center rounded-full bg-rill-700 text-xs font-semibold text-white"
        >
          {initials(name)}
        </span>
        <span className="max-w-40 truncate">{name}</span>
        <span className="sr-only">, account menu</span>
        <svg viewBox="0 0 12 12" className="size-3 text-ink-300" aria-hidden="true">
          <path d="M2.5 4.5 6 8l3.5-3.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
        </svg>
      </button>
      <div
        id={panelId}
        hidden={!open}
        className="absolute right-0 z-20 mt-2 w-64 rounded-lg border border-ink-200 bg-white py-2 text-sm shadow-lg"
      >
        <div className="border-b border-ink-100 px-4 pb-2">
          <p className="font-medium text-ink-900">{name}</p>
          <p className="truncate text-ink-500">{email}</p>
        </div>
        <ul className="pt-1">
          <li>
            <Link to="/account" className="block px-4 py-2 text-ink-800 hover:bg-ink-50">
              Account settings
            </Link>
          </li>
          <li>
            <button
              type="button"
              onClick={onSignOut}
              disabled={signingOut}
              className="block w-full px-4 py-2 text-left text-ink-800 hover:bg-ink-50 disabled:text-ink-400"
            >
              {signingOut ? "Signing out…" : "Sign out"}
            </button>
          </li>
        </ul>
      </div>
    </div>
  );
}
