import { describe, expect, it } from "vitest";
import { QUALITATIVE, SIGN_COLOURS } from "./palette";

/** CIELAB from an sRGB hex colour: the sRGB transfer curve of IEC 61966-2-1:1999, D65 white, CIE 15:2004 formulas. */
function lab(hex: string): [number, number, number] {
  const [r, g, b] = [1, 3, 5].map((i) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  const x = (0.4124 * r! + 0.3576 * g! + 0.1805 * b!) / 0.95047;
  const y = 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
  const z = (0.0193 * r! + 0.1192 * g! + 0.9505 * b!) / 1.08883;
  const f = (t: number) => (t > (6 / 29) ** 3 ? Math.cbrt(t) : t / (3 * (6 / 29) ** 2) + 4 / 29);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
}
const deltaE = (a: string, b: string) => Math.hypot(...lab(a).map((v, i) => v - lab(b)[i]!));

describe("graph palette", () => {
  it("lab() matches the published CIELAB values of sRGB white and primaries (common practice)", () => {
    // White is L* 100, a* b* 0; sRGB red is about (53.24, 80.09, 67.20) in every colour-science handbook.
    expect(lab("#FFFFFF").map((v) => Math.round(v) + 0)).toEqual([100, 0, 0]);
    expect(lab("#FF0000").map((v) => Math.round(v))).toEqual([53, 80, 67]);
  });

  it("QUALITATIVE is the eight Okabe–Ito colours, each once", () => {
    // Okabe & Ito, Color Universal Design (J*Fly, 2008): black, orange, sky blue, bluish green, yellow, blue,
    // vermillion, reddish purple.
    const published = ["#000000", "#E69F00", "#56B4E9", "#009E73", "#F0E442", "#0072B2", "#D55E00", "#CC79A7"];
    expect([...QUALITATIVE].sort()).toEqual([...published].sort());
  });

  it("QUALITATIVE puts clearly different colours next to each other (CIE76 ΔE*ab ≥ 30 between neighbours)", () => {
    // A ΔE*ab of about 2.3 is just noticeable (Sharma, Digital Color Imaging Handbook, CRC 2003); 30 is far above it.
    for (let i = 0; i + 1 < QUALITATIVE.length; i++)
      expect(
        deltaE(QUALITATIVE[i]!, QUALITATIVE[i + 1]!),
        `${QUALITATIVE[i]} vs ${QUALITATIVE[i + 1]}`,
      ).toBeGreaterThanOrEqual(30);
  });

  it("SIGN_COLOURS tells activation, repression and dual apart", () => {
    const { positive, negative, dual } = SIGN_COLOURS;
    expect(deltaE(positive, negative)).toBeGreaterThan(30);
    expect(deltaE(positive, dual)).toBeGreaterThan(30);
    expect(deltaE(negative, dual)).toBeGreaterThan(30);
  });
});
