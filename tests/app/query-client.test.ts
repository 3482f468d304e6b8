import { shouldRetry } from '@/hooks/query-client';
import { ApiError } from '@/shared/api-client';

describe('shouldRetry', () => {
  it.each([
    ['a 401 (signed out)', new ApiError(401, 'Sign in first.'), 0, false],
    ['a 403 (not allowed)', new ApiError(403, 'Admins only.'), 0, false],
    ['a 404', new ApiError(404, 'Not found.'), 0, false],
    ['a network failure, first time', new ApiError(0, 'Cannot reach the server.'), 0, true],
    ['a network failure, third time', new ApiError(0, 'Cannot reach the server.'), 2, false],
    ['a 503, first time', new ApiError(503, 'Busy.'), 0, true],
  ])('decides whether to ask again after %s', (_label, error, failures, expected) => {
    expect(shouldRetry(failures, error)).toBe(expected);
  });
});
