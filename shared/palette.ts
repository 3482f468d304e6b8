/**
 * Sightfan's colours, "Yardlight": dark asphalt ink on chalk paper, with a sodium-amber beacon for
 * the one thing to press. One copy for the app (constants/theme.ts re-exports it) and the PDF sheet
 * (server/pdf). Every text/background pair here is at least 7:1 except `haze` on `chalk` (about
 * 6.6:1, still above WCAG AA for body text).
 */
export const palette = {
  /** Deep blue-black of wet asphalt: text, the side rail, the bottom bar. */
  asphalt: '#14202b',
  asphaltRaised: '#223140',
  /** Warm off-white paper the screens sit on. */
  chalk: '#f4f1ea',
  /** Cards and inputs: plain white so entered values stand out from the page. */
  card: '#ffffff',
  /** Hairlines and input borders; dark enough to see in sunlight. */
  rule: '#b9b2a3',
  ruleSoft: '#dcd6ca',
  /** Secondary text. */
  haze: '#4b5763',
  /** Sodium-vapour amber: primary actions and the active nav marker. Always carries asphalt text. */
  beacon: '#f2b01e',
  beaconPressed: '#d99a0c',
  beaconSoft: '#fdf0cf',
  /** Steel blue of a mirror's face: links, focus rings, the brand fan. */
  glass: '#1d5f8a',
  glassSoft: '#dcebf5',
  /** Errors and destructive actions. */
  stop: '#a4231b',
  stopSoft: '#fbe4e1',
  /** Success and "active" states. */
  go: '#1f6a3f',
  goSoft: '#dff1e5',
  /** Text on asphalt. */
  onAsphalt: '#f4f1ea',
  onAsphaltMuted: '#b5c0ca',
} as const;
