import { Fragment, type ReactNode } from "react";

const URL_PATTERN = /https?:\/\/[^\s<>"]+/g;
/** Punctuation that ends a sentence rather than the address. */
const TRAILING = /[.,;:!?)\]'»”]+$/;

/**
 * Plain text with web addresses turned into links. React escapes every other character, so a
 * message can never inject markup; only http and https addresses become links.
 */
export function LinkedText({ text }: { text: string }) {
  const parts: ReactNode[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const raw = match[0];
    const url = raw.replace(TRAILING, "");
    const start = match.index ?? 0;
    parts.push(<Fragment key={`t${start}`}>{text.slice(last, start)}</Fragment>);
    parts.push(
      <a key={`a${start}`} href={url} rel="noopener noreferrer" className="break-all">
        {url}
      </a>,
    );
    last = start + url.length;
  }
  parts.push(<Fragment key="end">{text.slice(last)}</Fragment>);
  return <>{parts}</>;
}
