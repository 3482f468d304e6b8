import { homeFor, mayVisit, navItemsFor } from '@/constants/navigation';
import type { Role } from '@/shared/schemas';

describe('navigation with projects and the catalogue', () => {
  it.each<[Role, string[]]>([
    ['installer', ['projects', 'quick', 'catalogue', 'account']],
    ['reviewer', ['reviews', 'projects', 'catalogue', 'account']],
    ['admin', ['users', 'outbox', 'projects', 'catalogue', 'account']],
  ])('gives the %s the sections %j', (role, keys) => {
    expect(navItemsFor(role).map((item) => item.key)).toEqual(keys);
  });

  it.each<Role>(['installer', 'reviewer', 'admin'])('lets the %s open the catalogue and a project', (role) => {
    expect(mayVisit(role, '/catalogue')).toBe(true);
    expect(mayVisit(role, '/catalogue/3')).toBe(true);
    expect(mayVisit(role, '/projects/42')).toBe(true);
  });

  it('keeps each role starting on its daily work', () => {
    expect(homeFor('installer')).toBe('/projects');
    expect(homeFor('reviewer')).toBe('/reviews');
    expect(homeFor('admin')).toBe('/users');
  });

  it.each<[Role, string, boolean]>([
    ['installer', '/users', false],
    ['installer', '/outbox', false],
    ['installer', '/reviews', false],
    ['reviewer', '/users', false],
    ['reviewer', '/outbox', false],
    ['admin', '/reviews', false],
    ['admin', '/users', true],
  ])('lets the %s open %s: %s', (role, path, allowed) => {
    expect(mayVisit(role, path)).toBe(allowed);
  });

  it('does not mistake a path that merely starts with a section name for that section', () => {
    expect(mayVisit('installer', '/usersettings')).toBe(true);
  });
});
