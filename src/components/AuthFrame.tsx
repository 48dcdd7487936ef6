import { type ReactNode } from "react";
import { Caution } from "./Caution";
import { ContourArt } from "./ContourArt";
import { Wordmark } from "./Logo";
import { DocumentTitle } from "./DocumentTitle";

/** The frame of the pages people see before they are signed in. */
export function AuthFrame({ children, aside }: { children: ReactNode; aside?: ReactNode }) {
  return (
    <div className="flex min-h-screen">
      <aside className="relative hidden w-[42%] max-w-xl shrink-0 flex-col justify-between overflow-hidden bg-ink-900 p-10 text-white lg:flex">
        <span className="relative z-10">
          <Wordmark tone="light" />
        </span>
        <ContourArt className="pointer-events-none absolute -top-16 left-1/2 w-[125%] max-w-none -translate-x-1/2" />
        <div className="relative">
          <p className="text-2xl leading-snug font-semibold">
            Time of concentration, traced on the map, computed by every method your agency asks for,
            and signed off as a team.
          </p>
          <p className="mt-3 text-sm text-ink-300">
            Flow paths, travel-time sheets and calculation records for storm drainage design.
          </p>
        </div>
      </aside>
      <div className="flex flex-1 flex-col">
        <header className="flex items-center justify-between px-8 py-5">
          <span className="lg:invisible">
            <Wordmark />
          </span>
          {aside}
        </header>
        <main id="main" className="flex flex-1 items-start justify-center px-6 pt-6 pb-10 lg:pt-16">
          <div className="w-full max-w-md">{children}</div>
        </main>
        <footer className="px-8 pb-6">
          <Caution className="mx-auto max-w-md" />
        </footer>
      </div>
    </div>
  );
}

/** The white card a sign-in style form sits on. */
export function AuthCard({
  title,
  intro,
  children,
}: {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
}) {
  return (
    <div className="rounded-xl border border-ink-200 bg-white p-7 shadow-sm">
      <DocumentTitle title={title} />
      <h1 className="text-xl font-semibold tracking-tight text-ink-950">{title}</h1>
      {intro && <div className="mt-1.5 text-sm text-ink-600">{intro}</div>}
      <div className="mt-6">{children}</div>
    </div>
  );
}
