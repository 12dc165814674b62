/**
 * Machine codes for the common slips the engine recognises, each with the plain sentence shown to
 * the student (a 14-year-old should understand it). The sentences never contain the expected
 * number, so they are safe to show before the teacher reveals the answer.
 *
 * @example
 * slipMessages["celsius-for-kelvin"]; // => "It looks as if you used temperatures in °C. ..."
 */
export const slipMessages = {
  "celsius-for-kelvin":
    "It looks as if you used temperatures in °C. Change each temperature to kelvin (add 273) before working out 1/T.",
  "minutes-for-seconds": "It looks as if minutes and seconds have been mixed up. Check that every time is in the unit you wrote.",
  "cm3-for-dm3": "It looks as if cm³ and dm³ have been mixed up (1 dm³ = 1000 cm³). Check the volume units.",
  "joules-for-kilojoules": "It looks as if J and kJ have been mixed up (1 kJ = 1000 J). Check the energy unit.",
  "inverted-ratio":
    "It looks as if you divided the wrong way round. Divide the change in the quantity on the up axis by the change in the quantity on the along axis.",
  "lost-minus-sign": "Your answer is the right size but has the wrong sign. The line slopes downwards, so its gradient is negative.",
  "wrong-sign": "Your answer is the right size but has the wrong sign. Check the sign of your gradient and of the formula you used.",
  "negative-rate": "Your answer is the right size but has a minus sign. A rate is given as a positive number even when the amount goes down.",
  "wrong-interval": "It looks as if you used a different time interval. Check the start and end times you were asked for.",
  "wrong-columns": "It looks as if you used the wrong columns of the table. Check which quantities go on each axis.",
  "mean-rate-as-initial-rate":
    "It looks as if you divided the total change by the total time. That is the average rate for the whole experiment, not the rate at the start: draw a tangent at the start instead.",
  "chord-not-tangent":
    "It looks as if you worked out the gradient between two of your readings. Draw a tangent that just touches the curve at the time asked, and use two points on that line.",
  "anomaly-included": "It looks as if the anomalous reading was included in the mean. Leave out a reading that does not fit the others, and say why.",
  "log10-for-ln": "It looks as if you used log (base 10) instead of ln. This calculation needs ln, the natural logarithm.",
  "percentage-as-fraction": "It looks as if you forgot to multiply by 100 to turn the fraction into a percentage.",
  "resolution-rule":
    "Check the uncertainty of each reading: half the smallest scale division for a scale you read by eye, the last digit for a digital display, and double it when the value comes from two readings.",
  "power-of-ten": "Your digits look right but the size is out by a power of ten. Check your units and any powers of ten.",
  "tangent-not-touching": "Your tangent does not touch the curve at the time asked. Draw it so that it just touches the curve there.",
  "tangent-gradient-misread":
    "Your answer does not match the gradient of the line you drew. Work out (change in y) ÷ (change in x) from two points far apart on your line again.",
} as const;

/** A common slip, by machine code. */
export type SlipCode = keyof typeof slipMessages;

/**
 * The list of slip codes, for the app's schemas (for example a zod enum).
 *
 * @example
 * slipCodes.includes("wrong-interval"); // => true
 */
export const slipCodes = Object.keys(slipMessages) as SlipCode[];
