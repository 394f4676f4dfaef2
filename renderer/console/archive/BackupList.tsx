import type { z } from 'zod';
import type { backupListing } from '../../../app/contract/schemas/archive';

type Listing = z.infer<typeof backupListing>;

/** The archives in the backups folder, newest first; choosing one fills in the restore path. */
export function BackupList({ backups, backupsDir, onChoose }: { backups: readonly Listing[] | null; backupsDir: string | null; onChoose: (path: string) => void }) {
  return (
    <section className="panel" aria-labelledby="backups-heading">
      <h2 id="backups-heading">Backups</h2>
      {backupsDir && <p className="muted">In {backupsDir}</p>}
      {backups === null && <p className="muted">Reading the backups folder…</p>}
      {backups?.length === 0 && <p className="muted">No backups yet.</p>}
      {backups && backups.length > 0 && (
        <table aria-label="Backups">
          <thead>
            <tr>
              <th scope="col">Name</th>
              <th scope="col">Made</th>
              <th scope="col">Records</th>
              <th scope="col">Recordings</th>
              <th scope="col" aria-label="Actions" />
            </tr>
          </thead>
          <tbody>
            {backups.map((b) => (
              <tr key={b.path}>
                <td>
                  {b.name} {b.manifest?.demo && <span className="badge">demo</span>}
                </td>
                {b.manifest ? (
                  <>
                    <td>{new Date(b.manifest.createdAt).toLocaleString('en-GB')}</td>
                    <td>{Object.values(b.manifest.tables).reduce((n, t) => n + t.records, 0)}</td>
                    <td>{Object.keys(b.manifest.recordings).length}</td>
                  </>
                ) : (
                  <td colSpan={3} className="failure">
                    {b.problem}
                  </td>
                )}
                <td>
                  <button type="button" onClick={() => onChoose(b.path)} disabled={!b.manifest} aria-label={`Choose ${b.name} to restore`}>
                    Choose
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
