/**
 * Errors meant for a person. `UserError` carries one line that says what is wrong and what
 * to do; the CLI prints it without a stack trace (unless DEBUG is set) and exits with `exitCode`.
 *
 * @example
 * throw new UserError('PORT "abc" is not a number — set PORT to a number from 1 to 65535');
 */
export class UserError extends Error {
  readonly exitCode: number;
  constructor(message: string, exitCode = 1) {
    super(message);
    this.name = 'UserError';
    this.exitCode = exitCode;
  }
}

/** A usage mistake on the command line (unknown command or option): exit code 2. */
export class UsageError extends UserError {
  constructor(message: string) {
    super(message, 2);
    this.name = 'UsageError';
  }
}

/**
 * The one HTTP error class. Routes throw it; the app's error handler renders it as a page or
 * an htmx fragment. `message` is shown to the user and must say what to do next.
 */
export class HttpError extends Error {
  readonly status: 400 | 401 | 403 | 404 | 409 | 413 | 415 | 422 | 429 | 500 | 503;
  constructor(status: HttpError['status'], message: string) {
    super(message);
    this.name = 'HttpError';
    this.status = status;
  }
}

/** Node system errors carry a `code` such as EACCES; this reads it without `any`. */
export function errorCode(error: unknown): string | undefined {
  if (error && typeof error === 'object' && 'code' in error) {
    const code = (error as { code: unknown }).code;
    return typeof code === 'string' ? code : undefined;
  }
  return undefined;
}
