import { restWarnings, type RestClock } from '../../../app/core/study/rest-limits';

const minutes = (s: number) => `${Math.floor(s / 60)}:${String(Math.floor(s % 60)).padStart(2, '0')}`;

/** The rest limits now: viewing since the last rest, session length, and any warning. */
export function RestWarnings({ rest }: { rest: RestClock }) {
  const warnings = restWarnings(rest);
  return (
    <div aria-label="Rest limits" data-testid="rest-limits">
      <p className="muted">
        Viewing since the last rest {minutes(rest.viewingS)} (warning at {rest.limits.warnAfterMin} min, rest required at {rest.limits.requireRestAfterMin} min); session {minutes(rest.sessionS)} of {rest.limits.sessionWarnAfterMin} min.
      </p>
      {warnings.map((w) => (
        <p key={w.kind} className="warning" role="alert">
          {w.message}
        </p>
      ))}
    </div>
  );
}
