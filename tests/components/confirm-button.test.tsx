// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { ConfirmButton } from "@/components/ui/confirm-button";

afterEach(cleanup);

// The one "ask first" button every feature uses for something hard to undo (common practice for
// destructive actions: a second, clearly named step, and an easy way back).
describe("ConfirmButton", () => {
  const setup = () => {
    const onConfirm = vi.fn();
    render(<ConfirmButton label="Archive" question="Archive “Rates of reaction”? It leaves the library list." confirmLabel="Yes, archive it" onConfirm={onConfirm} />);
    return onConfirm;
  };

  it("asks first, in place, and acts only on the second, named button", () => {
    const onConfirm = setup();
    fireEvent.click(screen.getByRole("button", { name: "Archive" }));
    expect(onConfirm).not.toHaveBeenCalled();
    const group = screen.getByRole("group", { name: /Archive “Rates of reaction”\?/ });
    expect(document.activeElement).toBe(group);
    fireEvent.click(screen.getByRole("button", { name: "Yes, archive it" }));
    expect(onConfirm).toHaveBeenCalledTimes(1);
    expect(screen.queryByRole("group")).toBeNull();
  });

  it("backs out with Escape or the back-out button, doing nothing, and gives focus back", () => {
    const onConfirm = setup();
    fireEvent.click(screen.getByRole("button", { name: "Archive" }));
    fireEvent.keyDown(screen.getByRole("group"), { key: "Escape" });
    expect(screen.queryByRole("group")).toBeNull();
    expect(document.activeElement).toBe(screen.getByRole("button", { name: "Archive" }));
    fireEvent.click(screen.getByRole("button", { name: "Archive" }));
    fireEvent.click(screen.getByRole("button", { name: "Keep it as it is" }));
    expect(screen.queryByRole("group")).toBeNull();
    expect(onConfirm).not.toHaveBeenCalled();
  });

  it("cannot be pressed while the last action is still running", () => {
    render(<ConfirmButton label="Remove" question="Remove it?" confirmLabel="Yes, remove it" busy onConfirm={() => undefined} />);
    expect((screen.getByRole("button", { name: "Remove" }) as HTMLButtonElement).disabled).toBe(true);
  });
});
