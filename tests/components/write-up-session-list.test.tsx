// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { cleanup, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { SessionWriteUps } from "@/components/write-up/session-write-ups";
import type { SessionWriteUpRowJson } from "@/components/write-up/types";

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const rows: SessionWriteUpRowJson[] = [
  {
    studentId: "s1",
    studentName: "Corin Adebayo-Lind",
    writeUpId: "w1",
    status: "submitted",
    late: true,
    submittedAt: "2026-12-09T10:15:00.000Z",
    updatedAt: "2026-12-09T10:15:00.000Z",
    checks: { k1: { verdict: "agrees", stale: false, slip: null }, k2: { verdict: "disagrees", stale: true, slip: "minutes-for-seconds" } },
  },
  { studentId: "s2", studentName: "Tamsin Okoro", writeUpId: "w2", status: "draft", late: false, submittedAt: "2026-12-05T09:00:00.000Z", updatedAt: "2026-12-06T11:00:00.000Z", checks: {} },
  { studentId: "s3", studentName: "Priya Vandermeer", writeUpId: null, status: "not-started", late: false, submittedAt: null, updatedAt: null, checks: {} },
];

function renderList(answer: () => Promise<Response>) {
  const fetchMock = vi.fn(answer);
  vi.stubGlobal("fetch", fetchMock);
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <SessionWriteUps labSessionId="ls1" />
    </QueryClientProvider>,
  );
  return fetchMock;
}

describe("SessionWriteUps", () => {
  it("lists every student with where their write-up stands, their checks and a link to read it", async () => {
    const fetchMock = renderList(async () => new Response(JSON.stringify(rows), { status: 200, headers: { "content-type": "application/json" } }));
    const table = await screen.findByRole("table");
    expect(fetchMock).toHaveBeenCalledWith("/api/lab-sessions/ls1/write-ups", expect.anything());
    expect(screen.getByText("1 of 3 handed in")).toBeTruthy();
    const [, corin, tamsin, priya] = within(table).getAllByRole("row");
    expect(within(corin!).getByRole("link", { name: "Corin Adebayo-Lind" }).getAttribute("href")).toBe("/write-ups/w1");
    expect(within(corin!).getByText("Handed in")).toBeTruthy();
    expect(within(corin!).getByText("Late")).toBeTruthy();
    // Verdicts by count, each with its word for screen readers, and how many are stale.
    expect(corin!.textContent).toContain("1 Agrees");
    expect(corin!.textContent).toContain("1 Does not agree");
    expect(within(corin!).getByText("1 stale")).toBeTruthy();
    // Reopened work is being worked on again: its old hand-in time is not shown as current.
    expect(within(tamsin!).getByText("Writing")).toBeTruthy();
    expect(tamsin!.textContent).toContain("Saved");
    expect(tamsin!.textContent).not.toContain("Handed in");
    expect(within(priya!).queryByRole("link")).toBeNull();
    expect(within(priya!).getByText("Not started")).toBeTruthy();
  });

  it("says what went wrong and offers to try again when the list cannot load", async () => {
    renderList(async () => new Response(JSON.stringify({ error: { code: "forbidden", message: "This lab session is not for one of your classes." } }), { status: 403, headers: { "content-type": "application/json" } }));
    const alert = await screen.findByRole("alert");
    expect(alert.textContent).toContain("This lab session is not for one of your classes.");
    expect(within(alert).getByRole("button", { name: "Try again" })).toBeTruthy();
  });
});
