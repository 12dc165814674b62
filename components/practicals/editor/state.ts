import type { PracticalContent } from "@/lib/validation/practicals";
import type { Draft } from "../draft";

/** How sections change the draft: a function from the current draft to the next one. */
export type Change = (updater: (draft: Draft) => Draft) => void;

/** Changes one part of the content. */
export function changeContent<K extends keyof PracticalContent>(change: Change, key: K, fn: (value: PracticalContent[K]) => PracticalContent[K]): void {
  change((d) => ({ ...d, content: { ...d.content, [key]: fn(d.content[key]) } }));
}

export function replaceAt<T>(list: readonly T[], index: number, item: T): T[] {
  return list.map((x, i) => (i === index ? item : x));
}

export function removeAt<T>(list: readonly T[], index: number): T[] {
  return list.filter((_, i) => i !== index);
}

/** Moves an item by `by` places (−1 earlier, +1 later), staying inside the list. */
export function moveBy<T>(list: readonly T[], index: number, by: number): T[] {
  const to = index + by;
  if (to < 0 || to >= list.length || index < 0 || index >= list.length) return [...list];
  const next = [...list];
  const [item] = next.splice(index, 1);
  next.splice(to, 0, item!);
  return next;
}
