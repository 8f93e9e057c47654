import type { SessionUser } from '../constants/schemas/auth';

declare global {
  namespace Express {
    // passport puts the deserialised session user here.
    interface User extends SessionUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    organisationId?: number;
  }
}

export {};
