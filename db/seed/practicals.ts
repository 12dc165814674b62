// The demo department's practicals, written for the demo (invented wording and numbers). Hazard
// entries are typical of school practice and only illustrate the feature: a real department takes
// classifications from the supplier's safety data sheet and its own risk assessment.
import { practicalContentSchema, type PracticalContent } from "@/lib/validation/practicals";
import type { RichTextDoc, RichTextNode } from "@/lib/validation/rich-text";

const t = (text: string): RichTextNode => ({ type: "text", text });
const m = (latex: string): RichTextNode => ({ type: "inlineMath", attrs: { latex } });
const p = (...parts: (string | RichTextNode)[]): RichTextNode => ({ type: "paragraph", content: parts.map((x) => (typeof x === "string" ? t(x) : x)) });
const steps = (...items: (string | (string | RichTextNode)[])[]): RichTextNode => ({
  type: "orderedList",
  attrs: { start: 1 },
  content: items.map((i) => ({ type: "listItem", content: [Array.isArray(i) ? p(...i) : p(i)] })),
});
const doc = (...content: RichTextNode[]): RichTextDoc => ({ type: "doc", content });

const levels3 = (low: string, mid: string, high: string) => [
  { id: "l0", label: "Not yet", marks: 0, descriptor: low },
  { id: "l1", label: "Developing", marks: 1, descriptor: mid },
  { id: "l2", label: "Secure", marks: 2, descriptor: high },
];

export type DemoPractical = { key: string; title: string; topic: string; subject: string; yearGroup: number; content: PracticalContent };

const ratesRubric = (checkIds: { processing: string[]; analysis: string[] }) => ({
  title: "Rates write-up (three levels)",
  style: "marks" as const,
  sourceRubricId: null,
  criteria: [
    { id: "plan", title: "Planning and safety", description: "Identifies variables and hazards and how risks are controlled.", checkIds: [], levels: levels3("Variables or hazards missing.", "Variables named; some hazards missing.", "Variables and every hazard with its control measure.") },
    { id: "record", title: "Recording results", description: "Results table with headings as quantity / unit and consistent decimal places.", checkIds: [], levels: levels3("Units missing or readings inconsistent.", "Mostly consistent; a few slips.", "Complete, consistent, units in headings only.") },
    { id: "process", title: "Processing data", description: "Graph and calculations from the student's own data.", checkIds: checkIds.processing, levels: levels3("Calculations missing or wrong.", "Some calculations agree.", "All calculations agree, with units and sensible significant figures.") },
    { id: "analyse", title: "Analysis and evaluation", description: "Explains the trend; identifies anomalies, sources of error and improvements.", checkIds: checkIds.analysis, levels: levels3("Describes only.", "Explains the trend with some reference to the data.", "Explains with the data, evaluates errors and suggests improvements.") },
  ],
});

const acidHazard = (conc: string) => ({
  id: "acid",
  substance: `Hydrochloric acid, ${conc}`,
  pictograms: ["GHS07" as const],
  signalWord: "Warning" as const,
  hazardStatements: "May irritate skin and eyes at this concentration (check the supplier's data sheet).",
  controls: "Wear eye protection. Use the smallest volumes that work. Wipe up spills at once with plenty of water.",
});

const emergency =
  "Eyes: rinse with gently running water for at least 10 minutes and tell the teacher. Skin: wash with plenty of water. Spills: tell the teacher; dilute with water and mop up. Anyone unwell: stop, move to fresh air, tell the teacher.";

export const DEMO_PRACTICALS: DemoPractical[] = [
  {
    key: "mg-acid",
    title: "Magnesium and acid: gas collected over time",
    topic: "Rates of reaction",
    subject: "Chemistry",
    yearGroup: 10,
    content: practicalContentSchema.parse({
      aim: "Measure the volume of hydrogen given off as magnesium reacts with hydrochloric acid, and find the rate at different times.",
      introduction: doc(
        p("Magnesium reacts with hydrochloric acid to give hydrogen gas: ", m("\\mathrm{Mg(s) + 2HCl(aq) \\rightarrow MgCl_2(aq) + H_2(g)}"), "."),
        p("The rate of reaction at any moment is the gradient of the volume–time graph. Early on the acid is most concentrated and the reaction is fastest."),
      ),
      method: doc(
        steps(
          "Put on eye protection. Set up the conical flask, bung and gas syringe, and check the syringe moves freely and reads 0 cm³.",
          "Measure 50 cm³ of 1.0 mol/dm³ hydrochloric acid into the flask with a measuring cylinder.",
          "Add one 5 cm strip of magnesium ribbon, replace the bung at once and start the stopwatch.",
          "Read the volume of gas every 10 seconds for 2 minutes, or until the volume stops changing.",
          ["Plot volume of gas against time and draw a smooth curve of best fit. Draw a tangent at 20 s; its gradient ", m("\\Delta V / \\Delta t"), " is the rate at 20 s."],
        ),
      ),
      variables: { independent: "Time", dependent: "Volume of hydrogen collected", controlled: ["Volume and concentration of acid", "Length of magnesium ribbon", "Temperature of the room"] },
      apparatus: ["100 cm³ gas syringe and stand", "Conical flask (100 cm³) with bung and delivery tube", "Measuring cylinder (50 cm³)", "Stopwatch", "Magnesium ribbon, 5 cm strips"],
      safety: {
        hazards: [
          acidHazard("1.0 mol/dm³"),
          { id: "mg", substance: "Magnesium ribbon", pictograms: ["GHS02"], signalWord: "Danger", hazardStatements: "Flammable solid.", controls: "Keep away from flames. Hand out cut strips; no Bunsen burners on the bench." },
          { id: "h2", substance: "Hydrogen gas produced", pictograms: ["GHS02"], signalWord: "Danger", hazardStatements: "Extremely flammable gas.", controls: "Small volumes only; no flames in the room; vent the syringe away from faces." },
        ],
        eyeProtection: "goggles",
        otherPpe: [],
        emergency,
        riskAssessmentRef: "Department risk assessment RA-RATES-01 (demo)",
      },
      prep: {
        reagents: [
          { id: "hcl", name: "Hydrochloric acid", concentration: 1, concentrationUnit: "mol/dm³", amountPerGroup: 60, amountUnit: "cm³", notes: "50 cm³ used; 10 cm³ for a rinse" },
          { id: "mgr", name: "Magnesium ribbon", concentration: null, concentrationUnit: "mol/dm³", amountPerGroup: 3, amountUnit: "pieces", notes: "5 cm strips, cleaned" },
        ],
        apparatus: [
          { id: "syr", name: "100 cm³ gas syringe with stand and clamp", perGroup: 1 },
          { id: "flask", name: "Conical flask 100 cm³ with bung and delivery tube", perGroup: 1 },
          { id: "cyl", name: "Measuring cylinder 50 cm³", perGroup: 1 },
          { id: "watch", name: "Stopwatch", perGroup: 1 },
        ],
        spareMarginPercent: 10,
        technicianNotes: "Check gas syringes for sticking before the lesson.",
      },
      tables: [
        {
          id: "gas",
          title: "Volume of hydrogen against time",
          rowCount: 13,
          columns: [
            { id: "t", quantity: "time", symbol: "t", unit: "s", role: "independent", resolution: 1, decimalPlaces: 0, rangeMin: 0, rangeMax: 600 },
            { id: "v", quantity: "volume of gas", symbol: "V", unit: "cm³", role: "dependent", resolution: 1, decimalPlaces: 0, rangeMin: 0, rangeMax: 100 },
          ],
          presetRows: Array.from({ length: 13 }, (_, i) => ({ t: i * 10 })),
        },
      ],
      graphs: [{ id: "vt", title: "Volume of hydrogen against time", tableId: "gas", xColumn: "t", yColumn: "v", fit: "curve", throughOrigin: false, tangents: true }],
      checks: [
        { id: "mean030", label: "Mean rate from 0 s to 30 s", kind: "mean-rate", tableId: "gas", x: "t", y: "v", from: 0, to: 30, tolerancePercent: 5, sigFigs: { min: 2, max: 3 }, expectedUnit: "cm³/s", show: "hint" },
        { id: "rate20", label: "Rate at 20 s, from your tangent", kind: "rate-at", tableId: "gas", x: "t", y: "v", at: 20, model: "auto", tolerancePercent: 15, sigFigs: { min: 2, max: 3 }, expectedUnit: "cm³/s", show: "hint" },
        { id: "initial", label: "Initial rate", kind: "initial-rate", tableId: "gas", x: "t", y: "v", tolerancePercent: 15, sigFigs: { min: 2, max: 3 }, expectedUnit: "cm³/s", show: "verdict" },
      ],
      rubric: ratesRubric({ processing: ["mean030", "rate20", "initial"], analysis: [] }),
    }),
  },
  {
    key: "peroxide",
    title: "Hydrogen peroxide with and without a catalyst",
    topic: "Rates of reaction",
    subject: "Chemistry",
    yearGroup: 10,
    content: practicalContentSchema.parse({
      aim: "Compare the rate at which hydrogen peroxide gives off oxygen with and without manganese(IV) oxide as a catalyst.",
      introduction: doc(
        p("Hydrogen peroxide slowly decomposes: ", m("\\mathrm{2H_2O_2(aq) \\rightarrow 2H_2O(l) + O_2(g)}"), ". A catalyst speeds this up without being used up."),
        p("Compare the initial rates: the gradient of each curve at the start."),
      ),
      method: doc(
        steps(
          "Put on eye protection. Set up the flask and gas syringe.",
          "Measure 25 cm³ of 10-volume hydrogen peroxide solution into the flask.",
          "Run 1 (no catalyst): replace the bung, start the stopwatch, read the syringe every 20 s for 3 minutes.",
          "Run 2: rinse the flask, repeat with fresh solution, adding 0.50 g of manganese(IV) oxide from a folded paper just before the bung goes on.",
          "Plot both curves on one graph and compare their initial rates.",
        ),
      ),
      variables: { independent: "Catalyst present or absent (and time)", dependent: "Volume of oxygen collected", controlled: ["Volume and strength of hydrogen peroxide", "Mass of catalyst", "Temperature"] },
      apparatus: ["Gas syringe and stand", "Conical flask with bung and delivery tube", "Measuring cylinder (25 cm³)", "Balance reading to 0.01 g", "Stopwatch"],
      safety: {
        hazards: [
          { id: "h2o2", substance: "Hydrogen peroxide solution, 10-volume (about 3 %)", pictograms: ["GHS07"], signalWord: "Warning", hazardStatements: "Irritating to eyes at this strength. Stronger solutions are corrosive and oxidising.", controls: "Technician dilutes from stock; students only handle 10-volume. Eye protection. Wash skin contact at once." },
          { id: "mno2", substance: "Manganese(IV) oxide powder", pictograms: ["GHS07"], signalWord: "Warning", hazardStatements: "Harmful if swallowed or breathed in.", controls: "Weigh on paper, avoid raising dust; collect the solid for disposal — not down the sink." },
        ],
        eyeProtection: "goggles",
        otherPpe: [],
        emergency,
        riskAssessmentRef: "Department risk assessment RA-RATES-02 (demo)",
      },
      prep: {
        reagents: [
          { id: "per", name: "Hydrogen peroxide solution", concentration: 10, concentrationUnit: "volume", amountPerGroup: 60, amountUnit: "cm³", notes: "Dilute from 100-volume stock: see the calculator" },
          { id: "cat", name: "Manganese(IV) oxide powder", concentration: null, concentrationUnit: "mol/dm³", amountPerGroup: 1, amountUnit: "g", notes: "" },
        ],
        apparatus: [
          { id: "syr", name: "100 cm³ gas syringe with stand", perGroup: 1 },
          { id: "flask", name: "Conical flask with bung and delivery tube", perGroup: 1 },
          { id: "cyl", name: "Measuring cylinder 25 cm³", perGroup: 1 },
        ],
        spareMarginPercent: 15,
        technicianNotes: "Make the 10-volume solution fresh on the day.",
      },
      tables: [
        {
          id: "o2",
          title: "Volume of oxygen against time",
          rowCount: 10,
          columns: [
            { id: "t", quantity: "time", symbol: "t", unit: "s", role: "independent", resolution: 1, decimalPlaces: 0 },
            { id: "vn", quantity: "volume of oxygen, no catalyst", symbol: "V", unit: "cm³", role: "dependent", resolution: 1, decimalPlaces: 0, rangeMin: 0, rangeMax: 100 },
            { id: "vc", quantity: "volume of oxygen, with catalyst", symbol: "V", unit: "cm³", role: "dependent", resolution: 1, decimalPlaces: 0, rangeMin: 0, rangeMax: 100 },
          ],
          presetRows: Array.from({ length: 10 }, (_, i) => ({ t: i * 20 })),
        },
      ],
      graphs: [
        { id: "g1", title: "With catalyst", tableId: "o2", xColumn: "t", yColumn: "vc", fit: "curve", throughOrigin: false, tangents: true },
        { id: "g2", title: "Without catalyst", tableId: "o2", xColumn: "t", yColumn: "vn", fit: "line", throughOrigin: false, tangents: false },
      ],
      checks: [
        { id: "initcat", label: "Initial rate with the catalyst", kind: "initial-rate", tableId: "o2", x: "t", y: "vc", tolerancePercent: 15, sigFigs: { min: 2, max: 3 }, expectedUnit: "cm³/s", show: "hint" },
        { id: "gradnone", label: "Rate without the catalyst (gradient of your line)", kind: "gradient", tableId: "o2", x: "t", y: "vn", throughOrigin: false, tolerancePercent: 10, sigFigs: { min: 2, max: 3 }, expectedUnit: "cm³/s", show: "hint" },
      ],
      rubric: ratesRubric({ processing: ["initcat", "gradnone"], analysis: [] }),
    }),
  },
  {
    key: "thiosulfate",
    title: "Disappearing cross at different temperatures",
    topic: "Rates of reaction",
    subject: "Chemistry",
    yearGroup: 12,
    content: practicalContentSchema.parse({
      aim: "Time how long a cross takes to disappear as sodium thiosulfate reacts with acid at five temperatures, and find the activation energy.",
      introduction: doc(
        p("Sulfur forms as a fine precipitate: ", m("\\mathrm{Na_2S_2O_3 + 2HCl \\rightarrow 2NaCl + SO_2 + S + H_2O}"), "."),
        p("The time t for the cross to disappear is for a fixed amount of sulfur, so the rate is proportional to ", m("1/t"), ". From the Arrhenius equation, ", m("\\ln(1/t) = \\ln A' - \\frac{E_a}{R}\\cdot\\frac{1}{T}"), ", so the gradient of ln(1/t) against 1/T (in K⁻¹) is ", m("-E_a/R"), "."),
      ),
      method: doc(
        steps(
          "Put on eye protection. Warm 50 cm³ of 0.15 mol/dm³ sodium thiosulfate in a water bath to the first temperature (about 20 °C, then 30, 40, 50 and 60 °C).",
          "Stand the flask on the paper cross. Add 5 cm³ of 2.0 mol/dm³ hydrochloric acid, swirl, start the stopwatch.",
          "Record the temperature of the mixture and stop the clock when the cross can no longer be seen from above.",
          "Repeat three times at each temperature. Pour finished mixtures into the fume-cupboard waste beaker at once.",
          ["Calculate the mean time, 1/t, 1/T in K⁻¹ and ln(1/t). Plot ln(1/t) against 1/T, draw the line of best fit and use ", m("E_a = -\\text{gradient} \\times R"), "."],
        ),
      ),
      variables: { independent: "Temperature", dependent: "Time for the cross to disappear", controlled: ["Volumes and concentrations", "The same cross and observer", "Total volume"] },
      apparatus: ["Conical flask 100 cm³", "Paper with a printed cross", "Thermometer (0.5 °C)", "Water bath", "Measuring cylinders 50 cm³ and 10 cm³", "Stopwatch"],
      safety: {
        hazards: [
          { id: "so2", substance: "Sulfur dioxide given off", pictograms: ["GHS06"], signalWord: "Danger", hazardStatements: "Toxic if breathed in; can trigger asthma.", controls: "Good ventilation; small volumes; pour mixtures into a covered waste beaker in the fume cupboard straight away. Students with asthma should not lean over flasks." },
          acidHazard("2.0 mol/dm³"),
          { id: "bath", substance: "Hot water bath (up to 60 °C)", pictograms: [], signalWord: "None", hazardStatements: "Scalding.", controls: "Keep baths at the back of the bench; move flasks with a cloth; no running." },
        ],
        eyeProtection: "goggles",
        otherPpe: [],
        emergency: `${emergency} Anyone wheezing: stop the practical, ventilate, follow their care plan.`,
        riskAssessmentRef: "Department risk assessment RA-RATES-03 (demo)",
      },
      prep: {
        reagents: [
          { id: "thio", name: "Sodium thiosulfate solution", concentration: 0.15, concentrationUnit: "mol/dm³", amountPerGroup: 800, amountUnit: "cm³", notes: "15 runs of 50 cm³ plus spare" },
          { id: "hcl", name: "Hydrochloric acid", concentration: 2, concentrationUnit: "mol/dm³", amountPerGroup: 90, amountUnit: "cm³", notes: "" },
        ],
        apparatus: [
          { id: "flask", name: "Conical flask 100 cm³", perGroup: 2 },
          { id: "therm", name: "Thermometer 0–100 °C", perGroup: 1 },
          { id: "bath", name: "Thermostatic water bath (shared between two groups)", perGroup: 1 },
        ],
        spareMarginPercent: 10,
        technicianNotes: "Covered waste beaker with sodium carbonate solution in the fume cupboard.",
      },
      tables: [
        {
          id: "times",
          title: "Time for the cross to disappear",
          rowCount: 5,
          columns: [
            { id: "T", quantity: "temperature", symbol: "θ", unit: "°C", role: "independent", resolution: 0.5, decimalPlaces: 1, rangeMin: 0, rangeMax: 100 },
            { id: "t1", quantity: "time, run 1", symbol: "t", unit: "s", role: "repeat", resolution: 0.01, decimalPlaces: 1, meanOf: [] },
            { id: "t2", quantity: "time, run 2", symbol: "t", unit: "s", role: "repeat", resolution: 0.01, decimalPlaces: 1 },
            { id: "t3", quantity: "time, run 3", symbol: "t", unit: "s", role: "repeat", resolution: 0.01, decimalPlaces: 1 },
            { id: "tm", quantity: "mean time", symbol: "t", unit: "s", role: "mean", decimalPlaces: 1, meanOf: ["t1", "t2", "t3"] },
            { id: "inv", quantity: "1/t", symbol: "1/t", unit: "s⁻¹", role: "derived", decimalPlaces: 4, derivedFrom: "tm", formula: "reciprocal" },
            { id: "invT", quantity: "1/T", symbol: "1/T", unit: "K⁻¹", role: "derived", decimalPlaces: 6, derivedFrom: "T", formula: "reciprocal-kelvin-from-celsius" },
            { id: "ln", quantity: "ln(1/t)", symbol: "ln(1/t)", unit: "", role: "derived", decimalPlaces: 2, derivedFrom: "inv", formula: "ln" },
          ],
        },
      ],
      graphs: [{ id: "arr", title: "ln(1/t) against 1/T", tableId: "times", xColumn: "invT", yColumn: "ln", fit: "line", throughOrigin: false, tangents: false }],
      checks: [
        { id: "means", label: "Mean time at each temperature", kind: "mean-of-repeats", tableId: "times", repeats: ["t1", "t2", "t3"], answerColumn: "tm", tolerancePercent: 2, expectedUnit: "s", show: "hint" },
        { id: "recip", label: "1/t for each temperature", kind: "reciprocal-time", tableId: "times", t: "tm", answerColumn: "inv", tolerancePercent: 2, expectedUnit: "s⁻¹", show: "hint" },
        { id: "ea", label: "Activation energy", kind: "activation-energy", tableId: "times", temperature: "T", temperatureUnit: "°C", rate: "tm", rateIs: "time", tolerancePercent: 10, sigFigs: { min: 2, max: 3 }, expectedUnit: "kJ/mol", show: "hint" },
      ],
      rubric: ratesRubric({ processing: ["means", "recip"], analysis: ["ea"] }),
    }),
  },
  {
    key: "chips",
    title: "Marble chips and powder: mass lost over time",
    topic: "Rates of reaction",
    subject: "Chemistry",
    yearGroup: 10,
    content: practicalContentSchema.parse({
      aim: "Compare how quickly carbon dioxide escapes when acid reacts with marble chips and with the same mass of powder.",
      introduction: doc(p("Calcium carbonate reacts with acid giving carbon dioxide, which escapes through the cotton wool, so the mass on the balance falls. A larger surface area gives more collisions each second.")),
      method: doc(
        steps(
          "Put on eye protection. Put 40 cm³ of 1.0 mol/dm³ hydrochloric acid in a flask on the balance with a cotton-wool plug beside it.",
          "Add 5.00 g of marble chips, plug the flask and start the stopwatch; tare or record the starting mass.",
          "Record the mass lost every 30 s for 5 minutes.",
          "Repeat with 5.00 g of powder.",
        ),
      ),
      variables: { independent: "Surface area (chips or powder) and time", dependent: "Mass lost", controlled: ["Mass of marble", "Acid volume and concentration", "Temperature"] },
      apparatus: ["Top-pan balance (0.01 g)", "Conical flask 250 cm³", "Cotton wool", "Stopwatch"],
      safety: { hazards: [acidHazard("1.0 mol/dm³")], eyeProtection: "safety-spectacles", otherPpe: [], emergency, riskAssessmentRef: "" },
      prep: {
        reagents: [
          { id: "hcl", name: "Hydrochloric acid", concentration: 1, concentrationUnit: "mol/dm³", amountPerGroup: 90, amountUnit: "cm³", notes: "" },
          { id: "chips", name: "Marble chips (medium)", concentration: null, concentrationUnit: "mol/dm³", amountPerGroup: 5, amountUnit: "g", notes: "" },
          { id: "powder", name: "Powdered calcium carbonate", concentration: null, concentrationUnit: "mol/dm³", amountPerGroup: 5, amountUnit: "g", notes: "" },
        ],
        apparatus: [{ id: "bal", name: "Top-pan balance 0.01 g", perGroup: 1 }],
        spareMarginPercent: 10,
        technicianNotes: "",
      },
      tables: [
        {
          id: "mass",
          title: "Mass lost against time",
          rowCount: 11,
          columns: [
            { id: "t", quantity: "time", symbol: "t", unit: "s", role: "independent", resolution: 1, decimalPlaces: 0 },
            { id: "mc", quantity: "mass lost, chips", symbol: "Δm", unit: "g", role: "dependent", resolution: 0.01, decimalPlaces: 2, rangeMin: 0, rangeMax: 10 },
            { id: "mp", quantity: "mass lost, powder", symbol: "Δm", unit: "g", role: "dependent", resolution: 0.01, decimalPlaces: 2, rangeMin: 0, rangeMax: 10 },
          ],
          presetRows: Array.from({ length: 11 }, (_, i) => ({ t: i * 30 })),
        },
      ],
      graphs: [{ id: "g", title: "Mass lost against time (powder)", tableId: "mass", xColumn: "t", yColumn: "mp", fit: "curve", throughOrigin: false, tangents: true }],
      checks: [
        { id: "mean02", label: "Mean rate for the powder, 0 to 120 s", kind: "mean-rate", tableId: "mass", x: "t", y: "mp", from: 0, to: 120, tolerancePercent: 5, sigFigs: { min: 2, max: 3 }, expectedUnit: "g/s", show: "hint" },
        { id: "mean02c", label: "Mean rate for the chips, 0 to 120 s", kind: "mean-rate", tableId: "mass", x: "t", y: "mc", from: 0, to: 120, tolerancePercent: 5, sigFigs: { min: 2, max: 3 }, expectedUnit: "g/s", show: "hint" },
      ],
      rubric: ratesRubric({ processing: ["mean02", "mean02c"], analysis: [] }),
    }),
  },
  {
    key: "resistance",
    title: "Resistance of a wire from a voltage–current graph",
    topic: "Electricity",
    subject: "Physics",
    yearGroup: 11,
    content: practicalContentSchema.parse({
      aim: "Find the resistance of a length of constantan wire from the gradient of a graph of potential difference against current.",
      introduction: doc(p("For a wire at constant temperature, ", m("V = IR"), ", so a graph of V against I is a straight line through the origin whose gradient is the resistance R.")),
      method: doc(
        steps(
          "Set up the circuit: low-voltage supply, variable resistor, ammeter in series and voltmeter across 50.0 cm of wire.",
          "Set the current to about 0.10 A and record the current and potential difference.",
          "Increase the current in steps up to about 0.60 A. Switch off between readings so the wire does not heat up.",
          "Plot V against I and find the gradient of the best-fit line through the origin.",
        ),
      ),
      variables: { independent: "Current", dependent: "Potential difference", controlled: ["Length and thickness of wire", "Temperature of the wire"] },
      apparatus: ["Low-voltage power supply", "Ammeter", "Voltmeter", "Variable resistor", "Constantan wire on a metre rule", "Crocodile clips"],
      safety: {
        hazards: [{ id: "hot", substance: "Wire heating up at higher currents", pictograms: [], signalWord: "None", hazardStatements: "Can burn fingers.", controls: "Keep currents below 1 A; switch off between readings; do not touch the wire while current flows." }],
        eyeProtection: "safety-spectacles",
        otherPpe: [],
        emergency: "Burns: cool under running water for 20 minutes and tell the teacher. Switch off the supply at once if anything smells hot.",
        riskAssessmentRef: "",
      },
      prep: {
        reagents: [{ id: "wire", name: "Constantan wire, 0.28 mm diameter", concentration: null, concentrationUnit: "mol/dm³", amountPerGroup: 110, amountUnit: "cm", notes: "" }],
        apparatus: [
          { id: "psu", name: "Low-voltage supply", perGroup: 1 },
          { id: "am", name: "Ammeter", perGroup: 1 },
          { id: "vm", name: "Voltmeter", perGroup: 1 },
        ],
        spareMarginPercent: 10,
        technicianNotes: "",
      },
      tables: [
        {
          id: "vi",
          title: "Potential difference and current",
          rowCount: 6,
          columns: [
            { id: "I", quantity: "current", symbol: "I", unit: "A", role: "independent", resolution: 0.01, decimalPlaces: 2, rangeMin: 0, rangeMax: 1 },
            { id: "V", quantity: "potential difference", symbol: "V", unit: "V", role: "dependent", resolution: 0.01, decimalPlaces: 2, rangeMin: 0, rangeMax: 12 },
          ],
        },
      ],
      graphs: [{ id: "g", title: "V against I", tableId: "vi", xColumn: "I", yColumn: "V", fit: "line", throughOrigin: true, tangents: false }],
      checks: [{ id: "R", label: "Resistance from the gradient", kind: "gradient", tableId: "vi", x: "I", y: "V", throughOrigin: true, tolerancePercent: 10, sigFigs: { min: 2, max: 3 }, expectedUnit: "V/A", show: "hint" }],
      rubric: {
        title: "Competence record",
        style: "competence",
        sourceRubricId: null,
        criteria: [
          { id: "safe", title: "Works safely", description: "", checkIds: [], levels: [{ id: "n", label: "Not yet", marks: 0, descriptor: "" }, { id: "y", label: "Shown", marks: 1, descriptor: "" }] },
          { id: "app", title: "Uses meters correctly", description: "", checkIds: [], levels: [{ id: "n", label: "Not yet", marks: 0, descriptor: "" }, { id: "y", label: "Shown", marks: 1, descriptor: "" }] },
          { id: "proc", title: "Processes data", description: "Gradient from own graph.", checkIds: ["R"], levels: [{ id: "n", label: "Not yet", marks: 0, descriptor: "" }, { id: "y", label: "Shown", marks: 1, descriptor: "" }] },
        ],
      },
    }),
  },
];
