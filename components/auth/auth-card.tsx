import type { ReactNode } from "react";
import { LogoMark } from "@/components/ui/logo";

/** The narrow, phone-friendly card used by every sign-in page. */
export function AuthCard({ title, lead, children }: { title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    <div className="mx-auto w-full max-w-md">
      <div className="rounded-xl border border-line bg-surface p-5 shadow-sm sm:p-7">
        <div className="mb-4 flex items-center gap-3">
          <LogoMark size={40} />
          <h1 className="text-2xl font-bold">{title}</h1>
        </div>
        {lead ? <div className="mb-4 text-muted">{lead}</div> : null}
        {children}
      </div>
    </div>
  );
}
