"use client";

import { Button } from "@/components/ui/button";

/** Opens the browser's print dialogue; the page's print styles leave out the menu and buttons. */
export function PrintButton({ label = "Print this page" }: { label?: string }) {
  return (
    <Button variant="secondary" onClick={() => window.print()}>
      {label}
    </Button>
  );
}
