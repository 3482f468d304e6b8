import { createApiClient } from '@/shared/api-client';

/**
 * The app's one API client. '' means the same origin: the server serves both dist/ and /api.
 * EXPO_PUBLIC_API_URL points a dev bundle at a server on another port.
 */
export const api = createApiClient({ baseUrl: process.env.EXPO_PUBLIC_API_URL ?? '' });
