// @vitest-environment jsdom
import { act, cleanup, fireEvent, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { checkLatex, latexToHtml } from "@/components/editor/katex-html";
import { normaliseHref } from "@/components/editor/link-panel";
import { RichEditor } from "@/components/editor/rich-editor";
import { RichTextView } from "@/components/editor/rich-text-view";
import { sanitizeRichText, type RichTextDoc } from "@/lib/validation/rich-text";

afterEach(() => cleanup());

const doc = (...content: object[]): RichTextDoc => ({ type: "doc", content: content as RichTextDoc["content"] });
const p = (...content: object[]) => ({ type: "paragraph", content });
const t = (text: string, marks?: object[]) => ({ type: "text", text, ...(marks ? { marks } : {}) });

describe("RichTextView", () => {
  it("renders marks as elements and headings one level down the outline", () => {
    const { container } = render(
      <RichTextView
        doc={doc(
          { type: "heading", attrs: { level: 2 }, content: [t("Method")] },
          p(t("H"), t("2", [{ type: "subscript" }]), t("O"), t(" and cm"), t("3", [{ type: "superscript" }]), t(" — "), t("bold", [{ type: "bold" }]), t(" "), t("slanted", [{ type: "italic" }])),
        )}
      />,
    );
    expect(container.querySelector("h3")?.textContent).toBe("Method");
    expect(container.querySelector("sub")?.textContent).toBe("2");
    expect(container.querySelector("sup")?.textContent).toBe("3");
    expect(container.querySelector("strong")?.textContent).toBe("bold");
    expect(container.querySelector("em")?.textContent).toBe("slanted");
  });

  it("renders formulas with KaTeX (with MathML for screen readers)", () => {
    const { container } = render(<RichTextView doc={doc(p(t("Rate: "), { type: "inlineMath", attrs: { latex: "k[A]^2" } }), { type: "blockMath", attrs: { latex: "k = A e^{-E_a/RT}" } })} />);
    expect(container.querySelectorAll(".katex")).toHaveLength(2);
    expect(container.querySelectorAll("math")).toHaveLength(2);
    expect(container.querySelector(".katex-display")).not.toBeNull();
  });

  it("never renders text as HTML, and drops links that are not http, https or mailto", () => {
    const { container } = render(
      <RichTextView doc={doc(p(t("<img src=x onerror=alert(1)>")), p(t("bad", [{ type: "link", attrs: { href: "javascript:alert(1)" } }]), t(" good", [{ type: "link", attrs: { href: "https://example.org/safety" } }])))} />,
    );
    expect(container.querySelector("img")).toBeNull();
    expect(container.textContent).toContain("<img src=x onerror=alert(1)>");
    const links = container.querySelectorAll("a");
    expect(links).toHaveLength(1);
    expect(links[0]!.getAttribute("href")).toBe("https://example.org/safety");
    expect(links[0]!.getAttribute("rel")).toContain("noopener");
  });

  it("refuses KaTeX commands that could carry links or HTML", () => {
    const html = latexToHtml("\\href{javascript:alert(1)}{x} + \\htmlClass{evil}{y}", false);
    expect(html).not.toMatch(/<a\b/);
    expect(html).not.toMatch(/href="javascript/);
    expect(html).not.toContain('class="evil"');
    expect(html).toContain("color:#cc0000");
  });

  it("shows the fallback when a document is empty", () => {
    render(<RichTextView doc={doc(p())} empty={<p>Nothing yet.</p>} />);
    expect(screen.getByText("Nothing yet.")).toBeTruthy();
  });
});

describe("checkLatex and normaliseHref", () => {
  it("says what is wrong with an unfinished formula", () => {
    expect(checkLatex("\\frac{a}{b}")).toEqual({ ok: true });
    const bad = checkLatex("\\frac{a}{");
    expect(bad.ok).toBe(false);
  });

  it("accepts web and mail links only, adding https:// to a bare address", () => {
    expect(normaliseHref("https://example.org")).toEqual({ ok: true, href: "https://example.org" });
    expect(normaliseHref("www.example.org/risk")).toEqual({ ok: true, href: "https://www.example.org/risk" });
    expect(normaliseHref("technician@school.example")).toEqual({ ok: true, href: "mailto:technician@school.example" });
    expect(normaliseHref("javascript:alert(1)").ok).toBe(false);
    expect(normaliseHref("data:text/html,hi").ok).toBe(false);
    expect(normaliseHref("").ok).toBe(false);
  });
});

describe("RichEditor", () => {
  it("has a labelled toolbar whose buttons move focus with the arrow keys", () => {
    render(
      <>
        <p id="method-label">Method</p>
        <RichEditor id="f-content-method" labelId="method-label" value={doc(p(t("Step one")))} onChange={() => {}} />
      </>,
    );
    const toolbar = screen.getByRole("toolbar", { name: "Method" });
    const buttons = within(toolbar).getAllByRole("button");
    expect(buttons.map((b) => b.getAttribute("aria-label"))).toEqual(
      expect.arrayContaining(["Bold", "Italic", "Strike through", "Code", "Subscript", "Superscript", "Bulleted list", "Numbered list", "Quote", "Dividing line", "Link", "Formula", "Formula on its own line", "Undo", "Redo"]),
    );
    expect(buttons.filter((b) => b.tabIndex === 0)).toHaveLength(1);
    buttons[0]!.focus();
    fireEvent.keyDown(toolbar, { key: "ArrowRight" });
    expect(document.activeElement).toBe(buttons[1]);
    fireEvent.keyDown(toolbar, { key: "End" });
    expect(document.activeElement).toBe(buttons[buttons.length - 1]);
    expect(screen.getByRole("textbox", { name: "Method" }).id).toBe("f-content-method");
  });

  it("inserts a formula typed as LaTeX, with a live preview, into a document the server accepts", async () => {
    const onChange = vi.fn();
    render(
      <>
        <p id="m-label">Method</p>
        <RichEditor id="m" labelId="m-label" value={doc(p(t("Rate: ")))} onChange={onChange} />
      </>,
    );
    fireEvent.click(screen.getByRole("button", { name: "Formula" }));
    const input = screen.getByLabelText("Formula (LaTeX)");
    fireEvent.change(input, { target: { value: "\\text{rate} = k[A]^2" } });
    expect(screen.getByTestId("formula-preview").querySelector(".katex")).not.toBeNull();
    await act(async () => {
      fireEvent.click(screen.getByRole("button", { name: "Insert formula" }));
    });
    const last = onChange.mock.calls.at(-1)![0] as RichTextDoc;
    const clean = sanitizeRichText(last);
    const found = JSON.stringify(clean);
    expect(found).toContain('"type":"inlineMath"');
    expect(found).toContain("\\\\text{rate} = k[A]^2");
  });

  it("will not insert an empty formula, and says so", () => {
    render(
      <>
        <p id="m2-label">Method</p>
        <RichEditor id="m2" labelId="m2-label" value={doc(p())} onChange={() => {}} />
      </>,
    );
    fireEvent.click(screen.getByRole("button", { name: "Formula on its own line" }));
    fireEvent.click(screen.getByRole("button", { name: "Insert formula" }));
    expect(screen.getByRole("alert").textContent).toMatch(/Type a formula first/);
  });
});
