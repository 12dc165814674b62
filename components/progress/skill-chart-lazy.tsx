"use client";

import dynamic from "next/dynamic";

/** The skills chart with its chart library, loaded only in the browser so the report's first load stays small on a phone. */
export const SkillChartLazy = dynamic(() => import("./skill-chart").then((m) => m.SkillChart), {
  ssr: false,
  loading: () => (
    <div className="flex h-72 items-center justify-center rounded-md border border-line bg-surface text-muted sm:h-80" role="status">
      Loading the chart…
    </div>
  ),
});
