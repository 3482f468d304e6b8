import { compareMirrorsBySize } from '@/components/placement/mirror-text';
import { demoCatalogueDtos } from './fixtures';

describe('the order mirrors are offered in', () => {
  it('lists round mirrors by diameter as a number, so 300 mm comes before 1000 mm and 1200 mm', () => {
    const rounds = demoCatalogueDtos()
      .sort(compareMirrorsBySize)
      .filter((c) => c.mirror.shape === 'round')
      .map((c) => (c.mirror.shape === 'round' ? Math.round(c.mirror.diameterM * 1000) : 0));
    expect(rounds).toEqual([300, 400, 500, 600, 600, 800, 900, 1000, 1200]);
  });

  it('keeps shapes together in the order round, rectangular, dome, with domes by portion and then size', () => {
    const shapes = demoCatalogueDtos()
      .sort(compareMirrorsBySize)
      .map((c) => (c.mirror.shape === 'dome' ? `${c.mirror.portion}-${Math.round(c.mirror.diameterM * 1000)}` : c.mirror.shape));
    expect(shapes.slice(-8)).toEqual([
      'full-460',
      'full-610',
      'full-910',
      'half-610',
      'half-910',
      'quarter-460',
      'quarter-610',
      'quarter-910',
    ]);
    expect(shapes.indexOf('rect')).toBeGreaterThan(shapes.lastIndexOf('round'));
  });
});
