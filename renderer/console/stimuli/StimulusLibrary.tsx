import { useEffect, useState } from 'react';
import type { StimulusMeta } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';
import { ImportDialog } from './ImportDialog';
import { StimulusDetail } from './StimulusDetail';
import { StimulusTable } from './StimulusTable';
import { useStimuli } from './use-stimuli';

/** The stimulus library: every clip the lab can show, its statistics, preview and operations. */
export function StimulusLibrary() {
  const { api } = useHost();
  const { stimuli, failure } = useStimuli();
  const [removed, setRemoved] = useState<StimulusMeta | null>(null);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [importing, setImporting] = useState(false);

  useEffect(() => {
    if (stimuli && stimuli.length > 0 && !stimuli.some((s) => s.id === selectedId)) setSelectedId(stimuli[0]!.id);
  }, [stimuli, selectedId]);

  const selected = stimuli?.find((s) => s.id === selectedId) ?? null;
  return (
    <main className="library" aria-label="Stimulus library">
      <section className="library-list panel" aria-labelledby="library-heading">
        <div className="panel-head">
          <h2 id="library-heading">Stimuli</h2>
          <button type="button" onClick={() => setImporting(true)}>
            Import a recording…
          </button>
        </div>
        {failure && <FailureNote failure={failure} />}
        {stimuli === null && <p className="muted">Loading the library…</p>}
        {stimuli?.length === 0 && <p className="muted">The library is empty. Import a recording, or wait for the demo clips to be made (see Overview).</p>}
        {stimuli && stimuli.length > 0 && <StimulusTable stimuli={stimuli} selectedId={selectedId} onSelect={setSelectedId} />}
      </section>
      {removed && (
        <div className="undo-bar" role="status">
          Removed “{removed.name}”.{' '}
          <button
            type="button"
            className="link"
            onClick={() => {
              void api.restoreStimulus({ id: removed.id }).then((result) => result.ok && setSelectedId(result.value.id));
              setRemoved(null);
            }}
          >
            Undo
          </button>
        </div>
      )}
      {selected && <StimulusDetail key={selected.id} stimulus={selected} onDerived={setSelectedId} onRemoved={setRemoved} />}
      {importing && (
        <ImportDialog
          onClose={() => setImporting(false)}
          onImported={(id) => {
            setSelectedId(id);
          }}
        />
      )}
    </main>
  );
}
