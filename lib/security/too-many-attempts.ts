import { AppError } from '@/lib/server/errors';

/** Thrown (and answered 429 with Retry-After) while an account or an address is locked. */
export class TooManyAttemptsError extends AppError {
  constructor(public readonly retryAfterSeconds: number) {
    super('rate_limited', 'too_many_attempts', 'Too many attempts. Wait a little, then try again.', {
      details: { retryAfterSeconds },
    });
    this.name = 'TooManyAttemptsError';
  }
}
