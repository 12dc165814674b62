"use client";

import { signOut } from "next-auth/react";
import { useState } from "react";
import { cn } from "@/lib/utils";

export function SignOutButton({ className }: { className?: string }) {
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className={cn("font-semibold text-brand underline-offset-4 hover:underline disabled:opacity-60", className)}
      disabled={busy}
      onClick={() => {
        setBusy(true);
        void signOut({ callbackUrl: "/sign-in?signedOut=1" });
      }}
    >
      {busy ? "Signing out…" : "Sign out"}
    </button>
  );
}
