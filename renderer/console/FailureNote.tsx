import type { Failure } from '../../app/contract';

/** A host failure as the operator sees it: what went wrong, and where, in one line. */
export function FailureNote({ failure }: { failure: Failure }) {
  return (
    <p className="failure" role="alert">
      {failure.message}
      {failure.path ? <span className="muted"> ({failure.path})</span> : null}
    </p>
  );
}
