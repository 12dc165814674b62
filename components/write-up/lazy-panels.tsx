"use client";

import dynamic from "next/dynamic";

/**
 * The graph panel with its chart library, loaded only in the browser and only when a write-up
 * has a graph, so that the page's first load stays small on a phone.
 */
export const GraphPanelLazy = dynamic(() => import("./graph-panel").then((m) => m.GraphPanel), {
  ssr: false,
  loading: () => (
    <div className="flex min-h-64 items-center justify-center rounded-md border border-line bg-surface p-3 text-muted" role="status">
      Loading the graph…
    </div>
  ),
});
