import { splitLinks } from '@/components/outbox/link-text';

describe('splitLinks', () => {
  it('finds the invitation link in an e-mail and leaves the full stop after it as text', () => {
    const text = 'Choose your password here: http://localhost:8099/set-password?token=abc_DEF-123.\nThe link works once.';

    expect(splitLinks(text)).toEqual([
      { kind: 'text', text: 'Choose your password here: ' },
      { kind: 'link', url: 'http://localhost:8099/set-password?token=abc_DEF-123' },
      { kind: 'text', text: '.\nThe link works once.' },
    ]);
  });

  it('returns text without links as one part', () => {
    expect(splitLinks('No links here.')).toEqual([{ kind: 'text', text: 'No links here.' }]);
  });
});
