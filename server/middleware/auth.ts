/** Small composable guards. Every API route that is not public sits behind one of them. */
import type { RequestHandler } from 'express';
import type { Role } from '../../constants/schemas/roles';
import { forbidden, unauthorized } from '../http-error';

export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(unauthorized());
  next();
};

/** Passes when the signed-in user holds at least one of the roles in the active organisation. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!roles.some((r) => req.user!.roles.includes(r))) {
      return next(forbidden(`This needs the ${roles.join(' or ')} role.`));
    }
    next();
  };
}
