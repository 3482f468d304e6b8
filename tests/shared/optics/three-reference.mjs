// Independent reference ray tracer for tests, built on three.js only. For each case it lays a
// grid over the mirror (a three.js SphereGeometry cap around the mirror's axis, kept where the
// mirror's own shape says the surface exists), shoots a Ray from the eye at every grid vertex
// (Ray.intersectSphere: the vertex counts only if it is the first point the eye's ray meets),
// reflects it (Vector3.reflect about the unit normal) and meets the plane (Ray.intersectPlane).
// It prints, per case, the plane points hit within range (with their reflection points) and the area of the plane tiled by grid
// cells whose four corners all hit within range. It never sees the engine's outline or region.
// Run as a plain Node process because three.js is published as ES modules only.
import { Plane, Quaternion, Ray, Sphere, SphereGeometry, Vector3 } from 'three';

const chunks = [];
for await (const c of process.stdin) chunks.push(c);
const cases = JSON.parse(Buffer.concat(chunks).toString('utf8'));

/** The mirror's frame: w = unit axis, u = horizontal across (ẑ × w), v = w × u; u = +x when w is vertical. */
function frame(axis) {
  const w = new Vector3(...axis).normalize();
  const u = new Vector3(0, 0, 1).cross(w);
  if (u.length() === 0) u.set(1, 0, 0);
  u.normalize();
  const v = w.clone().cross(u);
  return { u, v, w };
}

/** Whether unit direction m (from the sphere's centre) lies on the mirror, from the shape's definition. */
function onMirror(mirror, R, f, m, inset = 0) {
  const mw = m.dot(f.w);
  if (mirror.shape === 'round') return mw > 0 && R * Math.sqrt(Math.max(0, 1 - mw * mw)) <= mirror.diameterM / 2 - inset;
  if (mirror.shape === 'rect')
    return mw > 0 && Math.abs(R * m.dot(f.u)) <= mirror.widthM / 2 - inset && Math.abs(R * m.dot(f.v)) <= mirror.heightM / 2 - inset;
  // Domes: the half-spaces through the centre bounding a hemisphere, a quarter and an eighth sphere.
  const normals = [];
  if (mirror.portion === 'full') normals.push(f.w.clone());
  else if (mirror.portion === 'half') normals.push(f.w.clone().add(f.v).normalize(), f.w.clone().sub(f.v).normalize());
  else
    for (const deg of [-90, 30, 150]) {
      const b = (deg * Math.PI) / 180;
      normals.push(
        f.w
          .clone()
          .addScaledVector(f.u, Math.SQRT2 * Math.cos(b))
          .addScaledVector(f.v, Math.SQRT2 * Math.sin(b))
          .normalize(),
      );
    }
  return normals.every((n) => R * m.dot(n) >= inset);
}

const out = cases.map(({ mirror, vertex, axis, eye, planeHeight, maxRange, rings, segments }) => {
  const R = mirror.shape === 'dome' ? mirror.diameterM / 2 : mirror.radiusM;
  const f = frame(axis);
  const V = new Vector3(...vertex);
  const C = V.clone().addScaledVector(f.w, -R);
  const E = new Vector3(...eye);
  const sphere = new Sphere(C, R);
  const floor = new Plane(new Vector3(0, 0, 1), -planeHeight);
  // Cap around the axis wide enough for the whole mirror: the rim's angle for a panel, a
  // hemisphere for a dome. SphereGeometry's pole is +y; turn it onto the axis.
  const half =
    mirror.shape === 'round'
      ? Math.asin(Math.min(1, mirror.diameterM / (2 * R)))
      : mirror.shape === 'rect'
        ? Math.asin(Math.min(1, Math.hypot(mirror.widthM, mirror.heightM) / (2 * R)))
        : Math.PI / 2;
  const geo = new SphereGeometry(R, segments, rings, 0, 2 * Math.PI, 0, half);
  geo.applyQuaternion(new Quaternion().setFromUnitVectors(new Vector3(0, 1, 0), f.w));
  geo.translate(C.x, C.y, C.z);
  const pos = geo.getAttribute('position');
  const cols = segments + 1;
  const hitAt = new Array(pos.count).fill(null);
  const hits = [];
  const P = new Vector3();
  const H = new Vector3();
  for (let k = 0; k < pos.count; k++) {
    P.fromBufferAttribute(pos, k);
    const m = P.clone().sub(C).normalize();
    if (!onMirror(mirror, R, f, m)) continue;
    const dir = P.clone().sub(E);
    const dist = dir.length();
    dir.normalize();
    // Start 2R short of the sphere along the same line so intersectSphere subtracts numbers of
    // size R², not |E − C|² (its own rounding would otherwise reach 1e-12 m at 12 m).
    const start = Math.max(0, C.clone().sub(E).dot(dir) - 2 * R);
    const first = new Ray(new Ray(E.clone(), dir).at(start, new Vector3()), dir).intersectSphere(sphere, H);
    if (!first || first.distanceTo(P) > 1e-7 * Math.max(1, dist)) continue; // the sphere hides this vertex from the eye
    const n = first.clone().sub(C).normalize();
    const refl = dir.clone().reflect(n);
    const q = new Ray(first.clone(), refl).intersectPlane(floor, new Vector3());
    if (!q || Math.hypot(q.x - V.x, q.y - V.y) > maxRange) continue;
    hitAt[k] = q;
    // Last field: 1 when the vertex lies on the mirror's edge (within 1 µm), where "on the
    // mirror or not" is decided by rounding.
    hits.push([q.x, q.y, first.x, first.y, first.z, onMirror(mirror, R, f, m, 1e-6) ? 0 : 1]);
  }
  // Area tiled by grid cells whose four corners all hit within range (shoelace of the quad).
  let tiledArea = 0;
  for (let iy = 0; iy < rings; iy++) {
    for (let ix = 0; ix < segments; ix++) {
      const a = hitAt[iy * cols + ix];
      const b = hitAt[iy * cols + ix + 1];
      const c = hitAt[(iy + 1) * cols + ix + 1];
      const d = hitAt[(iy + 1) * cols + ix];
      if (!a || !b || !c || !d) continue;
      tiledArea += Math.abs((a.x * b.y - b.x * a.y + b.x * c.y - c.x * b.y + c.x * d.y - d.x * c.y + d.x * a.y - a.x * d.y) / 2);
    }
  }
  return { hits, tiledArea };
});
process.stdout.write(JSON.stringify(out));
