// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { PersonRow } from "@/components/admin/api-types";
import { PAGE_SIZE, PeopleDirectory } from "@/components/admin/people-directory";

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Invented test people, numbered so their order is plain to see.
const people: PersonRow[] = Array.from({ length: 104 }, (_, i) => ({
  id: `p${i + 1}`,
  name: `Person ${String(i + 1).padStart(3, "0")}`,
  email: `person${i + 1}@test.example`,
  roles: ["student"],
  yearGroup: 10,
  status: "active",
  lastSignInAt: null,
}));

function renderDirectory() {
  vi.stubGlobal(
    "fetch",
    vi.fn(async () => new Response(JSON.stringify({ people }), { status: 200, headers: { "content-type": "application/json" } })),
  );
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <PeopleDirectory initial={{ role: "", status: "", q: "" }} />
    </QueryClientProvider>,
  );
}

describe("PeopleDirectory paging", () => {
  it("shows the first page, then the next and the last, with the count of everyone", async () => {
    renderDirectory();
    expect(await screen.findByText("Person 001")).toBeTruthy();
    expect(screen.queryByText(`Person ${String(PAGE_SIZE + 1).padStart(3, "0")}`)).toBeNull();
    expect(screen.getByText(/104 people · showing 1–50/)).toBeTruthy();
    expect(screen.getByText("Page 1 of 3")).toBeTruthy();
    expect((screen.getByRole("button", { name: "Previous page" }) as HTMLButtonElement).disabled).toBe(true);

    fireEvent.click(screen.getByRole("button", { name: "Next page" }));
    expect(screen.getByText("Person 051")).toBeTruthy();
    expect(screen.queryByText("Person 001")).toBeNull();

    fireEvent.click(screen.getByRole("button", { name: "Next page" }));
    expect(screen.getByText("Page 3 of 3")).toBeTruthy();
    expect(screen.getByText("Person 104")).toBeTruthy();
    expect(screen.getAllByRole("row")).toHaveLength(1 + 4);
    expect((screen.getByRole("button", { name: "Next page" }) as HTMLButtonElement).disabled).toBe(true);
  });

  it("says loading once, not twice", async () => {
    renderDirectory();
    expect(screen.getAllByText(/Loading people/)).toHaveLength(1);
    await screen.findByText("Person 001");
  });
});
