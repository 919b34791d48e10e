import { AppError } from '../../app-error';
import type { RouteHandler } from '../route-definition';

// Contract stubs (issue 6): replaced by the real handlers.
export const forgot: RouteHandler = () => {
  throw new AppError(501, 'NOT_BUILT', [{ path: '', message: 'Not built yet.' }]);
};
export const inspect: RouteHandler = () => {
  throw new AppError(501, 'NOT_BUILT', [{ path: '', message: 'Not built yet.' }]);
};
export const set: RouteHandler = () => {
  throw new AppError(501, 'NOT_BUILT', [{ path: '', message: 'Not built yet.' }]);
};
