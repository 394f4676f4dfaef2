import { useCallback, useEffect, useState } from 'react';
import type { z } from 'zod';
import type { backupListing } from '../../../app/contract/schemas/archive';
import { useHost } from '../host-context';
import { useLabState } from '../lab/lab-context';
import { BackupList } from './BackupList';
import { BackupPanel } from './BackupPanel';
import { RestorePanel } from './RestorePanel';

type Listing = z.infer<typeof backupListing>;

/**
 * Lab archive backups: back up now (folder or zip), the list of backups, and restore into
 * this profile when it is empty. It works before the lab is set up, so a new profile can
 * start from a backup instead of a new passphrase.
 */
export function ArchiveScreen() {
  const { api } = useHost();
  const lab = useLabState();
  const [backups, setBackups] = useState<{ dir: string; list: Listing[] } | null>(null);
  const [listFailure, setListFailure] = useState<string | null>(null);
  const [empty, setEmpty] = useState<boolean | null>(null);
  const [chosen, setChosen] = useState('');
  const store = lab.store;

  const refresh = useCallback(async () => {
    const r = await api.listLabBackups({});
    if (r.ok) setBackups({ dir: r.value.backupsDir, list: r.value.backups });
    else setListFailure(r.message);
    if (store) setEmpty(await store.isEmpty());
  }, [api, store]);

  useEffect(() => {
    void refresh();
  }, [refresh]);

  if (!store) return <main className="archive-screen">{lab.failure ? <p className="failure" role="alert">{lab.failure}</p> : <p className="muted">Opening the lab database…</p>}</main>;
  return (
    <main className="archive-screen" aria-label="Backups">
      {empty === false && <BackupPanel api={api} store={store} onDone={() => void refresh()} />}
      <BackupList backups={backups?.list ?? null} backupsDir={backups?.dir ?? null} onChoose={setChosen} />
      {listFailure && (
        <p className="failure" role="alert">
          The backups folder could not be read: {listFailure}
        </p>
      )}
      <RestorePanel
        api={api}
        store={store}
        empty={empty}
        chosenPath={chosen}
        onRestored={async () => {
          await lab.reload();
          await refresh();
        }}
      />
    </main>
  );
}
