import { convexImage, focalLength, perceivedDistance } from '../../../shared/optics';

/** Radius of curvature implied by an object distance and a magnification (mirror equation). */
function radiusFrom(objectDistance: number, magnification: number): number {
  const di = -magnification * objectDistance;
  const f = (objectDistance * di) / (objectDistance + di);
  return -2 * f;
}

describe('convex mirror worked examples from published textbooks', () => {
  // OpenStax, University Physics Vol. 3, §2.2 "Spherical Mirrors", example "Image in a Convex
  // Mirror" (keratometer): dₒ = 12 cm, m = 0.032; printed dᵢ = −0.384 cm, f = −0.40 cm,
  // |R| = 0.80 cm (rounded). Published, checked (docs/sources.md, "Mirror optics: worked examples").
  it('reproduces the keratometer example: printed rounding loosely, exact values tightly', () => {
    const R = radiusFrom(0.12, 0.032);
    const img = convexImage({ radiusM: R, objectDistanceM: 0.12 });
    expect(img.imageDistanceM * 100).toBeCloseTo(-0.384, 12);
    expect(img.magnification).toBeCloseTo(0.032, 14);
    expect(Math.abs(img.focalLengthM * 100 - -0.4)).toBeLessThan(0.005);
    expect(Math.abs(R * 100 - 0.8)).toBeLessThan(0.01);
    // Exact: f = dₒdᵢ/(dₒ + dᵢ) = 12·(−0.384)/11.616 cm.
    expect(img.focalLengthM * 100).toBeCloseTo((12 * -0.384) / (12 - 0.384), 12);
  });

  it('gives the printed magnification when the rounded focal length of −0.40 cm is used', () => {
    // Same OpenStax example, run forward from the rounded f = −0.40 cm: m ≈ 0.032 to print precision.
    const img = convexImage({ radiusM: 0.008, objectDistanceM: 0.12 });
    expect(Math.abs(img.magnification - 0.032)).toBeLessThan(0.0005);
    expect(Math.abs(img.imageDistanceM * 100 - -0.384)).toBeLessThan(0.005);
  });

  // OpenStax, College Physics, §25.7 problems: a shopper 3.00 m from a convex security mirror
  // sees m = 0.250 → dᵢ = −0.750 m, f = −1.00 m, R = 2.00 m (computed from the givens; docs/sources.md, "Mirror optics: worked examples").
  it('reproduces the shopper and security mirror problem', () => {
    const img = convexImage({ radiusM: 2, objectDistanceM: 3 });
    expect(img.magnification).toBeCloseTo(0.25, 14);
    expect(img.imageDistanceM).toBeCloseTo(-0.75, 14);
    expect(img.focalLengthM).toBe(-1);
    expect(radiusFrom(3, 0.25)).toBeCloseTo(2, 12);
  });

  // OpenStax, College Physics, §25.7 problems: cornea as a convex mirror, hₒ = 1.50 cm at
  // dₒ = 3.00 cm, hᵢ = 0.167 cm → m = 0.111, dᵢ = −0.334 cm, f = −0.376 cm, R = 0.752 cm
  // (key in the book; docs/sources.md, "Mirror optics: worked examples").
  it('reproduces the cornea problem to the printed three figures', () => {
    const m = 0.167 / 1.5;
    const R = radiusFrom(0.03, m);
    expect(R * 100).toBeCloseTo(0.752, 3);
    const img = convexImage({ radiusM: R, objectDistanceM: 0.03, objectHeightM: 0.015 });
    expect(img.magnification).toBeCloseTo(0.111, 3);
    expect(img.imageDistanceM * 100).toBeCloseTo(-0.334, 3);
    expect(img.focalLengthM * 100).toBeCloseTo(-0.376, 3);
    expect((img.imageHeightM as number) * 100).toBeCloseTo(0.167, 12);
  });

  // NCERT, Physics Class 12, Ray Optics, Exercise 9.2: 4.5 cm object 12 cm from a convex
  // mirror of focal length 15 cm → image 6.7 cm behind, m = 0.56, height 2.5 cm; exact
  // dᵢ = −20/3 cm, m = 5/9 (docs/sources.md, "Mirror optics: worked examples").
  it('reproduces NCERT exercise 9.2 exactly and to the printed rounding', () => {
    const img = convexImage({ radiusM: 0.3, objectDistanceM: 0.12, objectHeightM: 0.045 });
    expect(img.imageDistanceM).toBeCloseTo(-0.2 / 3, 14);
    expect(img.magnification).toBeCloseTo(5 / 9, 14);
    expect((img.imageHeightM as number) * 100).toBeCloseTo(2.5, 12);
    expect(Math.abs(img.imageDistanceM * 100 + 6.7)).toBeLessThan(0.05);
    expect(Math.abs(img.magnification - 0.56)).toBeLessThan(0.005);
  });

  it('uses f = −R/2', () => {
    expect(focalLength(2.4)).toBe(-1.2);
  });
});

describe('perceived distance in a convex mirror', () => {
  it('places the size cue farther away than the true path, by (D + |dᵢ|)/m', () => {
    // Shopper geometry above (OpenStax College Physics §25.7): R = 2 m, object 3 m from the mirror, eye 1 m.
    const p = perceivedDistance({ radiusM: 2, eyeDistanceM: 1, objectDistanceM: 3 });
    expect(p.trueDistanceM).toBe(4);
    expect(p.imageFromEyeM).toBeCloseTo(1.75, 14);
    expect(p.sizeCueDistanceM).toBeCloseTo(1.75 / 0.25, 12);
    expect(p.ratio).toBeCloseTo(7 / 4, 12);
  });
});
