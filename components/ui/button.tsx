import type { ButtonHTMLAttributes } from "react";

const VARIANTS = {
  primary: "bg-brand-700 text-white hover:bg-brand-800 disabled:bg-ink-faint",
  secondary: "border border-line-strong bg-white text-ink hover:bg-paper-sunk",
  danger: "bg-danger text-white hover:brightness-95",
  ghost: "text-brand-700 hover:bg-brand-50",
} as const;

export function buttonClass(variant: keyof typeof VARIANTS = "primary", extra = ""): string {
  return `inline-flex min-h-11 items-center justify-center gap-2 rounded-md px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed ${VARIANTS[variant]} ${extra}`;
}

export function Button({
  variant = "primary",
  className = "",
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: keyof typeof VARIANTS }) {
  return <button {...props} className={buttonClass(variant, className)} />;
}
