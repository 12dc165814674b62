import { describe, expect, it } from "vitest";
import { loadNistLinear, nistLinearNames } from "./fixtures";
import { minimumCoefficientLre, ourFit, referenceFits } from "./reference-packages";

// Source: NIST StRD certified values (tests/fixtures/nist-strd); reference implementations are the
// npm packages simple-statistics, ml-regression and jstat run on the same data (cross-checks, not copied).
describe("the engine beside general-purpose npm statistics packages on the NIST linear datasets", () => {
  for (const name of nistLinearNames) {
    it(`${name}: at least as accurate as every package, and agrees with those that are accurate`, () => {
      const data = loadNistLinear(name);
      const ours = ourFit(data);
      const ourLre = minimumCoefficientLre(ours, data.certified.estimates);
      const references = referenceFits(data);
      expect(references.length).toBeGreaterThanOrEqual(2);
      for (const reference of references) {
        const theirLre = minimumCoefficientLre(reference.coefficients, data.certified.estimates);
        expect(ourLre, `${name}: ours ${ourLre.toFixed(1)} against ${reference.implementation} ${theirLre.toFixed(1)}`).toBeGreaterThanOrEqual(
          theirLre - 1e-9,
        );
        if (theirLre >= 6 && reference.coefficients) {
          const allowed = 10 ** -(theirLre - 1);
          reference.coefficients.forEach((value, i) => {
            const scale = Math.max(Math.abs(data.certified.estimates[i]), 1e-300);
            expect(Math.abs(ours[i] - value) / scale, `${name} coefficient ${i} against ${reference.implementation}`).toBeLessThanOrEqual(allowed);
          });
        }
      }
    });
  }
});
