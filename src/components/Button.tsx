import { type ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "danger" | "quiet";

const VARIANTS: Record<Variant, string> = {
  primary: "bg-rill-700 text-white hover:bg-rill-800 disabled:bg-rill-700/60",
  secondary:
    "border border-ink-300 bg-white text-ink-800 hover:border-ink-400 hover:bg-ink-50 disabled:text-ink-400",
  danger: "bg-brick-600 text-white hover:bg-brick-700 disabled:bg-brick-600/60",
  quiet: "text-rill-700 hover:bg-rill-50 hover:text-rill-800 disabled:text-ink-400",
};

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: "md" | "sm";
  /** Shows progress and blocks a second submit while a request runs. */
  pending?: boolean;
}

export function buttonClass(variant: Variant = "primary", size: "md" | "sm" = "md"): string {
  const sizing = size === "sm" ? "h-8 px-3 text-sm" : "h-10 px-4 text-sm";
  return `inline-flex items-center justify-center gap-2 rounded-md font-medium transition-colors disabled:cursor-not-allowed ${sizing} ${VARIANTS[variant]}`;
}

export function Button({
  variant = "primary",
  size = "md",
  pending = false,
  disabled,
  className = "",
  children,
  type = "button",
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={`${buttonClass(variant, size)} ${className}`}
      {...rest}
    >
      {pending && (
        <span
          aria-hidden="true"
          className="size-3.5 animate-spin rounded-full border-2 border-current border-r-transparent"
        />
      )}
      {children}
    </button>
  );
}
