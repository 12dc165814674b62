"use client";

import { useEffect } from "react";
import { Button } from "@/components/ui/button";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <div className="mx-auto max-w-xl py-10">
      <h1 className="mb-2 text-3xl font-bold">Something went wrong</h1>
      <p className="mb-4 text-muted">
        Meniscus could not show this page just now. Nothing you saved has been lost. Try again; if it keeps happening, tell your school&apos;s IT team
        {error.digest ? ` and quote reference ${error.digest}` : ""}.
      </p>
      <Button onClick={reset}>Try again</Button>
    </div>
  );
}
