// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import type { LabSessionFormValues } from "@/components/lab-sessions/form-values";
import { GroupBuilder } from "@/components/lab-sessions/group-builder";
import { LabSessionForm } from "@/components/lab-sessions/lab-session-form";

const router = { push: vi.fn(), refresh: vi.fn(), replace: vi.fn() };
vi.mock("next/navigation", () => ({ useRouter: () => router }));

const roster = Array.from({ length: 7 }, (_, i) => ({ id: `st${i + 1}`, name: `Student ${String.fromCharCode(65 + i)}`, active: true }));
const requests: { url: string; method: string; body: unknown }[] = [];
let answer: (url: string, method: string) => { status: number; body: unknown };

beforeEach(() => {
  requests.length = 0;
  router.push.mockReset();
  answer = (url) => (url.startsWith("/api/classes/") ? { status: 200, body: { class: { students: roster } } } : { status: 201, body: { id: "new-session" } });
  vi.stubGlobal(
    "fetch",
    vi.fn(async (url: string, init?: RequestInit) => {
      const method = init?.method ?? "GET";
      requests.push({ url, method, body: init?.body ? JSON.parse(String(init.body)) : undefined });
      const { status, body } = answer(url, method);
      return new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });
    }),
  );
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const initial: LabSessionFormValues = {
  classId: "c1",
  practicalVersionId: "",
  opensDate: "2026-12-08",
  opensTime: "09:00",
  dueDate: "2026-12-15",
  dueTime: "16:00",
  grouping: "individual",
  groups: [],
  lateWork: "accept-flagged",
  lateDays: "7",
  notes: "",
};

function setup(values: Partial<LabSessionFormValues> = {}) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <LabSessionForm
        mode="create"
        classes={[
          { id: "c1", name: "10C Chemistry", studentCount: 7 },
          { id: "c2", name: "12A Chemistry", studentCount: 14 },
        ]}
        practicals={[{ versionId: "v1", title: "Gas from magnesium and acid", version: 2, topic: "Rates", yearGroup: 10 }]}
        initial={{ ...initial, ...values }}
      />
    </QueryClientProvider>,
  );
}

const field = (label: string) => screen.getByLabelText(label, { exact: true }) as HTMLInputElement;
const describedText = (el: HTMLElement) =>
  (el.getAttribute("aria-describedby") ?? "")
    .split(" ")
    .filter(Boolean)
    .map((id) => document.getElementById(id)?.textContent ?? "")
    .join(" ");

describe("LabSessionForm", () => {
  it("checks the form before sending: messages at the fields and in a summary, nothing sent", async () => {
    setup();
    fireEvent.change(field("Due date"), { target: { value: "2026-12-01" } });
    fireEvent.click(screen.getByRole("button", { name: "Schedule lab session" }));
    const summary = await screen.findByRole("alert");
    expect(summary.textContent).toContain("Choose a published practical.");
    expect(summary.textContent).toContain("The due date must be after the opening date.");
    await waitFor(() => expect(field("Due date").getAttribute("aria-invalid")).toBe("true"));
    expect(describedText(field("Due date"))).toContain("The due date must be after the opening date.");
    expect(requests.filter((r) => r.method === "POST")).toHaveLength(0);
  });

  it("auto-makes groups of 3 from the roster without leaving anyone alone, and sends them", async () => {
    setup({ practicalVersionId: "v1" });
    fireEvent.click(screen.getByLabelText(/Groups share one set of data/));
    fireEvent.click(await screen.findByRole("button", { name: "Auto-make groups of 3" }));
    const groups = screen.getByRole("list", { name: "Groups" });
    expect(groups.children).toHaveLength(3);
    expect(within(groups).getByText("Student G")).toBeTruthy();
    expect((screen.getByLabelText("Student G") as HTMLSelectElement).selectedOptions[0]!.textContent).toBe("Group 3");
    fireEvent.change(screen.getByLabelText("Student A"), { target: { value: "g2" } });
    fireEvent.click(screen.getByRole("button", { name: "Schedule lab session" }));
    await waitFor(() => expect(requests.some((r) => r.method === "POST")).toBe(true));
    const sent = requests.find((r) => r.method === "POST")!.body as { groups: { id: string; studentIds: string[] }[]; opensAt: string };
    expect(sent.groups.map((g) => g.studentIds)).toEqual([
      ["st2", "st3"],
      ["st4", "st5", "st1"],
      ["st6", "st7"],
    ]);
    expect(new Date(sent.opensAt).getTime()).toBe(new Date(2026, 11, 8, 9, 0).getTime());
    await waitFor(() => expect(router.push).toHaveBeenCalledWith("/lab-sessions/new-session?scheduled=1"));
  });

  it("puts the server's field messages at the fields and keeps everything typed", async () => {
    answer = (url) =>
      url.startsWith("/api/classes/")
        ? { status: 200, body: { class: { students: roster } } }
        : {
            status: 400,
            body: { error: { code: "bad_request", message: "Groups may only include students in the class.", fieldErrors: { "groups.0.studentIds": ["Everyone in a group must be in this class."], dueAt: ["Pick a later due date."] } } },
          };
    setup({ practicalVersionId: "v1" });
    fireEvent.change(screen.getByLabelText("Notes (optional)"), { target: { value: "Meet in lab 4." } });
    fireEvent.click(screen.getByLabelText(/Groups share one set of data/));
    fireEvent.click(await screen.findByRole("button", { name: "Auto-make groups of 3" }));
    fireEvent.click(screen.getByRole("button", { name: "Schedule lab session" }));
    const summary = await screen.findByRole("alert");
    await waitFor(() => expect(summary.textContent).toContain("Group 1: Everyone in a group must be in this class."));
    expect(describedText(field("Due date"))).toContain("Pick a later due date.");
    expect(describedText(screen.getAllByLabelText("Group name")[0]!)).toContain("Everyone in a group must be in this class.");
    expect((screen.getByLabelText("Notes (optional)") as HTMLTextAreaElement).value).toBe("Meet in lab 4.");
    expect(router.push).not.toHaveBeenCalled();
  });

  it("clears the groups, and says so, when the class changes", async () => {
    setup({ practicalVersionId: "v1" });
    fireEvent.click(screen.getByLabelText(/Groups share one set of data/));
    fireEvent.click(await screen.findByRole("button", { name: "Auto-make groups of 3" }));
    fireEvent.change(field("Class"), { target: { value: "c2" } });
    expect(await screen.findByText(/The groups were cleared because the class changed/)).toBeTruthy();
    expect(screen.queryByRole("list", { name: "Groups" })).toBeNull();
  });
});

describe("GroupBuilder", () => {
  it("lets a student who has left the class be taken out of their group", () => {
    const onChange = vi.fn();
    render(<GroupBuilder idPrefix="t" roster={roster.slice(0, 2)} groups={[{ id: "g1", name: "Bench A", studentIds: ["st1", "gone", "st2"] }]} onChange={onChange} errors={{}} />);
    expect(screen.getByText("A student no longer in the class")).toBeTruthy();
    fireEvent.click(screen.getByRole("button", { name: "Take out of Bench A" }));
    expect(onChange).toHaveBeenCalledWith([{ id: "g1", name: "Bench A", studentIds: ["st1", "st2"] }]);
  });
});
