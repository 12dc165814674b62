"use client";

import { useMemo, useSyncExternalStore } from "react";

/** The palette tokens a graph draws with (app/globals.css), read at run time so dark mode works. */
export type Palette = { ink: string; muted: string; line: string; surface: string; brand: string; accent: string; good: string; bad: string };

const TOKENS: (keyof Palette)[] = ["ink", "muted", "line", "surface", "brand", "accent", "good", "bad"];
// Used only when the page has no palette (for example before styles load); the light theme's values.
const FALLBACK: Palette = { ink: "#1c2430", muted: "#556070", line: "#d6d1c5", surface: "#ffffff", brand: "#23466b", accent: "#a85a17", good: "#276238", bad: "#a1352a" };

function snapshot(): string {
  const style = getComputedStyle(document.documentElement);
  return TOKENS.map((t) => style.getPropertyValue(`--${t}`).trim() || FALLBACK[t]).join("|");
}

function subscribe(onChange: () => void): () => void {
  if (typeof window.matchMedia !== "function") return () => {};
  const query = window.matchMedia("(prefers-color-scheme: dark)");
  query.addEventListener("change", onChange);
  return () => query.removeEventListener("change", onChange);
}

const serverSnapshot = () => TOKENS.map((t) => FALLBACK[t]).join("|");

/** The current palette; changes when the reader switches between light and dark mode. */
export function usePalette(): Palette {
  const key = useSyncExternalStore(subscribe, snapshot, serverSnapshot);
  return useMemo(() => {
    const values = key.split("|");
    return Object.fromEntries(TOKENS.map((t, i) => [t, values[i] ?? FALLBACK[t]])) as Palette;
  }, [key]);
}
