import { useState } from 'react';
import type { StudyRecord } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';

export function CreateStudy() {
  const { store, operator, setStudyId } = useLab();
  const [name, setName] = useState('');
  const [description, setDescription] = useState('');
  return (
    <form
      className="create-study"
      onSubmit={async (event) => {
        event.preventDefault();
        const study: StudyRecord = { id: `st-${globalThis.crypto.randomUUID()}`, name: name.trim(), description: description.trim(), createdAt: new Date().toISOString(), demo: false };
        await store.put('studies', study, { operatorId: operator?.id ?? null, action: 'create_study', summary: 'fields: name, description' });
        setStudyId(study.id);
        setName('');
        setDescription('');
      }}
    >
      <h3>New study</h3>
      <label className="field">
        Study name
        <input value={name} maxLength={200} onChange={(event) => setName(event.target.value)} />
      </label>
      <label className="field">
        Description
        <textarea value={description} maxLength={5000} rows={2} onChange={(event) => setDescription(event.target.value)} />
      </label>
      <button type="submit" disabled={name.trim() === ''}>
        Create the study
      </button>
    </form>
  );
}
