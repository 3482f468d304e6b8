import 'express-session';
import type { User } from './modules/users/user.entity';

declare module 'express-session' {
  interface SessionData {
    userId?: number;
  }
}

declare global {
  namespace Express {
    interface Request {
      user?: User;
      /** The request's id (server/middleware/request-log.ts), on every log line it causes. */
      id?: string;
    }
  }
}
