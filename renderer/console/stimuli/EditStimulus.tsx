import { useState } from 'react';
import type { Failure, StimulusMeta } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';

/** Name and notes; the flash mark comes from the flash screening (FlashResult). */
export function EditStimulus({ stimulus }: { stimulus: StimulusMeta }) {
  const { api } = useHost();
  const [name, setName] = useState(stimulus.name);
  const [notes, setNotes] = useState(stimulus.notes);
  const [failure, setFailure] = useState<Failure | null>(null);
  const [saved, setSaved] = useState(false);

  const save = async (patch: { name?: string; notes?: string }) => {
    const result = await api.updateStimulus({ id: stimulus.id, ...patch });
    setFailure(result.ok ? null : result);
    setSaved(result.ok);
  };

  return (
    <form
      className="edit-stimulus"
      aria-label="Describe this stimulus"
      onSubmit={(event) => {
        event.preventDefault();
        void save({ name: name.trim() || stimulus.name, notes });
      }}
    >
      <h3>Description</h3>
      <label className="field">
        Name
        <input value={name} onChange={(e) => (setName(e.target.value), setSaved(false))} maxLength={200} />
      </label>
      <label className="field">
        Notes
        <textarea value={notes} onChange={(e) => (setNotes(e.target.value), setSaved(false))} rows={3} />
      </label>
      <button type="submit">Save description</button>
      {saved && <span className="muted"> saved</span>}
      {failure && <FailureNote failure={failure} />}
    </form>
  );
}
