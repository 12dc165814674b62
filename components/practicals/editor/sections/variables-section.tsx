"use client";

import type { Draft } from "../../draft";
import { TextField } from "../fields";
import { changeContent, type Change } from "../state";
import { StringList } from "../string-list";

export function VariablesSection({ draft, change }: { draft: Draft; change: Change }) {
  const v = draft.content.variables;
  const setVariables = (patch: Partial<typeof v>) => changeContent(change, "variables", (cur) => ({ ...cur, ...patch }));
  return (
    <div className="flex flex-col gap-6">
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField path="content.variables.independent" label="Independent variable" hint="What students change, for example “concentration of acid”." value={v.independent} onChange={(independent) => setVariables({ independent })} />
        <TextField path="content.variables.dependent" label="Dependent variable" hint="What students measure, for example “volume of gas”." value={v.dependent} onChange={(dependent) => setVariables({ dependent })} />
      </div>
      <StringList
        path="content.variables.controlled"
        legend="Controlled variables"
        hint="What stays the same, so the test is fair."
        itemLabel="Controlled variable"
        addLabel="Add a controlled variable"
        items={v.controlled}
        maxItems={12}
        maxLength={200}
        onChange={(controlled) => setVariables({ controlled })}
      />
      <StringList
        path="content.apparatus"
        legend="Apparatus"
        hint="One item per line, with sizes: “100 cm³ gas syringe”, “250 cm³ conical flask”."
        itemLabel="Apparatus item"
        addLabel="Add apparatus"
        items={draft.content.apparatus}
        maxItems={40}
        maxLength={160}
        onChange={(apparatus) => changeContent(change, "apparatus", () => apparatus)}
      />
    </div>
  );
}
