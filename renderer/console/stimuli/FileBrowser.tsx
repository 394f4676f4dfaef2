import { useEffect, useRef, useState } from 'react';
import type { DirectoryListing, Failure } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { formatBytes } from '../format';
import { useHost } from '../host-context';

interface Props {
  readonly onChoose: (path: string) => void;
  readonly chosen: string | null;
}

/** Browses the host machine's folders; only importable files can be chosen. */
export function FileBrowser({ onChoose, chosen }: Props) {
  const { api } = useHost();
  const [listing, setListing] = useState<DirectoryListing | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);
  const [typed, setTyped] = useState('');

  // Only the newest listing is shown, and a path the operator typed while it loaded is kept:
  // a slow first listing must not replace the folder they have already asked for.
  const latest = useRef(0);
  const edits = useRef(0);
  const open = async (path: string | null) => {
    const request = ++latest.current;
    const editsBefore = edits.current;
    const result = await api.listDirectory({ path });
    if (request !== latest.current) return;
    if (!result.ok) return setFailure(result);
    setFailure(null);
    setListing(result.value);
    if (edits.current === editsBefore) setTyped(result.value.path);
  };
  useEffect(() => {
    void open(null);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const join = (dir: string, name: string) => `${dir.replace(/[\\/]+$/, '')}/${name}`;

  return (
    <div className="file-browser">
      <form
        className="path-bar"
        onSubmit={(event) => {
          event.preventDefault();
          void open(typed);
        }}
      >
        <label>
          Folder on the host
          <input value={typed} onChange={(e) => {
              edits.current++;
              setTyped(e.target.value);
            }} aria-label="Folder on the host" spellCheck={false} />
        </label>
        <button type="submit">Go</button>
        {listing?.parent && (
          <button type="button" onClick={() => void open(listing.parent)}>
            Up
          </button>
        )}
      </form>
      {listing && listing.places.length > 0 && (
        <div className="places">
          {listing.places.map((p) => (
            <button key={p.path} type="button" className="link" onClick={() => void open(p.path)}>
              {p.label}
            </button>
          ))}
        </div>
      )}
      {failure && <FailureNote failure={failure} />}
      <ul className="entries" aria-label="Folder contents">
        {listing?.entries.map((entry) => {
          const path = join(listing.path, entry.name);
          return (
            <li key={entry.name}>
              {entry.kind === 'directory' ? (
                <button type="button" className="entry entry-dir" onClick={() => void open(path)}>
                  {entry.name}/
                </button>
              ) : (
                <button
                  type="button"
                  className={`entry entry-file${path === chosen ? ' chosen' : ''}`}
                  disabled={!entry.importable}
                  aria-pressed={path === chosen}
                  onClick={() => onChoose(path)}
                >
                  {entry.name} <span className="muted">{formatBytes(entry.sizeBytes)}</span>
                </button>
              )}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
