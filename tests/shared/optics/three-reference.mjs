// Independent reference ray tracer for tests: reads cases as JSON on stdin, traces each with
// three.js (Ray.intersectSphere, Vector3.reflect, Ray.intersectPlane), prints JSON results.
// Run as a plain Node process because three.js is published as ES modules only.
import { Plane, Ray, Sphere, Vector3 } from 'three';

const chunks = [];
for await (const c of process.stdin) chunks.push(c);
const cases = JSON.parse(Buffer.concat(chunks).toString('utf8'));
const out = cases.map(({ centre, radius, eye, toward, planeHeight }) => {
  const c = new Vector3(...centre);
  const e = new Vector3(...eye);
  const dir = new Vector3(...toward).sub(e).normalize();
  // Start the ray 2R short of the centre's distance: the same line, but intersectSphere's
  // |v|² − tca² then subtracts numbers of size R² instead of |E − C|², so the reference is not
  // limited by its own rounding (at 12 m from a 0.15 m dome that would be ~1e-12 m).
  const start = Math.max(0, c.clone().sub(e).dot(dir) - 2 * radius);
  const hit = new Ray(new Ray(e.clone(), dir).at(start, new Vector3()), dir).intersectSphere(new Sphere(c, radius), new Vector3());
  if (!hit) return null;
  const n = hit.clone().sub(c).normalize();
  const refl = dir.clone().reflect(n);
  const floor = new Ray(hit.clone(), refl.clone()).intersectPlane(new Plane(new Vector3(0, 0, 1), -planeHeight), new Vector3());
  return { hit: hit.toArray(), cosIncidence: dir.dot(n), reflected: refl.toArray(), floor: floor ? floor.toArray() : null };
});
process.stdout.write(JSON.stringify(out));
