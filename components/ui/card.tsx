import type { HTMLAttributes, ReactNode } from "react";
import { cn } from "@/lib/utils";

export function Card({ className, ...props }: HTMLAttributes<HTMLDivElement>) {
  return <div className={cn("rounded-lg border border-line bg-surface p-4 sm:p-5", className)} {...props} />;
}

export function CardTitle({ children, className, as: As = "h2" }: { children: ReactNode; className?: string; as?: "h2" | "h3" }) {
  return <As className={cn("mb-2 text-lg font-bold", className)}>{children}</As>;
}
