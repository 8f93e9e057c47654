import type { SessionUser } from '../constants/schemas/auth';

declare global {
  namespace Express {
    // passport puts the deserialised session user here (declaration merging needs the empty interface).
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    organisationId?: number;
  }
}

export {};
