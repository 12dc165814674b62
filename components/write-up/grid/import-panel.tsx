"use client";

import { useEffect, useId, useRef } from "react";
import { Button } from "@/components/ui/button";
import type { TableTemplate } from "@/lib/validation/practicals";
import { headingOf, type CsvImportPlan } from "@/lib/write-ups/csv";

/** Asks the student to confirm a CSV import, showing which file column fills which table column. */
export function ImportPanel({
  table,
  fileName,
  plan,
  replacesData,
  onConfirm,
  onCancel,
}: {
  table: TableTemplate;
  fileName: string;
  plan: CsvImportPlan;
  replacesData: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const id = useId();
  const confirm = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    confirm.current?.focus();
  }, []);
  const rows = plan.rows.length;
  return (
    <div
      role="dialog"
      aria-modal="false"
      aria-labelledby={`${id}-title`}
      className="rounded-lg border-2 border-brand bg-surface p-4"
      onKeyDown={(e) => {
        if (e.key === "Escape") {
          e.stopPropagation();
          onCancel();
        }
      }}
    >
      <h4 id={`${id}-title`} className="font-bold">
        Import “{fileName}”?
      </h4>
      <p className="mt-1">
        {plan.mode === "headings"
          ? "The file’s headings were matched to the table’s columns:"
          : "The file’s columns do not have headings that match this table, so they will be used in order. Check that each one goes where it should:"}
      </p>
      <ul className="mt-2 space-y-1">
        {plan.fileColumns.map((label, i) => {
          const target = plan.mapping[i];
          return (
            <li key={i} className="flex flex-wrap gap-x-2">
              <span className="font-semibold">{label}</span>
              <span aria-hidden="true">→</span>
              <span className={target ? "" : "text-muted"}>{target ? headingOf(table, target) : "not used"}</span>
            </li>
          );
        })}
      </ul>
      <p className="mt-2">
        {rows} {rows === 1 ? "row" : "rows"} of readings.{" "}
        {replacesData ? "This replaces everything typed in the table now, and clears your decisions about anomalous readings. You can undo it straight afterwards." : ""}
      </p>
      <div className="mt-3 flex flex-wrap gap-2">
        <Button ref={confirm} onClick={onConfirm}>
          {plan.mode === "headings" ? "Import the readings" : "Yes, use the columns in this order"}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </div>
  );
}
