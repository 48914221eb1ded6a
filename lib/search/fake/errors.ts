/** Errors in the engine's documented shape: `{ message, code, type, link }` with an HTTP status. */

export type ErrorType = 'invalid_request' | 'auth' | 'internal';

export interface ErrorBody {
  message: string;
  code: string;
  type: ErrorType;
  link: string;
}

export class FakeApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly type: ErrorType = 'invalid_request',
  ) {
    super(message);
    this.name = 'FakeApiError';
  }

  toBody(): ErrorBody {
    return {
      message: this.message,
      code: this.code,
      type: this.type,
      link: `https://docs.meilisearch.com/errors#${this.code}`,
    };
  }
}

export const indexNotFound = (uid: string) => new FakeApiError(404, 'index_not_found', `Index \`${uid}\` not found.`);

export const badRequest = (code: string, message: string) => new FakeApiError(400, code, message);

export const notFound = () => new FakeApiError(404, 'not_found', 'The requested route does not exist.');

export const missingAuthorization = () =>
  new FakeApiError(
    401,
    'missing_authorization_header',
    'The Authorization header is missing. It must use the bearer authorization method.',
    'auth',
  );

export const invalidApiKey = () => new FakeApiError(403, 'invalid_api_key', 'The provided API key is invalid.', 'auth');
