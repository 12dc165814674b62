import { practicalContentSchema, type PracticalContent } from "@/lib/validation/practicals";

/**
 * A complete, publishable practical (invented content): gas collected over time, one table,
 * one graph, two checks and a two-criterion rubric.
 */
export function completePracticalContent(): PracticalContent {
  return practicalContentSchema.parse({
    aim: "Find how the rate of gas production changes over time.",
    introduction: { type: "doc", content: [{ type: "paragraph", content: [{ type: "text", text: "Gas is collected in a syringe." }] }] },
    method: { type: "doc", content: [{ type: "orderedList", content: [{ type: "listItem", content: [{ type: "paragraph", content: [{ type: "text", text: "Read the syringe every 10 s." }] }] }] }] },
    variables: { independent: "time", dependent: "volume of gas", controlled: ["temperature"] },
    apparatus: ["gas syringe", "conical flask"],
    safety: {
      hazards: [{ id: "h1", substance: "dilute acid", pictograms: ["GHS07"], signalWord: "Warning", hazardStatements: "Causes eye irritation.", controls: "Wear eye protection; mop up spills." }],
      eyeProtection: "goggles",
      otherPpe: [],
      emergency: "Rinse eyes with water for 10 minutes and tell the teacher.",
      riskAssessmentRef: "",
    },
    prep: { reagents: [{ id: "r1", name: "hydrochloric acid", concentration: 1, concentrationUnit: "mol/dm³", amountPerGroup: 50, amountUnit: "cm³" }], apparatus: [{ id: "a1", name: "gas syringe", perGroup: 1 }], spareMarginPercent: 10 },
    tables: [
      {
        id: "t1",
        title: "Volume of gas against time",
        rowCount: 8,
        columns: [
          { id: "time", quantity: "time", symbol: "t", unit: "s", role: "independent", resolution: 1, decimalPlaces: 0 },
          { id: "vol", quantity: "volume of gas", symbol: "V", unit: "cm³", role: "dependent", resolution: 1, decimalPlaces: 0, rangeMin: 0, rangeMax: 100 },
        ],
      },
    ],
    graphs: [{ id: "g1", title: "Volume against time", tableId: "t1", xColumn: "time", yColumn: "vol", fit: "curve", tangents: true }],
    checks: [
      { id: "k1", label: "Mean rate from 0 to 30 s", kind: "mean-rate", tableId: "t1", x: "time", y: "vol", from: 0, to: 30, tolerancePercent: 5, expectedUnit: "cm³/s" },
      { id: "k2", label: "Rate at 20 s from a tangent", kind: "rate-at", tableId: "t1", x: "time", y: "vol", at: 20, tolerancePercent: 15, expectedUnit: "cm³/s" },
    ],
    rubric: {
      title: "Rates write-up",
      criteria: [
        { id: "c1", title: "Recording", levels: [{ id: "l0", label: "Not yet", marks: 0 }, { id: "l1", label: "Secure", marks: 2 }] },
        { id: "c2", title: "Processing", checkIds: ["k1", "k2"], levels: [{ id: "l0", label: "Not yet", marks: 0 }, { id: "l1", label: "Partly", marks: 1 }, { id: "l2", label: "Secure", marks: 3 }] },
      ],
    },
  });
}
