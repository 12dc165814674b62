/** The demo school's sign-ins as README.md lists them (seeded into every fresh database). */
export const DEMO_PASSWORD = "lab-notebook-demo";

export const DEMO = {
  admin: { email: "admin@cobalt-lane.example", firstName: "Dana", name: "Dana Whitlock" },
  teacher: { email: "teacher@cobalt-lane.example", firstName: "Imogen", name: "Imogen Takahashi-Reed" },
  student: { email: "student@cobalt-lane.example", firstName: "Ellis", name: "Ellis Marchetti" },
  moderator: { email: "moderator@cobalt-lane.example", firstName: "Halima", name: "Halima Brightwater" },
  parent: { email: "parent@cobalt-lane.example", firstName: "Morag", name: "Morag Marchetti" },
  physics: { email: "physics@cobalt-lane.example", firstName: "Tomasz", name: "Tomasz Achterberg" },
  /** A teacher invited by the seed who has not chosen a password yet. */
  pendingTeacher: { email: "o.farrant@cobalt-lane.example", firstName: "Oluwaseun", name: "Oluwaseun Farrant" },
} as const;

export type DemoKey = keyof typeof DEMO;
