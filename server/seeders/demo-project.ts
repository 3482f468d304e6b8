import type { Scene, SceneWall } from '../../shared/schemas';

/**
 * DEMO DATA — an invented cold store ("Harbourline Cold Storage, Dock Road", fictional). A side
 * aisle between two racking blocks meets the main aisle at a blind T-junction, where forklifts cross;
 * at the loading-dock corner, trucks leaving the main aisle turn blind around a racking end.
 * M1 is a half dome on a building column's north face, facing up the side aisle; M2 is a round
 * mirror on the east end face of the south-west racking block. Each sits on its face: no wall
 * or rack passes through a mirror's body (the placement rule in shared/project-optics/mounting.ts).
 * Coordinates in metres from the building's south-west corner; x east, y north.
 */
const RACK_M = 6;
const WALL_M = 8;

function box(id: string, x0: number, y0: number, x1: number, y1: number, heightM: number, kind: SceneWall['kind']): SceneWall[] {
  return [
    { id: `${id}-s`, kind, aM: [x0, y0], bM: [x1, y0], heightM },
    { id: `${id}-e`, kind, aM: [x1, y0], bM: [x1, y1], heightM },
    { id: `${id}-n`, kind, aM: [x1, y1], bM: [x0, y1], heightM },
    { id: `${id}-w`, kind, aM: [x0, y1], bM: [x0, y0], heightM },
  ];
}

/**
 * M1's flat back lies on the column's north face (y = 10): a half dome at its mounting tilt of
 * 45° has its sphere centre on that face, R·sin 45° behind the vertex (R = 0.305 m).
 */
const M1_Y = 10 + 0.305 * Math.SQRT1_2;
/** M2's rim clears the rack's east face (x = 16) by about 8 mm when aimed 25° south of east. */
const M2_X = 16.21;

export const DEMO_PROJECT = {
  name: 'Cold store aisles and dock (demo)',
  customer: 'Harbourline Cold Storage (demo)',
  site: 'Dock Road store, hall 2 (demo)',
  notes: 'Demo project with invented dimensions. Two mirrors cover most of the zones; the dock apron still has a gap worth fixing.',
  scene: {
    walls: [
      ...box('hall', 0, 0, 40, 25, WALL_M, 'wall'),
      ...box('rack-w', 4, 13.5, 18, 23, RACK_M, 'racking'),
      ...box('rack-e', 21.5, 13.5, 36, 23, RACK_M, 'racking'),
      ...box('rack-sw', 4, 3, 16, 10, RACK_M, 'racking'),
      ...box('column', 19.2, 9.5, 20.3, 10, WALL_M, 'wall'),
    ],
    zones: [
      {
        id: 'z-junction',
        name: 'T-junction cross traffic',
        polygonM: [
          [12, 10.2],
          [28, 10.2],
          [28, 13.3],
          [12, 13.3],
        ],
        target: { kind: 'adult' },
      },
      {
        id: 'z-dock',
        name: 'Dock corner apron',
        polygonM: [
          [16.2, 4],
          [22, 4],
          [22, 9.8],
          [16.2, 9.8],
        ],
        target: { kind: 'adult' },
      },
    ],
    viewers: [
      { id: 'v-aisle', name: 'Forklift driver in the side aisle', positionM: [19.75, 17], eyeHeightM: 2.1 },
      { id: 'v-dock', name: 'Forklift driver leaving the dock', positionM: [26, 6.5], eyeHeightM: 2.1 },
    ],
  } satisfies Scene,
  placements: [
    {
      label: 'M1 junction',
      code: 'DEMO-DH610',
      positionM: [19.75, M1_Y] as [number, number],
      heightM: 2.9,
      azimuthDeg: 90,
      tiltDownDeg: 45,
      viewerId: 'v-aisle',
    },
    {
      label: 'M2 dock corner',
      code: 'DEMO-R600',
      positionM: [M2_X, 10.05] as [number, number],
      heightM: 3.0,
      azimuthDeg: -25,
      tiltDownDeg: 25,
      viewerId: 'v-dock',
    },
  ],
};
