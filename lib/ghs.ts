/**
 * The nine hazard pictograms of the UN Globally Harmonized System (GHS), an open standard, with
 * our own plain-English descriptions. The drawings are our own (components/practicals/ghs-pictogram.tsx).
 */
export const GHS_PICTOGRAMS = [
  { code: "GHS01", name: "Explosive", meaning: "May explode, for example when heated, struck or rubbed." },
  { code: "GHS02", name: "Flammable", meaning: "Catches fire easily: keep away from flames, sparks and heat." },
  { code: "GHS03", name: "Oxidising", meaning: "Gives off oxygen and can make other things burn more fiercely." },
  { code: "GHS04", name: "Gas under pressure", meaning: "A gas in a cylinder that may burst if heated, or is very cold." },
  { code: "GHS05", name: "Corrosive", meaning: "Can burn skin and damage eyes badly; may corrode metals." },
  { code: "GHS06", name: "Acutely toxic", meaning: "Can kill or seriously harm even in small amounts." },
  { code: "GHS07", name: "Harmful or irritant", meaning: "May irritate skin, eyes or breathing, or be harmful if swallowed." },
  { code: "GHS08", name: "Serious health hazard", meaning: "May cause long-term harm, for example to the lungs or to fertility." },
  { code: "GHS09", name: "Hazardous to the environment", meaning: "Harmful to water life: do not pour down the sink." },
] as const;

export type GhsCode = (typeof GHS_PICTOGRAMS)[number]["code"];
export const GHS_CODES = GHS_PICTOGRAMS.map((p) => p.code) as [GhsCode, ...GhsCode[]];

export const SIGNAL_WORDS = ["Danger", "Warning", "None"] as const;
export type SignalWord = (typeof SIGNAL_WORDS)[number];

export const EYE_PROTECTION = [
  { value: "safety-spectacles", label: "Safety spectacles" },
  { value: "goggles", label: "Chemical splash goggles" },
  { value: "face-shield", label: "Face shield (with goggles)" },
] as const;

/** The standing caution shown wherever a practical is read. */
export const STANDING_CAUTION =
  "Follow your school's own risk assessment, your employer's guidance and local regulations. Meniscus records hazards and control measures to help, but it does not replace them or a competent person's judgement.";

export const PREP_CHECK_LINE = "Calculated by Meniscus from the inputs shown: a competent person must check these quantities before anything is prepared.";
