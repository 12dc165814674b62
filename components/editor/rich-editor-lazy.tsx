"use client";

import dynamic from "next/dynamic";

/**
 * The rich editor, loaded only in the browser and only where text is written, so that pages
 * that just show a practical stay light.
 */
export const RichEditorLazy = dynamic(() => import("./rich-editor").then((m) => m.RichEditor), {
  ssr: false,
  loading: () => (
    <div className="min-h-40 rounded-md border border-line bg-surface p-3 text-muted" role="status">
      Loading the editor…
    </div>
  ),
});
