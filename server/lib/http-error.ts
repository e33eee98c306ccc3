/** An error whose status and message are safe to show the client. */
export class HttpError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly issues: Array<{ path: string; message: string }> = [],
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const notFound = (what = 'That record') => new HttpError(404, `${what} was not found`);

/** A refusal that points at one field of the request, so the form can show it beside that field. */
export const fieldError = (status: number, path: string, message: string) => new HttpError(status, message, [{ path, message }]);
