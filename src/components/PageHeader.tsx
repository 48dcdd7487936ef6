import { type ReactNode } from "react";
import { DocumentTitle } from "./DocumentTitle";

interface PageHeaderProps {
  title: string;
  /** A short line above the title, e.g. the team the page belongs to. */
  context?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
}

export function PageHeader({ title, context, description, actions }: PageHeaderProps) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-ink-200 pb-4">
      <DocumentTitle title={title} />
      <div className="min-w-0">
        {context && (
          <p className="mb-1 text-xs font-semibold tracking-wide text-rill-700 uppercase">
            {context}
          </p>
        )}
        <h1 className="text-2xl font-semibold tracking-tight text-ink-950">{title}</h1>
        {description && <div className="mt-1 max-w-3xl text-sm text-ink-600">{description}</div>}
      </div>
      {actions && <div className="flex shrink-0 items-center gap-2">{actions}</div>}
    </header>
  );
}
