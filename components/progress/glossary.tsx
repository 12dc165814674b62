import type { Reader } from "./types";
import { glossaryFor } from "./words";

/** The trade words a report uses, in our own plain words. The id lets other pages link straight to it. */
export function Glossary({ reader, headingLevel = "h2" }: { reader: Reader; headingLevel?: "h2" | "h3" }) {
  const H = headingLevel;
  return (
    <section id="glossary" aria-labelledby="glossary-heading" className="flex scroll-mt-6 flex-col gap-3">
      <H id="glossary-heading" className="text-xl font-bold">
        Words used in this report
      </H>
      <dl className="grid gap-3 sm:grid-cols-2">
        {glossaryFor(reader).map((g) => (
          <div key={g.term} className="progress-card rounded-lg border border-line bg-surface p-3">
            <dt className="font-bold">{g.term}</dt>
            <dd className="text-[0.97rem]">{g.meaning}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
