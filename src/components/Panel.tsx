import { type ReactNode } from "react";

interface PanelProps {
  title?: string;
  /** Id for aria-labelledby, so the section is a named landmark region. */
  titleId?: string;
  description?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
}

/** A white sheet on the drafting-paper background. */
export function Panel({
  title,
  titleId,
  description,
  actions,
  children,
  className = "",
}: PanelProps) {
  return (
    <section
      aria-labelledby={title ? titleId : undefined}
      className={`rounded-lg border border-ink-200 bg-white shadow-xs ${className}`}
    >
      {title && (
        <div className="flex items-start justify-between gap-3 border-b border-ink-100 px-5 py-3.5">
          <div>
            <h2 id={titleId} className="text-base font-semibold text-ink-900">
              {title}
            </h2>
            {description && <div className="mt-0.5 text-sm text-ink-500">{description}</div>}
          </div>
          {actions}
        </div>
      )}
      <div className="px-5 py-4">{children}</div>
    </section>
  );
}
