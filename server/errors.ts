/** Typed errors thrown by services; the error middleware turns them into JSON responses. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: { path: string; message: string }[],
  ) {
    super(message)
  }
}

export const badRequest = (message: string, fields?: { path: string; message: string }[]) =>
  new HttpError(400, 'invalid_request', message, fields)
export const unauthorized = (message = 'Sign in to continue') =>
  new HttpError(401, 'unauthorized', message)
export const forbidden = (message = 'Your role on this project does not allow that') =>
  new HttpError(403, 'forbidden', message)
export const notFound = (message = 'Not found') => new HttpError(404, 'not_found', message)
export const conflict = (message: string) => new HttpError(409, 'conflict', message)
