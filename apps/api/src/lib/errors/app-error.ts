export class AppError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly status = 400,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what: string) => new AppError('not_found', `${what} was not found`, 404);
export const forbidden = (message = 'Your role does not allow this') => new AppError('forbidden', message, 403);
export const unauthenticated = () => new AppError('unauthenticated', 'Sign in to continue', 401);
