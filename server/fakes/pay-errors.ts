/** An error answered in the provider's format: `{ error: { type, code?, message, param? } }`. */
export class PayError extends Error {
  constructor(
    readonly status: number,
    readonly type: 'invalid_request_error' | 'card_error' | 'authentication_error' | 'api_error',
    message: string,
    readonly extra: { code?: string; param?: string; decline_code?: string } = {},
  ) {
    super(message);
  }

  body() {
    return { error: { type: this.type, message: this.message, ...this.extra } };
  }
}

export const missing = (kind: string, id: string, param = 'id') =>
  new PayError(404, 'invalid_request_error', `No such ${kind}: '${id}'`, { code: 'resource_missing', param });

export const invalid = (message: string, param?: string) =>
  new PayError(400, 'invalid_request_error', message, param ? { param } : {});

/** What the provider answers when a charge or an attachment is refused. */
export const cardDeclined = () =>
  new PayError(402, 'card_error', 'Your card was declined.', { code: 'card_declined', decline_code: 'generic_decline' });
