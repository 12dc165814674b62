import { forwardRef, type ButtonHTMLAttributes } from "react";
import { cn } from "@/lib/utils";

export type ButtonVariant = "primary" | "secondary" | "ghost" | "danger";

const VARIANTS: Record<ButtonVariant, string> = {
  primary: "bg-brand text-on-brand hover:bg-brand-strong border border-brand",
  secondary: "bg-surface text-ink border border-line hover:border-brand hover:text-brand",
  ghost: "bg-transparent text-brand border border-transparent hover:bg-brand-soft",
  danger: "bg-surface text-bad border border-bad hover:bg-bad-soft",
};

export function buttonClasses(variant: ButtonVariant = "primary", size: "sm" | "md" = "md", className?: string) {
  return cn(
    "inline-flex items-center justify-center gap-2 rounded-md font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-60 no-underline",
    size === "sm" ? "min-h-9 px-3 text-sm" : "min-h-11 px-4 text-base",
    VARIANTS[variant],
    className,
  );
}

export const Button = forwardRef<HTMLButtonElement, ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant; size?: "sm" | "md" }>(
  function Button({ variant = "primary", size = "md", className, type = "button", ...props }, ref) {
    return <button ref={ref} type={type} className={buttonClasses(variant, size, className)} {...props} />;
  },
);
