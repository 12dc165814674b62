import { Table, Td, Th } from "@/components/ui/table";

type Body = {
  style: "marks" | "competence";
  criteria: { id: string; title: string; description: string; levels: { id: string; label: string; marks: number; descriptor: string }[] }[];
};

/** A rubric to read: each criterion with its levels from lowest to highest. */
export function RubricView({ body }: { body: Body }) {
  return (
    <ol className="flex flex-col gap-5">
      {body.criteria.map((c, i) => (
        <li key={c.id} className="flex flex-col gap-2">
          <h2 className="text-lg font-bold">
            {i + 1}. {c.title}
          </h2>
          {c.description ? <p className="text-muted">{c.description}</p> : null}
          <Table>
            <caption className="sr-only">Levels of {c.title}, lowest first</caption>
            <thead>
              <tr>
                <Th>{body.style === "competence" ? "Judgement" : "Level"}</Th>
                {body.style === "marks" ? <Th>Marks</Th> : null}
                <Th>What it looks like</Th>
              </tr>
            </thead>
            <tbody>
              {c.levels.map((l) => (
                <tr key={l.id}>
                  <Td className="font-semibold whitespace-nowrap">{l.label}</Td>
                  {body.style === "marks" ? <Td>{l.marks}</Td> : null}
                  <Td>{l.descriptor || <span className="text-muted">No descriptor.</span>}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </li>
      ))}
    </ol>
  );
}
