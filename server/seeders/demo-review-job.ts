/**
 * A second, small demo job that waits for the demo safety officer, so the reviewer's queue is not
 * empty in the demo. Invented dimensions; labelled demo.
 */
export const DEMO_REVIEW_JOB = {
  name: 'Loading bay pedestrian crossing (demo)',
  customer: 'Harbourline Cold Storage (demo)',
  site: 'Dock Road store, loading bay (demo)',
  notes: 'Demo job waiting for review: one mirror shows the crossing to drivers backing out of the bay. Invented figures.',
  scene: {
    walls: [
      { id: 'bay-wall', kind: 'wall' as const, aM: [0, 0] as [number, number], bM: [12, 0] as [number, number], heightM: 4 },
      { id: 'bay-pillar', kind: 'wall' as const, aM: [6, 0] as [number, number], bM: [6, 3] as [number, number], heightM: 4 },
    ],
    zones: [
      {
        id: 'z-crossing',
        name: 'Pedestrian crossing',
        polygonM: [
          [7, 1],
          [11, 1],
          [11, 3],
          [7, 3],
        ] as [number, number][],
        target: { kind: 'adult' as const },
      },
    ],
    viewers: [{ id: 'v-bay', name: 'Driver backing out of the bay', positionM: [3, 6] as [number, number], eyeHeightM: 2.1 }],
  },
  placement: { label: 'M1', positionM: [6, 3.45] as [number, number], heightM: 2.6, azimuthDeg: 80, tiltDownDeg: 15, viewerId: 'v-bay' },
  /** How long ago it was sent (the queue's waiting time). */
  sentHoursAgo: 3,
};
