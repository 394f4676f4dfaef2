import { Fragment } from 'react';
import { sessionKeyMap } from './key-map';

/** The session console's keys, from the same list the README prints. */
export function KeyMapHelp() {
  return (
    <section className="panel key-map" aria-labelledby="key-map-heading">
      <h3 id="key-map-heading">Keys</h3>
      <dl className="facts">
        {sessionKeyMap.map((b) => (
          <Fragment key={b.command}>
            <dt>
              <kbd>{b.label}</kbd>
            </dt>
            <dd>{b.description}</dd>
          </Fragment>
        ))}
      </dl>
    </section>
  );
}
