// The demo school: invented people with invented names. Any likeness to a real person or school
// is accidental. E-mail addresses use the reserved .example domain, so nothing can be delivered.

export const DEMO_SCHOOL = { name: "Cobalt Lane School", slug: "cobalt-lane" } as const;
export const DEMO_DOMAIN = "cobalt-lane.example";
/** One password for every demo account (printed in the README). */
export const DEMO_PASSWORD = "lab-notebook-demo";
export const ACADEMIC_YEAR = "2026-27";

export type DemoPerson = { key: string; name: string; email: string; roles: ("admin" | "teacher" | "student" | "moderator" | "parent")[]; yearGroup?: number; pending?: "invited" | "not-invited" };

export const STAFF: DemoPerson[] = [
  { key: "admin", name: "Dana Whitlock", email: `admin@${DEMO_DOMAIN}`, roles: ["admin"] },
  { key: "hod", name: "Rafael Osei-Lindqvist", email: `head.science@${DEMO_DOMAIN}`, roles: ["teacher", "moderator"] },
  { key: "teacher", name: "Imogen Takahashi-Reed", email: `teacher@${DEMO_DOMAIN}`, roles: ["teacher"] },
  { key: "physics", name: "Tomasz Achterberg", email: `physics@${DEMO_DOMAIN}`, roles: ["teacher"] },
  { key: "moderator", name: "Halima Brightwater", email: `moderator@${DEMO_DOMAIN}`, roles: ["moderator"] },
  { key: "newteacher", name: "Oluwaseun Farrant", email: `o.farrant@${DEMO_DOMAIN}`, roles: ["teacher"], pending: "invited" },
];

const FIRST = [
  "Ellis", "Noor", "Caspian", "Maelle", "Tobias", "Zuri", "Anouk", "Beckett", "Ilse", "Rafferty", "Saoirse", "Kofi", "Linnea", "Dashiell",
  "Yara", "Osian", "Perpetua", "Jasper", "Thandiwe", "Lorcan", "Mireille", "Idris", "Solveig", "Cassius", "Amara", "Fintan", "Ottilie",
  "Tariq", "Wren", "Bastian", "Inka", "Cosmo", "Liesel", "Matteo", "Niamh", "Ezra", "Paloma", "Hamish", "Suki", "Anselm", "Keziah",
  "Rohan", "Elowen", "Florian", "Ines", "Kit", "Marisol", "Quillon", "Runa", "Sylvan",
];
const LAST = [
  "Marchetti", "Abernethy-Cole", "Fairweather", "Okafor-Lund", "Pemberton-Yu", "Quiller", "Rasmussen-Daly", "Sato-Winter", "Thornbury",
  "Ulverston", "Valdivia", "Wetherall", "Yilmaz-Grant", "Zeller", "Ashdown", "Brackenridge", "Castellane", "Drummond-Iqbal", "Esterhuizen",
  "Fenwick-Osei", "Galloway", "Haverford", "Ingleby", "Jovanovic-Hart", "Kettlewell", "Lindqvist-Moss", "Mabry", "Nightingale-Roe",
  "Oyelaran", "Penhaligon",
];

/** A small deterministic generator (mulberry32) so the demo is the same on every machine. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export type DemoClass = { key: string; name: string; subject: string; yearGroup: number; teachers: string[]; size: number };

export const CLASSES: DemoClass[] = [
  { key: "10C", name: "10C Chemistry", subject: "Chemistry", yearGroup: 10, teachers: ["teacher"], size: 24 },
  { key: "10D", name: "10D Chemistry", subject: "Chemistry", yearGroup: 10, teachers: ["hod"], size: 22 },
  { key: "12A", name: "12A Chemistry", subject: "Chemistry", yearGroup: 12, teachers: ["hod", "teacher"], size: 14 },
  { key: "11P", name: "11P Physics", subject: "Physics", yearGroup: 11, teachers: ["physics"], size: 18 },
];

/**
 * Students for each class. The first student of 10C is the README's demo student; their sibling
 * is in 12A, and both share the demo parent.
 */
export function demoStudents(): { classKey: string; person: DemoPerson }[] {
  const rand = seededRandom(20261201);
  const used = new Set<string>();
  const out: { classKey: string; person: DemoPerson }[] = [];
  out.push({ classKey: "10C", person: { key: "student", name: "Ellis Marchetti", email: `student@${DEMO_DOMAIN}`, roles: ["student"], yearGroup: 10 } });
  out.push({ classKey: "12A", person: { key: "sibling", name: "Noor Marchetti", email: `noor.marchetti@${DEMO_DOMAIN}`, roles: ["student"], yearGroup: 12 } });
  used.add("Ellis Marchetti").add("Noor Marchetti");
  let n = 0;
  for (const cls of CLASSES) {
    const have = out.filter((o) => o.classKey === cls.key).length;
    for (let i = have; i < cls.size; i++) {
      let name = "";
      do {
        name = `${FIRST[Math.floor(rand() * FIRST.length)]} ${LAST[Math.floor(rand() * LAST.length)]}`;
      } while (used.has(name));
      used.add(name);
      n++;
      const email = `${name.toLowerCase().replace(/[^a-z ]/g, "").replace(/ /g, ".")}@${DEMO_DOMAIN}`;
      // A few accounts not yet set up, so the admin pages show every state.
      const pending = n % 17 === 5 ? "invited" : n % 23 === 7 ? "not-invited" : undefined;
      out.push({ classKey: cls.key, person: { key: `s${n}`, name, email, roles: ["student"], yearGroup: cls.yearGroup, pending } });
    }
  }
  return out;
}

export const PARENTS: { person: DemoPerson; children: string[]; relationship: string }[] = [
  { person: { key: "parent", name: "Morag Marchetti", email: `parent@${DEMO_DOMAIN}`, roles: ["parent"] }, children: ["student", "sibling"], relationship: "Mother" },
];
