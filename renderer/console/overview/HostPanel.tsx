import { useHostQuery } from '../host-context';
import { FailureNote } from '../FailureNote';

export function HostPanel() {
  const info = useHostQuery((api) => api.getAppInfo({}));
  return (
    <section className="panel" aria-labelledby="host-heading">
      <h2 id="host-heading">This installation</h2>
      {info === null && <p className="muted">Asking the host…</p>}
      {info && !info.ok && <FailureNote failure={info} />}
      {info?.ok && (
        <dl className="facts">
          <dt>Version</dt>
          <dd>{info.value.version}</dd>
          <dt>Running as</dt>
          <dd>{info.value.mode === 'electron' ? 'desktop app' : 'browser mode (host on 127.0.0.1)'}</dd>
          <dt>Data folder</dt>
          <dd className="path">{info.value.dataDir}</dd>
          <dt>Host started</dt>
          <dd>{new Date(info.value.startedAt).toLocaleString()}</dd>
        </dl>
      )}
    </section>
  );
}
