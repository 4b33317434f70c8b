/**
 * Student's t quantiles (src/calibrate/studentT.ts) against closed forms for 1, 2 and 4 degrees
 * of freedom (Shaw 2006, "Sampling Student's T distribution", Journal of Computational Finance
 * 9(4)) and against jStat (a general-purpose statistics library).
 */
import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { studentTCdf, studentTQuantile } from "../src/calibrate/studentT";

const PS = [0.001, 0.025, 0.05, 0.1, 0.3, 0.5, 0.7, 0.9, 0.95, 0.975, 0.995, 0.9999];

describe("studentTQuantile", () => {
  it("df = 1 (Cauchy): tan(pi (p - 1/2)) to 1e-12 relative", () => {
    for (const p of PS) {
      const want = Math.tan(Math.PI * (p - 0.5));
      expect(Math.abs(studentTQuantile(p, 1) - want)).toBeLessThanOrEqual(
        1e-12 * Math.max(1, Math.abs(want)),
      );
    }
  });

  it("df = 2: (2p - 1) / sqrt(2 p (1 - p)) to 1e-12 relative", () => {
    for (const p of PS) {
      const want = (2 * p - 1) / Math.sqrt(2 * p * (1 - p));
      expect(Math.abs(studentTQuantile(p, 2) - want)).toBeLessThanOrEqual(
        1e-12 * Math.max(1, Math.abs(want)),
      );
    }
  });

  it("df = 4: 2 sign(p - 1/2) sqrt(cos(acos(sqrt(alpha))/3) / sqrt(alpha) - 1), alpha = 4p(1-p), to 1e-12", () => {
    for (const p of PS) {
      const alpha = 4 * p * (1 - p);
      const q = Math.cos(Math.acos(Math.sqrt(alpha)) / 3) / Math.sqrt(alpha);
      const want = Math.sign(p - 0.5) * 2 * Math.sqrt(q - 1);
      expect(Math.abs(studentTQuantile(p, 4) - want)).toBeLessThanOrEqual(
        1e-12 * Math.max(1, Math.abs(want)),
      );
    }
  });

  it("agrees with jStat.studentt.inv for df 3..500 (1e-7 relative: jStat's own inverse beta is the looser one)", () => {
    for (const df of [3, 5, 7, 10, 15, 27, 60, 120, 500]) {
      for (const p of [0.025, 0.05, 0.5, 0.95, 0.975]) {
        const want = jStat.studentt.inv(p, df);
        expect(Math.abs(studentTQuantile(p, df) - want)).toBeLessThanOrEqual(
          1e-7 * Math.max(1, Math.abs(want)),
        );
      }
    }
  });

  it("the cdf at df = 1 is 1/2 + atan(t)/pi to 1e-14", () => {
    for (const t of [-30, -2, -0.3, 0, 0.7, 2.1, 8]) {
      expect(Math.abs(studentTCdf(t, 1) - (0.5 + Math.atan(t) / Math.PI))).toBeLessThan(1e-14);
    }
  });

  it("inverts its own cdf to 1e-13 and the cdf agrees with jStat to 1e-7 (jStat gives 0.5 - 4.4e-8 at t = 0, df = 1000; the closed forms above are the tight check)", () => {
    for (const df of [1, 2.5, 9, 44, 1000]) {
      for (const p of PS)
        expect(Math.abs(studentTCdf(studentTQuantile(p, df), df) - p)).toBeLessThan(1e-13);
      for (const t of [-30, -2, -0.3, 0, 0.7, 2.1, 8]) {
        expect(Math.abs(studentTCdf(t, df) - jStat.studentt.cdf(t, df))).toBeLessThan(1e-7);
      }
    }
  });
});
