import "server-only";
import path from "node:path";
import { Document, Font, Image, Page, StyleSheet, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { GLOSSARY, SKILL_WORDS, type SkillProgress } from "@/lib/progress/summary";
import { skillsChartPng } from "./chart-image";

let fontsReady = false;
function registerFonts() {
  if (fontsReady) return;
  // DejaVu Sans (free licence, fonts/DejaVu-LICENSE.txt): wide glyph coverage for units such as cm³ s⁻¹.
  Font.register({
    family: "ReportSans",
    fonts: [
      { src: path.join(process.cwd(), "fonts", "DejaVuSans.ttf") },
      { src: path.join(process.cwd(), "fonts", "DejaVuSans-Bold.ttf"), fontWeight: "bold" },
    ],
  });
  Font.registerHyphenationCallback((word) => [word]);
  fontsReady = true;
}

export type TermReportData = {
  schoolName: string;
  termName: string;
  generatedAt: Date;
  student: { name: string; yearGroup: number | null; classes: { name: string }[] };
  returned: { title: string; returnedAt: Date; total: number; maxTotal: number; feedback: string; markerName: string | null; late: boolean; criteria: { title: string; level: string; marks: number; max: number }[] }[];
  skills: SkillProgress[];
  coming: { title: string; dueAt: Date; state: string }[];
};

const styles = StyleSheet.create({
  page: { fontFamily: "ReportSans", fontSize: 10.5, padding: 36, color: "#1c2430", lineHeight: 1.4 },
  h1: { fontSize: 18, fontWeight: "bold", marginBottom: 2 },
  h2: { fontSize: 13, fontWeight: "bold", marginTop: 14, marginBottom: 6, color: "#23466b" },
  muted: { color: "#556070" },
  row: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: "#d6d1c5", paddingVertical: 3 },
  cell: { flex: 1 },
  box: { borderWidth: 0.8, borderColor: "#d6d1c5", borderRadius: 4, padding: 8, marginBottom: 6 },
  footer: { position: "absolute", bottom: 18, left: 36, right: 36, fontSize: 8, color: "#556070", flexDirection: "row", justifyContent: "space-between" },
});

const date = (d: Date) => d.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric" });

function Report({ data, chart }: { data: TermReportData; chart: Buffer | null }) {
  const secure = data.skills.filter((s) => s.status === "secure");
  const focus = data.skills.filter((s) => s.status === "focus");
  return (
    <Document title={`Science practical progress report: ${data.student.name}`} author={data.schoolName} creator="Meniscus">
      <Page size="A4" style={styles.page}>
        <Text style={styles.h1}>Science practical progress report</Text>
        <Text>
          {data.student.name}
          {data.student.yearGroup ? `, Year ${data.student.yearGroup}` : ""} · {data.schoolName}
        </Text>
        <Text style={styles.muted}>
          {data.termName} · {data.student.classes.map((c) => c.name).join(", ") || "No class"} · made on {date(data.generatedAt)}
        </Text>

        <Text style={styles.h2}>In short</Text>
        <Text>
          {data.returned.length
            ? `${data.student.name.split(" ")[0]} has had ${data.returned.length} practical write-up${data.returned.length === 1 ? "" : "s"} marked and returned this term.`
            : "No marked practical work has been returned yet this term."}
        </Text>
        {secure.length ? <Text>Doing well: {secure.map((s) => s.title).join(", ")}.</Text> : null}
        {focus.length ? <Text>To work on next: {focus.map((s) => s.title).join(", ")}.</Text> : null}

        {chart ? (
          <View wrap={false}>
            <Text style={styles.h2}>Skills this year</Text>
            {/* eslint-disable-next-line jsx-a11y/alt-text -- a react-pdf Image, not an HTML img: the sentence below describes the chart */}
            <Image src={chart} style={{ width: 520, height: 243 }} />
            <Text style={styles.muted}>Each bar is the percentage of the marks available for that skill, averaged over the year and for the most recent practical.</Text>
          </View>
        ) : null}

        <Text style={styles.h2}>Skills in plain words</Text>
        {data.skills.length ? (
          data.skills.map((s) => (
            <View key={s.title} style={styles.row} wrap={false}>
              <Text style={[styles.cell, { flex: 2 }]}>{s.title}</Text>
              <Text style={styles.cell}>{SKILL_WORDS[s.status].label}</Text>
              <Text style={styles.cell}>{Math.round(s.averagePercent)} % on average</Text>
            </View>
          ))
        ) : (
          <Text style={styles.muted}>Skills appear here once marked work has been returned.</Text>
        )}

        <Text style={styles.h2}>Marked practicals</Text>
        {data.returned.map((w) => (
          <View key={w.title + w.returnedAt.toISOString()} style={styles.box} wrap={false}>
            <Text style={{ fontWeight: "bold" }}>
              {w.title}: {w.total} out of {w.maxTotal}
              {w.late ? " (handed in late)" : ""}
            </Text>
            <Text style={styles.muted}>
              Returned {date(w.returnedAt)}
              {w.markerName ? ` by ${w.markerName}` : ""}
            </Text>
            {w.criteria.map((c) => (
              <Text key={c.title}>
                {c.title}: {c.level} ({c.marks}/{c.max})
              </Text>
            ))}
            {w.feedback ? <Text style={{ marginTop: 3 }}>Teacher&apos;s feedback: {w.feedback}</Text> : null}
          </View>
        ))}

        {data.coming.length ? (
          <>
            <Text style={styles.h2}>Coming up</Text>
            {data.coming.map((c, i) => (
              // Two lab sessions of one practical can be due at the same moment: the position keeps keys unique.
              <Text key={`${i}-${c.title}`}>
                {c.title}: due {date(c.dueAt)}
              </Text>
            ))}
          </>
        ) : null}

        <Text style={styles.h2}>Words used in this report</Text>
        {GLOSSARY.map((g) => (
          <Text key={g.term}>
            <Text style={{ fontWeight: "bold" }}>{g.term}: </Text>
            {g.meaning}
          </Text>
        ))}
        <View style={styles.footer} fixed>
          <Text>Meniscus · {data.schoolName}</Text>
          <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
        </View>
      </Page>
    </Document>
  );
}

/** Renders a student's term report as a PDF with the shipped fonts and a chart of their skills. */
export async function termReportPdf(data: TermReportData): Promise<Buffer> {
  registerFonts();
  const chart = data.skills.length ? skillsChartPng(data.skills) : null;
  return renderToBuffer(<Report data={data} chart={chart} />);
}
