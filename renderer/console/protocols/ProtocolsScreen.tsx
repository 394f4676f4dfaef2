import { useCallback, useEffect, useState } from 'react';
import type { ProtocolRecord, RecordOf } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';
import { latestVersions, newProtocol, protocolLineage, recordToSave } from './protocol-draft';
import { ProtocolEditor } from './ProtocolEditor';
import { stepKindLabels } from './StepFields';
import '../session/session.css';

type StimulusRecord = RecordOf<'stimuli'>;

/** The study's session protocols: list, create, edit (a protocol a session used gets a new version). */
export function ProtocolsScreen() {
  const { store, studyId, operator } = useLab();
  const [all, setAll] = useState<ProtocolRecord[] | null>(null);
  const [stimuli, setStimuli] = useState<StimulusRecord[]>([]);
  const [usedIds, setUsedIds] = useState<Set<string>>(new Set());
  const [editing, setEditing] = useState<ProtocolRecord | null>(null);
  const [saved, setSaved] = useState<string | null>(null);

  const refresh = useCallback(async () => {
    if (!studyId) return;
    const [protocols, studyStimuli, sessions] = await Promise.all([store.list('protocols', { studyId }), store.list('stimuli', { studyId }), store.list('sessions', { studyId })]);
    setAll(protocols);
    setStimuli(studyStimuli);
    setUsedIds(new Set(sessions.map((s) => s.protocolId)));
  }, [store, studyId]);
  useEffect(() => void refresh(), [refresh]);

  if (!studyId) return <main className="protocols panel">Choose or create a study first (Study screen).</main>;
  const newest = all ? latestVersions(all) : [];
  const newestVersion = (p: ProtocolRecord) => Math.max(...(all ?? []).filter((q) => protocolLineage(q.id) === protocolLineage(p.id)).map((q) => q.version));

  const save = async (draft: ProtocolRecord) => {
    const record = recordToSave(draft, newestVersion(draft), usedIds.has(draft.id), new Date().toISOString());
    const isNew = record.id !== draft.id || !all?.some((p) => p.id === record.id);
    await store.put('protocols', record, { operatorId: operator?.id ?? null, action: isNew ? 'create_protocol' : 'edit_protocol', summary: `protocol ${record.name} version ${record.version}` });
    setSaved(`Saved "${record.name}" version ${record.version}.`);
    setEditing(null);
    await refresh();
  };

  return (
    <main className="protocols" aria-label="Protocols">
      <section className="panel" aria-labelledby="protocols-heading">
        <div className="panel-head">
          <h2 id="protocols-heading">Protocols</h2>
          <button type="button" onClick={() => setEditing(newProtocol(studyId, `protocol-${globalThis.crypto.randomUUID()}`, new Date().toISOString()))}>
            New protocol
          </button>
        </div>
        {saved && <p role="status">{saved}</p>}
        {all === null ? (
          <p className="muted">Loading…</p>
        ) : newest.length === 0 ? (
          <p className="muted">No protocol yet.</p>
        ) : (
          <ul className="protocol-list">
            {newest.map((p) => (
              <li key={p.id}>
                <button type="button" className="link" onClick={() => setEditing(p)}>
                  {p.name}
                </button>{' '}
                <span className="muted">
                  version {p.version}: {p.steps.map((s) => stepKindLabels[s.kind]).join(', ')}
                  {usedIds.has(p.id) ? ' (used by a session)' : ''}
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>
      {editing && <ProtocolEditor key={editing.id} initial={editing} stimuli={stimuli} usedBySession={usedIds.has(editing.id)} onSave={save} onCancel={() => setEditing(null)} />}
    </main>
  );
}
