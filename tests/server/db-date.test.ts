import { fromDbDate } from '../../server/db-date';

// The instant is built with the JavaScript Date.UTC reference, not with the code under test.
const instant = Date.UTC(2026, 11, 2, 21, 25, 0);

describe('dates read by plain SQL', () => {
  it("read SQLite's milliseconds, a numeric string of them and PostgreSQL's Date as the same instant", () => {
    expect(fromDbDate(instant).getTime()).toBe(instant);
    expect(fromDbDate(String(instant)).getTime()).toBe(instant);
    expect(fromDbDate(new Date(instant)).getTime()).toBe(instant);
  });

  it('read an ISO timestamp text as that instant', () => {
    expect(fromDbDate('2026-12-02T21:25:00.000Z').getTime()).toBe(instant);
  });
});
