/**
 * An example roster file for admins to copy: invented people, reserved .example addresses, and
 * every column the importer understands. Built in the browser; nothing is fetched.
 */
export const EXAMPLE_ROSTER_ROWS: string[][] = [
  ["name", "email", "year group", "parent name", "parent email", "relationship"],
  ["Ada Fairbrook", "ada.fairbrook@school.example", "10", "Maren Fairbrook", "maren.fairbrook@home.example", "Mother"],
  ["Bram Okonkwo-Hale", "bram.okonkwo-hale@school.example", "10", "", "", ""],
  ["Celia Vantongeren", "celia.vantongeren@school.example", "10", "Piet Vantongeren", "piet.vantongeren@home.example", "Father"],
  ["Dev Arkwright", "dev.arkwright@school.example", "10", "Sunita Arkwright", "sunita.arkwright@home.example", "Guardian"],
  ["Effie Arkwright", "effie.arkwright@school.example", "10", "Sunita Arkwright", "sunita.arkwright@home.example", "Guardian"],
];

function csvCell(value: string): string {
  return /[",\n\r]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

export function exampleRosterCsv(): string {
  return EXAMPLE_ROSTER_ROWS.map((row) => row.map(csvCell).join(",")).join("\r\n") + "\r\n";
}

/** Starts a download of the example file. */
export function downloadExampleRoster(): void {
  const blob = new Blob([exampleRosterCsv()], { type: "text/csv;charset=utf-8" });
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = "roster-example.csv";
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
