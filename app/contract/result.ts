/**
 * Expected failures cross the boundary as values, never as thrown errors: a bad file, a
 * wrong passphrase or a malformed message is something the caller must handle, so it is
 * part of every response's type. Bugs still throw on the side where they happen.
 */
export const failureCodes = [
  'invalid_request', // the payload failed the contract's schema
  'invalid_response', // the host produced something the contract does not allow (a host bug)
  'unknown_channel',
  'untrusted_sender',
  'not_found',
  'bad_input', // a file or value the user supplied is wrong; message says where and why
  'conflict',
  'unavailable', // the feature needs something this machine or mode does not have
  'transport_closed',
  'internal',
] as const;

export type FailureCode = (typeof failureCodes)[number];

export interface Failure {
  readonly ok: false;
  readonly code: FailureCode;
  readonly message: string;
  /** Where in the payload or file the problem is, e.g. `request.trials[3].onset`. */
  readonly path?: string;
}

export interface Success<T> {
  readonly ok: true;
  readonly value: T;
}

export type Result<T> = Success<T> | Failure;

export function ok<T>(value: T): Success<T> {
  return { ok: true, value };
}

export function fail(code: FailureCode, message: string, path?: string): Failure {
  return path === undefined ? { ok: false, code, message } : { ok: false, code, message, path };
}

export function isFailure(value: unknown): value is Failure {
  return (
    typeof value === 'object' &&
    value !== null &&
    (value as { ok?: unknown }).ok === false &&
    typeof (value as { code?: unknown }).code === 'string'
  );
}
