import { homeFor, mayVisit, navItemsFor } from '@/constants/navigation';
import type { Role } from '@/shared/schemas';

describe('navigation by role', () => {
  it.each<[Role, string[]]>([
    ['installer', ['projects', 'account']],
    ['reviewer', ['reviews', 'account']],
    ['admin', ['users', 'outbox', 'projects', 'account']],
  ])('gives the %s the sections %j', (role, keys) => {
    expect(navItemsFor(role).map((item) => item.key)).toEqual(keys);
  });

  it.each<[Role, string]>([
    ['installer', '/projects'],
    ['reviewer', '/reviews'],
    ['admin', '/users'],
  ])('starts the %s on %s', (role, href) => {
    expect(homeFor(role)).toBe(href);
  });

  it.each<[Role, string, boolean]>([
    ['installer', '/users', false],
    ['installer', '/outbox', false],
    ['installer', '/reviews', false],
    ['installer', '/projects', true],
    ['reviewer', '/projects', false],
    ['reviewer', '/reviews', true],
    ['admin', '/users', true],
    ['admin', '/projects/42', true],
    ['admin', '/reviews', false],
  ])('lets the %s open %s: %s', (role, path, allowed) => {
    expect(mayVisit(role, path)).toBe(allowed);
  });

  it('does not mistake a path that merely starts with a section name for that section', () => {
    expect(mayVisit('installer', '/usersettings')).toBe(true);
  });
});
