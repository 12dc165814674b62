import katex from "katex";

/**
 * A formula as KaTeX HTML (with MathML for screen readers). `trust: false` refuses the commands
 * that could add links, classes or raw HTML, and errors are shown in place (red source text)
 * rather than thrown, so a typo in one formula never breaks a page.
 */
export function latexToHtml(latex: string, displayMode: boolean): string {
  return katex.renderToString(latex, {
    displayMode,
    throwOnError: false,
    trust: false,
    strict: "ignore",
    maxSize: 20,
    maxExpand: 200,
    output: "htmlAndMathml",
  });
}

/** Whether KaTeX can read a formula; the message says what is wrong when it cannot. */
export function checkLatex(latex: string): { ok: true } | { ok: false; message: string } {
  try {
    katex.renderToString(latex, { throwOnError: true, trust: false, strict: "ignore", maxSize: 20, maxExpand: 200 });
    return { ok: true };
  } catch (e) {
    const message = e instanceof Error ? e.message.replace(/^KaTeX parse error:\s*/, "") : "This formula cannot be read.";
    return { ok: false, message };
  }
}
