import { REL_EPS, SOLVER_EPS_RAD } from '../geometry/tolerance';
import type { Vec3 } from '../geometry/vec3';

/**
 * Alhazen's problem on a sphere: the point P on a sphere (centre C, radius R) at which a ray
 * from E reflects to pass through Q.
 *
 * P lies in the plane through C, E and Q (the normal at P, E − P and Q − P are coplanar).
 * In that plane put E on the first axis, write P = C + R(cos φ·a + sin φ·b) and let
 * t = (−sin φ, cos φ) be the tangent. The law of reflection holds exactly when the unit
 * vectors toward E and toward Q make equal angles with the normal on opposite sides, i.e.
 * g(φ) = (û_E + û_Q)·t = 0. g(0) > 0 (û_E is the normal there) and g(ψ) < 0 at Q's own
 * direction ψ, so the root is bracketed in (0, ψ); it is found by safeguarded regula falsi
 * (Illinois variant) to full double precision. The reflection is real only when both E and Q
 * are outside the tangent plane at P; otherwise the sphere itself hides one from the other.
 *
 * Returns the unit direction m (P = C + R·m), or null when E and Q cannot see each other in
 * the sphere (Q behind the sphere as seen from E, or either point inside it).
 */
export function sphereReflectionPoint(C: Vec3, R: number, E: Vec3, Q: Vec3): Vec3 | null {
  const ex = E[0] - C[0];
  const ey = E[1] - C[1];
  const ez = E[2] - C[2];
  const qx = Q[0] - C[0];
  const qy = Q[1] - C[1];
  const qz = Q[2] - C[2];
  const eL = Math.sqrt(ex * ex + ey * ey + ez * ez);
  const qL = Math.sqrt(qx * qx + qy * qy + qz * qz);
  if (!(eL > R) || !(qL > R)) return null;
  const ax = ex / eL;
  const ay = ey / eL;
  const az = ez / eL;
  const qa = qx * ax + qy * ay + qz * az;
  let bx = qx - qa * ax;
  let by = qy - qa * ay;
  let bz = qz - qa * az;
  const qb = Math.sqrt(bx * bx + by * by + bz * bz);
  const psi = Math.atan2(qb, qa);
  if (qb <= SOLVER_EPS_RAD * qL) {
    // Q on the line through C and E: on E's side the normal toward E reflects onto itself.
    if (qa > 0) return [ax, ay, az];
    return null;
  }
  bx /= qb;
  by /= qb;
  bz /= qb;
  // In-plane coordinates: E = (eL, 0), Q = (qa, qb).
  const g = (phi: number): number => {
    const c = Math.cos(phi);
    const s = Math.sin(phi);
    const px = R * c;
    const py = R * s;
    const uex = eL - px;
    const uey = -py;
    const ue = Math.sqrt(uex * uex + uey * uey);
    const uqx = qa - px;
    const uqy = qb - py;
    const uq = Math.sqrt(uqx * uqx + uqy * uqy);
    return (-s * uex + c * uey) / ue + (-s * uqx + c * uqy) / uq;
  };
  let lo = 0;
  let hi = psi;
  let glo = g(lo);
  let ghi = g(hi);
  let side = 0;
  let phi = 0.5 * (lo + hi);
  for (let it = 0; it < 200; it++) {
    phi = (lo * ghi - hi * glo) / (ghi - glo);
    if (!(phi > lo && phi < hi)) phi = 0.5 * (lo + hi);
    const gp = g(phi);
    if (gp === 0) break;
    if (gp > 0) {
      lo = phi;
      glo = gp;
      if (side === 1) ghi /= 2;
      side = 1;
    } else {
      hi = phi;
      ghi = gp;
      if (side === -1) glo /= 2;
      side = -1;
    }
    if (hi - lo <= 4e-16 * Math.max(1, hi)) break;
  }
  const c = Math.cos(phi);
  const s = Math.sin(phi);
  const m: Vec3 = [c * ax + s * bx, c * ay + s * by, c * az + s * bz];
  // Both points must be on the outer side of the tangent plane at P.
  if (eL * c <= R * (1 + REL_EPS)) return null;
  if (qa * c + qb * s <= R * (1 + REL_EPS)) return null;
  return m;
}
