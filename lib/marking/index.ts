/**
 * The calculation engine: plain TypeScript, deterministic, no framework, database or Node
 * imports. Every function refuses input it cannot compute with one error class,
 * `MarkingInputError`. See lib/marking/README.md for the app-facing guide.
 */

// Errors
export { MarkingInputError, type MarkingInputErrorCode } from "./marking-input-error";

// Constants
export { physicalConstants } from "./physical-constants";

// Fits
export { linearFit, type LinearFit, type LinearFitOptions } from "./linear-fit";
export { polynomialFit, maximumPolynomialDegree, type PolynomialFit } from "./polynomial-fit";
export { evaluatePolynomial } from "./evaluate-polynomial";
export { firstOrderFit, type FirstOrderFit, type FirstOrderFitOptions } from "./first-order-fit";
export { firstOrderStart, type FirstOrderKind, type FirstOrderStart } from "./first-order-start";
export { levenbergMarquardt, type LevenbergMarquardtOptions, type LevenbergMarquardtResult, type NonlinearModel } from "./levenberg-marquardt";
export { localRegression, type LocalRegression, type LocalRegressionOptions } from "./local-regression";

// Rates
export { interpolateLinear } from "./interpolate-linear";
export { meanRate, type MeanRateOptions } from "./mean-rate";
export { rateAt, type RateAt, type RateAtOptions, type RateModel } from "./rate-at";
export { initialRate } from "./initial-rate";
export { reciprocalTime } from "./reciprocal-time";
export { reactionOrder, type ReactionOrder } from "./reaction-order";
export { activationEnergy, type ActivationEnergy } from "./activation-energy";
export { twoPointActivationEnergy, type TwoPointActivationEnergy } from "./two-point-activation-energy";

// Results tables and uncertainty
export { meanOfRepeats, type MeanOfRepeats, type MeanOfRepeatsOptions } from "./mean-of-repeats";
export { findAnomalies, type Anomaly } from "./find-anomalies";
export { deriveColumn, type DerivedCell, type DerivedColumnOperation } from "./derive-column";
export { resolutionUncertainty, type ResolutionUncertainty, type ResolutionUncertaintyOptions } from "./resolution-uncertainty";
export { halfRangeUncertainty, type HalfRangeUncertainty } from "./half-range-uncertainty";
export { percentageUncertainty } from "./percentage-uncertainty";
export { combinedPercentageUncertainty, type CombinedPercentageUncertainty, type UncertainFactor } from "./combined-percentage-uncertainty";

// Units and typed numbers
export { parseUnit, type ParsedUnit } from "./parse-unit";
export { convertUnit } from "./convert-unit";
export { parseTypedNumber, type TypedNumber } from "./parse-typed-number";
export { significantFigures } from "./significant-figures";

// Answer checking
export {
  checkAnswer,
  defaultTolerancePercent,
  verdicts,
  type AnswerCheck,
  type AnswerPolicy,
  type ExpectedAnswer,
  type ExpectedMethod,
  type SignificantFigureRule,
  type StudentAnswer,
  type Verdict,
} from "./check-answer";
export { findLikelySlip, unitSlipCandidates, type LikelySlip, type SlipCandidate } from "./find-likely-slip";
export { slipCodes, slipMessages, type SlipCode } from "./slip-codes";
export { tangentTouchesCurve, type CurvePoint, type TangentLine, type TangentTouch } from "./tangent-touches-curve";

// Calculation checks on a results table (what the app calls)
export type {
  ActivationEnergyCheck,
  CheckDefinition,
  CheckKind,
  CheckPolicy,
  CheckSignificantFigureRule,
  ColumnId,
  GradientCheck,
  InitialRateCheck,
  MeanOfRepeatsCheck,
  MeanRateCheck,
  OrderCheck,
  PercentageUncertaintyCheck,
  RateAtCheck,
  ReciprocalTimeCheck,
  ResultsTable,
  ResultsTableColumn,
} from "./check-definition";
export { checkKinds, type CheckKindInfo, type CheckUnitRule } from "./check-kinds";
export { expectedUnit } from "./expected-unit";
export { validateCheckDefinition } from "./validate-check-definition";
export { runCheck, type CheckAnswerInput, type CheckResult, type ExpectedValue, type RowCheck } from "./run-check";

// Preparation helpers (results to be checked by a competent person)
export { solveDilution, type Dilution, type DilutionInput } from "./solve-dilution";
export { convertPeroxideStrength, type PeroxideStrength, type PeroxideStrengthInput } from "./convert-peroxide-strength";
export { scalePrepQuantity, type PrepQuantity, type PrepQuantityInput } from "./scale-prep-quantity";

// Moderation: sampling, agreement, adjustment
export { drawModerationSample, defaultSampleRule, type MarkedWork, type ModerationSampleDraw, type SampleRuleInput } from "./draw-moderation-sample";
export { weightedKappa, type WeightedKappa } from "./weighted-kappa";
export { markingAgreement, type AgreementCriterion, type CriterionAgreement, type MarkedPair, type MarkingAgreement } from "./marking-agreement";
export { suggestMarkAdjustment, type MarkAdjustment } from "./suggest-mark-adjustment";
