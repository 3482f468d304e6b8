import * as fc from 'fast-check';
import { bandWords, coveredPercent, formatCoveredShare, zoneBand } from '../../shared/zone-verdict';

describe('a zone’s covered share and its verdict', () => {
  it('shows 94.6 % as 94 % partly covered, never 95 % beside a "partly covered" verdict', () => {
    expect(formatCoveredShare(0.946)).toBe('94 %');
    expect(bandWords[zoneBand(0.946)]).toBe('partly covered');
    expect(formatCoveredShare(0.95)).toBe('95 %');
    expect(bandWords[zoneBand(0.95)]).toBe('covered');
  });

  it('counts a share computed a hair under a whole percent in floating point as that percent', () => {
    // 0.29 × 100 is 28.999999999999996 in binary floating point.
    expect(coveredPercent(0.29)).toBe(29);
    expect(coveredPercent(1 - 1e-12)).toBe(100);
  });

  it('says "—" and "not computed" for a share that could not be computed', () => {
    expect(formatCoveredShare(Number.NaN)).toBe('—');
    expect(zoneBand(Number.NaN)).toBe('unknown');
  });

  it('reads every verdict from the figure shown, and never shows more than was computed', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (f) => {
        const shown = coveredPercent(f)!;
        expect(`${shown} %`).toBe(formatCoveredShare(f));
        expect(shown).toBeLessThanOrEqual(f * 100 + 1e-6);
        expect(shown).toBeGreaterThan(f * 100 - 1);
        const band = zoneBand(f);
        expect(band).toBe(shown >= 95 ? 'good' : shown >= 60 ? 'partial' : 'poor');
      }),
    );
  });
});
